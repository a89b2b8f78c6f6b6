import type { PieceMetrics } from '../metrics';

/** One line of a comparison between two versions: a quantity, both values and the difference. */
export interface ComparisonRow {
	readonly group: 'piece' | 'seam' | 'dart' | 'pleat' | 'apex';
	readonly label: string;
	readonly unit: 'mm' | 'mm²' | '°';
	readonly a: number | null;
	readonly b: number | null;
	/** b − a, null when the quantity exists on one side only. */
	readonly difference: number | null;
}

const deg = (rad: number) => (rad * 180) / Math.PI;

function row(group: ComparisonRow['group'], label: string, unit: ComparisonRow['unit'], a: number | null, b: number | null): ComparisonRow {
	return { group, label, unit, a, b, difference: a === null || b === null ? null : b - a };
}

function byKey<T>(items: readonly T[], key: (t: T) => string): Map<string, T> {
	return new Map(items.map((t) => [key(t), t]));
}

/**
 * Two pieces' metrics side by side: area, perimeter, seam length with darts folded out, each seam
 * between corners (in outline order), each dart and pleat angle and intake, each apex's total.
 */
export function metricsCompare(a: PieceMetrics, b: PieceMetrics): ComparisonRow[] {
	const rows: ComparisonRow[] = [
		row('piece', 'Area outside the darts', 'mm²', a.areaMm2, b.areaMm2),
		row('piece', 'Perimeter', 'mm', a.perimeterMm, b.perimeterMm),
		row('piece', 'Seam length, darts folded out', 'mm', a.seamLengthMm, b.seamLengthMm)
	];
	const seams = Math.max(a.seams.length, b.seams.length);
	for (let i = 0; i < seams; i++) {
		rows.push(row('seam', `Seam ${i + 1}`, 'mm', a.seams[i]?.lengthMm ?? null, b.seams[i]?.lengthMm ?? null));
	}
	const da = byKey(a.darts, (d) => d.id);
	const db = byKey(b.darts, (d) => d.id);
	for (const id of new Set([...da.keys(), ...db.keys()])) {
		const x = da.get(id);
		const y = db.get(id);
		rows.push(row('dart', `Dart ${id}: angle`, '°', x ? deg(x.angleRad) : null, y ? deg(y.angleRad) : null));
		rows.push(row('dart', `Dart ${id}: intake`, 'mm', x?.intakeMm ?? null, y?.intakeMm ?? null));
	}
	const pa = byKey(a.pleats, (p) => p.id);
	const pb = byKey(b.pleats, (p) => p.id);
	for (const id of new Set([...pa.keys(), ...pb.keys()])) {
		const x = pa.get(id);
		const y = pb.get(id);
		rows.push(row('pleat', `Pleat ${id}: angle`, '°', x ? deg(x.angleRad) : null, y ? deg(y.angleRad) : null));
	}
	const aa = byKey(a.apexTotals, (t) => t.apexId);
	const ab = byKey(b.apexTotals, (t) => t.apexId);
	for (const id of new Set([...aa.keys(), ...ab.keys()])) {
		const x = aa.get(id);
		const y = ab.get(id);
		rows.push(row('apex', `${x?.label || y?.label || id}: shaping`, '°', x ? deg(x.totalAngleRad) : null, y ? deg(y.totalAngleRad) : null));
	}
	return rows;
}
