import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '$lib/pattern/fixtures/front-bodice-block';
import { dartNear, hitTest, snapPoint } from './hit';
import { fmtLength, lengthFromField, lengthToField } from './units';
import { fitBox, screenToWorld, worldToScreen, zoomAbout } from './view';

describe('editor units', () => {
	it('shows lengths in mm, cm and inches in eighths', () => {
		expect(fmtLength(210.238, 'mm')).toBe('210.2 mm');
		expect(fmtLength(210.238, 'cm')).toBe('21.02 cm');
		expect(fmtLength(210.238, 'in')).toBe('8 1/4 in');
		expect(fmtLength(-3.175, 'in')).toBe('−1/8 in');
	});
	it('reads typed lengths back in mm', () => {
		expect(lengthFromField('4 7/8', 'in')).toBeCloseTo(123.825, 6);
		expect(lengthFromField('12,5', 'cm')).toBe(125);
		expect(lengthFromField('−15', 'mm')).toBe(-15);
		expect(lengthFromField('abc', 'mm')).toBeNull();
		expect(lengthToField(30, 'in')).toBe('1 1/8');
		expect(lengthFromField(lengthToField(30, 'in'), 'in')).toBeCloseTo(28.575, 6);
	});
});

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
	it('snaps to points before midpoints and edges, then to the 10 mm grid', () => {
		expect(snapPoint(placed, { x: 336, y: 229 }, 3, { grid: true }).kind).toBe('point');
		expect(snapPoint(placed, { x: 330, y: 335 }, 3, { grid: true }).kind).toBe('midpoint');
		const g = snapPoint(placed, { x: 21, y: 39 }, 3, { grid: true });
		expect(g.kind).toBe('grid');
		expect(g.world).toEqual({ x: 20, y: 40 });
	});
	it('finds the dart near a point', () => {
		const d = piece.darts[0];
		const bp = piece.apexes[0].point;
		const onLeg = { x: bp.x + (d.leg1End.x - bp.x) * 0.85 + 3, y: bp.y + (d.leg1End.y - bp.y) * 0.85 };
		expect(dartNear(piece, onLeg, 10)).toBe('shoulder-dart');
		expect(dartNear(piece, { x: 20, y: 400 }, 10)).toBeNull();
	});
});
