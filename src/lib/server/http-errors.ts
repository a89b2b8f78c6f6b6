import { json } from '@sveltejs/kit';

/** Every JSON error this app answers: `{ error: { code, message, fields? } }`. */
export interface ApiErrorBody {
	error: { code: string; message: string; fields?: Record<string, string[] | undefined> };
}

/** Thrown inside API handlers and turned into a JSON error by `apiRoute`. */
export class ApiError extends Error {
	constructor(
		readonly status: number,
		readonly code: string,
		message: string,
		readonly fields?: Record<string, string[] | undefined>,
		readonly headers?: Record<string, string>
	) {
		super(message);
	}
}

const DEFAULT_CODES: Record<number, [string, string]> = {
	400: ['bad_request', 'The request is not valid.'],
	401: ['unauthenticated', 'Sign in first.'],
	403: ['forbidden', 'Your role in this studio does not allow this.'],
	404: ['not_found', 'Not found.'],
	405: ['method_not_allowed', 'This method is not allowed here.'],
	409: ['conflict', 'This conflicts with the current state.'],
	413: ['payload_too_large', 'The request body is too large.'],
	415: ['unsupported_media_type', 'Send JSON (Content-Type: application/json).'],
	429: ['too_many_requests', 'Too many requests. Try again later.'],
	500: ['internal', 'Something went wrong on our side.'],
	503: ['unavailable', 'The service is not available right now. Try again in a moment.']
};

export function defaultErrorCode(status: number): string {
	return DEFAULT_CODES[status]?.[0] ?? (status >= 500 ? 'internal' : 'error');
}

export function defaultErrorMessage(status: number): string {
	return DEFAULT_CODES[status]?.[1] ?? (status >= 500 ? 'Something went wrong on our side.' : 'Request failed.');
}

export function jsonError(
	status: number,
	code = defaultErrorCode(status),
	message = defaultErrorMessage(status),
	fields?: Record<string, string[] | undefined>,
	headers?: Record<string, string>
): Response {
	const body: ApiErrorBody = { error: { code, message, ...(fields ? { fields } : {}) } };
	return json(body, { status, headers });
}
