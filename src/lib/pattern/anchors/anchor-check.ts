import { vecDistance } from '../kernel';
import type { Piece } from '../piece-schema';
import { anchorBody, anchorDescribe, anchorResolve, anchorSchema, type AnchorBody } from './anchor';

/**
 * The check a save makes of the anchors a client sent with a step's points: each anchor, found on the
 * piece the step is made on (the source it names, for a step spanning pieces), must give the point it
 * stands beside within `toleranceMm`. A size run trusts a stored anchor over the point, so an anchor that
 * says something else than the point would make every other size differently from this one. Points
 * without an anchor are not checked (their anchor is read from the piece when a run needs it). Pure.
 */

export const ANCHOR_TOLERANCE_MM = 0.01;

const isVec = (v: unknown): v is { x: number; y: number; anchor?: unknown } =>
	typeof v === 'object' && v !== null && !Array.isArray(v) && typeof (v as { x?: unknown }).x === 'number' && typeof (v as { y?: unknown }).y === 'number';

/** What is wrong with the anchors of a step's parameters on its pieces, in the trade's words; empty when all agree. */
export function stepAnchorProblems(params: unknown, pieces: readonly Piece[], spansPieces: boolean, toleranceMm = ANCHOR_TOLERANCE_MM): string[] {
	const bodies: (AnchorBody | undefined)[] = [];
	const body = (k: number) => (pieces[k] ? (bodies[k] ??= anchorBody(pieces[k])) : undefined);
	const out: string[] = [];
	const visit = (value: unknown, only: number | null) => {
		if (out.length >= 3) return;
		if (Array.isArray(value)) return value.forEach((v) => visit(v, only));
		if (isVec(value)) {
			if (value.anchor === undefined) return;
			const at = `the point (${value.x.toFixed(1)}, ${value.y.toFixed(1)})`;
			const parsed = anchorSchema.safeParse(value.anchor);
			if (!parsed.success) return void out.push(`${at} carries an anchor that cannot be read: ${parsed.error.issues[0]?.message ?? 'invalid'}`);
			const a = parsed.data;
			const k = (a.kind === 'offset' ? a.of.piece : a.piece) ?? only ?? 0;
			const b = body(k);
			if (!b) return void out.push(`${at} is anchored on source ${k + 1}, which this step does not have`);
			const r = anchorResolve(b, a);
			if (!r.ok) return void out.push(`${at} is anchored at ${anchorDescribe(a)}, which cannot be found: ${r.message}`);
			const d = vecDistance(r.point, value);
			if (!(d <= toleranceMm)) out.push(`${at} is anchored at ${anchorDescribe(a)}, which is ${d.toFixed(2)} mm away from it (${toleranceMm} mm allowed)`);
			return;
		}
		if (typeof value !== 'object' || value === null) return;
		const o = value as Record<string, unknown>;
		let here = only;
		if (spansPieces && typeof o.pieceId === 'string' && 'edge' in o) {
			const k = pieces.findIndex((p) => p.id === o.pieceId);
			here = k < 0 ? only : k;
		}
		for (const v of Object.values(o)) visit(v, here);
	};
	visit(params, spansPieces ? null : 0);
	return out;
}
