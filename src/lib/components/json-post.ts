/**
 * A page's POST of a JSON body to the API, reported the way the pages report it. On success `done` runs
 * with the answer's body and null is returned; otherwise the message to show: the API's own, else a
 * general one, or that the server could not be reached (also when `done` fails). Never throws.
 */
export async function jsonPost<T>(url: string, payload: unknown, done: (body: T) => void | Promise<void>): Promise<string | null> {
	try {
		const r = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(payload) });
		const body = await r.json();
		if (!r.ok) return body.error?.message ?? 'That did not work.';
		await done(body as T);
		return null;
	} catch {
		return 'The server could not be reached; nothing changed.';
	}
}
