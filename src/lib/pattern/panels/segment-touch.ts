import type { Vec } from '../kernel';

/** Where two straight segments a–b and c–d cross or touch (collinear overlap included), or null. */
export function segmentsTouch(a: Vec, b: Vec, c: Vec, d: Vec): Vec | null {
	return segmentsTouchXY(a.x, a.y, b.x, b.y, c.x, c.y, d.x, d.y);
}

/** segmentsTouch on plain numbers (a = (ax, ay) … d = (dx, dy)). */
export function segmentsTouchXY(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): Vec | null {
	// bounding-box rejection first: most pairs that come close are merely close
	if (Math.max(ax, bx) < Math.min(cx, dx) - 1e-9 || Math.max(cx, dx) < Math.min(ax, bx) - 1e-9) return null;
	if (Math.max(ay, by) < Math.min(cy, dy) - 1e-9 || Math.max(cy, dy) < Math.min(ay, by) - 1e-9) return null;
	const rx = bx - ax;
	const ry = by - ay;
	const sx = dx - cx;
	const sy = dy - cy;
	const den = rx * sy - ry * sx;
	const qx = cx - ax;
	const qy = cy - ay;
	const rl = Math.hypot(rx, ry);
	if (Math.abs(den) <= 1e-12 * rl * Math.hypot(sx, sy)) {
		// parallel: touching only if collinear and overlapping
		if (Math.abs(qx * ry - qy * rx) > 1e-9 * rl) return null;
		const rr = rx * rx + ry * ry;
		const t0 = (qx * rx + qy * ry) / rr;
		const t1 = t0 + (sx * rx + sy * ry) / rr;
		const lo = Math.max(0, Math.min(t0, t1));
		const hi = Math.min(1, Math.max(t0, t1));
		return lo <= hi ? { x: ax + lo * rx, y: ay + lo * ry } : null;
	}
	const t = (qx * sy - qy * sx) / den;
	const u = (qx * ry - qy * rx) / den;
	const e = 1e-12;
	if (t < -e || t > 1 + e || u < -e || u > 1 + e) return null;
	return { x: ax + t * rx, y: ay + t * ry };
}
