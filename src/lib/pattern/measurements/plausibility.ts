import { measurementDefinitions, type MeasurementId } from './measurement-ids';
import type { MeasurementsMm } from './measurement-set';

/**
 * Plausible adult ranges in mm, used to catch typing and unit mistakes (a value in cm typed into a
 * mm field, a swapped pair). They are our own wide bounds (rule of thumb, M), not a standard.
 */
export const plausibleRangesMm: Readonly<Record<MeasurementId, readonly [number, number]>> = {
	bust: [600, 1800],
	underbust: [550, 1600],
	waist: [450, 1700],
	hip: [650, 1900],
	neck_base: [250, 600],
	upper_chest: [600, 1700],
	back_length: [300, 550],
	front_length: [300, 650],
	armhole_depth: [150, 320],
	shoulder_length: [80, 200],
	across_back: [250, 500],
	across_front: [230, 480],
	bust_point_separation: [120, 300],
	shoulder_to_bust_point: [180, 380],
	height: [1300, 2100]
};

export interface PlausibilityIssue {
	readonly severity: 'error' | 'warning';
	readonly ids: readonly MeasurementId[];
	readonly message: string;
}

const cm = (mm: number) => `${(mm / 10).toFixed(1)} cm`;

/** Checks a set of measurements (mm) and says, in plain words, what looks wrong. */
export function measurementProblems(m: MeasurementsMm): PlausibilityIssue[] {
	const issues: PlausibilityIssue[] = [];
	for (const [id, value] of Object.entries(m) as [MeasurementId, number][]) {
		const range = plausibleRangesMm[id];
		if (!range) continue;
		const label = measurementDefinitions[id].label;
		if (!Number.isFinite(value) || value <= 0) {
			issues.push({ severity: 'error', ids: [id], message: `${label} must be a positive length.` });
		} else if (value < range[0] || value > range[1]) {
			issues.push({
				severity: 'warning',
				ids: [id],
				message: `${label} is ${cm(value)}, outside the usual adult range ${cm(range[0])} – ${cm(range[1])}. Check the unit (mm, cm or inches).`
			});
		}
	}
	const { bust, underbust, waist, hip, neck_base, upper_chest, back_length, armhole_depth, shoulder_to_bust_point } = m;
	if (bust !== undefined && underbust !== undefined) {
		if (underbust > bust) {
			issues.push({
				severity: 'error',
				ids: ['underbust', 'bust'],
				message: `Under-bust (${cm(underbust)}) is larger than bust (${cm(bust)}): the bust girth is the largest girth over the bust. Were the two swapped?`
			});
		} else if (bust - underbust > 400) {
			issues.push({
				severity: 'warning',
				ids: ['bust', 'underbust'],
				message: `Bust is ${cm(bust - underbust)} more than under-bust; over 40 cm is very unusual. Check both.`
			});
		}
	}
	if (waist !== undefined && hip !== undefined && waist > hip + 100) {
		issues.push({
			severity: 'warning',
			ids: ['waist', 'hip'],
			message: `Waist (${cm(waist)}) is more than 10 cm larger than hip (${cm(hip)}). Possible, but check the hip was taken at its fullest.`
		});
	}
	if (waist !== undefined && bust !== undefined && waist > bust + 200) {
		issues.push({
			severity: 'warning',
			ids: ['waist', 'bust'],
			message: `Waist (${cm(waist)}) is more than 20 cm larger than bust (${cm(bust)}). Check both.`
		});
	}
	if (neck_base !== undefined && upper_chest !== undefined && neck_base >= upper_chest) {
		issues.push({
			severity: 'error',
			ids: ['neck_base', 'upper_chest'],
			message: `Neck base (${cm(neck_base)}) is not smaller than upper chest (${cm(upper_chest)}).`
		});
	}
	if (upper_chest !== undefined && bust !== undefined && upper_chest > bust + 100) {
		issues.push({
			severity: 'warning',
			ids: ['upper_chest', 'bust'],
			message: `Upper chest (${cm(upper_chest)}) is more than 10 cm larger than bust (${cm(bust)}). Check both.`
		});
	}
	if (armhole_depth !== undefined && back_length !== undefined && armhole_depth >= back_length) {
		issues.push({
			severity: 'error',
			ids: ['armhole_depth', 'back_length'],
			message: `Armhole depth (${cm(armhole_depth)}) must be less than the back length nape to waist (${cm(back_length)}).`
		});
	}
	if (shoulder_to_bust_point !== undefined && back_length !== undefined && shoulder_to_bust_point >= back_length + 50) {
		issues.push({
			severity: 'warning',
			ids: ['shoulder_to_bust_point', 'back_length'],
			message: `Side neck point to bust point (${cm(shoulder_to_bust_point)}) leaves no room between the bust point and the waist.`
		});
	}
	return issues;
}
