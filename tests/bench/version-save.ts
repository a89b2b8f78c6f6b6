// Benchmark: saving a version of a 2,000-vertex piece through the API on loopback (the server
// replays the pivot, recomputes metrics, runs the checks, stores the version in one transaction).
// Run: npx vite build && npx tsx tests/bench/version-save.ts   (uses the test database)
import { pivot } from '../../src/lib/pattern/operations/pivot';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { benchPiece } from './big-piece';
import { benchServer, percentiles } from './bench-server';

const SAVES = Number(process.env.SAVES ?? 60);

const { call, studioId, styleId, close } = await benchServer();
let piece: Piece = benchPiece(2000);
const created = await (await call('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, { name: 'Bench piece', geometry: piece, origin: { op: 'draft' } })).json();
const pieceId: string = created.piece.id;
let head: string = created.version.id;

const times: number[] = [];
for (let i = 0; i < SAVES; i++) {
	// Move the dart to the middle of an outline segment further round each time.
	const segs = piece.outline.segments;
	const k = [300, 700, 1100, 1500][i % 4];
	const s = segs[k];
	const to = s.kind === 'line' ? { x: (s.p0.x + s.p1.x) / 2, y: (s.p0.y + s.p1.y) / 2 } : s.p0;
	const params = { dartId: 'd', to };
	const r = pivot(piece, params);
	if (!r.ok) throw new Error(r.error.message);
	const t0 = performance.now();
	const res = await call('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: head, message: `pivot ${i}`, geometry: r.piece, recipe: [{ op: 'pivot', params }] });
	const t1 = performance.now();
	if (res.status !== 201) throw new Error(`save ${i}: ${res.status} ${await res.text()}`);
	head = (await res.json()).version.id;
	piece = r.piece;
	times.push(t1 - t0);
}
close();
console.log(`version save, 2,000-vertex piece, ${SAVES} saves on loopback: ${percentiles(times)}`);
process.exit(0);
