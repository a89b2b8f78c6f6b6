// A style of two drafted panels with a stored seam pair, and the body of a carry across them, made
// through the API and the same pure functions the editor uses (tests of the change endpoint).
import { expect } from 'vitest';
import { lineSegment } from '../../src/lib/pattern/kernel';
import { twoPanelWedge } from '../../src/lib/pattern/panels/fixtures/two-panel-wedge';
import { benchPanels } from '../../src/lib/pattern/panels/fixtures/bench-pieces';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { changeRecompute, type ChangeStep } from '../../src/lib/pattern/recipe/change';
import type { Client } from './helpers';

export interface PanelStyle {
	styleId: string;
	left: { id: string; v1: string; geometry: Piece };
	right: { id: string; v1: string; geometry: Piece };
	seamPairId: string;
}

/** Two panels whose seam opens as a 12° wedge below D (two-panel-wedge.ts), or two of about `vertices` each. */
export async function panelStyle(c: Client, studioId: string, vertices = 0): Promise<PanelStyle> {
	const { left, right } = vertices ? (() => { const b = benchPanels(vertices); return { left: b.panels[0], right: b.panels[1] }; })() : twoPanelWedge();
	const s = await c.api('POST', `/api/studios/${studioId}/styles`, { name: 'Panelled bodice', code: 'LR-311', season: 'SS28' });
	expect(s.status).toBe(201);
	const styleId = (await s.json()).style.id as string;
	const made = [];
	for (const [name, geometry] of [['Left panel', left], ['Right panel', right]] as const) {
		const p = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, { name, geometry, origin: { op: 'draft', params: { note: 'two panels' } } });
		expect(p.status).toBe(201);
		const body = await p.json();
		made.push({ id: body.piece.id as string, v1: body.version.id as string, geometry });
	}
	// the panel seam as stored: each edge's ends in its piece's outline order (down the left, up the right)
	const half = (6 * Math.PI) / 180;
	const spread = 250 * Math.tan(half);
	const sp = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/seam-pairs`, {
		label: 'panel seam',
		a: { pieceId: made[0].id, from: { x: 100, y: 0 }, to: { x: 100 - spread, y: 400 } },
		b: { pieceId: made[1].id, from: { x: 100 + spread, y: 400 }, to: { x: 100, y: 0 } },
		toleranceMm: 1.6
	});
	expect(sp.status).toBe(201);
	return { styleId, left: made[0], right: made[1], seamPairId: (await sp.json()).seamPair.id };
}

/** The body of a carry of the two panels along a straight line at y = 250, joined below, as the editor sends it. */
export function carryBody(st: PanelStyle, message = 'Panel seam carried into a waist band seam') {
	const { pair } = twoPanelWedge();
	const seams = [{ ...pair, a: { ...pair.a, pieceId: st.left.geometry.id }, b: { ...pair.b, pieceId: st.right.geometry.id }, storedId: st.seamPairId }];
	const styleLine = { segments: [lineSegment({ x: -10, y: 250 }, { x: 210, y: 250 })] };
	const steps: ChangeStep[] = [{ op: 'carry', sources: [{ pieceId: st.left.id }, { pieceId: st.right.id }], params: { seams, styleLine, fuse: 'below', name: 'Waist band' } }];
	const rc = changeRecompute(new Map([[st.left.id, st.left.geometry], [st.right.id, st.right.geometry]]), steps);
	if (!rc.ok) throw new Error(rc.message);
	const names = ['Waist band', 'Left upper panel', 'Right upper panel'];
	const pieces = rc.unused.map((u, n) => ({ ...u, name: names[n] ?? `Part ${n + 1}`, cut: 'pair' as const, geometry: rc.steps[u.step].result.pieces[u.result] }));
	const edge = rc.steps[0].result.seamPairs[0];
	const ends = (p: typeof edge.a) => ({ from: p.edge.segments[0].p0, to: (p.edge.segments.at(-1) as { p1?: { x: number; y: number }; p3?: { x: number; y: number } }).p1 ?? (p.edge.segments.at(-1) as { p3: { x: number; y: number } }).p3 });
	const index = (pieceId: string) => pieces.findIndex((p) => p.geometry.id === pieceId);
	const create = edge && index(edge.a.pieceId) >= 0 && index(edge.b.pieceId) >= 0 ? [{ label: 'waist band seam', a: { newPiece: index(edge.a.pieceId), ...ends(edge.a) }, b: { newPiece: index(edge.b.pieceId), ...ends(edge.b) } }] : [];
	return {
		message,
		bases: [{ pieceId: st.left.id, versionId: st.left.v1 }, { pieceId: st.right.id, versionId: st.right.v1 }],
		steps,
		pieces,
		seamPairs: { create, update: [] as unknown[] }
	};
}
