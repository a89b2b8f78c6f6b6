import { randomBytes } from 'node:crypto';

/**
 * Content-Security-Policy and friends, set from `handle` on every response SvelteKit renders.
 * SvelteKit's inline start-up script gets a per-response nonce (added to each <script> of the
 * rendered HTML in `transformPageChunk`); everything else must come from our own origin.
 * Styles allow 'unsafe-inline' because Svelte writes style attributes (transitions, style:
 * directives); images allow data: and blob: (canvas exports, previews) and the object store's origin
 * (fitting photos load from short-lived links to it). Do not also enable
 * `kit.csp` in svelte.config.js: two policies would both apply.
 */
export function cspNonce(): string {
	return randomBytes(16).toString('base64');
}

export function contentSecurityPolicy(nonce: string, imageOrigins: readonly string[] = []): string {
	return [
		"default-src 'self'",
		`script-src 'self' 'nonce-${nonce}'`,
		"style-src 'self' 'unsafe-inline'",
		["img-src 'self' data: blob:", ...imageOrigins].join(' '),
		"font-src 'self'",
		"connect-src 'self'",
		"worker-src 'self' blob:",
		"object-src 'none'",
		"base-uri 'self'",
		"form-action 'self'",
		"frame-ancestors 'none'"
	].join('; ');
}

/** The policy for responses that are not HTML pages (JSON, files): nothing may run or embed them. */
export const CSP_NON_HTML = "default-src 'none'; frame-ancestors 'none'";

/** Adds the nonce to every <script> tag of a rendered chunk that has none. */
export function scriptsWithNonce(html: string, nonce: string): string {
	return html.replace(/<script(?![^>]*\bnonce=)(?=[\s>])/g, `<script nonce="${nonce}"`);
}

export function securityHeadersSet(headers: Headers, nonce: string, imageOrigins: readonly string[] = []): void {
	const type = headers.get('content-type') ?? '';
	if (!headers.has('content-security-policy')) {
		headers.set('content-security-policy', type.startsWith('text/html') ? contentSecurityPolicy(nonce, imageOrigins) : CSP_NON_HTML);
	}
	headers.set('x-content-type-options', 'nosniff');
	headers.set('referrer-policy', 'strict-origin-when-cross-origin');
	headers.set('x-frame-options', 'DENY');
	headers.set('cross-origin-opener-policy', 'same-origin');
	headers.set('permissions-policy', 'camera=(self), microphone=(), geolocation=()');
}
