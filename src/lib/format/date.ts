/**
 * Dates as people read them: one format everywhere (the locale's medium date, e.g. "3 Dec 2026" in
 * en-GB, "Dec 3, 2026" in en-US), in the reader's locale and time zone. The server reads both from
 * the request (Accept-Language, and the time zone the browser reported in a cookie) and hands them to
 * the pages through the root layout, so the page rendered on the server and the page in the browser
 * show the same text.
 */

export const FALLBACK_LOCALE = 'en-GB';
export const FALLBACK_TIME_ZONE = 'UTC';
/** The cookie in which the browser reports its time zone (an IANA name such as "Europe/Lisbon"). */
export const TIME_ZONE_COOKIE = 'tz';

export interface DateSettings {
	locale: string;
	timeZone: string;
}

function localeSupported(tag: string): string | undefined {
	try {
		return Intl.DateTimeFormat.supportedLocalesOf([tag])[0];
	} catch {
		return undefined; // not a well-formed language tag
	}
}

/** The first language of an Accept-Language header that dates can be written in; en-GB otherwise. */
export function localeFromAcceptLanguage(header: string | null | undefined): string {
	if (!header) return FALLBACK_LOCALE;
	const tags = header
		.split(',')
		.map((part, i) => {
			const [tag, ...params] = part.trim().split(';');
			const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
			const weight = q ? Number(q.slice(2)) : 1;
			return { tag: tag.trim(), weight: Number.isFinite(weight) ? weight : 0, i };
		})
		.filter((t) => t.tag && t.tag !== '*' && t.weight > 0)
		.sort((a, b) => b.weight - a.weight || a.i - b.i);
	for (const t of tags) {
		const found = localeSupported(t.tag);
		if (found) return found;
	}
	return FALLBACK_LOCALE;
}

/** A time zone name the runtime knows, or UTC. */
export function timeZoneOrUtc(name: string | null | undefined): string {
	if (!name || name.length > 64) return FALLBACK_TIME_ZONE;
	try {
		return new Intl.DateTimeFormat('en', { timeZone: name }).resolvedOptions().timeZone;
	} catch {
		return FALLBACK_TIME_ZONE;
	}
}

/** The date of an instant (a Date or an ISO string), e.g. "3 Dec 2026"; "—" when it is not a date. */
export function dateFormat(value: Date | string, settings: DateSettings): string {
	const d = typeof value === 'string' ? new Date(value) : value;
	if (Number.isNaN(d.getTime())) return '—';
	return new Intl.DateTimeFormat(settings.locale, { dateStyle: 'medium', timeZone: settings.timeZone }).format(d);
}
