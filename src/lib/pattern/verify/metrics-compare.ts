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
	for (const [i, j] of seamsMatch(a.seams, b.seams)) {
		const label = i !== null ? `Seam ${i + 1}` : `New seam ${j! + 1}`;
		rows.push(row('seam', label, 'mm', i !== null ? a.seams[i].lengthMm : null, j !== null ? b.seams[j].lengthMm : null));
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
