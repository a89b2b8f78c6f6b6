import type { Handle } from '@sveltejs/kit';
import { defaultErrorCode, defaultErrorMessage, jsonError } from '../http-errors';
import { isApi, mutable } from './common';

/** Non-JSON or SvelteKit-shaped errors on /api become `{ error: { code, message } }`. */
export async function apiErrorShape(response: Response): Promise<Response> {
	if (response.status < 400) return response;
	const type = response.headers.get('content-type') ?? '';
	let message = defaultErrorMessage(response.status);
	if (type.includes('application/json')) {
		const body = (await response.clone().json().catch(() => null)) as { error?: unknown; message?: unknown } | null;
		if (body && typeof body.error === 'object' && body.error !== null) return response;
		if (body && typeof body.message === 'string' && response.status < 500) message = body.message;
	}
	const out = jsonError(response.status, defaultErrorCode(response.status), message);
	for (const h of ['allow', 'retry-after', 'set-cookie']) {
		const v = response.headers.get(h);
		if (v) out.headers.set(h, v);
	}
	return out;
}

/** Every API answer: errors in the API's JSON shape, and never cached. */
export const handleApiShape: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	if (!isApi(event.url.pathname)) return response;
	const shaped = mutable(await apiErrorShape(response));
	shaped.headers.set('cache-control', 'no-store');
	return shaped;
};
