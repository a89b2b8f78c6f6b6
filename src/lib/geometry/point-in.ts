import type { Outline, Vec } from './types';
import { quadraticRoots } from './roots';

/**
 * Point in outline by winding number against the exact curves: a ray from the point toward +x,
 * crossings counted with the half-open rule on y (a crossing counts when one end is above py and
 * the other at or below), cubics cut into y-monotone pieces. Points exactly on the boundary may go
 * either way; use outlineNearestPoint for an "on the line" test.
 */

function cubicY(t: number, a: number, b: number, c: number, d: number): number {
	const mt = 1 - t;
	return mt * mt * mt * a + 3 * mt * mt * t * b + 3 * mt * t * t * c + t * t * t * d;
}

/** Winding number of the outline around p (0 = outside for non-self-intersecting outlines). */
export function outlineWindingNumber(outline: Outline, p: Vec): number {
	const px = p.x;
	const py = p.y;
	const segs = outline.segments;
	let w = 0;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		if (s.kind === 'line') {
			const y0 = s.p0.y;
			const y1 = s.p1.y;
			const g0 = y0 > py;
			const g1 = y1 > py;
			if (g0 === g1) continue;
			const x0 = s.p0.x;
			const x1 = s.p1.x;
			if (x0 <= px && x1 <= px) continue;
			const xc = x0 + ((py - y0) * (x1 - x0)) / (y1 - y0);
			if (xc > px) w += g1 ? 1 : -1;
			continue;
		}
		const { p0, p1, p2, p3 } = s;
		const g0 = p0.y > py, g1 = p1.y > py, g2 = p2.y > py, g3 = p3.y > py;
		if (g0 === g1 && g1 === g2 && g2 === g3) continue;
		if (p0.x <= px && p1.x <= px && p2.x <= px && p3.x <= px) continue;
		if (p0.x > px && p1.x > px && p2.x > px && p3.x > px) {
			if (g0 !== g3) w += g3 ? 1 : -1;
			continue;
		}
		// y-monotone pieces
		const e0 = p1.y - p0.y, e1 = p2.y - p1.y, e2 = p3.y - p2.y;
		const cuts = [0];
		for (const r of quadraticRoots(e0 - 2 * e1 + e2, 2 * (e1 - e0), e0)) if (r > 0 && r < 1) cuts.push(r);
		cuts.push(1);
		cuts.sort((a, b) => a - b);
		for (let k = 0; k + 1 < cuts.length; k++) {
			let ta = cuts[k];
			let tb = cuts[k + 1];
			const ga = (ta === 0 ? p0.y : cubicY(ta, p0.y, p1.y, p2.y, p3.y)) > py;
			const gb = (tb === 1 ? p3.y : cubicY(tb, p0.y, p1.y, p2.y, p3.y)) > py;
			if (ga === gb) continue;
			// bisection on the predicate y(t) > py
			for (let it = 0; it < 60 && tb - ta > 1e-15; it++) {
				const tm = 0.5 * (ta + tb);
				if ((cubicY(tm, p0.y, p1.y, p2.y, p3.y) > py) === ga) ta = tm;
				else tb = tm;
			}
			const xc = cubicY(0.5 * (ta + tb), p0.x, p1.x, p2.x, p3.x);
			if (xc > px) w += gb ? 1 : -1;
		}
	}
	return w;
}

/** True when p is inside the outline. Rule 'nonzero' (default) or 'evenodd'. */
export function outlineContainsPoint(outline: Outline, p: Vec, rule: 'nonzero' | 'evenodd' = 'nonzero'): boolean {
	const w = outlineWindingNumber(outline, p);
	return rule === 'nonzero' ? w !== 0 : (w & 1) === 1;
}
