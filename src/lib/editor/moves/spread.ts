import { vecDistance } from '$lib/geometry';
import type { AnchoredPoint } from '$lib/pattern/anchors/anchor-pick';
import { pickedPoint } from './anchored';
import { editableSelected, mm, movePiece, stepPreview, type OnPiece } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef, type OverlayItem } from './types';

export interface SpreadState extends OnPiece {
	id: 'spread';
	/** Where the slash starts on the edge that spreads, and where it ends (the hinge, or the opposite edge). */
	ends: AnchoredPoint[];
	/** Hinged: one edge gets longer; parallel: the slash goes right through. */
	slash: 'hinged' | 'parallel';
	widthMm: number;
}

export function spreadStep(st: SpreadState) {
	const [from, to] = st.ends;
	if (!from || !to) return null;
	return { op: 'spread', params: { mode: st.slash, slashes: [{ from, to, widthMm: st.widthMm }] } };
}

/** Spread: slash from an edge (to a hinge, or right through) and open it by a typed width. */
export const spreadMove: MoveDef<SpreadState> = {
	id: 'spread',
	name: 'Spread',
	key: 'd',
	icon: 'M4 20 L10 4 M20 20 L14 4 M10 4 L14 4 M7 14 L17 14',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'spread', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), ends: [], slash: prev?.slash ?? 'hinged', widthMm: prev?.widthMm ?? 30 }),
	started: (st) => st.ends.length > 0,
	hint(_ctx, st) {
		const n = st.ends.length;
		if (n === 0) return 'Click the edge that spreads, where the slash starts.';
		if (n === 1) return st.slash === 'parallel' ? 'Click the opposite edge where the slash ends.' : 'Click the hinge point on the opposite edge.';
		return 'Type the spread width; Enter applies. Added fullness is declared in the ledger.';
	},
	down(ctx, st, p) {
		const h = p.hit;
		if (!h || !(h.kind === 'edge' || h.kind === 'point')) return false;
		if (st.ends.length === 0 || st.ends.length >= 2 || h.pieceKey !== st.pieceKey) {
			st.pieceKey = h.pieceKey;
			ctx.select(h.pieceKey);
			st.ends = [pickedPoint(ctx, st.pieceKey, h.local)];
		} else st.ends = [...st.ends, pickedPoint(ctx, st.pieceKey, h.local)];
		return false;
	},
	commit(ctx, st) {
		const s = spreadStep(st);
		return s && st.pieceKey ? outcome(ctx.apply(st.pieceKey, s)) : NOTHING;
	},
	preview(ctx, st) {
		const [a, b] = st.ends;
		if (!movePiece(ctx, st) || !a) return null;
		const overlay: OverlayItem[] = [{ kind: 'point', at: a, tone: 'preview' }, ...(b ? [{ kind: 'line' as const, points: [a, b], tone: 'preview' as const, dashed: true }] : [])];
		const s = spreadStep(st);
		if (!s) return { ...emptyPreview(st.pieceKey), overlay };
		return stepPreview(ctx, st, s, overlay, (v) => [
			{ label: 'Slash length', value: mm(ctx.unit, vecDistance(a, b!)) },
			...Object.entries(v).map(([k, x]) => ({ label: k.replace(/([A-Z])/g, ' $1').toLowerCase(), value: k.endsWith('Mm') ? mm(ctx.unit, x) : k.endsWith('Mm2') ? `${x.toFixed(0)} mm²` : k.endsWith('Rad') ? `${((x * 180) / Math.PI).toFixed(2)}°` : x.toFixed(2) }))
		]);
	}
};
