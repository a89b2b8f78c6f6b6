import { divergenceMark } from '../divergence-marking';
import type { MoveContext } from './context';
import type { Offer } from './offers';
import type { MoveState } from './registry';
import type { MoveId } from './types';

/** What starting an offered move needs of the editor. */
export interface OfferHost {
	readonly ctx: MoveContext;
	move: MoveState;
	moveMessage: string | null;
	setMove(id: MoveId): void;
}

/** An offered move chosen (its button, its key): it starts on what is selected; a mark applies at once. */
export function offerStart(h: OfferHost, o: Offer): void {
	if (o.id === 'divergence_point') {
		const key = h.ctx.selection.pieceKey;
		const apexId = h.ctx.selection.apexId;
		if (key && apexId) h.moveMessage = divergenceMark(h.ctx, key, apexId);
		return;
	}
	if (o.id === 'pair_with') {
		h.setMove('true_seam');
		if (h.move.id === 'true_seam' && o.seam) {
			h.move.seamPairId = null;
			h.move.edgePicks = [{ pieceKey: o.seam.pieceKey, at: o.seam.from }, { pieceKey: o.seam.pieceKey, at: o.seam.to }];
		}
		return;
	}
	h.setMove(o.id);
}
