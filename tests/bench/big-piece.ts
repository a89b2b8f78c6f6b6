// A large block for benchmarks: a wavy outline of `vertexCount` vertices round an apex, one block dart.
import { pieceFromInput } from '../../src/lib/pattern/piece';
import type { Piece } from '../../src/lib/pattern/piece-schema';

export function benchPiece(vertexCount: number): Piece {
	const P = { x: 400, y: 400 };
	const theta = 0.3;
	const L = 200;
	const start = -Math.PI / 2 + theta / 2;
	const at = (a: number, r: number) => ({ x: P.x + r * Math.cos(a), y: P.y + r * Math.sin(a) });
	const L2 = at(start, L);
	const L1 = at(start - theta, L);
	const pts = [L2];
	const n = vertexCount - 3;
	for (let j = 1; j <= n; j++) pts.push(at(start + (j * (2 * Math.PI - theta)) / (n + 1), L * (1.3 + 0.1 * Math.sin(j * 0.37))));
	pts.push(L1, P);
	return pieceFromInput({
		schemaVersion: 1,
		id: 'bench',
		name: 'Bench piece',
		outline: { segments: pts.map((p, i) => ({ kind: 'line' as const, p0: p, p1: pts[(i + 1) % pts.length] })) },
		apexes: [{ id: 'a', kind: 'bust_point', label: 'Bust point', point: P }],
		darts: [{ id: 'd', apexId: 'a', leg1End: L1, leg2End: L2 }],
		cut: 'pair'
	});
}
