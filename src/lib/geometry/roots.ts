/**
 * Real roots in [0,1] of a polynomial of degree ≤ 3 given in Bernstein form with coefficients
 * d0..d3 (f(t) = Σ dᵢ·Bᵢ³(t)). Robust: the interval is cut at the roots of f' into monotone pieces,
 * each sign change is bracketed and solved by safeguarded Newton/bisection; touching zeros
 * (|f| ≤ zeroTolerance at a turning point or an end) are reported as roots too.
 * Roots are returned sorted, de-duplicated.
 */
export function bernsteinCubicRoots(d0: number, d1: number, d2: number, d3: number, zeroTolerance: number): number[] {
	// quick rejection: all coefficients strictly on one side (convex hull property)
	if (d0 > zeroTolerance && d1 > zeroTolerance && d2 > zeroTolerance && d3 > zeroTolerance) return [];
	if (d0 < -zeroTolerance && d1 < -zeroTolerance && d2 < -zeroTolerance && d3 < -zeroTolerance) return [];
	const f = (t: number): number => {
		const mt = 1 - t;
		return mt * mt * mt * d0 + 3 * mt * mt * t * d1 + 3 * mt * t * t * d2 + t * t * t * d3;
	};
	const df = (t: number): number => {
		const mt = 1 - t;
		return 3 * (mt * mt * (d1 - d0) + 2 * mt * t * (d2 - d1) + t * t * (d3 - d2));
	};
	// derivative (quadratic, Bernstein e0,e1,e2) → power form A t² + B t + C
	const e0 = d1 - d0;
	const e1 = d2 - d1;
	const e2 = d3 - d2;
	const A = e0 - 2 * e1 + e2;
	const B = 2 * (e1 - e0);
	const C = e0;
	const breaks: number[] = [0];
	for (const r of quadraticRoots(A, B, C)) if (r > 0 && r < 1) breaks.push(r);
	breaks.push(1);
	breaks.sort((a, b) => a - b);
	const roots: number[] = [];
	const push = (t: number): void => {
		if (roots.length > 0 && Math.abs(roots[roots.length - 1] - t) < 1e-12) return;
		roots.push(t);
	};
	let lo = breaks[0];
	let flo = f(lo);
	if (Math.abs(flo) <= zeroTolerance) push(lo);
	for (let k = 1; k < breaks.length; k++) {
		const hi = breaks[k];
		const fhi = f(hi);
		const loZero = Math.abs(flo) <= zeroTolerance;
		const hiZero = Math.abs(fhi) <= zeroTolerance;
		if (!loZero && !hiZero && (flo < 0) !== (fhi < 0)) {
			push(solveBracketed(f, df, lo, hi, flo));
		}
		if (hiZero) push(hi);
		lo = hi;
		flo = fhi;
	}
	return roots;
}

function solveBracketed(f: (t: number) => number, df: (t: number) => number, lo: number, hi: number, flo: number): number {
	let a = lo;
	let b = hi;
	const aNeg = flo < 0;
	let t = 0.5 * (a + b);
	for (let i = 0; i < 100; i++) {
		const ft = f(t);
		if (ft === 0) return t;
		if (ft < 0 === aNeg) a = t;
		else b = t;
		const d = df(t);
		let next = d !== 0 ? t - ft / d : NaN;
		if (!(next > a && next < b)) next = 0.5 * (a + b);
		if (Math.abs(next - t) < 1e-15 || b - a < 1e-15) return next;
		t = next;
	}
	return t;
}

/** Real roots of A t² + B t + C (any degree ≤ 2; numerically stable form). */
export function quadraticRoots(A: number, B: number, C: number): number[] {
	const scale = Math.max(Math.abs(A), Math.abs(B), Math.abs(C));
	if (scale === 0) return [];
	if (Math.abs(A) <= 1e-12 * scale) {
		if (Math.abs(B) <= 1e-14 * scale) return [];
		return [-C / B];
	}
	const disc = B * B - 4 * A * C;
	if (disc < 0) {
		if (disc > -1e-14 * B * B) return [-B / (2 * A)];
		return [];
	}
	const sq = Math.sqrt(disc);
	const q = -0.5 * (B + (B >= 0 ? sq : -sq));
	const r1 = q / A;
	const r2 = q !== 0 ? C / q : r1;
	return r1 < r2 ? [r1, r2] : [r2, r1];
}
