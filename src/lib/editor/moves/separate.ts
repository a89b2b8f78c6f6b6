import { pieceMetrics } from '$lib/pattern/metrics';
import { divergenceProposals } from '../divergence-marking';
import { internalLineNear } from '../hit';
import { editorSeparate } from '../ops';
import { docSeparate } from '../state/doc-edits';
import { areaText } from '$lib/pattern/measurements/units';
import { editableSelected, movePiece, type OnPiece } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef } from './types';

export interface SeparateState extends OnPiece {
	id: 'separate';
	/** The style line to cut along. */
	lineId: string | null;
}

/** Separate: cut a piece along one of its style lines into two pieces. */
export const separateMove: MoveDef<SeparateState> = {
	id: 'separate',
	name: 'Separate',
	key: 'x',
	icon: 'M4 4 L20 4 L20 20 L4 20 Z M3 12 L21 12 M7 9 L9 12 L7 15',
	edits: true,
	fresh(ctx, prev) {
		const key = prev ? prev.pieceKey : editableSelected(ctx);
		return { id: 'separate', pieceKey: key, lineId: ctx.piece(key)?.geometry.internalLines[0]?.id ?? null };
	},
	started: () => false,
	hint: (_ctx, st) => (st.lineId ? 'Enter or Apply cuts the piece along the style line.' : 'Click a style line on a piece.'),
	down(ctx, st, p) {
		const h = p.hit;
		if (!h) return false;
		const g = ctx.piece(h.pieceKey)?.geometry;
		const id = g && internalLineNear(g, ctx.local(h.pieceKey, p.world), ctx.tolMm(12));
		if (id) {
			st.pieceKey = h.pieceKey;
			st.lineId = id;
			ctx.select(h.pieceKey);
		}
		return false;
	},
	commit(ctx, st) {
		const key = st.pieceKey;
		const lineId = st.lineId;
		if (!key || !lineId) return NOTHING;
		return outcome(ctx.edit((doc, stamp) => docSeparate(doc, key, lineId, stamp)), 'select');
	},
	preview(ctx, st) {
		const piece = movePiece(ctx, st);
		if (!piece || !st.lineId) return null;
		const r = editorSeparate(piece, { styleLineId: st.lineId });
		if (!r.ok) return emptyPreview(st.pieceKey, r.error.message);
		return {
			pieceKey: st.pieceKey,
			piece: null,
			pieces: r.pieces,
			error: null,
			readouts: r.pieces.map((q, i) => ({ label: `Piece ${i + 1} area`, value: areaText(pieceMetrics(q).areaMm2, ctx.unit) })),
			ledger: r.ledgerEntries,
			overlay: [],
			notes: [
				r.report.summary,
				...r.report.notes,
				...divergenceProposals(r.pieces).map((n) => `${n} will lie on the new seam: to carry or join the parts there, mark it as a divergence point (Shaping ledger, beside the point) after separating.`)
			],
			canCommit: true
		};
	}
};
