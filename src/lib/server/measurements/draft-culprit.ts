import { blockDraft, underStructureDraft, type Ease } from '$lib/pattern/drafting';
import { measurementDefinitions, type MeasurementId, type MeasurementsMm } from '$lib/pattern/measurements';
import { resultProblems } from '$lib/pattern/operation-result';
import type { Piece } from '$lib/pattern/piece-schema';

/**
 * When a draft fails, which measurement made it fail. Each measurement the set gives (all but the bust
 * girth, which every draft starts from) is left out in turn and the draft tried again with that one derived
 * by its rule; a measurement without which the draft succeeds is named as the cause.
 */

/** One draft of the pieces: why it fails (the first problem), or null when every piece is sound. */
export type DraftAttempt = (mm: MeasurementsMm) => string | null;

export interface DraftOptionsForAttempt {
	readonly bustDart: 'shoulder' | 'side';
	readonly frontCut: 'on_fold' | 'pair';
	readonly backCut: 'pair' | 'on_fold';
	readonly underStructure: 'none' | 4 | 6;
}

/** The pieces a draft makes, or the reason it throws. */
export function draftPieces(mm: MeasurementsMm, ease: Ease, options: DraftOptionsForAttempt): { ok: true; pieces: { name: string; geometry: Piece }[] } | { ok: false; message: string } {
	try {
		const block = blockDraft(mm, ease, { bustDart: options.bustDart, frontCut: options.frontCut, backCut: options.backCut });
		const panels = options.underStructure === 'none' ? [] : underStructureDraft(mm, ease, { panels: options.underStructure }).panels;
		return {
			ok: true,
			pieces: [
				{ name: 'Front', geometry: block.front },
				{ name: 'Back', geometry: block.back },
				...panels.map((p, i) => ({ name: `Under-structure panel ${i + 1}`, geometry: p }))
			]
		};
	} catch (e) {
		return { ok: false, message: (e as Error).message };
	}
}

/** A draft attempt that fails as the server would: the draft throws, or a piece's geometry is not sound. */
export function draftAttempt(ease: Ease, options: DraftOptionsForAttempt): DraftAttempt {
	return (mm) => {
		const r = draftPieces(mm, ease, options);
		if (!r.ok) return r.message;
		for (const p of r.pieces) {
			const problems = resultProblems(p.geometry);
			if (problems.length > 0) return `the drafted ${p.name} is not sound: ${problems[0]}`;
		}
		return null;
	};
}

/** The measurements without which the draft succeeds (empty when the draft succeeds, or no single one is to blame). */
export function draftCulprits(mm: MeasurementsMm, attempt: DraftAttempt): MeasurementId[] {
	if (attempt(mm) === null) return [];
	const out: MeasurementId[] = [];
	for (const id of Object.keys(mm) as MeasurementId[]) {
		if (id === 'bust') continue;
		const without: MeasurementsMm = { ...mm };
		delete without[id];
		if (attempt(without) === null) out.push(id);
	}
	return out;
}

const cm = (mm: number) => `${(mm / 10).toFixed(1)} cm`;

/** Says which measurements made the draft fail, with their values: "the waist girth (5000.0 cm)". */
export function draftCulpritText(mm: MeasurementsMm, ids: readonly MeasurementId[]): string {
	if (ids.length === 0) return 'No single measurement is to blame: check the bust girth and the measurements taken with it.';
	const names = ids.map((id) => `the ${measurementDefinitions[id].label.toLowerCase()} (${cm(mm[id]!)})`);
	const list = names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}`;
	return `The draft fails because of ${list}: without ${ids.length === 1 ? 'it' : 'any one of them'}, the block drafts. Check ${ids.length === 1 ? 'that value' : 'those values'} in the set.`;
}
