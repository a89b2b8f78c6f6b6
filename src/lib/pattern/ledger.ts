import { z } from 'zod';
import { pieceMetrics, type PieceMetrics } from './metrics';
import type { Piece } from './piece-schema';

/**
 * The shaping ledger. Every apex has a shaping budget: the total angle of the darts and pleats that
 * open at it. Operations post entries; moving shaping posts pairs that cancel (dart −θ, new dart +θ),
 * deliberate changes are labelled with their own kind (added fullness, removed ease).
 */

/** Kinds that move shaping around an apex: at each apex they must sum to zero. */
export const SHAPING_KINDS = ['dart', 'pleat', 'tuck', 'seam'] as const;
/**
 * Kinds that are explicit, labelled changes (allowed to change area, seam length or apex angle). Their
 * values are signed: `fullness` is fullness added (or, negative, removed), `removed_ease` ease removed
 * (or, negative, added). `other` is a change the pattern cutter names in words: it needs a note.
 */
export const LABELLED_KINDS = ['fullness', 'removed_ease', 'clearance', 'trued_seam', 'other'] as const;

/** The longest note a labelled change may carry. */
export const LEDGER_NOTE_MAX_LENGTH = 500;

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });

export const ledgerEntryKindSchema = z.enum([...SHAPING_KINDS, ...LABELLED_KINDS]);

export const ledgerEntrySchema = z.object({
	/** Apex the entry belongs to; null for changes that are not about an apex (fullness spread). */
	apexId: z.string().nullable(),
	kind: ledgerEntryKindSchema,
	/** Id of the dart, pleat or slash concerned. */
	refId: z.string(),
	/** Words for the pattern cutter, e.g. "shoulder dart closed". */
	label: z.string(),
	/** Signed change of the shaping angle at the apex (radians). */
	angleRad: finite(),
	/** Signed change of the piece area this entry accounts for (mm²). */
	areaMm2: finite().default(0),
	/** Signed change of seam length this entry accounts for (mm). */
	lengthMm: finite().default(0),
	/** The pattern cutter's words on why (required for `other`). */
	note: z.string().trim().max(LEDGER_NOTE_MAX_LENGTH).optional()
}).refine((e) => e.kind !== 'other' || (e.note ?? '').length > 0, {
	message: 'Say in a note what an "other" change is.',
	path: ['note']
});

/** The labelled entries that need a note and have none (an `other` change must say what it is). */
export function ledgerEntriesWithoutNote(entries: readonly LedgerEntry[]): LedgerEntry[] {
	return entries.filter((e) => e.kind === 'other' && !(e.note ?? '').trim());
}

export type LedgerEntryKind = z.infer<typeof ledgerEntryKindSchema>;
export type LedgerEntry = z.infer<typeof ledgerEntrySchema>;

export function ledgerEntry(
	e: Omit<LedgerEntry, 'areaMm2' | 'lengthMm'> & Partial<Pick<LedgerEntry, 'areaMm2' | 'lengthMm'>>
): LedgerEntry {
	return { areaMm2: 0, lengthMm: 0, ...e };
}

export interface ShapingTolerances {
	readonly angleRad: number;
	readonly areaMm2: number;
	readonly lengthMm: number;
}

export const DEFAULT_SHAPING_TOLERANCES: ShapingTolerances = {
	angleRad: (0.01 * Math.PI) / 180,
	areaMm2: 0.5,
	lengthMm: 0.05
};

const isShaping = (k: LedgerEntryKind) => (SHAPING_KINDS as readonly string[]).includes(k);

export interface ApexBalance {
	readonly apexId: string;
	/** Sum of dart/pleat/tuck/seam entries: zero when shaping was only moved. */
	readonly shapingSumRad: number;
	/** Sum of labelled changes (fullness, removed ease). */
	readonly labelledSumRad: number;
	readonly balanced: boolean;
}

/** Per apex: does the ledger balance (shaping only moved, within tolerance)? */
export function ledgerBalance(
	entries: readonly LedgerEntry[],
	toleranceRad = DEFAULT_SHAPING_TOLERANCES.angleRad
): ApexBalance[] {
	const byApex = new Map<string, { s: number; l: number }>();
	for (const e of entries) {
		if (e.apexId === null) continue;
		const acc = byApex.get(e.apexId) ?? { s: 0, l: 0 };
		if (isShaping(e.kind)) acc.s += e.angleRad;
		else acc.l += e.angleRad;
		byApex.set(e.apexId, acc);
	}
	return [...byApex.entries()].map(([apexId, { s, l }]) => ({
		apexId,
		shapingSumRad: s,
		labelledSumRad: l,
		balanced: Math.abs(s) <= toleranceRad
	}));
}

export type ShapingCheckCode =
	| 'apex_ledger_matches_piece'
	| 'apex_balanced'
	| 'area_kept'
	| 'seam_length_kept'
	| 'seam_lengths_each';

export interface ShapingCheck {
	readonly code: ShapingCheckCode;
	readonly passed: boolean;
	readonly apexId?: string;
	readonly message: string;
}

const deg = (rad: number) => (rad * 180) / Math.PI;
const fmtDeg = (rad: number) => `${deg(rad).toFixed(2)}°`;
const fmtSignedDeg = (rad: number) => `${rad >= 0 ? '+' : '−'}${Math.abs(deg(rad)).toFixed(2)}°`;
const fmtMm2 = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(1)} mm²`;
const fmtMm = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(2)} mm`;

function metricsOf(p: Piece | PieceMetrics): PieceMetrics {
	return 'outline' in p ? pieceMetrics(p) : p;
}

/**
 * The checks the server runs on every save: each apex keeps its shaping (or the change is labelled),
 * the ledger tells the truth about each apex, the area outside the wedges and the seam lengths are kept
 * unless a labelled entry accounts for the change.
 */
export function shapingChecks(
	before: Piece | PieceMetrics,
	after: Piece | PieceMetrics,
	entries: readonly LedgerEntry[],
	tolerances: ShapingTolerances = DEFAULT_SHAPING_TOLERANCES
): ShapingCheck[] {
	const mb = metricsOf(before);
	const ma = metricsOf(after);
	const checks: ShapingCheck[] = [];
	const apexIds = new Set<string>([...mb.apexTotals.map((a) => a.apexId), ...ma.apexTotals.map((a) => a.apexId)]);
	for (const e of entries) if (e.apexId) apexIds.add(e.apexId);
	for (const apexId of apexIds) {
		const tb = mb.apexTotals.find((a) => a.apexId === apexId);
		const ta = ma.apexTotals.find((a) => a.apexId === apexId);
		const name = (ta?.label || tb?.label) ? `${ta?.label || tb?.label} (${apexId})` : `apex ${apexId}`;
		const totalBefore = tb?.totalAngleRad ?? 0;
		const totalAfter = ta?.totalAngleRad ?? 0;
		const change = totalAfter - totalBefore;
		const mine = entries.filter((e) => e.apexId === apexId);
		const posted = mine.reduce((s, e) => s + e.angleRad, 0);
		const labelled = mine.filter((e) => !isShaping(e.kind)).reduce((s, e) => s + e.angleRad, 0);
		const truthful = Math.abs(change - posted) <= tolerances.angleRad;
		checks.push({
			code: 'apex_ledger_matches_piece',
			passed: truthful,
			apexId,
			message: truthful
				? `${name}: the ledger's ${fmtSignedDeg(posted)} matches the piece (${fmtDeg(totalBefore)} → ${fmtDeg(totalAfter)}).`
				: `${name}: the darts and pleats changed by ${fmtSignedDeg(change)} (${fmtDeg(totalBefore)} → ${fmtDeg(totalAfter)}) but the ledger records ${fmtSignedDeg(posted)}.`
		});
		const unexplained = change - labelled;
		const balanced = Math.abs(unexplained) <= tolerances.angleRad;
		checks.push({
			code: 'apex_balanced',
			passed: balanced,
			apexId,
			message: balanced
				? `${name}: shaping kept at ${fmtDeg(totalAfter)}${Math.abs(labelled) > tolerances.angleRad ? ` (labelled change ${fmtSignedDeg(labelled)})` : ''}.`
				: `${name}: ${fmtSignedDeg(unexplained)} of shaping is ${unexplained < 0 ? 'lost' : 'added'} without a labelled entry (was ${fmtDeg(totalBefore)}, now ${fmtDeg(totalAfter)}).`
		});
	}
	const areaPosted = entries.reduce((s, e) => s + e.areaMm2, 0);
	const areaChange = ma.areaMm2 - mb.areaMm2;
	const areaOk = Math.abs(areaChange - areaPosted) <= tolerances.areaMm2;
	checks.push({
		code: 'area_kept',
		passed: areaOk,
		message: areaOk
			? `Area outside the darts: ${ma.areaMm2.toFixed(1)} mm² (${fmtMm2(areaChange)}${Math.abs(areaPosted) > 0 ? `, labelled ${fmtMm2(areaPosted)}` : ''}).`
			: `Area outside the darts changed by ${fmtMm2(areaChange)} (${mb.areaMm2.toFixed(1)} → ${ma.areaMm2.toFixed(1)} mm²) but the ledger accounts for ${fmtMm2(areaPosted)}.`
	});
	const lengthPosted = entries.reduce((s, e) => s + e.lengthMm, 0);
	const lengthChange = ma.seamLengthMm - mb.seamLengthMm;
	const lengthOk = Math.abs(lengthChange - lengthPosted) <= tolerances.lengthMm;
	checks.push({
		code: 'seam_length_kept',
		passed: lengthOk,
		message: lengthOk
			? `Seam length with darts folded out: ${ma.seamLengthMm.toFixed(2)} mm (${fmtMm(lengthChange)}).`
			: `Seam length with darts folded out changed by ${fmtMm(lengthChange)} (${mb.seamLengthMm.toFixed(2)} → ${ma.seamLengthMm.toFixed(2)} mm) but the ledger accounts for ${fmtMm(lengthPosted)}.`
	});
	checks.push(seamsEachCheck(mb, ma, entries.reduce((t, e) => t + Math.abs(e.lengthMm), 0), tolerances.lengthMm));
	return checks;
}

/**
 * Seams one by one: the total (seam_length_kept) would not show one seam lengthened and another
 * shortened by as much. Seams are matched by length (both lists sorted, which gives the least change
 * one by one), and what they changed by in all must be within what the labelled entries declare
 * (their lengths taken without sign). A seam made or smoothed away (a new corner) needs a declaration.
 */
function seamsEachCheck(mb: PieceMetrics, ma: PieceMetrics, declaredMm: number, toleranceMm: number): ShapingCheck {
	const lb = mb.seams.map((s) => s.lengthMm).sort((a, b) => a - b);
	const la = ma.seams.map((s) => s.lengthMm).sort((a, b) => a - b);
	const declared = declaredMm > toleranceMm;
	let problem = '';
	if (lb.length !== la.length) {
		if (!declared) problem = `the piece had ${lb.length} seams between corners and now has ${la.length}`;
	} else {
		let moved = 0;
		let first = '';
		for (let i = 0; i < lb.length; i++) {
			const d = Math.abs(lb[i] - la[i]);
			if (d <= toleranceMm) continue;
			moved += d;
			first ||= `a seam of ${lb[i].toFixed(2)} mm is now ${la[i].toFixed(2)} mm`;
		}
		// small changes below the tolerance, one per seam, may ride on a declared entry
		if (moved > declaredMm + toleranceMm * Math.max(1, lb.length)) {
			problem = declared ? `the seams changed by ${moved.toFixed(2)} mm in all, one by one, but the declared changes account for ${declaredMm.toFixed(2)} mm (${first})` : first;
		}
	}
	return {
		code: 'seam_lengths_each',
		passed: problem === '',
		message: problem === '' ? `All ${la.length} seams keep their lengths (darts folded out)${declared ? ', or change as declared' : ''}.` : `Seam lengths not kept: ${problem}.`
	};
}
