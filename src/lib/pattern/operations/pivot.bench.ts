import { bench, describe } from 'vitest';
import { pieceFromInput } from '../piece';
import { pivot } from './pivot';

/** A 2,000-vertex block: a wavy star round the apex with one block dart. */
function bigPiece(vertexCount: number) {
	const P = { x: 0, y: 0 };
	const theta = 0.3;
	const L = 200;
	const start = -Math.PI / 2 + theta / 2;
	const L2 = { x: L * Math.cos(start), y: L * Math.sin(start) };
	const L1 = { x: L * Math.cos(start - theta), y: L * Math.sin(start - theta) };
	const pts = [L2];
	const n = vertexCount - 3;
	for (let j = 1; j <= n; j++) {
		const a = start + (j * (2 * Math.PI - theta)) / (n + 1);
		const r = L * (1.3 + 0.1 * Math.sin(j * 0.37));
		pts.push({ x: r * Math.cos(a), y: r * Math.sin(a) });
	}
	pts.push(L1, P);
	return pieceFromInput({
		schemaVersion: 1,
		id: 'big',
		name: 'Big piece (bench)',
		outline: { segments: pts.map((p, i) => ({ kind: 'line' as const, p0: p, p1: pts[(i + 1) % pts.length] })) },
		apexes: [{ id: 'a', kind: 'bust_point', label: '', point: P }],
		darts: [{ id: 'd', apexId: 'a', leg1End: L1, leg2End: L2 }],
		cut: 'pair'
	});
}

const piece = bigPiece(2000);
const seg = piece.outline.segments[700];
const target = { x: (seg.p0.x + (seg.kind === 'line' ? seg.p1.x : seg.p3.x)) / 2, y: (seg.p0.y + (seg.kind === 'line' ? seg.p1.y : seg.p3.y)) / 2 };

describe('pivot', () => {
	bench('pivot on a 2,000-vertex piece (with result checks)', () => {
		const r = pivot(piece, { dartId: 'd', to: target });
		if (!r.ok) throw new Error(r.error.message);
	});
});
