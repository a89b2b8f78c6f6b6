import { z } from 'zod';
import { draftCautions, EASE_DEFAULT, underStructureDraft, type Ease } from '$lib/pattern/drafting';
import { measurementHardProblems } from '$lib/pattern/measurements';
import { DRAFTED_SEAM_TOLERANCE_MM, draftedSeamPairs } from '$lib/pattern/panels/drafted-seams';
import type { Piece } from '$lib/pattern/piece-schema';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { draftedStyleDiscard } from '../repositories/measurement-sets';
import { seamPairsCreate } from '../repositories/seam-pairs';
import { stylesCreate, type StyleRow } from '../repositories/styles';
import { planLimitEnforce, planLimitReserve } from '../billing/plan';
import { pieceCreateWithFirstVersion } from '../versions/piece-create';
import { measurementChartsEnsure } from './charts';
import { draftAttempt, draftCulprits, draftCulpritText, draftPieces } from './draft-culprit';
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
 * `{ op: 'draft', params: { measurementSetId, ease, options } }`, and the seam pairs between
 * neighbouring panels (their divergence points are marked on the panels). All or nothing: if a version is
 * refused, the new style is removed again and the refusal is reported.
 */
export async function blockDraftIntoStyle(db: Db, studioId: string, authorId: string, req: BlockDraftRequest): Promise<DraftedStyle> {
	await planLimitEnforce(db, studioId, 'styles');
	await measurementChartsEnsure(db, studioId);
	const set = await measurementSetOr404(db, studioId, req.measurementSetId);
	const mm = measurementsMmOf(set.values);
	if (mm.bust === undefined) {
		throw new ApiError(422, 'implausible', `"${set.name}" has no bust girth: a block cannot be drafted from it.`, { measurementSetId: ['This set has no bust girth.'] });
	}
	// values no human body measures (a set saved before they were refused) are named, not drafted from
	const hard = measurementHardProblems(mm);
	if (hard.length > 0) {
		const messages = hard.map((p) => p.message);
		throw new ApiError(422, 'implausible', `A block cannot be drafted from "${set.name}": ${messages.join(' ')} Correct the set first.`, { measurementSetId: messages });
	}
	const ease: Ease = { bustMm: req.ease.bustMm, waistMm: req.ease.waistMm, ...(req.ease.underbustMm !== undefined ? { underbustMm: req.ease.underbustMm } : {}) };
	const options = req.options;
	const attempt = draftAttempt(ease, options);
	const failure = attempt(mm);
	if (failure !== null) {
		const blame = draftCulpritText(mm, draftCulprits(mm, attempt));
		throw new ApiError(422, 'draft_refused', `The block could not be drafted from "${set.name}": ${failure}. ${blame}`, { measurementSetId: [blame] });
	}
	const drafted = draftPieces(mm, ease, options);
	if (!drafted.ok) throw new ApiError(422, 'draft_refused', `The block could not be drafted from "${set.name}": ${drafted.message}`);
	// the seam pairs between neighbouring panels (the same pure draft, so the same panels)
	const seams = options.underStructure === 'none' ? [] : draftedSeamPairs(underStructureDraft(mm, ease, { panels: options.underStructure }));
	const params = { measurementSetId: set.id, ease, options };
	// refused early above (before drafting), and again under the studio's lock where the style is inserted
	const style = await db.transaction().execute(async (tx) => {
		await planLimitReserve(tx, studioId, 'styles');
		return stylesCreate(tx, {
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
	});
	const parts = ['front', 'back', ...drafted.pieces.slice(2).map((_, i) => `panel-${i + 1}`)];
	const wanted: { name: string; geometry: Piece; part: string }[] = drafted.pieces.map((p, i) => ({ ...p, part: parts[i] }));
	const out: DraftedStyle['pieces'] = [];
	const stored = new Map<string, string>();
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
			stored.set(w.geometry.id, r.piece.id);
		}
		// the seams between neighbouring panels, each with its divergence point marked on both panels
		for (const sp of seams) {
			const aPieceId = stored.get(sp.aPanelId);
			const bPieceId = stored.get(sp.bPanelId);
			if (!aPieceId || !bPieceId) throw new ApiError(422, 'draft_refused', `The drafted ${sp.label} names a panel that was not stored.`);
			await seamPairsCreate(db, { styleId: style.id, label: sp.label, aPieceId, aEdge: sp.a, bPieceId, bEdge: sp.b, allowedEaseMm: 0, toleranceMm: DRAFTED_SEAM_TOLERANCE_MM });
		}
	} catch (e) {
		await draftedStyleDiscard(db, studioId, style.id);
		throw e;
	}
	return { style, pieces: out };
}
