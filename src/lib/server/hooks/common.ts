import type { Handle } from '@sveltejs/kit';

export type Event = Parameters<Handle>[0]['event'];
export type Resolve = Parameters<Handle>[0]['resolve'];

export const isApi = (pathname: string) => pathname === '/api' || pathname.startsWith('/api/');

/** A response whose headers may be changed (some, like fetch's or a redirect's, are immutable). */
export function mutable(response: Response): Response {
	try {
		response.headers.set('x-content-type-options', 'nosniff');
		return response;
	} catch {
		return new Response(response.body, response);
	}
}
