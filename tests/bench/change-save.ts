// Benchmark: saving a carry of two 2,000-vertex panels as one style change through the API on loopback
// (the server loads both base versions, recomputes the carry, compares every new piece, runs the checks
// across the pieces, stores the change, the new pieces and their first versions in one transaction).
// Run: npx vite build && npx tsx tests/bench/change-save.ts   (uses the test database)
import { lineSegment } from '../../src/lib/pattern/kernel';
import { benchPanels } from '../../src/lib/pattern/panels/fixtures/bench-pieces';
import { changeRecompute, type ChangeStep } from '../../src/lib/pattern/recipe/change';
import { benchServer, percentiles } from './bench-server';

const SAVES = Number(process.env.SAVES ?? 40);
const VERTICES = 2000;

const { call, studioId, styleId, close } = await benchServer();

// two panels whose seam opens as a 12° wedge below D (bench-pieces.ts), stored as version 1 each
const { panels, seams } = benchPanels(VERTICES);
const stored: { id: string; v1: string }[] = [];
for (const [i, g] of panels.entries()) {
	const r = await (await call('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, { name: `Panel ${i + 1}`, geometry: g, origin: { op: 'draft' } })).json();
	stored.push({ id: r.piece.id, v1: r.version.id });
}
const styleLine = { segments: [lineSegment({ x: -10, y: 200 }, { x: 220, y: 200 })] };
const steps: ChangeStep[] = [{ op: 'carry', sources: stored.map((s) => ({ pieceId: s.id })), params: { seams, styleLine, fuse: 'below', name: 'Band' } }];
const rc = changeRecompute(new Map(stored.map((s, i) => [s.id, panels[i]])), steps);
if (!rc.ok) throw new Error(rc.message);
const body = {
	message: 'Carry into the style seam',
	bases: stored.map((s) => ({ pieceId: s.id, versionId: s.v1 })),
	steps,
	pieces: rc.unused.map((u, n) => ({ ...u, name: `New piece ${n + 1}`, cut: 'pair', geometry: rc.steps[u.step].result.pieces[u.result] }))
};
const vertices = body.pieces.reduce((t, p) => t + p.geometry.outline.segments.length, 0);

// the sources stay the heads (a change makes new pieces), so the same change can be saved again and again
const times: number[] = [];
for (let i = 0; i < SAVES; i++) {
	const t0 = performance.now();
	const res = await call('POST', `/api/studios/${studioId}/styles/${styleId}/changes`, body);
	const t1 = performance.now();
	if (res.status !== 201) throw new Error(`save ${i}: ${res.status} ${await res.text()}`);
	await res.arrayBuffer();
	times.push(t1 - t0);
}
close();
console.log(`change save, carry of two ${VERTICES}-vertex panels (${body.pieces.length} new pieces, ${vertices} segments), ${SAVES} saves on loopback: ${percentiles(times)}`);
process.exit(0);
