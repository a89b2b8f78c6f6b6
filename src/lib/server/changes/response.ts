import { ApiError } from '../http-errors';
import type { ChangeOutcome } from './save';

/** A refused change as the API's JSON error: 409 lists the stale bases, 422 says what is wrong and where. */
export function changeRefusal(r: Extract<ChangeOutcome, { ok: false }>): ApiError {
	if (r.status === 404) return new ApiError(404, 'not_found', r.message);
	if (r.status === 409) {
		const names = r.stale.map((s) => `${s.name} (now version ${s.headNumber})`).join(', ');
		return new ApiError(409, 'stale_base', `Someone saved a newer version of ${names} after you started. Nothing was saved: reload and make the change again.`, {
			bases: r.stale.map((s) => s.pieceId),
			heads: r.stale.map((s) => s.headVersionId ?? '')
		});
	}
	const p = r.problem;
	const fields: Record<string, string[]> = {};
	if (p.pieceIndex !== undefined) fields.piece = [String(p.pieceIndex)];
	if (p.distanceMm !== undefined && Number.isFinite(p.distanceMm)) fields.distanceMm = [p.distanceMm.toFixed(3)];
	if (p.details?.length) fields.details = [...p.details];
	return new ApiError(422, p.code, p.message, Object.keys(fields).length ? fields : undefined);
}
