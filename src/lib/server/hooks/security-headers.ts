import type { Handle } from '@sveltejs/kit';
import { storageOrigin } from '../storage';
import { mutable } from './common';

/**
 * Content-Security-Policy and friends on every response. Pages SvelteKit renders get their policy
 * from `kit.csp` in svelte.config.js (a nonce per response on SvelteKit's own inline scripts). The
 * object store's origin (fitting photos load from short-lived links to it) is known only when the app
 * runs (`S3_ENDPOINT`), so it is added to that policy's img-src here. Responses SvelteKit did not
 * render get a fixed policy: JSON and files may run or embed nothing; the app's own stand-alone pages
 * (the database-away page) may only use their inline styles.
 */
export const CSP_NON_HTML = "default-src 'none'; frame-ancestors 'none'";
export const CSP_STANDALONE_HTML =
	"default-src 'none'; style-src 'unsafe-inline'; img-src 'self'; font-src 'self'; base-uri 'none'; form-action 'self'; frame-ancestors 'none'";

/** The policy with `origins` added to its img-src (a policy without one is left as it is). */
export function cspImageOriginsAdd(policy: string, origins: readonly string[]): string {
	if (origins.length === 0) return policy;
	return policy
		.split(';')
		.map((d) => {
			const directive = d.trim();
			if (!/^img-src(\s|$)/.test(directive)) return directive;
			const have = new Set(directive.split(/\s+/));
			return [directive, ...origins.filter((o) => !have.has(o))].join(' ');
		})
		.join('; ');
}

export function securityHeadersSet(headers: Headers, imageOrigins: readonly string[]): void {
	const policy = headers.get('content-security-policy');
	if (policy) headers.set('content-security-policy', cspImageOriginsAdd(policy, imageOrigins));
	else headers.set('content-security-policy', (headers.get('content-type') ?? '').startsWith('text/html') ? CSP_STANDALONE_HTML : CSP_NON_HTML);
	headers.set('x-content-type-options', 'nosniff');
	headers.set('referrer-policy', 'strict-origin-when-cross-origin');
	headers.set('x-frame-options', 'DENY');
	headers.set('cross-origin-opener-policy', 'same-origin');
	headers.set('permissions-policy', 'camera=(self), microphone=(), geolocation=()');
}

export const handleSecurityHeaders: Handle = async ({ event, resolve }) => {
	const response = mutable(await resolve(event));
	const photos = storageOrigin();
	securityHeadersSet(response.headers, photos ? [photos] : []);
	return response;
};
