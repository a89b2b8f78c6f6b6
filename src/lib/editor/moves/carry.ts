import { segmentFlatten, vecDistance, vecLerp, type Path, type Vec } from '$lib/geometry';
import { carry, type SeamPair } from '$lib/pattern/panels';
import { docLayAsDrafted, docMerge } from '../state/doc-edits';
import { angleText, lengthReadoutText } from '$lib/pattern/measurements/units';
import type { Piece } from '$lib/pattern/piece-schema';
import { anchoredAmong } from './anchored';
import type { MoveContext } from './context';
import { opPieces, storedPair, storedPairUsable } from './seams';
import { emptyPreview, NOTHING, outcome, type MoveDef, type MovePreview, type OverlayItem, type Readout } from './types';

export interface CarryState {
	id: 'carry';
	/** The panels picked (editor keys). */
	keys: string[];
	/** The style line: start, handle 1, handle 2, end (coordinates of the first panel). */
	handles: Vec[];
	dragIndex: number;
	/** The line's start is placed by a click; the next click places its end. */
	awaitingEnd: boolean;
	/** Which side of the style line the panels are joined on. */
	fuse: 'above' | 'below';
	/** What is left where the line misses a divergence point. */
	residualAs: 'dart' | 'pleats';
}

/** The picked panels in seam order (centre front first) with the stored seam pairs between them. */
export function carryChain(ctx: MoveContext, st: CarryState): { keys: string[]; pairs: SeamPair[] } | string {
	const picked = new Set(st.keys);
	if (picked.size < 2) return 'Pick at least two panels (Shift+click, or tick them above).';
	const next = new Map<string, { b: string; pair: SeamPair }>();
	const isB = new Set<string>();
	for (const sp of ctx.seamPairs) {
		if (!picked.has(sp.aPieceId) || !picked.has(sp.bPieceId)) continue;
		const pair = storedPair(ctx, sp);
		if (!pair) continue;
		// the seam's own name in the operation's messages and ledger labels
		const named = sp.label && !ctx.seamPairs.some((x) => x !== sp && x.label === sp.label) ? { ...pair, id: sp.label } : pair;
		next.set(sp.aPieceId, { b: sp.bPieceId, pair: named });
		isB.add(sp.bPieceId);
	}
	const starts = [...picked].filter((k) => !isB.has(k));
	if (starts.length !== 1) return 'The picked panels are not one row joined by seam pairs (each panel sewn to the next); add the missing seam pairs.';
	const keys = [starts[0]];
	const pairs: SeamPair[] = [];
	while (next.has(keys[keys.length - 1]) && keys.length <= picked.size) {
		const n = next.get(keys[keys.length - 1])!;
		pairs.push(n.pair);
		keys.push(n.b);
	}
	if (keys.length !== picked.size) return 'The picked panels are not one row joined by seam pairs.';
	return { keys, pairs };
}

/**
 * The row of panels joined by stored seam pairs (each panel sewn to the next, centre front first): the
 * row the selected piece is in, else the longest; empty when no seam pair joins two editable pieces.
 */
export function carryRow(ctx: MoveContext): string[] {
	const next = new Map<string, string>();
	const isB = new Set<string>();
	for (const sp of ctx.seamPairs) {
		if (!storedPairUsable(ctx, sp, true) || sp.aPieceId === sp.bPieceId) continue;
		if (next.has(sp.aPieceId) || isB.has(sp.bPieceId)) continue; // a fork: the first pair stored wins
		next.set(sp.aPieceId, sp.bPieceId);
		isB.add(sp.bPieceId);
	}
	const rows: string[][] = [];
	for (const start of next.keys()) {
		if (isB.has(start)) continue;
		const row = [start];
		while (next.has(row[row.length - 1]) && row.length <= next.size) row.push(next.get(row[row.length - 1])!);
		rows.push(row);
	}
	const sel = ctx.selectedKey;
	return rows.find((r) => sel !== null && r.includes(sel)) ?? [...rows].sort((a, b) => b.length - a.length)[0] ?? [];
}

/** Panels laid at their own drafting coordinates (one shared offset), as carry needs them. */
export function panelsAsDrafted(ctx: MoveContext, keys: readonly string[]): boolean {
	const o = ctx.piece(keys[0])?.offset;
	return !!o && keys.every((k) => {
		const q = ctx.piece(k)?.offset;
		return !!q && Math.abs(q.x - o.x) < 1e-9 && Math.abs(q.y - o.y) < 1e-9;
	});
}

function styleLinePath(h: readonly Vec[]): Path {
	return { segments: [{ kind: 'cubic', p0: h[0], p1: h[1], p2: h[2], p3: h[3] }] };
}

const straight = (a: Vec, b: Vec): Vec[] => [a, vecLerp(a, b, 1 / 3), vecLerp(a, b, 2 / 3), b];

function local(ctx: MoveContext, st: CarryState, world: Vec): Vec {
	const o = ctx.piece(st.keys[0] ?? null)?.offset ?? { x: 0, y: 0 };
	return { x: world.x - o.x, y: world.y - o.y };
}

/** The style line as the step stores it: each point with its anchor among the panels. */
function styleLineAnchored(pieces: readonly Piece[], line: Path): Path {
	return { segments: line.segments.map((s) => (s.kind === 'cubic' ? { ...s, p0: anchoredAmong(pieces, s.p0), p1: anchoredAmong(pieces, s.p1), p2: anchoredAmong(pieces, s.p2), p3: anchoredAmong(pieces, s.p3) } : { ...s, p0: anchoredAmong(pieces, s.p0), p1: anchoredAmong(pieces, s.p1) })) };
}

function carryRun(ctx: MoveContext, st: CarryState) {
	const chain = carryChain(ctx, st);
	if (typeof chain === 'string') return { error: chain } as const;
	if (!panelsAsDrafted(ctx, chain.keys)) return { error: 'The panels are spread out on the table: lay them as drafted to draw the style line across them.', chain } as const;
	const h = st.handles;
	if (h.length !== 4 || vecDistance(h[0], h[3]) < 1) return { chain } as const;
	const op = opPieces(ctx, chain.keys);
	if (!op) return { error: 'A panel is missing.' } as const;
	const styleLine = styleLinePath(h);
	const r = carry(op.pieces, chain.pairs.map(op.pairFor), { styleLine, fuse: st.fuse, residualAs: st.residualAs });
	return { chain, styleLine, r } as const;
}

/** Carry: cut the panels along one style line and join one side, closing their wedges into the style seam. */
export const carryMove: MoveDef<CarryState> = {
	id: 'carry',
	name: 'Carry',
	key: 'k',
	icon: 'M4 4 L4 20 M10 4 L9 20 M15 4 L16 20 M20 4 L20 20 M2 13 C8 16 16 16 22 13',
	edits: true,
	// the panels of one row, in seam order (only pieces the stored seam pairs join)
	fresh: (ctx, prev) => ({ id: 'carry', keys: ctx.selection.panels.length >= 2 ? [...ctx.selection.panels] : carryRow(ctx), handles: [], dragIndex: -1, awaitingEnd: false, fuse: prev?.fuse ?? 'below', residualAs: prev?.residualAs ?? 'dart' }),
	started: (st) => st.handles.length > 0,
	begin(ctx, st) {
		// laid as drafted, so that one style line crosses them as they are sewn
		if (st.keys.length >= 2 && !panelsAsDrafted(ctx, st.keys)) ctx.edit((doc) => docLayAsDrafted(doc, st.keys));
	},
	hint(ctx, st) {
		const h = st.handles;
		if (st.keys.length < 2) return ctx.seamPairs.length ? 'Shift+click the panels to carry (or tick them in the form).' : 'No seam pairs join these pieces yet: pair the panel seams first (Join or True seam, then “Pair these seams”).';
		if (h.length === 0) return 'Drag across the panels to draw the style line (or click its start, then its end).';
		if (st.awaitingEnd) return 'Click where the style line ends.';
		return 'Drag the ends or the round handles; watch the reach line and the residuals. Enter or Apply carries.';
	},
	down(ctx, st, p) {
		if (p.shift) {
			const k = p.hit?.pieceKey;
			if (k && !ctx.piece(k)?.readOnly) st.keys = st.keys.includes(k) ? st.keys.filter((x) => x !== k) : [...st.keys, k];
			return false;
		}
		if (st.keys.length < 2) return false;
		const at = local(ctx, st, p.snap.kind === 'grid' || p.snap.kind === 'free' ? p.world : p.snap.world);
		const h = st.handles;
		if (st.awaitingEnd) {
			st.handles = straight(h[0], at);
			st.awaitingEnd = false;
			return false;
		}
		if (h.length === 4) {
			const i = h.findIndex((q) => vecDistance(q, local(ctx, st, p.world)) < ctx.tolMm(10));
			if (i >= 0) {
				st.dragIndex = i;
				return true;
			}
			return false;
		}
		st.handles = straight(at, at);
		st.dragIndex = 3;
		return true;
	},
	move(ctx, st, p) {
		const i = st.dragIndex;
		if (i < 0) return;
		const at = local(ctx, st, p.world);
		const h = st.handles;
		// while the line is being drawn it stays straight; afterwards each handle moves alone
		if (i === 3 && vecDistance(h[1], vecLerp(h[0], h[3], 1 / 3)) < 1e-6 && vecDistance(h[2], vecLerp(h[0], h[3], 2 / 3)) < 1e-6) st.handles = straight(h[0], at);
		else st.handles = h.map((q, k) => (k === i ? at : q));
	},
	up(_ctx, st, _p, moved) {
		if (!moved && st.handles.length === 4 && vecDistance(st.handles[0], st.handles[3]) < 1) st.awaitingEnd = true;
		st.dragIndex = -1;
	},
	commit(ctx, st) {
		const run = carryRun(ctx, st);
		if (!('r' in run) || !run.r) return NOTHING;
		if (!run.r.ok) return outcome(run.r.error.message);
		const { chain, styleLine, r } = run;
		// the step as the server recomputes it: the seams as the operation took them, each with its stored pair
		const op = opPieces(ctx, chain.keys)!;
		const seams = chain.pairs.map((p) => {
			const storedId = ctx.seamPairs.find((x) => x.id === p.id || x.label === p.id)?.id;
			return storedId ? { ...op.pairFor(p), storedId } : op.pairFor(p);
		});
		const merge = {
			sources: chain.keys,
			made: r.pieces,
			step: { op: 'carry' as const, params: { seams, styleLine: styleLineAnchored(op.pieces, styleLine), fuse: st.fuse, residualAs: st.residualAs } },
			label: `${chain.keys.length} panels carried into one seam — ${r.report.summary}`,
			seamPairs: r.seamPairs,
			seamLabel: (i: number, _a: unknown, b: { name: string }) => `style seam ${i + 1} (${b.name})`
		};
		return outcome(ctx.edit((doc, stamp) => docMerge(doc, merge, stamp)), 'select');
	},
	preview: carryPreview
};

function carryPreview(ctx: MoveContext, st: CarryState): MovePreview | null {
	const run = carryRun(ctx, st);
	const h = st.handles;
	const overlay: OverlayItem[] = [];
	const keys = 'chain' in run && run.chain ? run.chain.keys : st.keys;
	// the picked panels, outlined
	for (const k of keys) {
		const p = ctx.piece(k);
		if (!p) continue;
		const pts = p.geometry.outline.segments.flatMap((g) => segmentFlatten(g, 0.5));
		overlay.push({ kind: 'line', points: [...pts, pts[0]].map((q) => ({ x: q.x + p.offset.x, y: q.y + p.offset.y })), tone: 'select' });
	}
	const outlines = overlay.length;
	const o = ctx.piece(keys[0] ?? null)?.offset ?? { x: 0, y: 0 };
	const W = (q: Vec): Vec => ({ x: q.x + o.x, y: q.y + o.y });
	if (h.length === 4) {
		overlay.push({ kind: 'line', points: segmentFlatten(styleLinePath(h).segments[0], 0.3).map(W), tone: 'preview' });
		if (vecDistance(h[0], h[3]) >= 1) {
			overlay.push({ kind: 'line', points: [W(h[0]), W(h[1])], tone: 'select', dashed: true }, { kind: 'line', points: [W(h[3]), W(h[2])], tone: 'select', dashed: true });
			overlay.push(...h.map((q, i) => ({ kind: 'handle' as const, at: W(q), active: i === st.dragIndex })));
		}
	}
	const base: MovePreview = { ...emptyPreview(keys[0] ?? null, 'error' in run ? (run.error ?? null) : null), overlay, overlayWorld: true };
	if (!('r' in run) || !run.r) return keys.length ? { ...base, readouts: [{ label: 'Panels', value: String(keys.length) }] } : base;
	const r = run.r;
	if (!r.ok) return { ...base, error: r.error.message };
	overlay.splice(0, outlines);
	for (const e of r.styleSeamEdges) overlay.push({ kind: 'line', points: e.segments.flatMap((g) => segmentFlatten(g, 0.3)).map(W), tone: 'measure' });
	overlay.push({ kind: 'line', points: r.reachLine.segments.flatMap((g) => segmentFlatten(g, 0.3)).map(W), tone: 'reach', dashed: true });
	const apexes = run.chain.keys.flatMap((k) => ctx.piece(k)?.geometry.apexes ?? []);
	const mm = (v: number) => lengthReadoutText(v, ctx.unit);
	const seamName = (id: string) => ctx.seamPairs.find((x) => x.id === id)?.label || id;
	for (const res of r.residuals) {
		const D = apexes.find((a) => a.id === res.apexId)?.point;
		if (!D) continue;
		overlay.push({ kind: 'point', at: W(D), tone: 'bad' }, { kind: 'label', at: W({ x: D.x, y: D.y - 4 }), text: `${seamName(res.seamId)}: ${mm(res.distanceMm)} off · ${angleText(res.angleRad)} · ${mm(res.widthAtLineMm)} at the line` });
	}
	const carried = r.report.values.carriedAngleRad ?? 0;
	const readouts: Readout[] = [
		{ label: 'Panels', value: String(run.chain.keys.length) },
		{ label: 'Carried into the style seam', value: angleText(carried), tone: r.residuals.length ? 'warn' : 'ok' },
		{ label: 'Style seam (joined side)', value: mm(r.styleSeamLengthMm) },
		{ label: 'Style line (other side)', value: mm(r.otherSideSeamLengthMm) },
		{ label: 'Shaping moved', value: mm(r.shapingMovedMm) }
	];
	if (!r.residuals.length) readouts.push({ label: 'Residuals', value: 'none: the line reaches every divergence point', tone: 'ok' });
	for (const res of r.residuals) {
		readouts.push({ label: `Residual at ${seamName(res.seamId)}`, value: `${mm(res.distanceMm)} off · ${angleText(res.angleRad)} · ${mm(res.widthAtLineMm)} at the line`, tone: 'bad' });
	}
	return { ...base, piece: null, pieces: r.pieces, piecesGapMm: 0, hides: run.chain.keys, readouts, ledger: r.ledgerEntries, notes: [r.report.summary, ...r.report.notes], canCommit: true };
}
