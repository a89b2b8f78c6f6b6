import { vecDistance, type Vec } from '$lib/geometry';
import { pieceSeams } from '$lib/pattern/piece-seams';
import type { Piece } from '$lib/pattern/piece-schema';
import { divergenceMarkable } from '../divergence-marking';
import type { MoveContext } from './context';
import { carryRow } from './carry';
import { storedPairUsable } from './seams';
import type { MoveId } from './types';

/**
 * The moves offered for what is selected, in the trade's words: a dart offers pivot, share, pleats,
 * pull back and cap; an apex, marking it as a divergence point; a seam, true, notch, pair with…; two
 * panels, join; a row of panels, carry; a piece, grain, fold, allowance, reshape, notch, spread, separate (and
 * the moves of its first dart, of its seam pairs and of its row).
 */
export type OfferId = MoveId | 'divergence_point' | 'pair_with';

export interface Offer {
	readonly id: OfferId;
	readonly label: string;
	/** The keyboard shortcut (tinykeys). */
	readonly key: string;
	/** The move starts with the edge of this seam picked (pair with…). */
	readonly seam?: { readonly pieceKey: string; readonly from: { x: number; y: number }; readonly to: { x: number; y: number } };
}

export interface Offered {
	/** What the moves apply to, in words ("Dart shoulder-dart of Front bodice"). */
	readonly on: string;
	readonly moves: readonly Offer[];
}

export const OFFER_KEYS: Record<OfferId, string> = {
	select: 'v',
	pivot: 'p',
	share: 'h',
	pleat: 'l',
	pull_back: 'b',
	cap: 'c',
	style_line: 's',
	separate: 'x',
	spread: 'd',
	notch: 'n',
	grain: 'g',
	fold: 'f',
	allowance: 'a',
	measure: 'm',
	join: 'j',
	carry: 'k',
	true_seam: 't',
	reshape: 'r',
	divergence_point: 'e',
	pair_with: 'w'
};

const offer = (id: OfferId, label: string, extra: Partial<Offer> = {}): Offer => ({ id, label, key: OFFER_KEYS[id], ...extra });
const DART_MOVES = (): Offer[] => [offer('pivot', 'Pivot'), offer('share', 'Share'), offer('pleat', 'Pleats'), offer('pull_back', 'Pull back'), offer('cap', 'Cap')];

/**
 * The seam an outline segment is on, from corner to corner — but a panel seam runs on through its
 * divergence point (where the panels part, the seam goes on down the wedge): it is sewn as one.
 */
export function seamThroughDivergence(g: Piece, segmentIndex: number): { name: string; start: Vec; end: Vec } | null {
	const seams = pieceSeams(g);
	const i = seams.findIndex((x) => x.segmentIndices.includes(segmentIndex));
	if (i < 0) return null;
	const atD = (v: Vec) => g.apexes.some((a) => a.kind === 'divergence' && vecDistance(a.point, v) < 1e-6);
	const n = seams.length;
	let start = seams[i].start;
	let end = seams[i].end;
	for (let k = 1; k < n && atD(end); k++) end = seams[(i + k) % n].end;
	for (let k = 1; k < n && atD(start); k++) start = seams[(i - k + n) % n].start;
	return { name: seams[i].name, start, end };
}

export function offersFor(ctx: MoveContext): Offered | null {
	const sel = ctx.selection;
	const name = (k: string) => ctx.piece(k)?.name ?? 'a piece';
	const editable = (k: string | null) => {
		const p = ctx.piece(k);
		return !!p && !p.readOnly && !p.retired;
	};
	if (sel.panels.length >= 2) {
		const keys = sel.panels.filter(editable);
		const moves: Offer[] = [];
		if (keys.length === 2) moves.push(offer('join', 'Join'));
		if (keys.length >= 2) moves.push(offer('carry', 'Carry'));
		return { on: `${sel.panels.length} panels: ${sel.panels.map(name).join(', ')}`, moves };
	}
	const key = sel.pieceKey;
	const p = ctx.piece(key);
	if (!key || !p) return null;
	if (!editable(key)) return { on: `${p.name} (read only)`, moves: [] };
	const g = p.geometry;
	if (sel.dartId && g.darts.some((d) => d.id === sel.dartId)) return { on: `Dart ${sel.dartId} of ${p.name}`, moves: DART_MOVES() };
	if (sel.apexId) {
		const apex = g.apexes.find((a) => a.id === sel.apexId);
		if (apex) return { on: `${apex.label || apex.id} of ${p.name}`, moves: divergenceMarkable(g, apex) ? [offer('divergence_point', 'Mark as divergence point')] : [] };
	}
	if (sel.seamPairId) {
		const sp = ctx.seamPairs.find((x) => x.id === sel.seamPairId);
		if (sp) {
			const moves = [offer('true_seam', 'True'), offer('notch', 'Notch')];
			if (storedPairUsable(ctx, sp, true)) moves.push(offer('join', 'Join'));
			return { on: `Seam ${sp.label || 'pair'}: ${name(sp.aPieceId)} – ${name(sp.bPieceId)}`, moves };
		}
	}
	if (sel.segmentIndex >= 0) {
		const seam = seamThroughDivergence(g, sel.segmentIndex);
		if (seam) {
			return {
				on: `${seam.name} of ${p.name}`,
				moves: [offer('true_seam', 'True'), offer('notch', 'Notch'), offer('pair_with', 'Pair with…', { seam: { pieceKey: key, from: seam.start, to: seam.end } })]
			};
		}
	}
	const moves: Offer[] = [offer('grain', 'Grain'), offer('fold', 'Fold'), offer('allowance', 'Allowance'), offer('reshape', 'Reshape'), offer('notch', 'Notch'), offer('spread', 'Spread')];
	if (g.internalLines.length) moves.push(offer('separate', 'Separate'));
	if (g.darts.length) moves.push(...DART_MOVES());
	if (ctx.seamPairs.some((sp) => (sp.aPieceId === key || sp.bPieceId === key) && storedPairUsable(ctx, sp, true))) moves.push(offer('join', 'Join'), offer('true_seam', 'True seam'));
	if (carryRow(ctx).includes(key)) moves.push(offer('carry', 'Carry'));
	return { on: p.name, moves };
}
