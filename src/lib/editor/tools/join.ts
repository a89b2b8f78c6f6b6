import { join } from '$lib/pattern/panels';
import { pieceMetrics } from '$lib/pattern/metrics';
import type { EditorState } from '../editor-state.svelte';
import { fmtArea, fmtDeg } from '../units';
import { chosenPair, opPieces, pairOverlay, seamPicking } from './seams';
import { emptyPreview, type OverlayItem, type ToolDef, type ToolPreview } from './types';

function joinRun(s: EditorState) {
	const c = chosenPair(s);
	if (!c) return null;
	const op = opPieces(s, [c.pair.a.pieceId, c.pair.b.pieceId]);
	if (!op) return null;
	const [a, b] = op.pieces;
	const name = `${a.name} + ${b.name}`;
	const seam = op.pairFor(c.pair);
	// the step as the server recomputes it: the seam's edges, and the style's stored pair when one was chosen
	const stored = s.seamPairs.some((x) => x.id === s.input.seamPairId && x.id === c.pair.id);
	const params = { seam: stored ? { ...seam, storedId: c.pair.id } : seam, wedge: s.input.wedge, name };
	return { c, a, b, params, r: join(op.pieces, seam, { wedge: s.input.wedge, name }) };
}

/** Join: merge two pieces along their shared seam; at a divergence point close the wedge or keep it as a dart. */
export const joinTool: ToolDef = {
	id: 'join',
	name: 'Join',
	key: 'j',
	icon: 'M3 5 L11 5 L11 19 L3 19 Z M13 5 L21 5 L21 19 L13 19 Z M9 12 L15 12 M13 10 L15 12 L13 14',
	edits: true,
	hint(s) {
		const n = s.input.edgePicks.length;
		if (s.input.seamPairId) return 'Joining along the chosen seam pair; or click two ends of an edge on each piece. Enter or Apply joins.';
		if (n === 0) return 'Choose a seam pair, or click the two ends of the seam edge on the first piece.';
		if (n === 1) return 'Click the other end of the edge on the same piece.';
		if (n === 2) return 'Click the two ends of the matching edge on the second piece.';
		if (n === 3) return 'Click the other end of the second edge.';
		return 'Enter or Apply joins the pieces.';
	},
	...seamPicking,
	commit(s) {
		const run = joinRun(s);
		if (!run) return;
		if (!run.r.ok) {
			s.toolMessage = run.r.error.message;
			return;
		}
		const { c, a, b, r, params } = run;
		const err = s.mergePieces(
			[c.pair.a.pieceId, c.pair.b.pieceId],
			r.pieces,
			{ op: 'join', params },
			`${a.name} and ${b.name} joined — ${r.report.summary}`
		);
		s.toolMessage = err;
		if (!err) s.setTool('select');
	},
	preview(s): ToolPreview | null {
		const run = joinRun(s);
		const picks = s.input.edgePicks;
		const overlay: OverlayItem[] = picks.map((q) => {
			const o = s.piece(q.pieceKey)?.offset ?? { x: 0, y: 0 };
			return { kind: 'point' as const, at: { x: q.at.x + o.x, y: q.at.y + o.y }, tone: 'select' as const };
		});
		if (!run) return picks.length ? { ...emptyPreview(null), overlay } : null;
		const { c, a, b, r } = run;
		const seam = pairOverlay(s, c.pair);
		overlay.push({ kind: 'line', points: seam.a, tone: 'select' }, { kind: 'line', points: seam.b, tone: 'select', dashed: true });
		if (!r.ok) return { ...emptyPreview(null, r.error.message), overlay, overlayWorld: true };
		// on the merged piece (drawn where piece a lies) the seam is edge a
		overlay.splice(overlay.length - 1, 1);
		const angle = Math.abs(r.ledgerEntries[0]?.angleRad ?? 0);
		const dart = r.pieces[0].darts.find((d) => !a.darts.some((x) => x.id === d.id) && !b.darts.some((x) => x.id === d.id));
		return {
			pieceKey: c.pair.a.pieceId,
			piece: null,
			pieces: r.pieces,
			hides: [c.pair.a.pieceId, c.pair.b.pieceId],
			error: null,
			readouts: [
				{ label: 'Seam', value: c.label },
				{ label: 'Wedge at the divergence point', value: fmtDeg(angle) },
				{ label: s.input.wedge === 'close' ? 'Closed; opened as a dart' : 'Kept as a dart', value: dart ? dart.id : 'none' },
				{ label: 'Area before', value: fmtArea(r.report.values.areaBeforeMm2 ?? 0, s.unit) },
				{ label: 'Area after', value: fmtArea(pieceMetrics(r.pieces[0]).areaMm2, s.unit) }
			],
			ledger: r.ledgerEntries,
			overlay,
			overlayWorld: true,
			notes: [r.report.summary, ...r.report.notes],
			canCommit: true
		};
	}
};
