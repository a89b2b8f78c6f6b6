// DXF boundaries drawn with curves (arcs, circles, bulged polylines, splines, pieces chained end to end)
// and notch kinds, read by the importer: areas against closed forms, chords within the stated tolerance.
import { describe, expect, it } from 'vitest';
import { DxfWriter, LWPolylineFlags, SplineFlags, Units, point3d } from '@tarikjabiri/dxf';
import { outlineArea, pathLength, pathNearestPoint, type Outline } from '$lib/pattern/kernel';
import { rectPiece } from './test-support/rect-piece';
import { DXF_IMPORT_TOLERANCE_MM } from './dxf-curves';
import { styleDxf } from './dxf-writer';
import { dxfImport } from './import-dxf';
import { importedPieces } from './import-model';
import { importRefusal } from './test-support/refusal';

function drawing(draw: (d: DxfWriter) => void): string {
	const d = new DxfWriter();
	d.setUnits(Units.Millimeters);
	d.addLayer('1', 7);
	d.addLayer('4', 1);
	draw(d);
	return d.stringify();
}
const only = (text: string) => {
	const pieces = importedPieces(dxfImport(text));
	expect(pieces).toHaveLength(1);
	return pieces[0];
};
/** Largest distance of the outline's corners from a circle (mm). */
const offCircle = (o: Outline, cx: number, cy: number, r: number) => Math.max(...o.segments.map((s) => Math.abs(Math.hypot(s.p0.x - cx, s.p0.y - cy) - r)));
const refusal = importRefusal;

describe('DXF boundaries drawn with curves', () => {
	it('reads a CIRCLE as a closed boundary: corners on the circle, chords within the tolerance (area πr², within 0.1 %)', () => {
		const p = only(drawing((d) => d.addCircle(point3d(100, 100, 0), 60, { layerName: '1' })));
		expect(offCircle(p.outline, 100, -100, 60)).toBeLessThan(1e-9);
		const sagitta = Math.max(...p.outline.segments.map((s) => 60 - Math.hypot((s.p0.x + s.p1.x) / 2 - 100, (s.p0.y + s.p1.y) / 2 + 100)));
		expect(sagitta).toBeLessThanOrEqual(DXF_IMPORT_TOLERANCE_MM + 1e-9);
		expect(Math.abs(outlineArea(p.outline) - Math.PI * 60 * 60) / (Math.PI * 60 * 60)).toBeLessThan(0.001);
	});

	it('chains LINEs and ARCs that meet end to end, in any direction, into one boundary (a slot: rectangle and two half circles)', () => {
		const p = only(
			drawing((d) => {
				d.addLine(point3d(0, 0, 0), point3d(200, 0, 0), { layerName: '1' });
				d.addArc(point3d(200, 40, 0), 40, -90, 90, { layerName: '1' });
				// drawn backwards: from the left end to the right
				d.addLine(point3d(0, 80, 0), point3d(200, 80, 0), { layerName: '1' });
				d.addArc(point3d(0, 40, 0), 40, 90, 270, { layerName: '1' });
			})
		);
		const want = 200 * 80 + Math.PI * 40 * 40;
		expect(Math.abs(outlineArea(p.outline) - want) / want).toBeLessThan(0.001);
		expect(Math.abs(pathLength(p.outline) - (400 + 2 * Math.PI * 40)) / (400 + 2 * Math.PI * 40)).toBeLessThan(0.001);
	});

	it('reads LWPOLYLINE bulges as arcs (bulge 1 = half circle)', () => {
		const p = only(
			drawing((d) =>
				d.addLWPolyline(
					[
						{ point: { x: 0, y: 0 }, bulge: 1 },
						// the arc from (0, 0) to (100, 0) turns counter-clockwise: below the chord, away from the rectangle
						{ point: { x: 100, y: 0 } },
						{ point: { x: 100, y: 50 } },
						{ point: { x: 0, y: 50 } }
					],
					{ flags: LWPolylineFlags.Closed, layerName: '1' }
				)
			)
		);
		const want = 100 * 50 + (Math.PI * 50 * 50) / 2;
		expect(Math.abs(outlineArea(p.outline) - want) / want).toBeLessThan(0.001);
	});

	it('reads a cubic SPLINE within the tolerance of the same curve as a Bézier (one span, clamped knots)', () => {
		const c = [
			{ x: 0, y: 0 },
			{ x: 40, y: 120 },
			{ x: 160, y: 120 },
			{ x: 200, y: 0 }
		];
		const p = only(
			drawing((d) => {
				d.addSpline({ controlPoints: c.map((q) => point3d(q.x, q.y, 0)), degreeCurve: 3, knots: [0, 0, 0, 0, 1, 1, 1, 1], flags: SplineFlags.Planar }, { layerName: '1' });
				d.addLine(point3d(200, 0, 0), point3d(0, 0, 0), { layerName: '1' });
			})
		);
		// the same curve in the product's own type (y flipped as the importer does)
		const bezier: Outline = {
			segments: [
				{ kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 40, y: -120 }, p2: { x: 160, y: -120 }, p3: { x: 200, y: 0 } },
				{ kind: 'line', p0: { x: 200, y: 0 }, p1: { x: 0, y: 0 } }
			]
		};
		for (const s of p.outline.segments) {
			expect(pathNearestPoint(bezier, s.p0).distance).toBeLessThan(1e-6);
			const mid = { x: (s.p0.x + s.p1.x) / 2, y: (s.p0.y + s.p1.y) / 2 };
			expect(pathNearestPoint(bezier, mid).distance).toBeLessThanOrEqual(DXF_IMPORT_TOLERANCE_MM * 1.01);
		}
		expect(Math.abs(outlineArea(p.outline) - outlineArea(bezier)) / outlineArea(bezier)).toBeLessThan(0.001);
	});

	it('refuses boundary pieces that do not close, naming the entity and where it ends', () => {
		const e = refusal(() =>
			dxfImport(
				drawing((d) => {
					d.addLine(point3d(0, 0, 0), point3d(200, 0, 0), { layerName: '1' });
					d.addArc(point3d(200, 40, 0), 40, -90, 90, { layerName: '1' });
				})
			)
		);
		expect([e.status, e.code]).toEqual([422, 'open_boundary']);
		expect(e.message).toMatch(/(LINE|ARC) .*layer 1 in model space: the boundary is open/);
	});

	it('refuses a rational spline, whose weights it cannot read, naming it', () => {
		const text = drawing((d) =>
			d.addSpline({ controlPoints: [point3d(0, 0, 0), point3d(50, 80, 0), point3d(100, 0, 0)], degreeCurve: 2, knots: [0, 0, 0, 1, 1, 1], weights: [1, 0.7, 1], flags: SplineFlags.Closed | SplineFlags.Rational }, { layerName: '1' })
		);
		const e = refusal(() => dxfImport(text));
		expect([e.status, e.code]).toEqual([422, 'unreadable_curve']);
		expect(e.message).toMatch(/SPLINE .*layer 1 .*rational/);
	});
});

describe('notch kinds on layer 4', () => {
	it('exports single and double notches as slits and reads them back as the same kinds at the same places', () => {
		const base = rectPiece({ name: 'Panel', w: 200, h: 300, cut: 'single' });
		const piece = {
			...base,
			notches: [
				{ id: 'a', at: { x: 0, y: 100 }, count: 1 as const },
				{ id: 'b', at: { x: 200, y: 150 }, count: 2 as const },
				{ id: 'c', at: { x: 80, y: 300 }, count: 2 as const }
			]
		};
		const back = importedPieces(dxfImport(styleDxf([{ piece, styleName: 'S', sizeLabel: '10', quantity: 1, category: 'self' }])))[0];
		// the importer's coordinates are the block's own: match by shape, translated
		const shift = { x: back.outline.segments[0].p0.x - piece.outline.segments[0].p0.x, y: back.outline.segments[0].p0.y - piece.outline.segments[0].p0.y };
		expect(back.notches).toHaveLength(3);
		for (const n of piece.notches) {
			const got = back.notches.find((m) => Math.hypot(m.at.x - shift.x - n.at.x, m.at.y - shift.y - n.at.y) < 0.1);
			expect(got, n.id).toBeDefined();
			expect(got!.count).toBe(n.count);
		}
	});

	it('reads a POINT on layer 4 as a single notch', () => {
		const p = only(
			drawing((d) => {
				d.addCircle(point3d(0, 0, 0), 50, { layerName: '1' });
				d.addPoint(50, 0, 0, { layerName: '4' });
			})
		);
		expect(p.notches.map((n) => n.count)).toEqual([1]);
		expect(Math.hypot(p.notches[0].at.x - 50, p.notches[0].at.y)).toBeLessThan(0.02);
	});
});
