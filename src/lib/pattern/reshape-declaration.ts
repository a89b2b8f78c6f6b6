import { DEFAULT_SHAPING_TOLERANCES, ledgerEntry, type LedgerEntry, type ShapingTolerances } from './ledger';
import { pieceMetrics } from './metrics';
import type { Piece } from './piece-schema';
import { metricsCompare } from './verify/metrics-compare';
import { seamNames } from './verify/seam-names';

/**
 * What a hand reshape (the `reshape` step, verify/reshape.ts) changed in a piece, and the labelled
 * ledger entries the pattern cutter declares for it. A reshape posts nothing to the ledger itself, so
 * the server refuses a version whose area outside the darts, sewn seam lengths or shaping at an apex
 * changed unless each change is declared (ledger.ts `shapingChecks`). Each change found here becomes
 * one entry of the kind the pattern cutter picks: ease, fullness (both signed: added or removed), or
 * other with a note.
 */

/** What the pattern cutter says a change is. */
export type DeclarationChoice = 'ease' | 'fullness' | 'other';
export const DECLARATION_CHOICES: readonly DeclarationChoice[] = ['ease', 'fullness', 'other'];

/** The ledger kind each choice is posted as (the values carry the sign: added or removed). */
export const DECLARATION_LEDGER_KIND = { ease: 'removed_ease', fullness: 'fullness', other: 'other' } as const satisfies Record<DeclarationChoice, LedgerEntry['kind']>;

export interface ReshapeChange {
	/** Stable within one comparison: 'area', 'seam:<n>' (n-th seam row) or 'apex:<apexId>'. */
	readonly key: string;
	readonly subject: 'area' | 'seam' | 'apex';
	/** Words for the change's subject: "Area outside the darts", "Lower edge", "Bust point: shaping". */
	readonly label: string;
	/** Before and after in the subject's unit (mm², mm, radians); null where the seam or apex is new or gone. */
	readonly before: number | null;
	readonly after: number | null;
	/** after − before (a new seam counts from 0, a gone one to 0). */
	readonly difference: number;
	readonly unit: 'mm²' | 'mm' | 'rad';
	readonly apexId: string | null;
	/** The change gives the body more cloth (area or seam longer, less shaping at an apex). */
	readonly addsCloth: boolean;
	/** The choice offered first: added ease where cloth is added, removed fullness where it is taken away. */
	readonly suggested: DeclarationChoice;
	/** What the entry for this change posts (the seams' small unlisted changes are folded into the largest). */
	readonly post: { readonly angleRad: number; readonly areaMm2: number; readonly lengthMm: number };
}

export interface ChangeDeclaration {
	readonly choice: DeclarationChoice;
	/** The pattern cutter's words; required for "other". */
	readonly note?: string;
}

const deg = (rad: number) => (rad * 180) / Math.PI;

/** The words for a choice on a change: "Added ease", "Removed fullness", "Other". */
export function declarationChoiceLabel(choice: DeclarationChoice, change: Pick<ReshapeChange, 'addsCloth'>): string {
	if (choice === 'other') return 'Other';
	return `${change.addsCloth ? 'Added' : 'Removed'} ${choice}`;
}

function change(c: Omit<ReshapeChange, 'suggested' | 'addsCloth'> & { addsCloth: boolean }): ReshapeChange {
	return { ...c, suggested: c.addsCloth ? 'ease' : 'fullness' };
}

/**
 * Everything a reshape changed that the server would refuse undeclared: the area outside the darts,
 * each sewn seam (darts folded out, named by where it runs, paired by where it runs and how long it is)
 * and the shaping at each apex, where the change is past the server's tolerance. An empty list: the
 * reshape keeps everything and saves without a declaration.
 */
export function reshapeChanges(before: Piece, after: Piece, tolerances: ShapingTolerances = DEFAULT_SHAPING_TOLERANCES): ReshapeChange[] {
	const mb = pieceMetrics(before);
	const ma = pieceMetrics(after);
	const out: ReshapeChange[] = [];

	const areaDiff = ma.areaMm2 - mb.areaMm2;
	if (Math.abs(areaDiff) > tolerances.areaMm2) {
		out.push(change({ key: 'area', subject: 'area', label: 'Area outside the darts', before: mb.areaMm2, after: ma.areaMm2, difference: areaDiff, unit: 'mm²', apexId: null, addsCloth: areaDiff > 0, post: { angleRad: 0, areaMm2: areaDiff, lengthMm: 0 } }));
	}

	const rows = metricsCompare(mb, ma, seamNames(before, mb.seams), seamNames(after, ma.seams)).filter((r) => r.group === 'seam');
	const seams: ReshapeChange[] = [];
	// a moved point may make a corner (a seam becomes two) or smooth one away: the seams gone and the
	// seams new are shown as one change of that stretch
	const gone = rows.filter((r) => r.b === null);
	const made = rows.filter((r) => r.a === null);
	const split = gone.length > 0 && made.length > 0;
	rows.forEach((r, n) => {
		if (split && (r.a === null || r.b === null)) return;
		const d = (r.b ?? 0) - (r.a ?? 0);
		if (Math.abs(d) <= tolerances.lengthMm) return;
		seams.push(change({ key: `seam:${n}`, subject: 'seam', label: r.label, before: r.a, after: r.b, difference: d, unit: 'mm', apexId: null, addsCloth: d > 0, post: { angleRad: 0, areaMm2: 0, lengthMm: d } }));
	});
	if (split) {
		const name = (label: string) => label.replace(/ \((gone|new)\)$/, '');
		const a = gone.reduce((t, r) => t + (r.a ?? 0), 0);
		const b = made.reduce((t, r) => t + (r.b ?? 0), 0);
		const words = (rs: typeof rows) => rs.map((r) => name(r.label).toLowerCase()).join(' and ');
		const label = `${name(gone.map((r) => r.label).join(' and '))}, now ${words(made)}`;
		if (Math.abs(b - a) > tolerances.lengthMm) {
			seams.push(change({ key: 'seam:stretch', subject: 'seam', label: label.charAt(0).toUpperCase() + label.slice(1), before: a, after: b, difference: b - a, unit: 'mm', apexId: null, addsCloth: b > a, post: { angleRad: 0, areaMm2: 0, lengthMm: b - a } }));
		}
	}
	// the server checks the total seam length: what the small unlisted changes add up to rides on the largest
	const total = ma.seamLengthMm - mb.seamLengthMm;
	const listed = seams.reduce((s, c) => s + c.post.lengthMm, 0);
	const rest = total - listed;
	if (seams.length > 0 && rest !== 0) {
		const k = seams.reduce((best, c, i) => (Math.abs(c.difference) > Math.abs(seams[best].difference) ? i : best), 0);
		seams[k] = { ...seams[k], post: { ...seams[k].post, lengthMm: seams[k].post.lengthMm + rest } };
	} else if (seams.length === 0 && Math.abs(total) > tolerances.lengthMm) {
		seams.push(change({ key: 'seam:all', subject: 'seam', label: 'Sewn seams in all, darts folded out', before: mb.seamLengthMm, after: ma.seamLengthMm, difference: total, unit: 'mm', apexId: null, addsCloth: total > 0, post: { angleRad: 0, areaMm2: 0, lengthMm: total } }));
	}
	out.push(...seams);

	const ids = new Set([...mb.apexTotals.map((a) => a.apexId), ...ma.apexTotals.map((a) => a.apexId)]);
	for (const id of ids) {
		const a = mb.apexTotals.find((t) => t.apexId === id);
		const b = ma.apexTotals.find((t) => t.apexId === id);
		const d = (b?.totalAngleRad ?? 0) - (a?.totalAngleRad ?? 0);
		if (Math.abs(d) <= tolerances.angleRad) continue;
		const name = b?.label || a?.label || id;
		out.push(change({ key: `apex:${id}`, subject: 'apex', label: `${name}: shaping`, before: a?.totalAngleRad ?? null, after: b?.totalAngleRad ?? null, difference: d, unit: 'rad', apexId: id, addsCloth: d < 0, post: { angleRad: d, areaMm2: 0, lengthMm: 0 } }));
	}
	return out;
}

function amountText(c: ReshapeChange): string {
	const v = (x: number | null, digits: number, f = (y: number) => y) => (x === null ? '—' : f(x).toFixed(digits));
	if (c.unit === 'rad') return `${v(c.before, 2, deg)}° → ${v(c.after, 2, deg)}°`;
	if (c.unit === 'mm²') return `${v(c.before, 0)} → ${v(c.after, 0)} mm²`;
	return `${v(c.before, 1)} → ${v(c.after, 1)} mm`;
}

export type DeclaredEntries =
	| { readonly ok: true; readonly entries: LedgerEntry[] }
	/** Keys of the changes declared "other" without a note. */
	| { readonly ok: false; readonly missingNotes: string[] };

/**
 * The ledger entries for the changes, one each, of the kind chosen for it (the suggested choice where
 * none is given), labelled with what changed. Sent as the save's `declared`, they make the server
 * accept the reshape. Refused while an "other" change has no note.
 */
export function reshapeDeclaredEntries(changes: readonly ReshapeChange[], declarations: Readonly<Record<string, ChangeDeclaration>> = {}): DeclaredEntries {
	const missingNotes: string[] = [];
	const entries = changes.map((c) => {
		const d = declarations[c.key] ?? { choice: c.suggested };
		const note = d.note?.trim() ?? '';
		if (d.choice === 'other' && !note) missingNotes.push(c.key);
		return ledgerEntry({
			apexId: c.apexId,
			kind: DECLARATION_LEDGER_KIND[d.choice],
			refId: c.key,
			label: `${declarationChoiceLabel(d.choice, c)} by hand: ${c.label.charAt(0).toLowerCase()}${c.label.slice(1)} ${amountText(c)}`,
			...c.post,
			...(note ? { note } : {})
		});
	});
	return missingNotes.length ? { ok: false, missingNotes } : { ok: true, entries };
}
