import { pieceMetrics } from '$lib/pattern/metrics';
import { emptyPreview, type ToolDef } from './types';
import { toolPiece } from './common';
import { internalLineNear } from '../hit';
import { editorSeparate } from '../ops';
import { fmtArea } from '../units';
import { divergenceProposals } from '../divergence-marking';

/** Separate: cut a piece along one of its style lines into two pieces. */
export const separateTool: ToolDef = {
	id: 'separate',
	name: 'Separate',
	key: 'x',
	icon: 'M4 4 L20 4 L20 20 L4 20 Z M3 12 L21 12 M7 9 L9 12 L7 15',
	edits: true,
	hint: (s) => (s.input.lineId ? 'Enter or Apply cuts the piece along the style line.' : 'Click a style line on a piece.'),
	down(s, p) {
		const h = p.hit;
		if (!h) return false;
		const g = s.piece(h.pieceKey)?.geometry;
		const id = g && internalLineNear(g, s.local(h.pieceKey, p.world), s.tolMm(12));
		if (id) {
			s.input.pieceKey = h.pieceKey;
			s.input.lineId = id;
			s.selection.pieceKey = h.pieceKey;
		}
		return false;
	},
	commit(s) {
		const key = s.input.pieceKey;
		if (!key || !s.input.lineId) return;
		const err = s.separatePiece(key, s.input.lineId);
		s.toolMessage = err;
		if (!err) s.setTool('select');
	},
	preview(s) {
		const piece = toolPiece(s);
		if (!piece || !s.input.lineId) return null;
		const r = editorSeparate(piece, { styleLineId: s.input.lineId });
		if (!r.ok) return emptyPreview(s.input.pieceKey, r.error.message);
		return {
			pieceKey: s.input.pieceKey,
			piece: null,
			pieces: r.pieces,
			error: null,
			readouts: r.pieces.map((q, i) => ({ label: `Piece ${i + 1} area`, value: fmtArea(pieceMetrics(q).areaMm2, s.unit) })),
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
