import { anchorBody, type Anchor } from '../anchors/anchor';
import { anchorText, landmarkWords } from '../anchors/anchor-text';
import type { Piece } from '../piece-schema';
import { nestAnchorDefault } from './nest';

/**
 * What a nest can be aligned at, as the picker offers it: every landmark of the base (centre front waist,
 * side waist, bust point, …) and a place along every named seam, by fraction of its length ("side seam,
 * 50 % from the underarm"), the fraction chosen by the person. Pure.
 */

export interface NestAnchorChoice {
	/** `landmark:<name>` or `edge:<seam>`: what the picker stores. */
	readonly value: string;
	readonly label: string;
	readonly group: 'landmark' | 'edge';
}

export function nestAnchorChoices(base: Piece): NestAnchorChoice[] {
	const body = anchorBody(base);
	return [
		...body.landmarks.map((l) => ({ value: `landmark:${l.name}`, label: landmarkWords(l.name), group: 'landmark' as const })),
		...body.seams.filter((s) => s.lengthMm > 0).map((s) => ({ value: `edge:${s.name}`, label: `along the ${s.name}`, group: 'edge' as const }))
	];
}

/** The anchor of a choice; an edge choice at `fraction` of the seam from its start (clamped to 0–1). */
export function nestAnchorOf(value: string, fraction: number): Anchor | null {
	if (value.startsWith('landmark:')) return { kind: 'landmark', name: value.slice('landmark:'.length) };
	if (value.startsWith('edge:')) return { kind: 'edge', edge: value.slice('edge:'.length), from: 'start', fraction: Math.min(1, Math.max(0, Number.isFinite(fraction) ? fraction : 0.5)) };
	return null;
}

/** The choice the picker starts on: the default landmark (centre front waist where there is one). */
export function nestChoiceDefault(base: Piece): string | null {
	const a = nestAnchorDefault(base);
	return a && a.kind === 'landmark' ? `landmark:${a.name}` : null;
}

/** An anchor said for the nest's caption ("the centre front waist", "the side seam, 50 % from the underarm"). */
export function nestAnchorWords(base: Piece, a: Anchor): string {
	return `the ${anchorText(a, anchorBody(base), (mm) => `${mm.toFixed(1)} mm`)}`;
}
