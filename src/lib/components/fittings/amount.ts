import { lengthText, type LengthUnit } from '$lib/pattern/measurements/units';
import type { FitNoteCategory } from '$lib/fittings/notes';

/** What + and − of an amount mean for a category: let out / take in, lengthen / shorten, move. */
export function amountWords(category: FitNoteCategory): [plus: string, minus: string] {
	if (category === 'length') return ['lengthen', 'shorten'];
	if (category === 'seam_placement' || category === 'balance') return ['move out / down', 'move in / up'];
	return ['let out', 'take in'];
}

/** "let out 6 mm", "shorten 1/4 in": the amount through the one units module. */
export function amountText(mm: number, category: FitNoteCategory, unit: LengthUnit = 'mm'): string {
	const [plus, minus] = amountWords(category);
	return `${mm >= 0 ? plus : minus} ${lengthText(Math.abs(mm), unit)}`;
}
