import Flatten from '@flatten-js/core';
import { Bezier } from 'bezier-js';
import ClipperLib from 'clipper-lib';
import { bench, describe } from 'vitest';
import {
	outlineContainsPoint,
	outlineFlatten,
	outlineFromPolyline,
	outlineLineIntersections,
	outlinePerimeter,
	outlineRotateAbout,
	outlineSignedArea,
	pathLength,
	type Outline,
	type Segment
} from '../../src/lib/geometry';
import { starPolygon } from '../../src/lib/geometry/test-support/arbitraries';
import { allowance } from '../../src/lib/pattern/panels/allowance';
import { CLIPPER_SCALE, toClipper } from '../../src/lib/pattern/panels/clipper-tools';
import { manyVertexPiece } from '../../src/lib/pattern/panels/fixtures/simple-pieces';

/**
 * The kernel beside the general-purpose libraries a user would otherwise pick, on the same inputs in
 * the same run (`npm run bench:medians -- tests/bench/reference-libraries.bench.ts` prints each group's
 * medians and the ratio reference ÷ kernel). Each library's input object is built once, outside the
 * timed function, as the kernel's is.
 *
 * - area, length, rotation, point-in, line intersections: a 2,000-vertex star polygon (radii 50–150 mm)
 *   against @flatten-js/core 1.6.15 (`Polygon.area()`, the sum of its edges' `length` — its
 *   `face.perimeter` is stored when the polygon is built, so it is not a measurement —, `rotate`,
 *   `contains`, `intersect(Line)`);
 * - curve length: 667 cubics (the geometry bench's "cubics" shape) against bezier-js 6.1.4
 *   `Bezier.length()` (fixed 24-point Legendre–Gauss; the kernel's adaptive quadrature is accurate to
 *   1e-10 relative, so it does more work per curve);
 * - offset: a 10 mm seam allowance round a smooth 2,000-vertex piece. The kernel's `allowance` (per-edge
 *   bands from clipper-lib, corners, union, curves flattened to 0.002 mm and simplified first) against
 *   clipper-lib 6.4.2's own `ClipperOffset` of the flattened outline (round joins, one call): what the
 *   product adds on top of the library, measured.
 */

const n = 2000;
const poly: Outline = outlineFromPolyline(starPolygon(n, 42));
const flatPoly = new Flatten.Polygon(starPolygon(n, 42).map((p) => [p.x, p.y] as [number, number]));
const flatFace = [...flatPoly.faces][0] as Flatten.Face;
const centre = { x: 10, y: 20 };
const flatCentre = new Flatten.Point(10, 20);
const probe = { x: 12.5, y: -3.25 };
const flatProbe = new Flatten.Point(12.5, -3.25);
const flatLine = new Flatten.Line(new Flatten.Point(0, 0), new Flatten.Point(0.6, 0.8));

const pts = starPolygon(Math.round(n / 3), 7);
const cubics: Segment[] = pts.map((p0, i) => {
	const p3 = pts[(i + 1) % pts.length];
	const dx = p3.x - p0.x, dy = p3.y - p0.y;
	return {
		kind: 'cubic',
		p0,
		p1: { x: p0.x + dx / 3 - 0.1 * dy, y: p0.y + dy / 3 + 0.1 * dx },
		p2: { x: p0.x + (2 * dx) / 3 - 0.1 * dy, y: p0.y + (2 * dy) / 3 + 0.1 * dx },
		p3
	};
});
const curvePath = { segments: cubics };
const beziers = cubics.map((s) => (s.kind === 'cubic' ? new Bezier(s.p0.x, s.p0.y, s.p1.x, s.p1.y, s.p2.x, s.p2.y, s.p3.x, s.p3.y) : null)!);

const piece = manyVertexPiece('oval', n);
const clipperInput = toClipper(outlineFlatten(piece.outline, 0.002));

let sink = 0;

describe(`area, ${n}-vertex polygon`, () => {
	bench('kernel: outlineSignedArea', () => { sink += outlineSignedArea(poly); });
	bench('reference: @flatten-js/core Polygon.area()', () => { sink += flatPoly.area(); });
});

describe(`length, ${n}-vertex polygon`, () => {
	bench('kernel: outlinePerimeter', () => { sink += outlinePerimeter(poly); });
	bench('reference: @flatten-js/core sum of edge lengths', () => {
		let s = 0;
		let e: Flatten.Edge = flatFace.first;
		do {
			s += e.length;
			e = e.next;
		} while (e !== flatFace.first);
		sink += s;
	});
});

describe(`rotation, ${n}-vertex polygon`, () => {
	bench('kernel: outlineRotateAbout', () => { sink += outlineRotateAbout(poly, centre, 0.1).segments.length; });
	bench('reference: @flatten-js/core Polygon.rotate()', () => { sink += flatPoly.rotate(0.1, flatCentre).edges.size; });
});

describe(`point-in, ${n}-vertex polygon`, () => {
	bench('kernel: outlineContainsPoint', () => { sink += outlineContainsPoint(poly, probe) ? 1 : 0; });
	bench('reference: @flatten-js/core Polygon.contains()', () => { sink += flatPoly.contains(flatProbe) ? 1 : 0; });
});

describe(`line intersections, ${n}-vertex polygon`, () => {
	bench('kernel: outlineLineIntersections', () => { sink += outlineLineIntersections(poly, { x: 0, y: 0 }, { x: 0.6, y: 0.8 }).length; });
	bench('reference: @flatten-js/core Polygon.intersect(Line)', () => { sink += flatPoly.intersect(flatLine).length; });
});

describe(`curve length, ${cubics.length} cubics`, () => {
	bench('kernel: pathLength (adaptive, 1e-10 relative)', () => { sink += pathLength(curvePath); });
	bench('reference: bezier-js Bezier.length() summed', () => {
		let s = 0;
		for (const b of beziers) s += b.length();
		sink += s;
	});
});

describe(`offset 10 mm, smooth ${n}-vertex piece`, () => {
	bench('kernel: allowance (seam allowance)', () => {
		const r = allowance(piece, { defaultWidthMm: 10 });
		if (!r.ok) throw new Error(r.error.message);
		sink += r.cutLine.length;
	});
	bench('reference: clipper-lib ClipperOffset (round joins)', () => {
		const co = new ClipperLib.ClipperOffset(2, 0.002 * CLIPPER_SCALE);
		co.AddPath(clipperInput, ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
		const out: ClipperLib.Paths = [];
		co.Execute(out, 10 * CLIPPER_SCALE);
		sink += out.length;
	});
});

export { sink };
