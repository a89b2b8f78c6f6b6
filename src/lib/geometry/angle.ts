import type { Vec } from './types';

/**
 * Angles in radians. Positive = from +x toward +y (clockwise on a y-down screen).
 */

/** Signed angle that turns vector a onto vector b, in (-π, π]. */
export function vecAngleBetween(a: Vec, b: Vec): number {
	return Math.atan2(a.x * b.y - a.y * b.x, a.x * b.x + a.y * b.y);
}

/** Direction angle of a vector, in (-π, π]. */
export function vecAngle(a: Vec): number {
	return Math.atan2(a.y, a.x);
}

/** Unit vector at angle a. */
export function vecFromAngle(angle: number, length = 1): Vec {
	return { x: Math.cos(angle) * length, y: Math.sin(angle) * length };
}

/** Normalise an angle into (-π, π]. */
export function angleNormalize(angle: number): number {
	const twoPi = 2 * Math.PI;
	let a = angle % twoPi;
	if (a <= -Math.PI) a += twoPi;
	else if (a > Math.PI) a -= twoPi;
	return a;
}

/** Normalise an angle into [0, 2π). */
export function angleNormalizePositive(angle: number): number {
	const twoPi = 2 * Math.PI;
	let a = angle % twoPi;
	if (a < 0) a += twoPi;
	return a >= twoPi ? 0 : a;
}

export function angleToDegrees(angle: number): number {
	return (angle * 180) / Math.PI;
}

export function angleFromDegrees(degrees: number): number {
	return (degrees * Math.PI) / 180;
}

/** Chord (dart intake) of a wedge of angle θ at radius r: w = 2r·sin(θ/2). */
export function chordWidth(radius: number, angle: number): number {
	return 2 * radius * Math.sin(angle / 2);
}

/** Wedge angle whose chord at radius r is w: θ = 2·asin(w / 2r). NaN when w > 2r. */
export function chordAngle(radius: number, width: number): number {
	return 2 * Math.asin(width / (2 * radius));
}
