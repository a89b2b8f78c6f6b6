import type { PieceMetrics } from '../metrics';
import { pieceMetrics } from '../metrics';
import type { Piece } from '../piece-schema';
import { seamNames } from './seam-names';

/** One line of a comparison between two versions: a quantity, both values and the difference. */
export interface ComparisonRow {
	readonly group: 'piece' | 'seam' | 'dart' | 'pleat' | 'apex';
	readonly label: string;
	readonly unit: 'mm' | 'mm²' | '°';
	readonly a: number | null;
	readonly b: number | null;
	/** b − a, null when the quantity exists on one side only. */
	readonly difference: number | null;
	/** The change is past what a pattern cutter lets pass for this kind of quantity (COMPARE_THRESHOLDS). */
	readonly flagged: boolean;
}

/**
 * What a pattern cutter worries about when two versions differ. The comparison measures the sewn seams
 * (darts and pleats folded out), never the outline with its dart and pleat legs, which changes with
 * every dart move without changing the garment.
 */
export const COMPARE_THRESHOLDS = {
	/**
	 * A sewn seam longer or shorter by more than 3 mm no longer meets the seam it is sewn to as before:
	 * 1/8 in (≈ 3 mm) is the widely accepted truing tolerance (reference-values row 25, C/P; 1/16 in in
	 * professional work, 6 mm off is a defect). Common practice (CP) as a threshold for a comparison.
	 */
	seamLengthMm: 3,
	/** The piece's area outside the darts changed by more than 1 %: fit or ease changed (CP). */
	areaFraction: 0.01,
	/** The shaping at an apex changed by more than 0.5° (about 2 mm of intake 250 mm from the apex): the fit there changed (CP). */
	apexAngleDeg: 0.5
} as const;

/** The thresholds in words, for the screens that show a comparison. */
export const COMPARE_THRESHOLD_NOTES: readonly string[] = [
	`a sewn seam (darts folded out) changed by more than ${COMPARE_THRESHOLDS.seamLengthMm} mm (about 1/8 in, the usual truing tolerance)`,
	`the area outside the darts changed by more than ${COMPARE_THRESHOLDS.areaFraction * 100} %`,
	`the shaping at an apex changed by more than ${COMPARE_THRESHOLDS.apexAngleDeg}°`
];

const deg = (rad: number) => (rad * 180) / Math.PI;

type SeamLike = PieceMetrics['seams'][number];

/**
 * Pairs the seams of two versions: an operation may start the outline elsewhere or move a chain, so
 * seams are matched by where they run and how long they are, not by their place in the outline. Greedy
 * on the cost |Δlength| + distance of the two ends; pairs off by more than 25 % of the length stay apart.
 */
function seamsMatch(a: readonly SeamLike[], b: readonly SeamLike[]): [number | null, number | null][] {
	const d = (p: { x: number; y: number }, q: { x: number; y: number }) => Math.hypot(p.x - q.x, p.y - q.y);
	const cand: { i: number; j: number; cost: number }[] = [];
	a.forEach((x, i) =>
		b.forEach((y, j) => {
			const cost = Math.abs(x.lengthMm - y.lengthMm) + 0.1 * (d(x.startPoint, y.startPoint) + d(x.endPoint, y.endPoint));
			if (cost <= 0.25 * Math.max(x.lengthMm, y.lengthMm)) cand.push({ i, j, cost });
		})
	);
	cand.sort((p, q) => p.cost - q.cost);
	const ai = new Map<number, number>();
	const usedB = new Set<number>();
	for (const c of cand) {
		if (ai.has(c.i) || usedB.has(c.j)) continue;
		ai.set(c.i, c.j);
		usedB.add(c.j);
	}
	const out: [number | null, number | null][] = a.map((_, i) => [i, ai.get(i) ?? null]);
	b.forEach((_, j) => {
		if (!usedB.has(j)) out.push([null, j]);
	});
	return out;
}

function row(group: ComparisonRow['group'], label: string, unit: ComparisonRow['unit'], a: number | null, b: number | null, worry?: (diff: number) => boolean): ComparisonRow {
	const difference = a === null || b === null ? null : b - a;
	return { group, label, unit, a, b, difference, flagged: difference !== null && worry !== undefined && worry(difference) };
}

function byKey<T>(items: readonly T[], key: (t: T) => string): Map<string, T> {
	return new Map(items.map((t) => [key(t), t]));
}

const words = (id: string) => id.replace(/[-_]+/g, ' ');
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Two pieces' metrics side by side: area outside the darts, the sewn seams in all and each sewn seam
 * (darts and pleats folded out, named by where it runs when names are given), each dart's and pleat's
 * angle and intake, each apex's total. Rows past COMPARE_THRESHOLDS are flagged.
 */
export function metricsCompare(a: PieceMetrics, b: PieceMetrics, namesA?: readonly string[], namesB?: readonly string[]): ComparisonRow[] {
	const T = COMPARE_THRESHOLDS;
	const seamWorry = (d: number) => Math.abs(d) > T.seamLengthMm;
	const rows: ComparisonRow[] = [
		row('piece', 'Area outside the darts', 'mm²', a.areaMm2, b.areaMm2, (d) => Math.abs(d) > T.areaFraction * a.areaMm2),
		row('piece', 'Sewn seams in all, darts folded out', 'mm', a.seamLengthMm, b.seamLengthMm, seamWorry)
	];
	for (const [i, j] of seamsMatch(a.seams, b.seams)) {
		const name = i !== null ? (namesA?.[i] ?? `seam ${i + 1}`) : `${namesB?.[j!] ?? `seam ${j! + 1}`} (new)`;
		const label = i !== null && j === null ? `${name} (gone)` : name;
		rows.push(row('seam', capital(label), 'mm', i !== null ? a.seams[i].lengthMm : null, j !== null ? b.seams[j].lengthMm : null, seamWorry));
	}
	const da = byKey(a.darts, (d) => d.id);
	const db = byKey(b.darts, (d) => d.id);
	for (const id of new Set([...da.keys(), ...db.keys()])) {
		const x = da.get(id);
		const y = db.get(id);
		rows.push(row('dart', `Dart "${words(id)}": angle`, '°', x ? deg(x.angleRad) : null, y ? deg(y.angleRad) : null));
		rows.push(row('dart', `Dart "${words(id)}": intake at the seam`, 'mm', x?.intakeMm ?? null, y?.intakeMm ?? null));
	}
	const pa = byKey(a.pleats, (p) => p.id);
	const pb = byKey(b.pleats, (p) => p.id);
	for (const id of new Set([...pa.keys(), ...pb.keys()])) {
		const x = pa.get(id);
		const y = pb.get(id);
		rows.push(row('pleat', `${x?.kind === 'tuck' || y?.kind === 'tuck' ? 'Tuck' : 'Pleat'} "${words(id)}": angle`, '°', x ? deg(x.angleRad) : null, y ? deg(y.angleRad) : null));
	}
	const aa = byKey(a.apexTotals, (t) => t.apexId);
	const ab = byKey(b.apexTotals, (t) => t.apexId);
	for (const id of new Set([...aa.keys(), ...ab.keys()])) {
		const x = aa.get(id);
		const y = ab.get(id);
		rows.push(
			row('apex', `${x?.label || y?.label || words(id)}: shaping`, '°', x ? deg(x.totalAngleRad) : null, y ? deg(y.totalAngleRad) : null, (d) => Math.abs(d) > T.apexAngleDeg)
		);
	}
	return rows;
}

/** Two pieces compared, seams named by where they run on each piece (seam-names.ts). */
export function piecesCompare(a: Piece, b: Piece): ComparisonRow[] {
	const ma = pieceMetrics(a);
	const mb = pieceMetrics(b);
	return metricsCompare(ma, mb, seamNames(a, ma.seams), seamNames(b, mb.seams));
}
