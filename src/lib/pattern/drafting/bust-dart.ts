import { cupCode } from '../measurements/cup-code';

/**
 * Bust (shoulder) dart intake of the metric block method: 70 mm at the reference bust of 88 cm,
 * ± 6 mm per 4 cm of bust (80/84/88/92/96 → 58/64/70/76/82 mm). Source: W. Aldrich, Metric Pattern
 * Cutting for Women's Wear, 5th ed. (2008), via a published tutorial of its bodice block
 * (reference-values row 6, S). Linear in bust girth, extrapolated beyond the tabulated sizes.
 */
export const BUST_DART_REFERENCE_BUST_MM = 880;
export const BUST_DART_REFERENCE_INTAKE_MM = 70;
export const BUST_DART_STEP_MM_PER_40MM = 6;

export function bustDartIntakeMm(bustMm: number): number {
	return BUST_DART_REFERENCE_INTAKE_MM + ((bustMm - BUST_DART_REFERENCE_BUST_MM) / 40) * BUST_DART_STEP_MM_PER_40MM;
}

/** Wedge angle from intake and leg length: θ = 2·asin(w / 2r) (reference-values row 17). */
export function dartAngleRad(intakeMm: number, legLengthMm: number): number {
	return 2 * Math.asin(intakeMm / (2 * legLengthMm));
}

/** Intake at the edge of a wedge of angle θ with legs r: w = 2r·sin(θ/2) (row 17). */
export function dartIntakeMm(angleRad: number, legLengthMm: number): number {
	return 2 * legLengthMm * Math.sin(angleRad / 2);
}

/**
 * Suggested clearance of the sewn dart point from the bust point. Row 10 (Threads #181, C) gives the
 * range: 25 mm for a small bust, up to 64 mm or more for large cups. Where in that range a given
 * bust falls is our rule of thumb (M): 25 mm up to a bust − under-bust difference of 12 cm (A/B
 * cups), rising linearly to 64 mm at 24 cm (about an H cup), capped at 64 mm.
 */
export const DART_CLEARANCE_MIN_MM = 25;
export const DART_CLEARANCE_MAX_MM = 64;

export function dartClearanceSuggestionMm(bustMm: number, underbustMm: number): number {
	const diff = bustMm - underbustMm;
	const t = Math.min(1, Math.max(0, (diff - 120) / 120));
	return DART_CLEARANCE_MIN_MM + t * (DART_CLEARANCE_MAX_MM - DART_CLEARANCE_MIN_MM);
}

export function dartClearanceNote(bustMm: number, underbustMm: number): string {
	const c = cupCode(bustMm, underbustMm);
	return `Suggested clearance ${dartClearanceSuggestionMm(bustMm, underbustMm).toFixed(0)} mm for bust − under-bust ${(c.differenceMm / 10).toFixed(1)} cm${
		c.code ? ` (EN 13402 ${c.code})` : ''
	}; range 25–64 mm after Threads #181 (C), placement within it a rule of thumb (M).`;
}
