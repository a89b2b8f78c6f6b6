import type { MeasurementId } from './measurement-ids';
import { measurementSetSchema, type MeasurementSet, type MeasurementsMm, type MeasurementValue } from './measurement-set';

/**
 * Proportional rules for what a size chart does not give. Every rule here is a RULE OF THUMB
 * (status M): they follow the pattern of the metric block method (a reference size at 88 cm bust,
 * fixed steps per 4 cm of bust, as reference-values row 6 gives for the bust dart), but the numbers
 * are ours and unconfirmed. They are never presented as part of a chart; a client's own measurement
 * always takes their place. Row 7's spans (bust-point spacing 170–200 mm, side neck point to apex
 * 240–270 mm for misses 8–14, M) are used only as sanity bounds in tests.
 */
export const DERIVATION_REFERENCE_BUST_MM = 880;

export interface DerivationRule {
	readonly id: MeasurementId;
	/** The rule in words, stored beside the derived value. */
	readonly text: string;
	readonly valueMm: (m: Required<Pick<MeasurementsMm, 'bust'>> & MeasurementsMm) => number;
}

const step = (bustMm: number) => (bustMm - DERIVATION_REFERENCE_BUST_MM) / 40;

const rule = (id: MeasurementId, text: string, valueMm: DerivationRule['valueMm']): DerivationRule => ({
	id,
	text: `${text} (rule of thumb, M; not from the chart)`,
	valueMm
});

export const derivationRules: readonly DerivationRule[] = [
	rule('back_length', '410 mm at 88 cm bust, ± 4 mm per 4 cm of bust', (m) => 410 + 4 * step(m.bust)),
	rule('armhole_depth', 'nape to underarm line: 200 mm at 88 cm bust, ± 4 mm per 4 cm of bust', (m) => 200 + 4 * step(m.bust)),
	rule('shoulder_length', '122.5 mm at 88 cm bust, ± 2.5 mm per 4 cm of bust', (m) => 122.5 + 2.5 * step(m.bust)),
	rule('across_back', '344 mm at 88 cm bust, ± 11 mm per 4 cm of bust', (m) => 344 + 11 * step(m.bust)),
	rule('across_front', '324 mm at 88 cm bust, ± 11 mm per 4 cm of bust', (m) => 324 + 11 * step(m.bust)),
	rule('bust_point_separation', '180 mm at 88 cm bust, ± 5 mm per 4 cm of bust', (m) => 180 + 5 * step(m.bust)),
	rule('shoulder_to_bust_point', 'side neck point to bust point: 250 mm at 88 cm bust, ± 4 mm per 4 cm of bust', (m) => 250 + 4 * step(m.bust)),
	rule('hip', 'bust girth + 50 mm', (m) => m.bust + 50),
	rule('neck_base', '37 cm at 88 cm bust, ± 10 mm per 4 cm of bust', (m) => 370 + 10 * step(m.bust)),
	rule('underbust', 'bust girth − 150 mm', (m) => m.bust - 150),
	rule('waist', 'bust girth − 200 mm', (m) => m.bust - 200)
];

/** The rule used when `id` is missing, if there is one. */
export function derivationRuleFor(id: MeasurementId): DerivationRule | undefined {
	return derivationRules.find((r) => r.id === id);
}

/**
 * The set with every missing measurement the draft needs filled in by its rule, marked
 * `derived: true` with the rule text. Measured / chart values are never replaced.
 * Needs the bust girth.
 */
export function measurementSetWithDerived(set: MeasurementSet): MeasurementSet {
	const have = new Map(set.measurements.map((m) => [m.id, m.valueMm] as const));
	const bust = have.get('bust');
	if (bust === undefined) throw new Error('the bust girth is needed to derive the other measurements');
	const base: MeasurementsMm & { bust: number } = { ...Object.fromEntries(have), bust };
	const added: MeasurementValue[] = [];
	for (const r of derivationRules) {
		if (have.has(r.id)) continue;
		added.push({ id: r.id, valueMm: r.valueMm(base), derived: true, rule: r.text, status: 'M' });
	}
	return measurementSetSchema.parse({ ...set, measurements: [...set.measurements, ...added] });
}

/** Like measurementSetWithDerived, on a plain map of mm values. */
export function measurementsMmWithDerived(m: MeasurementsMm): Required<Pick<MeasurementsMm, DraftMeasurementId>> & MeasurementsMm {
	if (m.bust === undefined) throw new Error('the bust girth is needed to derive the other measurements');
	const base = { ...m, bust: m.bust };
	const out: MeasurementsMm = { ...m };
	for (const r of derivationRules) if (out[r.id] === undefined) out[r.id] = r.valueMm(base);
	return out as Required<Pick<MeasurementsMm, DraftMeasurementId>> & MeasurementsMm;
}

/** Measurements the bodice draft uses. */
export type DraftMeasurementId =
	| 'bust'
	| 'underbust'
	| 'waist'
	| 'neck_base'
	| 'back_length'
	| 'armhole_depth'
	| 'shoulder_length'
	| 'across_back'
	| 'across_front'
	| 'bust_point_separation'
	| 'shoulder_to_bust_point';
