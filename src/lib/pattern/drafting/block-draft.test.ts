import Flatten from '@flatten-js/core';
import { describe, expect, it } from 'vitest';
import { outlineProblems, type Outline, type Segment, type Vec } from '../../geometry';
import { astmD5585MeasurementSet, astmD5585Sizes, measurementsMm, type AstmD5585Chart } from '../measurements';
import { pieceStructureProblems } from '../piece';
import { pieceSchema, type Piece } from '../piece-schema';
import { blockDraft } from './block-draft';
import { bustDartIntakeMm, dartAngleRad, dartClearanceSuggestionMm } from './bust-dart';
import { EASE_DEFAULT } from './ease';

// ---- Independent probes (do not use the draft's own numbers) --------------------------------
// Outlines are sampled here with our own Bernstein evaluation and handed to @flatten-js/core 1.6.15
// for the line crossings and point-in-polygon tests.

function bezier(s: Segment, t: number): Vec {
	if (s.kind === 'line') return { x: s.p0.x + (s.p1.x - s.p0.x) * t, y: s.p0.y + (s.p1.y - s.p0.y) * t };
	const u = 1 - t;
	const a = u * u * u, b = 3 * u * u * t, c = 3 * u * t * t, d = t * t * t;
	return { x: a * s.p0.x + b * s.p1.x + c * s.p2.x + d * s.p3.x, y: a * s.p0.y + b * s.p1.y + c * s.p2.y + d * s.p3.y };
}

function samples(o: Outline, perCubic = 200): Vec[] {
	const pts: Vec[] = [];
	for (const s of o.segments) {
		const n = s.kind === 'line' ? 1 : perCubic;
		for (let i = 0; i < n; i++) pts.push(bezier(s, i / n));
	}
	return pts;
}

function polygonOf(o: Outline): Flatten.Polygon {
	return new Flatten.Polygon(samples(o).map((p) => [p.x, p.y] as [number, number]));
}

/** Length of cloth along the horizontal line at y (sum of the intervals inside the outline). */
function clothAlongY(o: Outline, y: number): number {
	const poly = polygonOf(o);
	const xs = poly
		.intersect(new Flatten.Line(new Flatten.Point(-1e4, y), new Flatten.Point(1e4, y)))
		.map((p) => p.x)
		.sort((a, b) => a - b);
	let total = 0;
	for (let i = 0; i + 1 < xs.length; i++) {
		const m = (xs[i] + xs[i + 1]) / 2;
		if (xs[i + 1] - xs[i] > 1e-9 && poly.contains(new Flatten.Point(m, y))) total += xs[i + 1] - xs[i];
	}
	return total;
}

const len = (s: Segment) => {
	let l = 0;
	let prev = bezier(s, 0);
	const n = s.kind === 'line' ? 1 : 2000;
	for (let i = 1; i <= n; i++) {
		const p = bezier(s, i / n);
		l += Math.hypot(p.x - prev.x, p.y - prev.y);
		prev = p;
	}
	return l;
};
const near = (a: Vec, b: Vec, tol = 1e-6) => Math.hypot(a.x - b.x, a.y - b.y) <= tol;
const touchesApex = (piece: Piece, s: Segment) =>
	piece.apexes.some((a) => near(s.p0, a.point, 1e-6) || near(s.kind === 'line' ? s.p1 : s.p3, a.point, 1e-6));

/** Sewn length of the straight seam between two cubic runs: line segments after cubic run `k`, dart legs left out. */
function straightRunAfterCubic(piece: Piece, k: number, stop: (s: Segment) => boolean): number {
	const segs = piece.outline.segments;
	let seen = 0;
	let i = 0;
	for (; i < segs.length; i++) {
		if (segs[i].kind === 'cubic' && (i + 1 >= segs.length || segs[i + 1].kind !== 'cubic')) {
			seen++;
			if (seen === k) break;
		}
	}
	let total = 0;
	for (let j = i + 1; j < segs.length && segs[j].kind === 'line'; j++) {
		if (!touchesApex(piece, segs[j])) total += len(segs[j]);
		if (stop(segs[j])) break;
	}
	return total;
}

const waistY = (p: Piece) => Math.max(...samples(p.outline).map((q) => q.y));
/** Side seam: the straight run after the armhole down to the waist corner. */
const sideSeam = (p: Piece) => straightRunAfterCubic(p, 2, (s) => s.kind === 'line' && Math.abs(s.p1.y - waistY(p)) < 1e-9);
/** Shoulder: the straight run after the neckline up to the armhole. */
const shoulder = (p: Piece) => straightRunAfterCubic(p, 1, () => false);

/** Outline problems, except the outline touching itself at a shared dart apex (block darts by design). */
function problemsBesidesApexTouch(p: Piece) {
	return outlineProblems(p.outline).filter(
		(q) => !(q.code === 'self-intersection' && q.point && p.apexes.some((a) => near(q.point!, a.point, 1e-3)))
	);
}

const ROW25_PROFESSIONAL_MM = 1.6; // Threads #200 (2018/19): professional truing tolerance 1/16 in ≈ 1.6 mm (row 25, C/P)
const EPS = 1e-3; // probe lines just off the bust line / waist line, clear of the apex touch points

const cases: { chart: AstmD5585Chart; size: (typeof astmD5585Sizes)[number]; dart: 'shoulder' | 'side' }[] = [];
for (const chart of ['curvy', 'straight'] as const)
	for (const size of astmD5585Sizes) for (const dart of ['shoulder', 'side'] as const) cases.push({ chart, size, dart });

describe('fitted bodice block for every size of ASTM D5585-11e1 Table 1 (row 1, C)', () => {
	it.each(cases)('$chart size $size, bust dart at the $dart', ({ chart, size, dart }) => {
		const m = measurementsMm(astmD5585MeasurementSet(chart, size));
		const { front, back, report } = blockDraft(m, EASE_DEFAULT, { bustDart: dart });
		expect(pieceSchema.safeParse(front).success).toBe(true);
		expect(report.warnings).toEqual([]);
		// every dart wedge runs leg1End → apex → leg2End in the outline (the piece model's own check)
		expect(pieceStructureProblems(front)).toEqual([]);
		expect(pieceStructureProblems(back)).toEqual([]);

		// closed, no self-intersection (the kernel's checks), apart from block darts meeting at BP
		expect(problemsBesidesApexTouch(front)).toEqual([]);
		expect(problemsBesidesApexTouch(back)).toEqual([]);
		// the back has no shared apex: @flatten-js/core must find it a valid simple polygon too
		expect(polygonOf(back.outline).isValid()).toBe(true);

		// both pieces are drafted on one waist line
		expect(waistY(front)).toBeCloseTo(waistY(back), 9);
		const bp = front.apexes.find((a) => a.kind === 'bust_point')!.point;

		// bust girth at the bust line, darts closed = chart bust + bust ease (within 1 mm)
		const bustGirth = 2 * (clothAlongY(front.outline, bp.y - EPS) + clothAlongY(back.outline, bp.y - EPS));
		expect(Math.abs(bustGirth - (m.bust! + EASE_DEFAULT.bustMm))).toBeLessThan(1);
		// waist likewise, waist darts closed (probe just above the waist line, through the dart mouths)
		const wy = waistY(front) - EPS;
		const waistGirth = 2 * (clothAlongY(front.outline, wy) + clothAlongY(back.outline, wy));
		expect(Math.abs(waistGirth - (m.waist! + EASE_DEFAULT.waistMm))).toBeLessThan(1);

		// side seams true (row 25: 1/16 in ≈ 1.6 mm professional, C/P)
		expect(Math.abs(sideSeam(front) - sideSeam(back))).toBeLessThan(ROW25_PROFESSIONAL_MM);
		// shoulders: the back's extra length is taken out by its shoulder dart (stated back shoulder ease,
		// report.seams.backShoulderDartIntakeMm); the sewn back shoulder equals the front shoulder.
		expect(Math.abs(shoulder(front) - shoulder(back))).toBeLessThan(ROW25_PROFESSIONAL_MM);
		expect(report.seams.backShoulderDartIntakeMm).toBeGreaterThan(0);

		// bust point is an apex; both front darts share it; back darts have their own pivots
		expect(front.darts.every((d) => d.apexId === 'bust-point')).toBe(true);
		expect(back.apexes.map((a) => a.kind)).toEqual(['dart_pivot', 'dart_pivot']);
		for (const d of back.darts) {
			const pivot = back.apexes.find((a) => a.id === d.apexId)!.point;
			// row 12 (S): back darts pivot ~38 mm beyond the tip on the dart centre line
			expect(Math.hypot(pivot.x - d.pullBack!.sewnPoint.x, pivot.y - d.pullBack!.sewnPoint.y)).toBeCloseTo(38, 6);
			const mid = { x: (d.leg1End.x + d.leg2End.x) / 2, y: (d.leg1End.y + d.leg2End.y) / 2 };
			const cross = (d.pullBack!.sewnPoint.x - mid.x) * (pivot.y - mid.y) - (d.pullBack!.sewnPoint.y - mid.y) * (pivot.x - mid.x);
			expect(Math.abs(cross)).toBeLessThan(1e-6);
		}
		// grainlines parallel to the centre lines, two arrowheads (row 27, C)
		for (const p of [front, back]) {
			expect(p.grainline!.arrowheads).toBe('both');
			expect(p.grainline!.from.x).toBeCloseTo(p.grainline!.to.x, 9);
		}
		// notches: one at the front armhole, two at the back (primer §7)
		expect(front.notches.find((n) => n.id === 'front-armhole')!.count).toBe(1);
		expect(back.notches.find((n) => n.id === 'back-armhole')!.count).toBe(2);
	});
});

describe('bust dart of the metric block method', () => {
	it('matches the intakes of the metric block method (Aldrich 5th ed. 2008 via a tutorial, row 6, S)', () => {
		// 80/84/88/92/96 cm bust → 58/64/70/76/82 mm (row 6, S)
		expect([800, 840, 880, 920, 960].map(bustDartIntakeMm)).toEqual([58, 64, 70, 76, 82]);
	});
	it('opens the drafted dart by that intake at the shoulder, angle θ = 2·asin(w/2r) (row 17)', () => {
		const { front, report } = blockDraft({ bust: 880, underbust: 740, waist: 700 }, EASE_DEFAULT);
		const d = front.darts.find((x) => x.id === 'bust-dart')!;
		const bp = front.apexes[0].point;
		expect(Math.hypot(d.leg1End.x - d.leg2End.x, d.leg1End.y - d.leg2End.y)).toBeCloseTo(70, 9);
		const r = Math.hypot(d.leg1End.x - bp.x, d.leg1End.y - bp.y);
		const a1 = Math.atan2(d.leg1End.y - bp.y, d.leg1End.x - bp.x);
		const a2 = Math.atan2(d.leg2End.y - bp.y, d.leg2End.x - bp.x);
		expect(Math.abs(a2 - a1)).toBeCloseTo(dartAngleRad(70, r), 9);
		expect(report.bustDart.angleRad).toBeCloseTo(2 * Math.asin(70 / (2 * r)), 12);
	});
	it('keeps the angle when the dart is at the side (row 8, C: angle unchanged wherever the dart is moved)', () => {
		const m = { bust: 960, underbust: 800, waist: 760 };
		const s = blockDraft(m, EASE_DEFAULT, { bustDart: 'shoulder' }).front;
		const t = blockDraft(m, EASE_DEFAULT, { bustDart: 'side' }).front;
		const ang = (p: Piece) => {
			const d = p.darts.find((x) => x.id === 'bust-dart')!;
			const bp = p.apexes[0].point;
			const u = { x: d.leg1End.x - bp.x, y: d.leg1End.y - bp.y };
			const v = { x: d.leg2End.x - bp.x, y: d.leg2End.y - bp.y };
			return Math.abs(Math.atan2(u.x * v.y - u.y * v.x, u.x * v.x + u.y * v.y));
		};
		expect(ang(t)).toBeCloseTo(ang(s), 9);
	});
	it('suggests a dart point clearance within Threads #181 range: 25 mm small bust, up to 64 mm large cups (row 10, C)', () => {
		for (const chart of ['curvy', 'straight'] as const)
			for (const size of astmD5585Sizes) {
				const m = measurementsMm(astmD5585MeasurementSet(chart, size));
				const c = blockDraft(m).report.dartClearanceSuggestionMm;
				expect(c).toBeGreaterThanOrEqual(25);
				expect(c).toBeLessThanOrEqual(64);
			}
		expect(dartClearanceSuggestionMm(900, 800)).toBe(25);
		expect(dartClearanceSuggestionMm(1200, 900)).toBe(64);
	});
});

describe('cut instructions and report', () => {
	it('puts centre front on the fold by default and cuts the back as a pair; both can be changed', () => {
		const m = measurementsMm(astmD5585MeasurementSet('curvy', '10'));
		const a = blockDraft(m);
		expect(a.front.cut).toBe('on_fold');
		expect(a.front.foldLine).not.toBeNull();
		expect(a.back.cut).toBe('pair');
		expect(a.back.foldLine).toBeNull();
		const b = blockDraft(m, EASE_DEFAULT, { frontCut: 'pair', backCut: 'on_fold' });
		expect(b.front.cut).toBe('pair');
		expect(b.back.cut).toBe('on_fold');
	});
	it('reports which measurements were derived, with their rules, and the ease source', () => {
		const m = measurementsMm(astmD5585MeasurementSet('curvy', '10'));
		const { report } = blockDraft(m);
		const byId = Object.fromEntries(report.measurementsUsed.map((u) => [u.id, u]));
		expect(byId.bust.derived).toBe(false);
		expect(byId.back_length.derived).toBe(true);
		expect(byId.back_length.rule).toMatch(/rule of thumb/);
		expect(report.ease.source).toMatch(/costume construction text/);
		expect(report.cautions).toEqual([]);
	});
});
