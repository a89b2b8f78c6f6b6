import { lengthValueProblem } from './plausibility';
import { lengthParse, type LengthUnit } from './units';

/** What a typed measurement field holds: a length in mm, or why not, each case with its own message. */
export type LengthFieldRead =
	| { readonly ok: true; readonly mm: number }
	| { readonly ok: false; readonly kind: 'not_a_number' | 'negative' | 'zero'; readonly message: string };

const example = (unit: LengthUnit) => (unit === 'in' ? '34 1/8' : unit === 'cm' ? '86.5' : '865');

/**
 * Reads one typed field ("86.5", "34 1/8", "92 cm") in the form's unit. A negative value, zero and a text
 * that is not a number are told apart, so the person knows what to change.
 */
export function lengthFieldRead(label: string, text: string, unit: LengthUnit): LengthFieldRead {
	const t = text.trim();
	const negative = /^[-−–]/.test(t);
	const parsed = lengthParse(negative ? t.replace(/^[-−–]\s*/, '') : t, unit);
	if (!parsed) {
		return { ok: false, kind: 'not_a_number', message: `${label}: “${t}” is not a number. Write e.g. ${example(unit)} (${unit}).` };
	}
	if (negative && parsed.mm > 0) return { ok: false, kind: 'negative', message: lengthValueProblem(label, -parsed.mm)! };
	if (parsed.mm === 0) return { ok: false, kind: 'zero', message: lengthValueProblem(label, 0)! };
	return { ok: true, mm: parsed.mm };
}
