import { segmentFlatten, type Vec } from '$lib/geometry';
import type { MoveContext } from './moves/context';
import { dartApex } from './moves/common';
import { pairOverlay, storedPair } from './moves/seams';
import type { OverlayItem } from './moves/types';

/** What is selected, drawn over the table in world millimetres: a dart's legs, an apex, a seam pair's edges, the panels picked. */
export function selectionOverlay(ctx: MoveContext): OverlayItem[] {
	const sel = ctx.selection;
	const items: OverlayItem[] = [];
	const p = ctx.piece(sel.pieceKey);
	const W = (q: Vec): Vec => ({ x: q.x + (p?.offset.x ?? 0), y: q.y + (p?.offset.y ?? 0) });
	if (p && sel.dartId) {
		const w = dartApex(p.geometry, sel.dartId);
		if (w) items.push({ kind: 'line', points: [W(w.leg1End), W(w.apex), W(w.leg2End)], tone: 'select' }, { kind: 'point', at: W(w.apex), tone: 'select' });
	}
	if (p && sel.apexId) {
		const a = p.geometry.apexes.find((x) => x.id === sel.apexId);
		if (a) items.push({ kind: 'point', at: W(a.point), tone: 'select' });
	}
	if (sel.seamPairId) {
		const sp = ctx.seamPairs.find((x) => x.id === sel.seamPairId);
		const pair = sp && storedPair(ctx, sp);
		if (pair) {
			const e = pairOverlay(ctx, pair);
			items.push({ kind: 'line', points: e.a, tone: 'select' }, { kind: 'line', points: e.b, tone: 'select' });
		}
	}
	for (const k of sel.panels) {
		const q = ctx.piece(k);
		if (!q) continue;
		const pts = q.geometry.outline.segments.flatMap((g) => segmentFlatten(g, 1));
		items.push({ kind: 'line', points: [...pts, pts[0]].map((v) => ({ x: v.x + q.offset.x, y: v.y + q.offset.y })), tone: 'select', dashed: true });
	}
	return items;
}
