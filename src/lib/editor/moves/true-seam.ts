import { segmentFlatten, vecDistance, type Vec } from '$lib/geometry';
import { ledgerEntry } from '$lib/pattern/ledger';
import { trueSeam } from '$lib/pattern/panels';
import { reshapeChanges } from '$lib/pattern/reshape-declaration';
import type { Piece } from '$lib/pattern/piece-schema';
import { lengthReadoutText, lengthDifferenceText } from '$lib/pattern/measurements/units';
import type { SeamEdit } from '../doc';
import { anchoredMove } from './anchored';
import type { MoveContext } from './context';
import { chosenPair, firstUsablePair, selectedPairOr, opPieces, pairOverlay, pathEnd, pathStart, seamPickDown, type SeamPick } from './seams';
import { emptyPreview, NOTHING, outcome, type MoveDef, type MovePreview, type OverlayItem } from './types';

export interface TrueSeamState extends SeamPick {
	id: 'true_seam';
	/** The end moved to make the seam true (none: measure only). */
	adjust: 'none' | 'a-start' | 'a-end' | 'b-start' | 'b-end';
}

function trueRun(ctx: MoveContext, st: TrueSeamState) {
	const c = chosenPair(ctx, st);
	if (!c) return null;
	const keys = [c.pair.a.pieceId, c.pair.b.pieceId];
	const op = opPieces(ctx, keys);
	if (!op) return null;
	const adj = st.adjust;
	const adjust = adj === 'none' ? undefined : { side: adj[0] as 'a' | 'b', end: (adj.endsWith('start') ? 'start' : 'end') as 'start' | 'end' };
	return { c, keys, before: op.pieces, r: trueSeam(op.pieces, { ...op.pairFor(c.pair), id: c.label }, { adjust }), adjust };
}

/** The outline points the truing moved, as a reshape step (ends and Bézier handles). */
export function reshapeMoves(before: Piece, after: Piece): { from: Vec; to: Vec }[] {
	const moves: { from: Vec; to: Vec }[] = [];
	const pts = (p: Piece) => p.outline.segments.flatMap((g) => (g.kind === 'line' ? [g.p0, g.p1] : [g.p0, g.p1, g.p2, g.p3]));
	const a = pts(before);
	const b = pts(after);
	if (a.length !== b.length) return [];
	for (let i = 0; i < a.length; i++) {
		if (vecDistance(a[i], b[i]) > 1e-9 && !moves.some((m) => vecDistance(m.from, a[i]) < 1e-6)) moves.push({ from: a[i], to: b[i] });
	}
	return moves;
}

/**
 * The stored seam pair's edge with its moved end at the new point (the other end kept as stored), so the
 * server measures the trued edge; null for a seam picked by clicking (nothing stored to move).
 */
function storedEndMoved(ctx: MoveContext, st: TrueSeamState, run: NonNullable<ReturnType<typeof trueRun>>): SeamEdit | undefined {
	const sp = ctx.seamPairs.find((x) => x.id === st.seamPairId);
	if (!sp || !run.r.ok || !run.adjust) return undefined;
	const side = run.adjust.side;
	const before = side === 'a' ? run.c.pair.a.edge : run.c.pair.b.edge;
	const after = side === 'a' ? run.r.seamPairs[0].a.edge : run.r.seamPairs[0].b.edge;
	const end = run.adjust.end === 'start' ? pathStart : pathEnd;
	const was = end(before);
	const now = end(after);
	const stored = side === 'a' ? sp.aEdge : sp.bEdge;
	// the stored end nearest the moved one follows it
	const movesFrom = vecDistance(stored.from, was) <= vecDistance(stored.to, was);
	return { seamPairId: sp.id, side, from: movesFrom ? now : stored.from, to: movesFrom ? stored.to : now };
}

/** True seam: both edges measured with darts folded out, the difference against the allowed ease, one end moved to match. */
export const trueSeamMove: MoveDef<TrueSeamState> = {
	id: 'true_seam',
	name: 'True seam',
	key: 't',
	icon: 'M4 8 L20 8 M4 16 L17 16 M20 13 L20 19 M4 5 L4 11 M4 13 L4 19 M20 5 L20 11',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'true_seam', seamPairId: selectedPairOr(ctx, firstUsablePair(ctx)), edgePicks: [], adjust: prev?.adjust ?? 'none' }),
	started: (st) => st.edgePicks.length > 0,
	hint(_ctx, st) {
		const n = st.edgePicks.length;
		if (st.seamPairId) return 'Measuring the chosen seam pair; choose the end to move, then Enter or Apply.';
		if (n < 2) return 'Choose a seam pair, or click the two ends of the first edge.';
		if (n < 4) return 'Click the two ends of the edge sewn to it.';
		return 'Choose the end to move, then Enter or Apply.';
	},
	down: seamPickDown,
	commit(ctx, st) {
		const run = trueRun(ctx, st);
		if (!run || !run.r.ok || !run.adjust) return NOTHING;
		const side = run.adjust.side === 'a' ? 0 : 1;
		const key = run.keys[side];
		const moves = reshapeMoves(run.before[side], run.r.pieces[side]);
		if (!moves.length) return outcome('The seam is already true at that end: nothing to move.');
		// what the move changes in the piece, declared as labelled changes (reshape posts nothing itself): one
		// entry per seam whose length changed (moving an end changes the trued seam and its neighbour),
		// as the server checks the seams one by one
		const moved = run.r.after.aMm + run.r.after.bMm - (run.r.before.aMm + run.r.before.bMm);
		const trued = `seam "${run.c.label}" trued: edge ${moved >= 0 ? 'lengthened' : 'shortened'} by ${Math.abs(moved).toFixed(2)} mm`;
		const declared = reshapeChanges(run.before[side], run.r.pieces[side])
			.filter((c) => c.subject !== 'apex')
			.map((c) =>
				ledgerEntry({
					apexId: null,
					kind: 'trued_seam',
					refId: c.key,
					label: `${trued}; ${c.label.toLowerCase()} ${c.difference >= 0 ? '+' : ''}${c.difference.toFixed(c.unit === 'mm²' ? 0 : 2)} ${c.unit}`,
					angleRad: 0,
					lengthMm: c.post.lengthMm,
					areaMm2: c.post.areaMm2
				})
			);
		const label = `${ctx.piece(key)?.name}: seam "${run.c.label}" trued`;
		// each point moved taken by its anchor on the piece, where it goes as an offset from it (as Reshape stores it)
		const anchored = moves.map((m) => anchoredMove(run.before[side], m));
		return outcome(ctx.apply(key, { op: 'reshape', params: { moves: anchored } }, { label, declared, seamEdit: storedEndMoved(ctx, st, run) }), 'select');
	},
	preview(ctx, st): MovePreview | null {
		const run = trueRun(ctx, st);
		const overlay: OverlayItem[] = st.edgePicks.map((q) => {
			const o = ctx.piece(q.pieceKey)?.offset ?? { x: 0, y: 0 };
			return { kind: 'point' as const, at: { x: q.at.x + o.x, y: q.at.y + o.y }, tone: 'select' as const };
		});
		if (!run) return overlay.length ? { ...emptyPreview(null), overlay, overlayWorld: true } : null;
		const seam = pairOverlay(ctx, run.c.pair);
		overlay.push({ kind: 'line', points: seam.a, tone: 'select' }, { kind: 'line', points: seam.b, tone: 'measure', dashed: true });
		const r = run.r;
		if (!r.ok) return { ...emptyPreview(null, r.error.message), overlay, overlayWorld: true };
		const mm = (v: number) => lengthReadoutText(v, ctx.unit);
		const side = run.adjust?.side === 'b' ? 1 : 0;
		const key = run.keys[side];
		if (run.adjust) {
			const o = ctx.piece(key)?.offset ?? { x: 0, y: 0 };
			for (const m of reshapeMoves(run.before[side], r.pieces[side])) overlay.push({ kind: 'point', at: { x: m.to.x + o.x, y: m.to.y + o.y }, tone: 'preview' });
			const e = side === 0 ? r.seamPairs[0].a.edge : r.seamPairs[0].b.edge;
			overlay.push({ kind: 'line', points: e.segments.flatMap((g) => segmentFlatten(g, 0.3)).map((q) => ({ x: q.x + o.x, y: q.y + o.y })), tone: 'preview' });
		}
		const b = r.before;
		const a = r.after;
		return {
			pieceKey: key,
			piece: run.adjust ? r.pieces[side] : null,
			error: null,
			readouts: [
				{ label: 'Seam', value: run.c.label },
				{ label: 'Edge a (darts folded out)', value: mm(b.aMm) },
				{ label: 'Edge b (darts folded out)', value: mm(b.bMm) },
				{ label: 'Difference a − b', value: lengthDifferenceText(b.differenceMm, ctx.unit), tone: b.withinTolerance ? 'ok' : 'bad' },
				{ label: 'Allowed ease', value: mm(b.allowedEaseMm) },
				{ label: 'Reads', value: b.withinTolerance ? 'true' : `${mm(b.deviationMm)} off`, tone: b.withinTolerance ? ('ok' as const) : ('bad' as const) },
				...(run.adjust
					? [
							{ label: 'After: difference a − b', value: lengthDifferenceText(a.differenceMm, ctx.unit), tone: a.withinTolerance ? ('ok' as const) : ('bad' as const) },
							{ label: 'After: edge moved by', value: lengthDifferenceText(a.aMm + a.bMm - b.aMm - b.bMm, ctx.unit) }
						]
					: [])
			],
			ledger: r.ledgerEntries,
			overlay,
			overlayWorld: true,
			notes: [r.report.summary, ...r.report.notes],
			canCommit: !!run.adjust
		};
	}
};
