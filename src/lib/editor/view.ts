import type { BoundingBox, Vec } from '$lib/geometry';

/** Pure view arithmetic: screen px ↔ world mm, zoom limits, fitting a box. */

/** CSS px per mm of a standard 96 dpi screen. */
export const DEFAULT_PX_PER_MM = 96 / 25.4;
export const CALIBRATION_KEY = 'dartelier.pxPerMm';
export const UNIT_KEY = 'dartelier.unit';
/** Largest zoom: 8× true size. */
export const MAX_TRUE_FACTOR = 8;

export interface View {
	readonly scale: number;
	readonly panX: number;
	readonly panY: number;
}

export function screenToWorld(v: View, p: Vec): Vec {
	return { x: (p.x - v.panX) / v.scale, y: (p.y - v.panY) / v.scale };
}

export function worldToScreen(v: View, p: Vec): Vec {
	return { x: p.x * v.scale + v.panX, y: p.y * v.scale + v.panY };
}

/** Zoom about a screen point, keeping the world point under it fixed. */
export function zoomAbout(v: View, factor: number, at: Vec, min: number, max: number): View {
	const scale = Math.min(max, Math.max(min, v.scale * factor));
	const w = screenToWorld(v, at);
	return { scale, panX: at.x - w.x * scale, panY: at.y - w.y * scale };
}

export function fitBox(box: BoundingBox, width: number, height: number, marginPx = 40): View {
	const bw = Math.max(1, box.maxX - box.minX);
	const bh = Math.max(1, box.maxY - box.minY);
	const scale = Math.max(0.02, Math.min((width - 2 * marginPx) / bw, (height - 2 * marginPx) / bh));
	return {
		scale,
		panX: width / 2 - ((box.minX + box.maxX) / 2) * scale,
		panY: height / 2 - ((box.minY + box.maxY) / 2) * scale
	};
}
