import { ApiError } from '../http-errors';
import type { SaveOutcome } from './save';

/** A refused save as the API's JSON error (409 carries the current head; 422 says what is wrong). */
export function saveRefusal(r: Extract<SaveOutcome, { ok: false }>): ApiError {
	if (r.status === 404) return new ApiError(404, 'not_found', r.message);
	if (r.status === 409) {
		return new ApiError(409, 'stale_base', r.message, { head: [JSON.stringify(r.head)] }, {
			'x-head-version': r.head.id ?? '',
			'x-head-number': String(r.head.number)
		});
	}
	return new ApiError(422, r.problem.code, r.problem.message, r.problem.details ? { details: [...r.problem.details] } : undefined);
}
