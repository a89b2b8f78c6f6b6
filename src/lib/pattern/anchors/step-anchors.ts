import type { Vec } from '../kernel';
import { anchorBody, anchorBodyLike, anchorDescribe, anchorResolve, anchorSchema, type Anchor, type AnchorBody } from './anchor';
import { anchorInferAmong } from './anchor-infer';
import type { Piece } from '../piece-schema';

/**
 * A step's parameters carried from the body they were made on to another body (the same step on the
 * block of another size). Every point in the parameters (any `{ x, y }`, the ends and control points of
 * a path among them) is found again by its anchor: the one stored beside it (`anchor`), else the one
 * read from the base body by the rules of anchor-infer.ts. A point on a seam pair's edge
 * (`{ pieceId, edge }`) is anchored on that piece; any other point of a step spanning pieces on
 * whichever source it belongs to.
 */

export type StepCarry = { readonly ok: true; readonly params: unknown } | { readonly ok: false; readonly message: string; readonly anchor?: Anchor };

interface Ctx {
	readonly base: readonly AnchorBody[];
	readonly target: readonly AnchorBody[];
	readonly spans: boolean;
	/** Inferred anchors by the base point (a shared path end gets the same anchor and point). */
	readonly memo: Map<string, Vec>;
}

const isVec = (v: unknown): v is { x: number; y: number; anchor?: unknown } =>
	typeof v === 'object' && v !== null && !Array.isArray(v) && typeof (v as { x?: unknown }).x === 'number' && typeof (v as { y?: unknown }).y === 'number';

class CarryFailure {
	constructor(readonly message: string, readonly anchor?: Anchor) {}
}

function carryPoint(ctx: Ctx, v: { x: number; y: number; anchor?: unknown }, only: number | null): Vec {
	const key = `${only ?? '*'}:${v.x}:${v.y}:${JSON.stringify(v.anchor ?? null)}`;
	const known = ctx.memo.get(key);
	if (known) return known;
	let anchor: Anchor | null = null;
	if (v.anchor !== undefined) {
		const parsed = anchorSchema.safeParse(v.anchor);
		if (!parsed.success) throw new CarryFailure(`a point carries an anchor that cannot be read: ${parsed.error.issues[0]?.message ?? 'invalid'}`);
		anchor = parsed.data;
	} else {
		const bodies = only === null ? ctx.base : [ctx.base[only]];
		const indices = only === null ? ctx.base.map((_, k) => k) : [only];
		anchor = anchorInferAmong(bodies, v, ctx.spans ? indices : undefined);
	}
	if (!anchor) throw new CarryFailure(`the point (${v.x.toFixed(1)}, ${v.y.toFixed(1)}) cannot be tied to anything on the piece it was made on`);
	const k = anchorPiece(anchor) ?? only ?? 0;
	const body = ctx.target[k];
	if (!body) throw new CarryFailure(`${anchorDescribe(anchor)} is on a piece this step does not have`, anchor);
	const r = anchorResolve(body, anchor);
	if (!r.ok) throw new CarryFailure(`${anchorDescribe(anchor)}: ${r.message}`, anchor);
	ctx.memo.set(key, r.point);
	return r.point;
}

function anchorPiece(a: Anchor): number | undefined {
	return a.kind === 'offset' ? a.of.piece : a.piece;
}

function walk(ctx: Ctx, value: unknown, only: number | null): unknown {
	if (Array.isArray(value)) return value.map((v) => walk(ctx, v, only));
	if (isVec(value)) {
		const p = carryPoint(ctx, value, only);
		const { anchor: _a, ...rest } = value;
		return { ...rest, x: p.x, y: p.y };
	}
	if (typeof value !== 'object' || value === null) return value;
	const o = value as Record<string, unknown>;
	let here = only;
	if (ctx.spans && typeof o.pieceId === 'string' && 'edge' in o) {
		const k = ctx.base.findIndex((b) => b.piece.id === o.pieceId);
		if (k < 0) throw new CarryFailure(`a seam names the piece "${o.pieceId}", which is not a source of this step`);
		here = k;
	}
	return Object.fromEntries(Object.entries(o).map(([key, v]) => [key, walk(ctx, v, here)]));
}

/**
 * Carries a step's parameters from the pieces it was made on (`base`, its sources in order) to other
 * pieces (`target`, the same sources on another body). Fails in the trade's words when a point cannot be
 * found again ("30 % along the shoulder: the Upper front has no shoulder").
 */
export function stepParamsCarry(params: unknown, base: readonly Piece[], target: readonly Piece[], spansPieces: boolean): StepCarry {
	const bases = base.map(anchorBody);
	const ctx: Ctx = { base: bases, target: target.map((t, k) => (bases[k] ? anchorBodyLike(t, bases[k]) : anchorBody(t))), spans: spansPieces, memo: new Map() };
	try {
		return { ok: true, params: walk(ctx, params, spansPieces ? null : 0) };
	} catch (e) {
		if (e instanceof CarryFailure) return { ok: false, message: e.message, ...(e.anchor ? { anchor: e.anchor } : {}) };
		throw e;
	}
}

/** Every point of a step's parameters with the anchor it has on the base body (the editor shows these). */
export function stepAnchors(params: unknown, base: readonly Piece[], spansPieces: boolean): { point: Vec; anchor: Anchor | null }[] {
	const bodies = base.map(anchorBody);
	const out: { point: Vec; anchor: Anchor | null }[] = [];
	const visit = (value: unknown, only: number | null) => {
		if (Array.isArray(value)) return value.forEach((v) => visit(v, only));
		if (isVec(value)) {
			const given = value.anchor !== undefined ? anchorSchema.safeParse(value.anchor) : null;
			const b = only === null ? bodies : [bodies[only]];
			const idx = only === null ? bodies.map((_, k) => k) : [only];
			out.push({ point: { x: value.x, y: value.y }, anchor: given?.success ? given.data : anchorInferAmong(b, value, spansPieces ? idx : undefined) });
			return;
		}
		if (typeof value !== 'object' || value === null) return;
		const o = value as Record<string, unknown>;
		let here = only;
		if (spansPieces && typeof o.pieceId === 'string' && 'edge' in o) {
			const k = bodies.findIndex((b) => b.piece.id === o.pieceId);
			here = k < 0 ? only : k;
		}
		for (const v of Object.values(o)) visit(v, here);
	};
	visit(params, spansPieces ? null : 0);
	return out;
}
