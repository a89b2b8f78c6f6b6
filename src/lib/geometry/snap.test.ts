import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { angleFromDegrees } from './angle';
import { outlineFromPolyline } from './path';
import { segmentPointAt } from './segment';
import { chainSnapPoints, pointSnap, snapToAngle, snapToEdges, snapToGrid, type SnapPointCandidate } from './snap';
import type { CubicSegment, Outline, Vec } from './types';
import { vecDistance } from './vec';
import { arbPoint, bezierCircle } from './test-support/arbitraries';

const square: Outline = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }]);

describe('snapping to points', () => {
	const points: SnapPointCandidate[] = [
		{ point: { x: 10, y: 10 }, role: 'apex', id: 'bp' },
		{ point: { x: 14, y: 10 }, role: 'notch', id: 'n1' }
	];

	it('moves onto the nearest point inside the radius and says which it was', () => {
		const r = pointSnap({ x: 13, y: 11 }, { radiusMm: 5, points });
		expect(r.point).toEqual({ x: 14, y: 10 });
		expect(r.target).toEqual({ kind: 'point', role: 'notch', id: 'n1' });
		expect(r.distanceMm).toBeCloseTo(Math.SQRT2, 12);
	});

	it('leaves the point where it is when nothing is inside the radius', () => {
		const p = { x: 50, y: 50 };
		const r = pointSnap(p, { radiusMm: 5, points, edges: [{ chain: square, id: 'sq' }], grid: { spacingMm: 20, origin: { x: 0, y: 0 } } });
		expect(r.point).toEqual(p);
		expect(r.target).toEqual({ kind: 'none' });
		expect(r.distanceMm).toBe(0);
	});

	it('never moves a point farther than the radius, whatever it snaps to', () => {
		const circle = bezierCircle({ x: 0, y: 0 }, 80);
		const cands = chainSnapPoints(circle, 'c');
		fc.assert(
			fc.property(arbPoint(120), fc.double({ min: 0.1, max: 30, noNaN: true }), (p, radiusMm) => {
				const r = pointSnap(p, {
					radiusMm,
					points: cands,
					edges: [{ chain: circle, id: 'c' }],
					grid: { spacingMm: 25.4, origin: { x: 3, y: -7 } },
					angle: { anchor: { x: 5, y: 5 }, stepRad: angleFromDegrees(15) }
				});
				expect(vecDistance(r.point, p)).toBeLessThanOrEqual(radiusMm + 1e-9);
				expect(Math.abs(vecDistance(r.point, p) - r.distanceMm)).toBeLessThan(1e-9);
			}),
			{ numRuns: 200 }
		);
	});
});

describe('snapping to edges', () => {
	it('lands on the nearest point of a straight edge, with the segment and t', () => {
		const r = pointSnap({ x: 103, y: 25 }, { radiusMm: 5, edges: [{ chain: square, id: 'sq' }] });
		expect(r.point).toEqual({ x: 100, y: 25 });
		expect(r.target).toEqual({ kind: 'edge', id: 'sq', segmentIndex: 1, t: 0.25 });
	});

	// Reference: brute-force sampling of the cubic at 20,000 parameters (D); the snap is never farther
	// than the densest sample, and the point it returns lies on the curve at the t it reports.
	it('on a cubic is at least as near as a dense sampling of the curve, and on the curve', () => {
		fc.assert(
			fc.property(arbPoint(100), arbPoint(100), arbPoint(100), arbPoint(100), arbPoint(120), (p0, p1, p2, p3, q) => {
				const c: CubicSegment = { kind: 'cubic', p0, p1, p2, p3 };
				const r = snapToEdges(q, [{ chain: { segments: [c] }, id: 'c' }], 1000);
				expect(r).not.toBeNull();
				let dense = Infinity;
				for (let k = 0; k <= 20000; k++) dense = Math.min(dense, vecDistance(segmentPointAt(c, k / 20000), q));
				// 1e-6 mm slack: on degenerate cubics (collinear, doubling back) Newton stops within a micron
				expect(r!.distanceMm).toBeLessThanOrEqual(dense + 1e-6);
				if (r!.target.kind !== 'edge') throw new Error('expected an edge');
				expect(vecDistance(r!.point, segmentPointAt(c, r!.target.t))).toBeLessThan(1e-9);
			}),
			{ numRuns: 60 }
		);
	});

	it('skips the segments that move with the dragged point and reports the others by their own index', () => {
		// near the top edge (segment 0) but that one is skipped: the left edge (segment 3) is next nearest
		const r = snapToEdges({ x: 3, y: 2 }, [{ chain: square, id: 'sq', skipSegments: [0] }], 5);
		expect(r?.target).toEqual({ kind: 'edge', id: 'sq', segmentIndex: 3, t: 0.98 });
		expect(r?.point.x).toBe(0);
		expect(snapToEdges({ x: 50, y: 2 }, [{ chain: square, id: 'sq', skipSegments: [0] }], 5)).toBeNull();
	});

	it('picks the nearer of two chains', () => {
		const other = outlineFromPolyline([{ x: 104, y: 0 }, { x: 200, y: 0 }, { x: 200, y: 100 }, { x: 104, y: 100 }]);
		const r = snapToEdges({ x: 103, y: 50 }, [{ chain: square, id: 'a' }, { chain: other, id: 'b' }], 5);
		expect(r?.target.kind === 'edge' && r.target.id).toBe('b');
		expect(r?.distanceMm).toBeCloseTo(1, 12);
	});
});

describe('snapping to the grid', () => {
	it('lands on a node of the grid (inch grid, shifted origin), the nearest one', () => {
		const grid = { spacingMm: 25.4, origin: { x: 3, y: -7 } };
		fc.assert(
			fc.property(arbPoint(500), (p) => {
				const r = snapToGrid(p, grid, 100);
				expect(r).not.toBeNull();
				if (r!.target.kind !== 'grid') throw new Error('expected grid');
				const { column, row } = r!.target;
				expect(Math.abs(r!.point.x - (3 + column * 25.4))).toBeLessThan(1e-9);
				expect(Math.abs(r!.point.y - (-7 + row * 25.4))).toBeLessThan(1e-9);
				// brute force over the neighbouring nodes: none is nearer
				for (let i = -1; i <= 1; i++)
					for (let j = -1; j <= 1; j++) {
						const n = { x: 3 + (column + i) * 25.4, y: -7 + (row + j) * 25.4 };
						expect(r!.distanceMm).toBeLessThanOrEqual(vecDistance(p, n) + 1e-9);
					}
			})
		);
	});

	it('does not snap past the radius, and a node of a 20 mm grid is reached from within it', () => {
		const grid = { spacingMm: 20, origin: { x: 0, y: 0 } };
		expect(snapToGrid({ x: 31, y: 9 }, grid, 2)).toBeNull();
		expect(snapToGrid({ x: 39, y: 41 }, grid, 2)?.point).toEqual({ x: 40, y: 40 });
	});
});

describe('snapping to angles', () => {
	const anchor: Vec = { x: 10, y: 20 };
	const step = angleFromDegrees(15);

	it('keeps the length from the anchor and turns to the nearest multiple of the step', () => {
		fc.assert(
			fc.property(fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), fc.double({ min: 1, max: 400, noNaN: true }), (a, len) => {
				const p = { x: anchor.x + len * Math.cos(a), y: anchor.y + len * Math.sin(a) };
				const r = snapToAngle(p, { anchor, stepRad: step }, 1e6);
				expect(r).not.toBeNull();
				if (r!.target.kind !== 'angle') throw new Error('expected angle');
				expect(Math.abs(vecDistance(r!.point, anchor) - len)).toBeLessThan(1e-9);
				const got = Math.atan2(r!.point.y - anchor.y, r!.point.x - anchor.x);
				// a multiple of 15°, at most half a step from where the point was
				const k = got / step;
				expect(Math.abs(k - Math.round(k))).toBeLessThan(1e-9);
				const turned = Math.abs(Math.atan2(Math.sin(got - a), Math.cos(got - a)));
				expect(turned).toBeLessThanOrEqual(step / 2 + 1e-12);
			})
		);
	});

	it('snaps a nearly horizontal drag onto the horizontal, y down', () => {
		const r = pointSnap({ x: 110, y: 22 }, { radiusMm: 5, angle: { anchor, stepRad: step } });
		expect(r.target).toEqual({ kind: 'angle', anchor, angleRad: 0, step: 0 });
		expect(r.point.y).toBeCloseTo(20, 12);
		expect(r.point.x).toBeCloseTo(10 + Math.hypot(100, 2), 12);
	});

	it('does nothing on the anchor itself', () => {
		expect(snapToAngle(anchor, { anchor, stepRad: step }, 5)).toBeNull();
	});
});

describe('priority between kinds', () => {
	const points: SnapPointCandidate[] = [{ point: { x: 100, y: 20 }, role: 'segment_end', id: 'sq' }];
	const edges = [{ chain: square, id: 'sq' }];
	const grid = { spacingMm: 20, origin: { x: 0, y: 0 } };

	it('prefers a point to a nearer edge, and an edge to a nearer grid node (default order)', () => {
		const p = { x: 101, y: 22 };
		expect(pointSnap(p, { radiusMm: 5, points, edges, grid }).target.kind).toBe('point');
		expect(pointSnap({ x: 101, y: 49 }, { radiusMm: 5, points, edges, grid: { spacingMm: 10, origin: { x: 0, y: 0 } } }).target).toMatchObject({ kind: 'edge', segmentIndex: 1 });
	});

	it('follows the order given, and leaves out kinds that are not in it', () => {
		const p = { x: 101, y: 22 };
		expect(pointSnap(p, { radiusMm: 5, points, edges, grid, order: ['grid', 'point'] }).target).toEqual({ kind: 'grid', column: 5, row: 1 });
		expect(pointSnap(p, { radiusMm: 5, points, edges, grid, order: ['edge'] }).target.kind).toBe('edge');
	});

	it('falls back to the next kind when the first has nothing inside the radius', () => {
		const r = pointSnap({ x: 50, y: 3 }, { radiusMm: 4, points, edges, grid });
		expect(r.target).toMatchObject({ kind: 'edge', id: 'sq', segmentIndex: 0 });
		expect(r.point).toEqual({ x: 50, y: 0 });
	});
});

describe('snap points of an outline', () => {
	it('lists each corner once and every handle of the cubics', () => {
		const circle = bezierCircle({ x: 0, y: 0 }, 50);
		const pts = chainSnapPoints(circle, 'c');
		expect(pts.filter((p) => p.role === 'segment_end')).toHaveLength(4);
		expect(pts.filter((p) => p.role === 'handle')).toHaveLength(8);
		expect(pts.every((p) => p.id === 'c')).toBe(true);
	});

	it('keeps the end of an open path and the shared ends of skipped segments', () => {
		const path = { segments: square.segments.slice(0, 3) }; // open: 4 ends
		expect(chainSnapPoints(path, 'p').map((p) => p.point)).toEqual([{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }]);
		// dragging the corner (100, 0): segments 0 and 1 move with it; (0, 0) and (100, 100) stay targets
		const kept = chainSnapPoints(square, 'sq', [0, 1]).map((p) => p.point);
		expect(kept).toContainEqual({ x: 0, y: 0 });
		expect(kept).toContainEqual({ x: 100, y: 100 });
		expect(kept).not.toContainEqual({ x: 100, y: 0 });
	});
});
