// The Billing page's calls to the API, and waiting for the payment provider's webhook to show.
import type { BillingSummary } from '$lib/billing/summary';

export type Answer<T> = { ok: true; data: T } | { ok: false; message: string; code: string };

export async function billingCall<T>(method: string, url: string, body?: unknown): Promise<Answer<T>> {
	let res: Response;
	try {
		res = await fetch(url, {
			method,
			headers: { accept: 'application/json', ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
			body: body === undefined ? undefined : JSON.stringify(body)
		});
	} catch {
		return { ok: false, code: 'network', message: 'The server did not answer. Check your connection.' };
	}
	const data = await res.json().catch(() => null);
	if (!res.ok) {
		const e = (data as { error?: { code: string; message: string } } | null)?.error;
		return { ok: false, code: e?.code ?? 'error', message: e?.message ?? `Request failed (${res.status}).` };
	}
	return { ok: true, data: data as T };
}

/**
 * Asks the server for the studio's billing every second until `done` holds (the provider's webhook has
 * been handled) or `tries` run out. Each answer is handed to `seen` so the page always shows the
 * server's state, never what the return address claims.
 */
export async function billingAwait(
	url: string,
	done: (b: BillingSummary) => boolean,
	seen: (b: BillingSummary) => void,
	tries = 60
): Promise<boolean> {
	for (let i = 0; i < tries; i++) {
		await new Promise((r) => setTimeout(r, 1000));
		const r = await billingCall<BillingSummary>('GET', url);
		if (!r.ok) continue;
		seen(r.data);
		if (done(r.data)) return true;
	}
	return false;
}
