import { chainSnapPoints, pointSnap, type SnapPointCandidate } from '$lib/geometry/snap';
import { vecDistance, type Vec } from '$lib/geometry';
import type { LedgerEntry } from '$lib/pattern/ledger';
import { pieceMetrics } from '$lib/pattern/metrics';
import type { Piece } from '$lib/pattern/piece-schema';
import { reshapeChanges, reshapeDeclaredEntries } from '$lib/pattern/reshape-declaration';
import { editorApply } from '../ops';
import { areaText, lengthReadoutText, lengthDifferenceText } from '$lib/pattern/measurements/units';
import { anchoredMove } from './anchored';
import { editableSelected, movePiece, type OnPiece } from './common';
import type { MoveContext } from './context';
import { emptyPreview, NOTHING, outcome, type CommitOutcome, type MoveDef, type MovePreview, type OverlayItem, type Readout } from './types';

export interface ReshapeState extends OnPiece {
	id: 'reshape';
	/** Each outline point moved so far: where it was on the piece, where it is now (piece coordinates). */
	moves: { from: Vec; to: Vec }[];
	/** The point being dragged (where it was on the piece). */
	dragging: Vec | null;
	/** The change alters the area, a seam or the shaping: the declaration form is open. */
	declaring: boolean;
	/** The points as they were before each drag (undo takes back one drag), and the drags undone (redo). */
	past: Moves[];
	future: Moves[];
	/** The points when the pointer went down (a drag that moved them becomes one undo step). */
	atDown: Moves | null;
}

type Moves = { from: Vec; to: Vec }[];

/** The outline's points a hand can move: segment ends and Bézier handles (each once), a handle with the end it belongs to. */
export function reshapePoints(piece: Piece): { at: Vec; handleOf: Vec | null }[] {
	const out: { at: Vec; handleOf: Vec | null }[] = [];
	const add = (at: Vec, handleOf: Vec | null) => {
		if (!out.some((q) => vecDistance(q.at, at) < 1e-6)) out.push({ at, handleOf });
	};
	for (const s of piece.outline.segments) {
		add(s.p0, null);
		if (s.kind === 'cubic') {
			add(s.p1, s.p0);
			add(s.p2, s.p3);
		}
	}
	return out;
}

const movedTo = (st: ReshapeState, p: Vec): Vec => st.moves.find((m) => vecDistance(m.from, p) < 1e-6)?.to ?? p;

/** The piece with the points moved, and what that changed. */
export function reshapeRun(ctx: MoveContext, st: ReshapeState) {
	const piece = movePiece(ctx, st);
	const moves = st.moves.filter((m) => vecDistance(m.from, m.to) > 1e-9);
	if (!piece || moves.length === 0) return null;
	const r = editorApply(piece, { op: 'reshape', params: { moves } });
	return { piece, moves, r, changes: r.ok ? reshapeChanges(piece, r.piece) : [] };
}

/** Snap a dragged point: to the points and edges of its piece (those moving with it left out), other pieces' points, the paper's grid, 15° from its neighbour. */
function snapped(ctx: MoveContext, st: ReshapeState, piece: Piece, from: Vec, at: Vec): Vec {
	const key = st.pieceKey!;
	const o = ctx.piece(key)!.offset;
	const segs = piece.outline.segments;
	const moving = segs.flatMap((s, i) => ((s.kind === 'line' ? [s.p0, s.p1] : [s.p0, s.p1, s.p2, s.p3]).some((q) => vecDistance(q, from) < 1e-6) ? [i] : []));
	const points: SnapPointCandidate[] = chainSnapPoints(piece.outline, key, moving);
	for (const p of ctx.visible) {
		if (p.key === key) continue;
		const dx = p.offset.x - o.x;
		const dy = p.offset.y - o.y;
		for (const c of chainSnapPoints(p.geometry.outline, p.key)) points.push({ ...c, point: { x: c.point.x + dx, y: c.point.y + dy } });
	}
	const i = moving[0] ?? -1;
	const seg = segs[i];
	const neighbour = seg ? (vecDistance(seg.p0, from) < 1e-6 ? segs[(i - 1 + segs.length) % segs.length].p0 : seg.p0) : null;
	return pointSnap(at, {
		radiusMm: ctx.tolMm(9),
		points,
		edges: [{ chain: piece.outline, id: key, skipSegments: moving }],
		grid: { spacingMm: ctx.paperGridMm, origin: { x: -o.x, y: -o.y } },
		angle: neighbour ? { anchor: neighbour, stepRad: Math.PI / 12 } : null
	}).point;
}

/** Reshape by hand: drag the outline's points and Bézier handles; seam lengths, area and ledger follow live. */
export const reshapeMove: MoveDef<ReshapeState> = {
	id: 'reshape',
	name: 'Reshape',
	key: 'r',
	icon: 'M4 18 C8 6 16 6 20 18 M12 8.5 L12 8.6 M8 6 L16 6',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'reshape', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), moves: [], dragging: null, declaring: false, past: [], future: [], atDown: null }),
	started: (st) => st.moves.length > 0,
	hint: (_ctx, st) =>
		st.declaring
			? 'Say what the change is, then apply it.'
			: st.moves.length
				? 'Drag more points or handles; the seams, the area and the ledger follow. Enter or Apply keeps the shape.'
				: 'Drag a point of the outline or a round Bézier handle: it snaps to points, edges, the paper’s grid and 15° steps.',
	down(ctx, st, p) {
		const h = p.hit;
		if (h && h.pieceKey !== st.pieceKey) {
			const q = ctx.piece(h.pieceKey);
			if (!q || q.readOnly || st.moves.length) return false;
			st.pieceKey = h.pieceKey;
			ctx.select(h.pieceKey);
		}
		const piece = movePiece(ctx, st);
		if (!piece || !st.pieceKey) return false;
		const local = ctx.local(st.pieceKey, p.world);
		let best: Vec | null = null;
		let bestD = ctx.tolMm(9);
		for (const q of reshapePoints(piece)) {
			const d = vecDistance(movedTo(st, q.at), local);
			if (d <= bestD) {
				bestD = d;
				best = q.at;
			}
		}
		st.dragging = best;
		if (best) st.declaring = false;
		st.atDown = best ? st.moves : null;
		return best !== null;
	},
	move(ctx, st, p) {
		const from = st.dragging;
		const piece = movePiece(ctx, st);
		if (!from || !piece || !st.pieceKey) return;
		const to = snapped(ctx, st, piece, from, ctx.local(st.pieceKey, p.world));
		st.moves = [...st.moves.filter((m) => vecDistance(m.from, from) > 1e-6), { from, to }];
	},
	up(_ctx, st) {
		st.dragging = null;
		// one drag, one undo step
		if (st.atDown && st.atDown !== st.moves) {
			st.past = [...st.past, st.atDown];
			st.future = [];
		}
		st.atDown = null;
	},
	undo(_ctx, st) {
		const before = st.past.at(-1);
		if (!before || st.dragging) return null;
		st.future = [st.moves, ...st.future];
		st.past = st.past.slice(0, -1);
		st.moves = before;
		st.declaring = false;
		return 'the last point dragged';
	},
	redo(_ctx, st) {
		const after = st.future[0];
		if (!after || st.dragging) return null;
		st.past = [...st.past, st.moves];
		st.future = st.future.slice(1);
		st.moves = after;
		st.declaring = false;
		return 'the point dragged';
	},
	commit(ctx, st) {
		const run = reshapeRun(ctx, st);
		if (!run) return NOTHING;
		if (!run.r.ok) return outcome(run.r.error.message);
		// a change to the area, a seam or the shaping is declared first (the form calls reshapeApply)
		if (run.changes.length) {
			st.declaring = true;
			return NOTHING;
		}
		return reshapeApply(ctx, st, []);
	},
	preview: reshapePreview
};

/** The reshape applied, with the labelled entries that declare what it changed. */
export function reshapeApply(ctx: MoveContext, st: ReshapeState, declared: readonly LedgerEntry[]): CommitOutcome {
	const run = reshapeRun(ctx, st);
	if (!run || !st.pieceKey) return NOTHING;
	return outcome(ctx.apply(st.pieceKey, { op: 'reshape', params: { moves: run.moves.map((m) => anchoredMove(run.piece, m)) } }, { label: `${ctx.piece(st.pieceKey)?.name}: reshaped by hand`, declared }));
}

function reshapePreview(ctx: MoveContext, st: ReshapeState): MovePreview | null {
	const piece = movePiece(ctx, st);
	if (!piece) return null;
	const overlay: OverlayItem[] = [];
	for (const q of reshapePoints(piece)) {
		const at = movedTo(st, q.at);
		if (q.handleOf) overlay.push({ kind: 'line', points: [movedTo(st, q.handleOf), at], tone: 'select', dashed: true });
		overlay.push({ kind: 'handle', at, active: st.dragging !== null && vecDistance(st.dragging, q.at) < 1e-6 });
	}
	const run = reshapeRun(ctx, st);
	if (!run) return { ...emptyPreview(st.pieceKey), overlay };
	if (!run.r.ok) return { ...emptyPreview(st.pieceKey, run.r.error.message), overlay };
	const u = ctx.unit;
	const mb = pieceMetrics(run.piece);
	const ma = pieceMetrics(run.r.piece);
	const readouts: Readout[] = [
		{ label: 'Area outside the darts', value: `${areaText(ma.areaMm2, u)} (${ma.areaMm2 >= mb.areaMm2 ? '+' : '−'}${areaText(Math.abs(ma.areaMm2 - mb.areaMm2), u)})` },
		{ label: 'Seam length, darts folded out', value: `${lengthReadoutText(ma.seamLengthMm, u)} (${lengthDifferenceText(ma.seamLengthMm - mb.seamLengthMm, u)})` }
	];
	// each seam the reshape changes, named as the declaration names it (and as the server's check does)
	for (const c of run.changes) {
		if (c.subject === 'seam' && c.after !== null) readouts.push({ label: c.label, value: `${lengthReadoutText(c.after, u)} (${lengthDifferenceText(c.difference, u)})`, tone: 'warn' });
	}
	// the ledger shows the entries the change would be declared with (as suggested; the form may change them)
	const declared = reshapeDeclaredEntries(run.changes);
	return {
		pieceKey: st.pieceKey,
		piece: run.r.piece,
		error: null,
		readouts,
		ledger: declared.ok ? declared.entries : [],
		overlay,
		notes: [run.r.report.summary, ...(run.changes.length ? [`It changes ${run.changes.map((c) => c.label.toLowerCase()).join(', ')}: say what on Apply; the ledger declares it and the server counts it.`] : [])],
		canCommit: true
	};
}
