import type { UnderStructureDraft } from '../drafting/under-structure';
import type { Vec } from '../kernel';
import { polylineEdgeEnds } from './seam-edge-ends';

/**
 * The seam pairs of a drafted under-structure, between each two neighbouring panels (centre front
 * first), with their edges as the style stores them (from → to in each panel's outline order). Each
 * edge runs from the waist through the divergence point to the top; the divergence point is an apex
 * of kind `divergence` on both panels (drafting marks it), so carry and join find the wedge there.
 */
/** Drafted panel seams are sewn to match, trued to 1/16 in (reference-values row 25, C/P). */
export const DRAFTED_SEAM_TOLERANCE_MM = 25.4 / 16;

export interface DraftedSeamPair {
	readonly label: string;
	readonly aPanelId: string;
	readonly a: { from: Vec; to: Vec };
	readonly bPanelId: string;
	readonly b: { from: Vec; to: Vec };
}

export function draftedSeamPairs(draft: Pick<UnderStructureDraft, 'panels' | 'seams'>): DraftedSeamPair[] {
	return draft.seams.map((s) => {
		const a = draft.panels.find((p) => p.id === s.leftPanelId);
		const b = draft.panels.find((p) => p.id === s.rightPanelId);
		if (!a || !b) throw new Error(`The draft has no panel for seam ${s.id}.`);
		const letter = s.id.replace(/^seam-/, '').toUpperCase();
		return {
			label: `panel seam ${letter}`,
			aPanelId: a.id,
			a: polylineEdgeEnds(a, [s.left.lower[0], s.left.lower[1], s.left.upper[1]]),
			bPanelId: b.id,
			b: polylineEdgeEnds(b, [s.right.lower[0], s.right.lower[1], s.right.upper[1]])
		};
	});
}
