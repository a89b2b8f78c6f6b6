import { describe, expect, it } from 'vitest';
import { dateFormat, localeFromAcceptLanguage, timeZoneOrUtc } from './date';

describe('dates in the reader locale', () => {
	const at = '2026-12-03T10:00:00.000Z';

	it('writes a date the same way from a Date and from its ISO string, with the month named', () => {
		const s = { locale: 'en-US', timeZone: 'UTC' };
		expect(dateFormat(at, s)).toBe('Dec 3, 2026');
		expect(dateFormat(new Date(at), s)).toBe('Dec 3, 2026');
		expect(dateFormat(at, { locale: 'en-GB', timeZone: 'UTC' })).toBe('3 Dec 2026');
	});

	it('never writes the all-numeric month/day form in English locales', () => {
		for (const locale of ['en-US', 'en-GB', 'en-CA', 'en-AU']) expect(dateFormat(at, { locale, timeZone: 'UTC' })).not.toMatch(/^\d+\/\d+\/\d+$/);
	});

	it('counts the day in the reader time zone', () => {
		const late = '2026-12-03T23:30:00.000Z';
		expect(dateFormat(late, { locale: 'en-GB', timeZone: 'UTC' })).toBe('3 Dec 2026');
		expect(dateFormat(late, { locale: 'en-GB', timeZone: 'Asia/Tokyo' })).toBe('4 Dec 2026');
	});

	it('shows a dash for something that is not a date', () => {
		expect(dateFormat('not a date', { locale: 'en-GB', timeZone: 'UTC' })).toBe('—');
	});

	it('takes the preferred language of the Accept-Language header, by weight', () => {
		expect(localeFromAcceptLanguage('en-US,en;q=0.9')).toBe('en-US');
		expect(localeFromAcceptLanguage('fr;q=0.5, de-DE;q=0.8')).toBe('de-DE');
		expect(localeFromAcceptLanguage('*;q=1, nl-NL;q=0.3')).toBe('nl-NL');
	});

	it('falls back to en-GB for a missing or malformed header', () => {
		expect(localeFromAcceptLanguage(undefined)).toBe('en-GB');
		expect(localeFromAcceptLanguage('')).toBe('en-GB');
		expect(localeFromAcceptLanguage('%%%, 12')).toBe('en-GB');
	});

	it('accepts only time zones the runtime knows, else UTC', () => {
		expect(timeZoneOrUtc('Europe/Lisbon')).toBe('Europe/Lisbon');
		expect(timeZoneOrUtc('Mars/Olympus')).toBe('UTC');
		expect(timeZoneOrUtc('')).toBe('UTC');
	});
});
