import { blockDraft, underStructureDraft, type Ease } from '../drafting';
import type { MeasurementsMm } from '../measurements';
import type { Piece } from '../piece-schema';

/**
 * The drafted piece a `draft` origin names, drafted again from another measurement set: the same ease
 * and options, the same part (`front`, `back`, `panel-<n>` of the under-structure).
 */
export interface DraftOrigin {
	readonly ease?: Ease;
	readonly options?: { bustDart?: 'shoulder' | 'side'; frontCut?: 'on_fold' | 'pair'; backCut?: 'pair' | 'on_fold'; underStructure?: 'none' | 4 | 6 };
	readonly part?: string;
}

export type DraftPart = { readonly ok: true; readonly piece: Piece } | { readonly ok: false; readonly message: string };

/** Drafts are the same for every part of one set: each (set, ease, options) drafted once per run. */
export type DraftCache = Map<string, { block: ReturnType<typeof blockDraft>; panels: readonly Piece[] } | string>;

export function draftPart(mm: MeasurementsMm, origin: DraftOrigin, cache: DraftCache = new Map()): DraftPart {
	const ease = origin.ease;
	const o = origin.options ?? {};
	if (!ease || typeof ease.bustMm !== 'number' || typeof ease.waistMm !== 'number') return { ok: false, message: 'the draft does not say which ease it was made with' };
	const key = JSON.stringify({ ease, o });
	let drafted = cache.get(key);
	if (drafted === undefined) {
		try {
			const block = blockDraft(mm, ease, { bustDart: o.bustDart ?? 'shoulder', frontCut: o.frontCut ?? 'on_fold', backCut: o.backCut ?? 'pair' });
			const panels = o.underStructure === 4 || o.underStructure === 6 ? underStructureDraft(mm, ease, { panels: o.underStructure }).panels : [];
			drafted = { block, panels };
		} catch (e) {
			drafted = (e as Error).message;
		}
		cache.set(key, drafted);
	}
	if (typeof drafted === 'string') return { ok: false, message: `the block cannot be drafted for these measurements: ${drafted}` };
	const part = origin.part ?? 'front';
	if (part === 'front') return { ok: true, piece: drafted.block.front };
	if (part === 'back') return { ok: true, piece: drafted.block.back };
	const m = /^panel-(\d+)$/.exec(part);
	const panel = m ? drafted.panels[Number(m[1]) - 1] : undefined;
	return panel ? { ok: true, piece: panel } : { ok: false, message: `the draft has no part "${part}"` };
}
