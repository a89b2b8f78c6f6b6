import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '$lib/pattern/fixtures/front-bodice-block';
import { dartNear, hitTest, snapPoint } from './hit';
import { fitBox, screenToWorld, worldToScreen, zoomAbout } from './view';

describe('editor view', () => {
	it('zooms about a screen point without moving the world point under it', () => {
		const v = { scale: 2, panX: 10, panY: -20 };
		const at = { x: 300, y: 200 };
		const w = screenToWorld(v, at);
		const z = zoomAbout(v, 1.7, at, 0.1, 50);
		const back = worldToScreen(z, w);
		expect(back.x).toBeCloseTo(at.x, 9);
		expect(back.y).toBeCloseTo(at.y, 9);
	});
	it('fits a box into the viewport', () => {
		const v = fitBox({ minX: 0, minY: 0, maxX: 500, maxY: 1000 }, 800, 600, 40);
		expect(v.scale).toBeCloseTo(0.52, 9);
		expect(worldToScreen(v, { x: 250, y: 500 })).toEqual({ x: 400, y: 300 });
	});
});

describe('editor hit testing and snapping', () => {
	const piece = frontBodiceBlock();
	const placed = [{ key: 'a', piece, offset: { x: 100, y: 0 } }];
	it('finds apexes, outline points, edges and the inside, in that order', () => {
		expect(hitTest(placed, { x: 195.5, y: 250 }, 2)?.kind).toBe('apex');
		expect(hitTest(placed, { x: 335, y: 231 }, 2)?.kind).toBe('point');
		const e = hitTest(placed, { x: 332.6, y: 280 }, 2);
		expect(e?.kind).toBe('edge');
		expect(e?.local.y).toBeCloseTo(280, 0);
		expect(hitTest(placed, { x: 160, y: 350 }, 2)?.kind).toBe('inside');
		expect(hitTest(placed, { x: 0, y: 350 }, 2)).toBeNull();
	});
	it('snaps to points before midpoints and edges, then to the pattern paper grid the user chose', () => {
		const cm2 = { gridMm: 20 };
		expect(snapPoint(placed, { x: 336, y: 229 }, 3, { grid: true }, cm2).kind).toBe('point');
		expect(snapPoint(placed, { x: 330, y: 335 }, 3, { grid: true }, cm2).kind).toBe('midpoint');
		const g = snapPoint(placed, { x: 21, y: 39 }, 3, { grid: true }, cm2);
		expect(g.kind).toBe('grid');
		expect(g.world).toEqual({ x: 20, y: 40 });
		// on inch paper the nearest node is 1 in away on each axis
		const inch = snapPoint(placed, { x: 24, y: 27 }, 3, { grid: true }, { gridMm: 25.4 });
		expect(inch.kind).toBe('grid');
		expect(inch.world.x).toBeCloseTo(25.4, 9);
		expect(inch.world.y).toBeCloseTo(25.4, 9);
		// a 10 mm node is no longer a snap on 2 cm paper
		expect(snapPoint(placed, { x: 11, y: 29 }, 3, { grid: true }, cm2).kind).toBe('free');
		expect(snapPoint(placed, { x: 21, y: 39 }, 3, { grid: false }, cm2).kind).toBe('free');
	});
	it('snaps a line end to 15° steps from its other end before the grid', () => {
		const from = { x: 0, y: 600 };
		const s = snapPoint(placed, { x: 50, y: 601.5 }, 3, { grid: true, angleFrom: from }, { gridMm: 20 });
		expect(s.kind).toBe('angle');
		expect(s.world.y).toBeCloseTo(600, 9);
		expect(Math.hypot(s.world.x - from.x, s.world.y - from.y)).toBeCloseTo(Math.hypot(50, 1.5), 9);
	});
	it('on one piece, always gives the nearest point of its outline', () => {
		const s = snapPoint(placed, { x: 0, y: 350 }, 3, { onlyPiece: 'a', outlineOnly: true }, { gridMm: 20 });
		expect(s.pieceKey).toBe('a');
		expect(['edge', 'point', 'midpoint']).toContain(s.kind);
	});
	it('finds the dart near a point', () => {
		const d = piece.darts[0];
		const bp = piece.apexes[0].point;
		const onLeg = { x: bp.x + (d.leg1End.x - bp.x) * 0.85 + 3, y: bp.y + (d.leg1End.y - bp.y) * 0.85 };
		expect(dartNear(piece, onLeg, 10)).toBe('shoulder-dart');
		expect(dartNear(piece, { x: 20, y: 400 }, 10)).toBeNull();
	});
});
