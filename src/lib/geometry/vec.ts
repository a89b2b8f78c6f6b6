import type { Vec } from './types';

/** Vector / point arithmetic. Points and vectors are both `Vec`. */

export function vec(x: number, y: number): Vec {
	return { x, y };
}

export function vecAdd(a: Vec, b: Vec): Vec {
	return { x: a.x + b.x, y: a.y + b.y };
}

export function vecSub(a: Vec, b: Vec): Vec {
	return { x: a.x - b.x, y: a.y - b.y };
}

export function vecScale(a: Vec, s: number): Vec {
	return { x: a.x * s, y: a.y * s };
}

export function vecDot(a: Vec, b: Vec): number {
	return a.x * b.x + a.y * b.y;
}

/** z-component of the 3-D cross product a × b. Positive when b is turned from a toward +y. */
export function vecCross(a: Vec, b: Vec): number {
	return a.x * b.y - a.y * b.x;
}

export function vecLength(a: Vec): number {
	return Math.sqrt(a.x * a.x + a.y * a.y);
}

export function vecDistance(a: Vec, b: Vec): number {
	const dx = a.x - b.x;
	const dy = a.y - b.y;
	return Math.sqrt(dx * dx + dy * dy);
}

/** Unit vector in the direction of a; the zero vector stays zero. */
export function vecNormalize(a: Vec): Vec {
	const l = vecLength(a);
	return l === 0 ? { x: 0, y: 0 } : { x: a.x / l, y: a.y / l };
}

export function vecLerp(a: Vec, b: Vec, t: number): Vec {
	return { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
}

/** a turned by +90° (from +x toward +y; clockwise on a y-down screen). */
export function vecPerp(a: Vec): Vec {
	return { x: -a.y, y: a.x };
}

export function vecEquals(a: Vec, b: Vec, tolerance = 0): boolean {
	return Math.abs(a.x - b.x) <= tolerance && Math.abs(a.y - b.y) <= tolerance;
}

export function vecIsFinite(a: Vec): boolean {
	return Number.isFinite(a.x) && Number.isFinite(a.y);
}
