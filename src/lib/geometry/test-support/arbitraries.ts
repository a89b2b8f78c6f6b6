import fc from 'fast-check';
import type { Outline, Segment, Vec } from '../types';

/** Test helpers (imported only by *.test.ts / *.bench.ts). */

/** A star-shaped simple polygon: n vertices at increasing angles with radii in [rMin, rMax]. */
export function starPolygon(n: number, seed: number, center: Vec = { x: 0, y: 0 }, rMin = 50, rMax = 150): Vec[] {
	let s = seed >>> 0 || 1;
	const rnd = (): number => {
		s ^= s << 13; s >>>= 0;
		s ^= s >>> 17;
		s ^= s << 5; s >>>= 0;
		return s / 4294967296;
	};
	const pts: Vec[] = [];
	for (let i = 0; i < n; i++) {
		const a = ((i + 0.2 + 0.6 * rnd()) / n) * 2 * Math.PI;
		const r = rMin + (rMax - rMin) * rnd();
		pts.push({ x: center.x + r * Math.cos(a), y: center.y + r * Math.sin(a) });
	}
	return pts;
}

export const arbPoint = (range = 500): fc.Arbitrary<Vec> =>
	fc.record({ x: fc.double({ min: -range, max: range, noNaN: true }), y: fc.double({ min: -range, max: range, noNaN: true }) });

/**
 * Random closed outline of lines and cubics: vertices of a star polygon, each edge either a line or a
 * cubic with control points jittered off the chord.
 */
export const arbOutline: fc.Arbitrary<Outline> = fc
	.record({
		n: fc.integer({ min: 3, max: 12 }),
		seed: fc.integer({ min: 1, max: 2 ** 31 - 1 }),
		kinds: fc.array(fc.boolean(), { minLength: 12, maxLength: 12 }),
		jitter: fc.array(fc.double({ min: -20, max: 20, noNaN: true }), { minLength: 48, maxLength: 48 }),
		cx: fc.double({ min: -300, max: 300, noNaN: true }),
		cy: fc.double({ min: -300, max: 300, noNaN: true })
	})
	.map(({ n, seed, kinds, jitter, cx, cy }) => {
		const pts = starPolygon(n, seed, { x: cx, y: cy });
		const segs: Segment[] = pts.map((p0, i) => {
			const p3 = pts[(i + 1) % n];
			if (!kinds[i]) return { kind: 'line', p0, p1: p3 };
			const j = jitter.slice(i * 4, i * 4 + 4);
			return {
				kind: 'cubic',
				p0,
				p1: { x: p0.x + (p3.x - p0.x) / 3 + j[0], y: p0.y + (p3.y - p0.y) / 3 + j[1] },
				p2: { x: p0.x + ((p3.x - p0.x) * 2) / 3 + j[2], y: p0.y + ((p3.y - p0.y) * 2) / 3 + j[3] },
				p3
			};
		});
		return { segments: segs };
	});

/** Circle of radius r about c made of four cubics with k = 4(√2 − 1)/3, running +x → +y. */
export function bezierCircle(c: Vec, r: number, k = (4 * (Math.SQRT2 - 1)) / 3): Outline {
	const P = (x: number, y: number): Vec => ({ x: c.x + r * x, y: c.y + r * y });
	return {
		segments: [
			{ kind: 'cubic', p0: P(1, 0), p1: P(1, k), p2: P(k, 1), p3: P(0, 1) },
			{ kind: 'cubic', p0: P(0, 1), p1: P(-k, 1), p2: P(-1, k), p3: P(-1, 0) },
			{ kind: 'cubic', p0: P(-1, 0), p1: P(-1, -k), p2: P(-k, -1), p3: P(0, -1) },
			{ kind: 'cubic', p0: P(0, -1), p1: P(k, -1), p2: P(1, -k), p3: P(1, 0) }
		]
	};
}
