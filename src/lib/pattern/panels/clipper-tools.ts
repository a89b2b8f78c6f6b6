import ClipperLib from 'clipper-lib';
import type { Vec } from '../kernel';

/**
 * clipper-lib works on integers. THE ONE PLACE the scale is stated: 1 mm = 1000 units (µm), so
 * coordinates move ≤ 0.5 µm (toolchain.md, "Geometry performance facts").
 */
export const CLIPPER_SCALE = 1000;

export type IntPath = { X: number; Y: number }[];

export function toClipper(points: readonly Vec[]): IntPath {
	return points.map((p) => ({ X: Math.round(p.x * CLIPPER_SCALE), Y: Math.round(p.y * CLIPPER_SCALE) }));
}

export function fromClipper(path: IntPath): Vec[] {
	return path.map((p) => ({ x: p.X / CLIPPER_SCALE, y: p.Y / CLIPPER_SCALE }));
}

export { ClipperLib };
