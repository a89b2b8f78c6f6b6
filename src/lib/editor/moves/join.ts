import { join } from '$lib/pattern/panels';
import { pieceMetrics } from '$lib/pattern/metrics';
import { docMerge } from '../state/doc-edits';
import { areaText, angleText } from '$lib/pattern/measurements/units';
import type { MoveContext } from './context';
import { chosenPair, firstUsablePair, selectedPairOr, opPieces, pairOverlay, seamPickDown, type SeamPick } from './seams';
import { emptyPreview, NOTHING, outcome, type MoveDef, type MovePreview, type OverlayItem } from './types';

export interface JoinState extends SeamPick {
	id: 'join';
	/** At a divergence point the wedge between the panels is closed (and opened as a dart) or kept as a dart. */
	wedge: 'close' | 'keep_as_dart';
}

function joinRun(ctx: MoveContext, st: JoinState) {
	const c = chosenPair(ctx, st);
	if (!c) return null;
	const op = opPieces(ctx, [c.pair.a.pieceId, c.pair.b.pieceId]);
	if (!op) return null;
	const [a, b] = op.pieces;
	const name = `${a.name} + ${b.name}`;
	const seam = op.pairFor(c.pair);
	// the step as the server recomputes it: the seam's edges, and the style's stored pair when one was chosen
	const stored = ctx.seamPairs.some((x) => x.id === st.seamPairId && x.id === c.pair.id);
	const params = { seam: stored ? { ...seam, storedId: c.pair.id } : seam, wedge: st.wedge, name };
	return { c, a, b, params, r: join(op.pieces, seam, { wedge: st.wedge, name }) };
}

/** Join: merge two pieces along their shared seam; at a divergence point close the wedge or keep it as a dart. */
export const joinMove: MoveDef<JoinState> = {
	id: 'join',
	name: 'Join',
	key: 'j',
	icon: 'M3 5 L11 5 L11 19 L3 19 Z M13 5 L21 5 L21 19 L13 19 Z M9 12 L15 12 M13 10 L15 12 L13 14',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'join', seamPairId: selectedPairOr(ctx, firstUsablePair(ctx)), edgePicks: [], wedge: prev?.wedge ?? 'close' }),
	started: (st) => st.edgePicks.length > 0,
	hint(_ctx, st) {
		const n = st.edgePicks.length;
		if (st.seamPairId) return 'Joining along the chosen seam pair; or click two ends of an edge on each piece. Enter or Apply joins.';
		if (n === 0) return 'Choose a seam pair, or click the two ends of the seam edge on the first piece.';
		if (n === 1) return 'Click the other end of the edge on the same piece.';
		if (n === 2) return 'Click the two ends of the matching edge on the second piece.';
		if (n === 3) return 'Click the other end of the second edge.';
		return 'Enter or Apply joins the pieces.';
	},
	down: seamPickDown,
	commit(ctx, st) {
		const run = joinRun(ctx, st);
		if (!run) return NOTHING;
		if (!run.r.ok) return outcome(run.r.error.message);
		const { c, a, b, r, params } = run;
		const merge = { sources: [c.pair.a.pieceId, c.pair.b.pieceId], made: r.pieces, step: { op: 'join' as const, params }, label: `${a.name} and ${b.name} joined — ${r.report.summary}` };
		return outcome(ctx.edit((doc, stamp) => docMerge(doc, merge, stamp)), 'select');
	},
	preview(ctx, st): MovePreview | null {
		const run = joinRun(ctx, st);
		const picks = st.edgePicks;
		const overlay: OverlayItem[] = picks.map((q) => {
			const o = ctx.piece(q.pieceKey)?.offset ?? { x: 0, y: 0 };
			return { kind: 'point' as const, at: { x: q.at.x + o.x, y: q.at.y + o.y }, tone: 'select' as const };
		});
		if (!run) return picks.length ? { ...emptyPreview(null), overlay } : null;
		const { c, a, b, r } = run;
		const seam = pairOverlay(ctx, c.pair);
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
				{ label: 'Wedge at the divergence point', value: angleText(angle) },
				{ label: st.wedge === 'close' ? 'Closed; opened as a dart' : 'Kept as a dart', value: dart ? dart.id : 'none' },
				{ label: 'Area before', value: areaText(r.report.values.areaBeforeMm2 ?? 0, ctx.unit) },
				{ label: 'Area after', value: areaText(pieceMetrics(r.pieces[0]).areaMm2, ctx.unit) }
			],
			ledger: r.ledgerEntries,
			overlay,
			overlayWorld: true,
			notes: [r.report.summary, ...r.report.notes],
			canCommit: true
		};
	}
};
