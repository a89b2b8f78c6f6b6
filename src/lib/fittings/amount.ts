import { UNIT_KEY } from '$lib/editor/view';
import { lengthParse, lengthReadoutText, type LengthUnit } from '$lib/pattern/measurements/units';
import { FIT_NOTE_CATEGORY_LABELS, type FitNoteCategory } from './notes';

/** What + and − of an amount mean for a category: let out / take in, lengthen / shorten, move. */
export function amountWords(category: FitNoteCategory): [plus: string, minus: string] {
	if (category === 'length') return ['lengthen', 'shorten'];
	if (category === 'seam_placement' || category === 'balance') return ['move out / down', 'move in / up'];
	return ['let out', 'take in'];
}

/**
 * "let out 6.0 mm", "shorten 1/4 in", "take in 0.35 cm": the amount through the one units module, inches
 * as fractions to the nearest sixteenth (as every readout of the product).
 */
export function amountText(mm: number, category: FitNoteCategory, unit: LengthUnit): string {
	const [plus, minus] = amountWords(category);
	return `${mm >= 0 ? plus : minus} ${lengthReadoutText(Math.abs(mm), unit)}`;
}

/** "too tight, let out 1/4 in", or the category alone when the note has no amount. */
export function fitNoteHeadline(note: { category: FitNoteCategory; amountMm: number | null }, unit: LengthUnit): string {
	const label = FIT_NOTE_CATEGORY_LABELS[note.category];
	return note.amountMm === null ? label : `${label}, ${amountText(note.amountMm, note.category, unit)}`;
}

/**
 * A typed amount in mm (its size: the direction is chosen apart), read in `unit` unless the text names
 * its own ("6", "3/16", "1 1/4", "0.6 cm", "6 mm"). Null when it is not a length.
 */
export function amountParse(text: string, unit: LengthUnit): number | null {
	return lengthParse(text, unit)?.mm ?? null;
}

export const AMOUNT_PLACEHOLDER: Record<LengthUnit, string> = { mm: '6', cm: '0.6', in: '1/4' };

/**
 * The unit amounts are shown and typed in: the one this person chose (the editor's unit menu or the
 * fitting page's, remembered in this browser), else the note's own (its fitting's measurement set, else
 * the style's), else millimetres.
 */
export function amountUnit(chosen: LengthUnit | null, own: LengthUnit | null | undefined): LengthUnit {
	return chosen ?? own ?? 'mm';
}

function isUnit(u: unknown): u is LengthUnit {
	return u === 'mm' || u === 'cm' || u === 'in';
}

/** The unit this person chose in this browser (the same setting as the editor's), or null. */
export function unitChosen(store: Pick<Storage, 'getItem'> | null = browserStorage()): LengthUnit | null {
	const u = store?.getItem(UNIT_KEY);
	return isUnit(u) ? u : null;
}

/** Remembers the chosen unit in this browser (the editor then shows lengths in it too). */
export function unitChoose(u: LengthUnit, store: Pick<Storage, 'setItem'> | null = browserStorage()): void {
	try {
		store?.setItem(UNIT_KEY, u);
	} catch {
		// storage refused (private mode, quota): the choice holds for this page only
	}
}

function browserStorage(): Storage | null {
	try {
		return typeof localStorage === 'undefined' ? null : localStorage;
	} catch {
		return null;
	}
}
