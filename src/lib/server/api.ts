import { log } from './log';
import { isHttpError, isRedirect, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { databaseUnavailableJson } from './db/unavailable-response';
import { errorIsDatabaseUnavailable } from './db/unavailable';
import { ApiError, defaultErrorCode, jsonError } from './http-errors';
import { fieldErrors } from './validation';

/** Largest JSON body the API routes of this module read (bytes). */
export const API_BODY_LIMIT = 1024 * 1024;

/**
 * Wraps a +server.ts handler: whatever it throws (ApiError, SvelteKit's error(), anything else)
 * becomes `{ error: { code, message, fields? } }` with the right status; unexpected errors are
 * logged and answered 500 without details.
 */
export function apiRoute<E extends RequestEvent>(handler: (event: E) => Promise<Response>) {
	return async (event: E): Promise<Response> => {
		try {
			return await handler(event);
		} catch (e) {
			if (e instanceof ApiError) return jsonError(e.status, e.code, e.message, e.fields, e.headers);
			if (isHttpError(e)) {
				return jsonError(e.status, e.body.code ?? defaultErrorCode(e.status), e.body.message, e.body.fields);
			}
			if (isRedirect(e)) throw e;
			if (errorIsDatabaseUnavailable(e)) return databaseUnavailableJson();
			log.error({ method: event.request.method, route: event.route.id, err: e }, 'unexpected error in an API route');
			return jsonError(500);
		}
	};
}

function tooLarge(limit: number): ApiError {
	// The rest of the body stays unread: close the connection after answering.
	return new ApiError(413, 'payload_too_large', `The request body is larger than ${limit} bytes.`, undefined, {
		connection: 'close'
	});
}

/**
 * Reads the body as text, refusing it (413) past `limit` by content-length or by bytes read. A body
 * over the limit is still read to its end (and dropped) so that the client, still sending, receives
 * the 413 instead of a broken connection; adapter-node's BODY_SIZE_LIMIT bounds what that costs.
 */
export async function readBodyLimited(request: Request, limit = API_BODY_LIMIT): Promise<string> {
	if (!request.body) return '';
	const declared = request.headers.get('content-length');
	let over = declared !== null && Number(declared) > limit;
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) break;
			size += value.byteLength;
			if (size > limit) over = true;
			if (!over) chunks.push(value);
		}
	} catch (e) {
		// adapter-node's own BODY_SIZE_LIMIT surfaces here as a stream error with status 413
		if ((e as { status?: number })?.status === 413 || over) throw tooLarge(limit);
		throw new ApiError(400, 'bad_request', 'The request body could not be read.');
	}
	if (over) throw tooLarge(limit);
	return Buffer.concat(chunks).toString('utf8');
}

/** Reads and size-checks a JSON body and parses it, without validating its shape. */
async function readJsonValue(request: Request, limit: number): Promise<unknown> {
	const type = request.headers.get('content-type') ?? '';
	if (!/^application\/(.+\+)?json\b/i.test(type)) {
		throw new ApiError(415, 'unsupported_media_type', 'Send JSON (Content-Type: application/json).');
	}
	const text = await readBodyLimited(request, limit);
	let value: unknown;
	try {
		value = text === '' ? undefined : JSON.parse(text);
	} catch {
		throw new ApiError(400, 'invalid_json', 'The request body is not valid JSON.');
	}
	// JSON can carry U+0000 only as the escape \u0000: look further only when the text holds one
	if (text.includes('\\u0000') && jsonHoldsNul(value)) {
		throw new ApiError(400, 'invalid', 'The request body holds the NUL character (\\u0000), which no text may contain.');
	}
	return value;
}

/**
 * Does a parsed JSON value hold U+0000 in any string or key? PostgreSQL stores it in neither text nor
 * jsonb (the insert would fail), so such a body is refused before any database work. Walks without
 * recursion: a body may be nested thousands deep.
 */
export function jsonHoldsNul(value: unknown): boolean {
	const stack: unknown[] = [value];
	while (stack.length > 0) {
		const v = stack.pop();
		if (typeof v === 'string') {
			if (v.includes('\u0000')) return true;
		} else if (Array.isArray(v)) {
			for (const x of v) stack.push(x);
		} else if (v !== null && typeof v === 'object') {
			for (const [k, x] of Object.entries(v)) {
				if (k.includes('\u0000')) return true;
				stack.push(x);
			}
		}
	}
	return false;
}

function validated<S extends z.ZodType>(value: unknown, schema: S): z.output<S> {
	const parsed = schema.safeParse(value);
	if (!parsed.success) {
		throw new ApiError(400, 'invalid', 'Some fields are not valid.', fieldErrors(parsed.error));
	}
	return parsed.data;
}

/** Reads, size-checks, parses and validates a JSON body; 400 with field errors when it does not fit. */
export async function readJson<S extends z.ZodType>(
	request: Request,
	schema: S,
	limit = API_BODY_LIMIT
): Promise<z.output<S>> {
	return validated(await readJsonValue(request, limit), schema);
}

/**
 * The body of every PATCH route: a JSON object holding at least one of the fields the resource lets
 * change. Anything else (an empty object, only unknown keys, only `flags` such as acceptWarnings, an
 * array, null, a number, a string) is answered 400 with the list of fields that can be changed,
 * before any database work. Unknown keys next to known ones are ignored, as in every other body.
 */
export async function readPatch<S extends z.ZodObject>(
	request: Request,
	schema: S,
	options: { flags?: readonly string[]; limit?: number; nothingMessage?: (fields: string) => string } = {}
): Promise<z.output<S>> {
	const value = await readJsonValue(request, options.limit ?? API_BODY_LIMIT);
	const flags = new Set(options.flags ?? []);
	const changeable = Object.keys(schema.shape).filter((k) => !flags.has(k));
	const list = changeable.join(', ');
	if (typeof value !== 'object' || value === null || Array.isArray(value)) {
		throw new ApiError(400, 'invalid', `Send a JSON object with the fields to change (${list}).`);
	}
	if (!changeable.some((k) => (value as Record<string, unknown>)[k] !== undefined)) {
		const message = options.nothingMessage?.(list) ?? `Nothing to change: send at least one of ${list}.`;
		throw new ApiError(400, 'nothing_to_change', message);
	}
	return validated(value, schema);
}

/** Validates route params; 400 with field errors. */
export function parseParams<S extends z.ZodType>(params: unknown, schema: S): z.output<S> {
	const parsed = schema.safeParse(params);
	if (!parsed.success) {
		throw new ApiError(400, 'invalid_params', 'Some parts of the address are not valid.', fieldErrors(parsed.error));
	}
	return parsed.data;
}
