import { z } from 'zod';
import { blockDraft, draftCautions, EASE_DEFAULT, underStructureDraft, type Ease } from '$lib/pattern/drafting';
import type { Piece } from '$lib/pattern/piece-schema';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { draftedStyleDiscard } from '../repositories/measurement-sets';
import { stylesCreate, type StyleRow } from '../repositories/styles';
import { pieceCreateWithFirstVersion } from '../versions/piece-create';
import { measurementChartsEnsure } from './charts';
import { measurementSetOr404, measurementsMmOf } from './sets';

/** Ease bounds (whole girth, mm): negative for boned, close-fitting work; the cautions say the rest. */
const easeMm = (label: string) =>
	z
		.number({ message: `${label}: enter a number of millimetres.` })
		.min(-200, `${label}: more than 20 cm of reduction is outside what this draft allows.`)
		.max(300, `${label}: more than 30 cm of ease is not a fitted block.`);

export const blockDraftOptionsSchema = z.object({
	bustDart: z.enum(['shoulder', 'side']).default('shoulder'),
	frontCut: z.enum(['on_fold', 'pair']).default('on_fold'),
	backCut: z.enum(['pair', 'on_fold']).default('pair'),
	/** Optional boned under-structure: the whole front in 4 or 6 panels. */
	underStructure: z.union([z.literal('none'), z.literal(4), z.literal(6)]).default('none')
});

export const blockDraftRequestSchema = z.object({
	measurementSetId: z.uuid('Pick a measurement set.'),
	name: z.string().trim().min(1, 'Name the style.').max(120, 'Keep the name under 120 characters.'),
	code: z.string().trim().max(40).default(''),
	season: z.string().trim().max(40).default(''),
	ease: z
		.object({
			bustMm: easeMm('Bust ease'),
			waistMm: easeMm('Waist ease'),
			underbustMm: easeMm('Under-bust ease').optional()
		})
		.default({ ...EASE_DEFAULT }),
	options: blockDraftOptionsSchema.default({ bustDart: 'shoulder', frontCut: 'on_fold', backCut: 'pair', underStructure: 'none' })
});
export type BlockDraftRequest = z.output<typeof blockDraftRequestSchema>;

export interface DraftedStyle {
	style: StyleRow;
	pieces: { id: string; name: string; versionId: string; versionNumber: number }[];
}

/**
 * Drafts a fitted bodice block (and, if asked, a boned under-structure) from one of the studio's
 * measurement sets, ON THE SERVER, and stores it as a new style: pieces Front and Back (and the
 * panels), each with version 1 whose recipe starts with
 * `{ op: 'draft', params: { measurementSetId, ease, options } }`. All or nothing: if a version is
 * refused, the new style is removed again and the refusal is reported.
 */
export async function blockDraftIntoStyle(db: Db, studioId: string, authorId: string, req: BlockDraftRequest): Promise<DraftedStyle> {
	await measurementChartsEnsure(db, studioId);
	const set = await measurementSetOr404(db, studioId, req.measurementSetId);
	const mm = measurementsMmOf(set.values);
	if (mm.bust === undefined) {
		throw new ApiError(422, 'implausible', `"${set.name}" has no bust girth: a block cannot be drafted from it.`, { measurementSetId: ['This set has no bust girth.'] });
	}
	const ease: Ease = { bustMm: req.ease.bustMm, waistMm: req.ease.waistMm, ...(req.ease.underbustMm !== undefined ? { underbustMm: req.ease.underbustMm } : {}) };
	const options = req.options;
	let block;
	let panels: Piece[] = [];
	try {
		block = blockDraft(mm, ease, { bustDart: options.bustDart, frontCut: options.frontCut, backCut: options.backCut });
		if (options.underStructure !== 'none') panels = underStructureDraft(mm, ease, { panels: options.underStructure }).panels;
	} catch (e) {
		throw new ApiError(422, 'draft_refused', `The block could not be drafted from "${set.name}": ${(e as Error).message}`);
	}
	const params = { measurementSetId: set.id, ease, options };
	const style = await stylesCreate(db, {
		studioId,
		name: req.name,
		code: req.code,
		season: req.season,
		notes: `Block drafted from "${set.name}" (${set.source || (set.clientRef ? `client ${set.clientRef}` : 'own measurements')}).${
			draftCautions(ease).length > 0 ? ' Negative ease: for a boned, close-fitting garment; fit a toile first.' : ''
		}`,
		measurementSetId: set.id,
		createdBy: authorId
	});
	const wanted: { name: string; geometry: Piece; part: string }[] = [
		{ name: 'Front', geometry: block.front, part: 'front' },
		{ name: 'Back', geometry: block.back, part: 'back' },
		...panels.map((p, i) => ({ name: `Under-structure panel ${i + 1}`, geometry: p, part: `panel-${i + 1}` }))
	];
	const out: DraftedStyle['pieces'] = [];
	try {
		for (const w of wanted) {
			const r = await pieceCreateWithFirstVersion(db, {
				studioId,
				styleId: style.id,
				authorId,
				name: w.name,
				message: `Drafted from "${set.name}"`,
				geometry: w.geometry,
				origin: { op: 'draft', params: { ...params, part: w.part } }
			});
			if (!r.ok) {
				const why = 'problem' in r ? r.problem.message : r.message;
				throw new ApiError(422, 'draft_refused', `The drafted ${w.name} was refused: ${why}`);
			}
			out.push({ id: r.piece.id, name: w.name, versionId: r.version.id, versionNumber: r.version.number });
		}
	} catch (e) {
		await draftedStyleDiscard(db, studioId, style.id);
		throw e;
	}
	return { style, pieces: out };
}
