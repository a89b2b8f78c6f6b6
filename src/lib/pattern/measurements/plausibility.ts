import { measurementDefinitions, type MeasurementId } from './measurement-ids';
import type { MeasurementsMm, SourceStatus } from './measurement-set';

/**
 * What a human body can measure, per measurement: the usual adult range (outside it: a warning, the
 * person may confirm the value) and the hard limits (outside them: an error, no body measures that; the
 * value cannot be saved or drafted from). Each row names where its hard limits come from, with the status
 * marks of the shared reference values (C confirmed, S secondary, M memory, D derived). The usual ranges
 * are our own wide bounds (M) to catch typing and unit mistakes (cm typed into a mm field).
 */
export interface PlausibilityRow {
	readonly usualMm: readonly [number, number];
	readonly hardMm: readonly [number, number];
	readonly source: string;
	readonly status: SourceStatus;
}

const TRUNK_SOURCE =
	'low: the smallest waist on record, 38.1 cm tight-laced (Guinness World Records, Cathie Jung); high: a chest girth of 124 in (315 cm) reported for Robert Earl Hughes (secondary page, not confirmed)';
const LENGTH_SOURCE = 'our own outer bounds, from memory: no adult body length or width of this kind comes near them (unconfirmed)';

export const plausibilityTable: Readonly<Record<MeasurementId, PlausibilityRow>> = {
	bust: { usualMm: [600, 1800], hardMm: [381, 3150], source: TRUNK_SOURCE, status: 'S' },
	underbust: { usualMm: [550, 1600], hardMm: [381, 3150], source: TRUNK_SOURCE, status: 'S' },
	upper_chest: { usualMm: [600, 1700], hardMm: [381, 3150], source: TRUNK_SOURCE, status: 'S' },
	waist: {
		usualMm: [450, 1700],
		hardMm: [381, 3020],
		source: 'smallest waist on a living person 38.1 cm (Guinness World Records, Cathie Jung, C); largest waist 302 cm (Walter Hudson, Guinness record as reported by Wikipedia, S)',
		status: 'S'
	},
	hip: { usualMm: [650, 1900], hardMm: [381, 3150], source: `${TRUNK_SOURCE}; no hip record found, the chest bound is used (M)`, status: 'M' },
	neck_base: { usualMm: [250, 600], hardMm: [150, 1000], source: LENGTH_SOURCE, status: 'M' },
	back_length: { usualMm: [300, 550], hardMm: [100, 1360], source: `${LENGTH_SOURCE}; high: half the tallest recorded height, 272 cm (Robert Wadlow, S), D`, status: 'M' },
	front_length: { usualMm: [300, 650], hardMm: [100, 1360], source: `${LENGTH_SOURCE}; high: half the tallest recorded height, 272 cm (Robert Wadlow, S), D`, status: 'M' },
	armhole_depth: { usualMm: [150, 320], hardMm: [50, 800], source: LENGTH_SOURCE, status: 'M' },
	shoulder_length: { usualMm: [80, 200], hardMm: [30, 500], source: LENGTH_SOURCE, status: 'M' },
	across_back: { usualMm: [250, 500], hardMm: [100, 1200], source: LENGTH_SOURCE, status: 'M' },
	across_front: { usualMm: [230, 480], hardMm: [100, 1200], source: LENGTH_SOURCE, status: 'M' },
	bust_point_separation: { usualMm: [120, 300], hardMm: [50, 800], source: LENGTH_SOURCE, status: 'M' },
	shoulder_to_bust_point: { usualMm: [180, 380], hardMm: [60, 1000], source: LENGTH_SOURCE, status: 'M' },
	height: {
		usualMm: [1300, 2100],
		hardMm: [546, 2720],
		source: 'shortest adult verified 54.6 cm (Chandra Bahadur Dangi) and tallest recorded 272 cm (Robert Wadlow), Guinness World Records as reported by news pages',
		status: 'S'
	}
};

/** The usual adult ranges in mm (warnings outside them). */
export const plausibleRangesMm: Readonly<Record<MeasurementId, readonly [number, number]>> = Object.fromEntries(
	Object.entries(plausibilityTable).map(([id, row]) => [id, row.usualMm])
) as Record<MeasurementId, readonly [number, number]>;

export interface PlausibilityIssue {
	readonly severity: 'error' | 'warning';
	readonly ids: readonly MeasurementId[];
	readonly message: string;
}

const cm = (mm: number) => `${(mm / 10).toFixed(1)} cm`;

/** Why a value is not a length at all: not a number, negative or zero (each its own message); null if it is one. */
export function lengthValueProblem(label: string, value: number): string | null {
	if (!Number.isFinite(value)) return `${label} is not a number: type a length such as 86.5.`;
	if (value < 0) return `${label} cannot be negative: a body measurement is a length.`;
	if (value === 0) return `${label} is zero: leave the field empty if it was not measured.`;
	return null;
}

/** The error for a value outside what a human body can measure, with the limits and where they come from. */
export function outsideHumanMessage(id: MeasurementId, valueMm: number): string {
	const row = plausibilityTable[id];
	const label = measurementDefinitions[id].label;
	const which = valueMm > row.hardMm[1] ? 'larger' : 'smaller';
	return `${label} is ${cm(valueMm)}: ${which} than any human body measures (limits ${cm(row.hardMm[0])} – ${cm(row.hardMm[1])}; ${row.source}). Check the value and its unit (mm, cm or inches).`;
}

/** Only the errors that put a value outside a human body or make it no length (drafting refuses these). */
export function measurementHardProblems(m: MeasurementsMm): PlausibilityIssue[] {
	const out: PlausibilityIssue[] = [];
	for (const [id, value] of Object.entries(m) as [MeasurementId, number][]) {
		const row = plausibilityTable[id];
		if (!row) continue;
		const invalid = lengthValueProblem(measurementDefinitions[id].label, value);
		if (invalid) out.push({ severity: 'error', ids: [id], message: invalid });
		else if (value < row.hardMm[0] || value > row.hardMm[1]) out.push({ severity: 'error', ids: [id], message: outsideHumanMessage(id, value) });
	}
	return out;
}

/** Checks a set of measurements (mm) and says, in plain words, what looks wrong. */
export function measurementProblems(m: MeasurementsMm): PlausibilityIssue[] {
	const issues: PlausibilityIssue[] = [];
	for (const [id, value] of Object.entries(m) as [MeasurementId, number][]) {
		const row = plausibilityTable[id];
		if (!row) continue;
		const range = row.usualMm;
		const label = measurementDefinitions[id].label;
		const invalid = lengthValueProblem(label, value);
		if (invalid) {
			issues.push({ severity: 'error', ids: [id], message: invalid });
		} else if (value < row.hardMm[0] || value > row.hardMm[1]) {
			issues.push({ severity: 'error', ids: [id], message: outsideHumanMessage(id, value) });
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
