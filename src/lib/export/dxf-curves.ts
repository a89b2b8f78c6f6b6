/**
 * Curves of a DXF read as points: arcs, circles, bulged polyline spans and B-splines are flattened into
 * chords that stay within DXF_IMPORT_TOLERANCE_MM of the exact curve; open entities that meet end to end
 * are chained into closed loops. Pure; coordinates in the file's own units (the caller scales).
 */

export type Pt = { x: number; y: number; bulge?: number };

/** Largest distance of an imported chord from the curve it stands for (mm). */
export const DXF_IMPORT_TOLERANCE_MM = 0.01;
/** Ends of two entities closer than this are one corner of a chained boundary (mm). */
export const DXF_CHAIN_GAP_MM = 0.05;

/** Steps for an arc of radius r and sweep theta so that the chord's sagitta stays within tol. */
function arcSteps(r: number, sweepRad: number, tol: number): number {
	const ratio = Math.min(1, tol / Math.max(Math.abs(r), 1e-12));
	const step = 2 * Math.acos(1 - ratio);
	return Math.max(2, Math.ceil(Math.abs(sweepRad) / Math.max(step, 1e-4)));
}

/** Points of an arc from start to start + sweep (radians, counter-clockwise positive), both ends included. */
export function arcPoints(c: Pt, r: number, startRad: number, sweepRad: number, tol: number): Pt[] {
	const n = arcSteps(r, sweepRad, tol);
	const out: Pt[] = [];
	for (let k = 0; k <= n; k++) {
		const t = startRad + (sweepRad * k) / n;
		out.push({ x: c.x + r * Math.cos(t), y: c.y + r * Math.sin(t) });
	}
	return out;
}

/** An ARC entity (angles counter-clockwise from start to end). */
export function dxfArcPoints(c: Pt, r: number, startRad: number, endRad: number, tol: number): Pt[] {
	let sweep = endRad - startRad;
	while (sweep <= 0) sweep += 2 * Math.PI;
	return arcPoints(c, r, startRad, sweep, tol);
}

/** A CIRCLE entity as a closed ring (the last point is not repeated). */
export function circlePoints(c: Pt, r: number, tol: number): Pt[] {
	return arcPoints(c, r, 0, 2 * Math.PI, tol).slice(0, -1);
}

/** A polyline's points, with bulged (arc) spans flattened within tol. A closed ring is not repeated at its end. */
export function polylinePoints(vs: readonly Pt[], closed: boolean, tol: number): Pt[] {
	const out: Pt[] = [];
	const n = vs.length;
	for (let i = 0; i < n; i++) {
		const a = vs[i];
		out.push({ x: a.x, y: a.y });
		const b = vs[(i + 1) % n];
		if (!a.bulge || (!closed && i === n - 1)) continue;
		const theta = 4 * Math.atan(a.bulge);
		const chord = Math.hypot(b.x - a.x, b.y - a.y);
		if (chord === 0) continue;
		const r = chord / (2 * Math.sin(theta / 2));
		const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
		const h = r * Math.cos(theta / 2);
		const c = { x: mid.x - ((b.y - a.y) / chord) * h, y: mid.y + ((b.x - a.x) / chord) * h };
		const start = Math.atan2(a.y - c.y, a.x - c.x);
		const pts = arcPoints(c, Math.abs(r), start, theta, tol);
		out.push(...pts.slice(1, -1));
	}
	return out;
}

/** The B-spline of the given degree, knots and control points at u (de Boor). */
function deBoor(degree: number, knots: readonly number[], ctrl: readonly Pt[], u: number): Pt {
	const n = ctrl.length - 1;
	let k = degree;
	while (k < n && u >= knots[k + 1]) k++;
	const d = ctrl.slice(k - degree, k + 1).map((p) => ({ x: p.x, y: p.y }));
	for (let r = 1; r <= degree; r++) {
		for (let j = degree; j >= r; j--) {
			const i = j + k - degree;
			const den = knots[i + degree + 1 - r] - knots[i];
			const a = den === 0 ? 0 : (u - knots[i]) / den;
			d[j] = { x: (1 - a) * d[j - 1].x + a * d[j].x, y: (1 - a) * d[j - 1].y + a * d[j].y };
		}
	}
	return d[degree];
}

/** Why a SPLINE cannot be read, or null. */
export function splineProblem(s: { degree: number; knots: readonly number[]; ctrl: readonly Pt[]; rational: boolean }): string | null {
	if (s.rational) return 'a rational spline (with weights) is not read: convert it to a polyline or a plain spline';
	if (!(s.degree >= 1 && s.degree <= 5)) return `its degree ${s.degree} is not between 1 and 5`;
	if (s.ctrl.length < s.degree + 1) return 'it has too few control points (fit-point-only splines are not read)';
	if (s.knots.length !== s.ctrl.length + s.degree + 1) return 'its knots do not match its control points';
	for (let i = 1; i < s.knots.length; i++) if (!(s.knots[i] >= s.knots[i - 1])) return 'its knots are not in order';
	return null;
}

/**
 * A non-rational B-spline flattened within tol: each knot span is cut in two until the curve's midpoint
 * and quarter points lie within tol of the chord.
 */
export function splinePoints(degree: number, knots: readonly number[], ctrl: readonly Pt[], tol: number): Pt[] {
	const u0 = knots[degree];
	const u1 = knots[knots.length - 1 - degree];
	const at = (u: number) => deBoor(degree, knots, ctrl, u);
	const off = (p: Pt, a: Pt, b: Pt) => {
		const dx = b.x - a.x;
		const dy = b.y - a.y;
		const l = Math.hypot(dx, dy);
		return l === 0 ? Math.hypot(p.x - a.x, p.y - a.y) : Math.abs((p.x - a.x) * dy - (p.y - a.y) * dx) / l;
	};
	const out: Pt[] = [at(u0)];
	const walk = (ua: number, ub: number, a: Pt, b: Pt, depth: number) => {
		const um = (ua + ub) / 2;
		const m = at(um);
		const q1 = at((ua + um) / 2);
		const q3 = at((um + ub) / 2);
		if (depth < 16 && Math.max(off(m, a, b), off(q1, a, b), off(q3, a, b)) > tol) {
			walk(ua, um, a, m, depth + 1);
			walk(um, ub, m, b, depth + 1);
		} else out.push(b);
	};
	const spans = [...new Set(knots.slice(degree, knots.length - degree))].filter((u) => u >= u0 && u <= u1);
	for (let i = 0; i + 1 < spans.length; i++) {
		// two halves at least, so a span that bends back on itself is not taken for a straight one
		const mid = (spans[i] + spans[i + 1]) / 2;
		walk(spans[i], mid, out[out.length - 1], at(mid), 0);
		walk(mid, spans[i + 1], out[out.length - 1], at(spans[i + 1]), 0);
	}
	return out;
}

export interface ChainPart<S> {
	readonly points: readonly Pt[];
	readonly source: S;
}

/**
 * Open parts joined end to end (either way round) into closed loops. Parts that close no loop are given
 * back as `open`, each with the end that found no partner.
 */
export function chainLoops<S>(parts: readonly ChainPart<S>[], gap: number): { loops: { points: Pt[]; sources: S[] }[]; open: { source: S; end: Pt }[] } {
	const left = parts.filter((p) => p.points.length >= 2).map((p) => ({ ...p, used: false }));
	const loops: { points: Pt[]; sources: S[] }[] = [];
	const open: { source: S; end: Pt }[] = [];
	const near = (a: Pt, b: Pt) => Math.hypot(a.x - b.x, a.y - b.y) <= gap;
	for (const start of left) {
		if (start.used) continue;
		start.used = true;
		const pts: Pt[] = [...start.points];
		const sources: S[] = [start.source];
		let closed = near(pts[0], pts[pts.length - 1]) && pts.length > 2;
		while (!closed) {
			const end = pts[pts.length - 1];
			const next = left.find((p) => !p.used && (near(p.points[0], end) || near(p.points[p.points.length - 1], end)));
			if (!next) break;
			next.used = true;
			const seq = near(next.points[0], end) ? next.points : [...next.points].reverse();
			pts.push(...seq.slice(1));
			sources.push(next.source);
			closed = near(pts[0], pts[pts.length - 1]);
		}
		if (closed) {
			pts.pop();
			loops.push({ points: pts, sources });
		} else open.push({ source: sources[sources.length - 1], end: pts[pts.length - 1] });
	}
	return { loops, open };
}
