import type { Vec } from '../kernel';

/** Where two straight segments cross or touch (collinear overlap included), or null. */
export function segmentsTouch(a: Vec, b: Vec, c: Vec, d: Vec): Vec | null {
	// bounding-box rejection first: most pairs sharing a grid cell are merely close
	if (Math.max(a.x, b.x) < Math.min(c.x, d.x) - 1e-9 || Math.max(c.x, d.x) < Math.min(a.x, b.x) - 1e-9) return null;
	if (Math.max(a.y, b.y) < Math.min(c.y, d.y) - 1e-9 || Math.max(c.y, d.y) < Math.min(a.y, b.y) - 1e-9) return null;
	const rx = b.x - a.x;
	const ry = b.y - a.y;
	const sx = d.x - c.x;
	const sy = d.y - c.y;
	const den = rx * sy - ry * sx;
	const qx = c.x - a.x;
	const qy = c.y - a.y;
	const rl = Math.hypot(rx, ry);
	if (Math.abs(den) <= 1e-12 * rl * Math.hypot(sx, sy)) {
		// parallel: touching only if collinear and overlapping
		if (Math.abs(qx * ry - qy * rx) > 1e-9 * rl) return null;
		const rr = rx * rx + ry * ry;
		const t0 = (qx * rx + qy * ry) / rr;
		const t1 = t0 + (sx * rx + sy * ry) / rr;
		const lo = Math.max(0, Math.min(t0, t1));
		const hi = Math.min(1, Math.max(t0, t1));
		return lo <= hi ? { x: a.x + lo * rx, y: a.y + lo * ry } : null;
	}
	const t = (qx * sy - qy * sx) / den;
	const u = (qx * ry - qy * rx) / den;
	const e = 1e-12;
	if (t < -e || t > 1 + e || u < -e || u > 1 + e) return null;
	return { x: a.x + t * rx, y: a.y + t * ry };
}
