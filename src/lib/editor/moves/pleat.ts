import type { Vec } from '$lib/geometry';
import type { MoveContext } from './context';
import { anchoredOn } from './anchored';
import { dartApex, dartStart, deg, distanceAlongOutline, mm, pickDart, movePiece, pointAlongOutline, stepPreview, type OnDart } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef, type OverlayItem } from './types';

export interface PleatState extends OnDart {
	id: 'pleat';
	count: number;
	/** Along the outline from the dart: forward from its leg-2 end (positive), back from its leg-1 end (negative). */
	firstAtMm: number;
	spacingMm: number;
	mode: 'equal_angle' | 'equal_intake';
	kind: 'pleat' | 'tuck';
	foldToward: 'auto' | 'leg1' | 'leg2';
	/** Parallel pleats: the pivot circle's radius (0: off). */
	parallelMm: number;
}

/** Where the pleats open: from the dart's leg-2 end forward (positive) or its leg-1 end backward (negative). */
export function pleatPoints(ctx: MoveContext, st: PleatState): Vec[] | null {
	const piece = movePiece(ctx, st);
	const w = piece && dartApex(piece, st.dartId);
	if (!piece || !w) return null;
	const n = Math.max(1, Math.min(12, Math.round(st.count)));
	const first = st.firstAtMm;
	const from = first >= 0 ? w.leg2End : w.leg1End;
	const dir = first >= 0 ? 1 : -1;
	// each with its anchor: the same fraction of its seam on every size
	return Array.from({ length: n }, (_, i) => anchoredOn(piece, pointAlongOutline(piece.outline, from, first + dir * i * st.spacingMm)));
}

function pleatStep(ctx: MoveContext, st: PleatState) {
	const at = pleatPoints(ctx, st);
	if (!at || !st.dartId) return null;
	return {
		op: 'pleat',
		params: {
			dartId: st.dartId,
			at,
			mode: st.mode,
			kind: st.kind,
			...(st.foldToward !== 'auto' ? { foldToward: st.foldToward } : {}),
			...(st.parallelMm > 0 ? { parallel: { pivotRadiusMm: st.parallelMm } } : {})
		}
	};
}

/** The first pleat at a point of the outline: its distance from the nearer side of the dart. */
function firstAtPoint(ctx: MoveContext, st: PleatState, at: Vec) {
	const piece = movePiece(ctx, st);
	const w = piece && dartApex(piece, st.dartId);
	if (!piece || !w) return;
	const d2 = distanceAlongOutline(piece.outline, w.leg2End, at);
	const d1 = distanceAlongOutline(piece.outline, w.leg1End, at);
	st.firstAtMm = Math.round((d2 >= 0 ? d2 : d1) * 10) / 10;
}

/** Pleat: turn a dart that sits at a seam into pleats or tucks; numbers typed, first position clickable. */
export const pleatMove: MoveDef<PleatState> = {
	id: 'pleat',
	name: 'Pleat',
	key: 'l',
	icon: 'M3 18 L7 6 L11 18 L15 6 L19 18 M3 21 L21 21',
	edits: true,
	fresh: (ctx, prev) => ({
		id: 'pleat',
		...(prev ? { pieceKey: prev.pieceKey, dartId: null } : dartStart(ctx)),
		count: prev?.count ?? 2,
		firstAtMm: prev?.firstAtMm ?? 15,
		spacingMm: prev?.spacingMm ?? 30,
		mode: prev?.mode ?? 'equal_angle',
		kind: prev?.kind ?? 'pleat',
		foldToward: 'auto',
		parallelMm: 0
	}),
	started: () => false,
	hint(_ctx, st) {
		if (!st.dartId) return 'Click the dart to turn into pleats (it should already sit at the seam).';
		return 'Type the count, first position and spacing, or click the outline where the first pleat goes; Enter applies.';
	},
	down(ctx, st, p) {
		if (pickDart(ctx, st, p)) return false;
		if (p.hit?.pieceKey !== st.pieceKey || !(p.hit.kind === 'edge' || p.hit.kind === 'point')) return false;
		firstAtPoint(ctx, st, p.hit.local);
		return true;
	},
	move(ctx, st, p) {
		if (!st.pieceKey) return;
		const snap = ctx.snapAt(p.world, { onlyPiece: st.pieceKey, outlineOnly: true });
		ctx.showSnap(snap);
		if (snap.local) firstAtPoint(ctx, st, snap.local);
	},
	up(ctx) {
		ctx.showSnap(null);
	},
	commit(ctx, st) {
		const step = pleatStep(ctx, st);
		return step && st.pieceKey ? outcome(ctx.apply(st.pieceKey, step)) : NOTHING;
	},
	preview(ctx, st) {
		const piece = movePiece(ctx, st);
		if (!piece || !st.dartId) return null;
		const w = dartApex(piece, st.dartId);
		if (!w) return emptyPreview(st.pieceKey, 'That dart is not on this piece.');
		const step = pleatStep(ctx, st);
		const overlay = (pleatPoints(ctx, st) ?? []).flatMap((q): OverlayItem[] => [
			{ kind: 'line', points: [w.apex, q], tone: 'select', dashed: true },
			{ kind: 'point', at: q, tone: 'preview' }
		]);
		if (!step) return { ...emptyPreview(st.pieceKey), overlay };
		return stepPreview(ctx, st, step, overlay, (v) => {
			const out = [{ label: 'Dart angle', value: deg(v.angleRad) }];
			for (let i = 1; i <= (v.count ?? 0); i++) {
				out.push({ label: `Pleat ${i} angle`, value: deg(v[`pleat${i}AngleRad`]) });
				out.push({ label: `Pleat ${i} intake`, value: mm(ctx.unit, v[`pleat${i}IntakeMm`]) });
				out.push({ label: `Pleat ${i} depth`, value: mm(ctx.unit, v[`pleat${i}DepthMm`]) });
			}
			return out;
		});
	}
};
