import { outlineNearestPoint, vecDistance } from '$lib/geometry';
import type { AllowanceCorner } from '$lib/pattern/panels';
import { allowanceEdges } from '$lib/pattern/panels/allowance-edges';
import { editableSelected, movePiece, pickPiece, reportReadouts, stepPreview, type OnPiece } from './common';
import { NOTHING, outcome, type MoveDef } from './types';

export interface AllowanceState extends OnPiece {
	id: 'allowance';
	defaultWidthMm: number;
	/** Edges given their own width (allowance edge index → width). */
	edgeWidths: { edge: number; widthMm: number }[];
	/** Corners given their own shape (corner index → shape). */
	corners: Record<number, AllowanceCorner>;
	/** The shape of every other corner. */
	otherCorners: 'mitre' | 'square';
}

export function allowanceStep(st: AllowanceState) {
	const widths: Record<string, number> = {};
	for (const e of st.edgeWidths) widths[String(e.edge)] = e.widthMm;
	return { op: 'allowance', params: { defaultWidthMm: st.defaultWidthMm, widthsMm: widths, corners: { ...st.corners }, defaultCorner: st.otherCorners } };
}

/** Allowance: the seam allowance round the piece; an edge or a corner can have its own. Allowance comes last. */
export const allowanceMove: MoveDef<AllowanceState> = {
	id: 'allowance',
	name: 'Allowance',
	key: 'a',
	icon: 'M5 5 L19 5 L19 19 L5 19 Z M2 2 L22 2 L22 22 L2 22 Z',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'allowance', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), defaultWidthMm: prev?.defaultWidthMm ?? 10, edgeWidths: [], corners: {}, otherCorners: 'mitre' }),
	started: (st) => st.edgeWidths.length > 0 || Object.keys(st.corners).length > 0,
	hint: () => 'Type the seam allowance; click an edge to give it its own width, or a corner to shape it (folded as it will be pressed). Allowance comes last: Enter applies.',
	down(ctx, st, p) {
		const h = p.hit;
		if (!h) return false;
		if (h.pieceKey !== st.pieceKey) {
			st.edgeWidths = [];
			st.corners = {};
		}
		if (!pickPiece(ctx, st, h.pieceKey)) return false;
		const g = movePiece(ctx, st);
		if (!g || !(h.kind === 'edge' || h.kind === 'point')) return false;
		const edges = allowanceEdges(g);
		// a click on a corner (where one allowance edge ends and the next starts) picks that corner
		const corner = edges.findIndex((e) => vecDistance(e.path.segments[0].p0, h.local) <= ctx.tolMm(6));
		if (corner >= 0 && edges.length > 1) {
			if (!(corner in st.corners)) st.corners = { ...st.corners, [corner]: 'folded_next' };
			return false;
		}
		let best = -1;
		let bestD = ctx.tolMm(10);
		for (const e of edges) {
			const d = outlineNearestPoint(e.path, h.local).distance;
			if (d <= bestD) {
				bestD = d;
				best = e.index;
			}
		}
		if (best >= 0 && !st.edgeWidths.some((e) => e.edge === best)) st.edgeWidths = [...st.edgeWidths, { edge: best, widthMm: st.defaultWidthMm }];
		return false;
	},
	commit(ctx, st) {
		return st.pieceKey && movePiece(ctx, st) ? outcome(ctx.apply(st.pieceKey, allowanceStep(st))) : NOTHING;
	},
	preview(ctx, st) {
		if (!movePiece(ctx, st)) return null;
		return stepPreview(ctx, st, allowanceStep(st), [], reportReadouts(ctx.unit));
	}
};
