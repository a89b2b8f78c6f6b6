import type { MeasurementsMm } from '../measurements';
import { measurementDefinitions, measurementIds, type MeasurementId } from '../measurements/measurement-ids';
import type { SizePieceResult } from './size-result';

/**
 * The table of a size run: for every size the measurements it was made from and, for one piece, the
 * area, the seam lengths and the shaping at each apex the server measured, each beside its difference
 * from the base size (the style's own pieces, on the measurement set they were made on). Pure: numbers
 * in mm, mm² and degrees; the page writes them in the person's unit.
 */

export type PieceMetrics = NonNullable<SizePieceResult['metrics']>;

export interface TableSize {
	readonly key: string;
	readonly name: string;
	readonly measurementsMm?: MeasurementsMm;
	readonly pieces?: readonly { readonly pieceId: string; readonly metrics: PieceMetrics | null }[];
}

export interface TableBase {
	readonly name: string;
	readonly measurementsMm: MeasurementsMm;
	readonly pieces: readonly { readonly pieceId: string; readonly metrics: PieceMetrics | null }[];
}

export type RowKind = 'length' | 'area' | 'angle';

export interface TableCell {
	readonly key: string;
	readonly value: number | null;
	/** value − base; null where either is missing. */
	readonly diff: number | null;
}

export interface TableRow {
	readonly label: string;
	readonly kind: RowKind;
	readonly base: number | null;
	readonly cells: readonly TableCell[];
}

const GIRTHS_FIRST: readonly MeasurementId[] = ['bust', 'waist', 'hip'];

/**
 * The sizes from smallest to largest: by bust girth, then waist, then hip, as the measurements used say;
 * sizes without measurements keep their place after those with them (in the run's order).
 */
export function sizesOrdered<T extends { readonly measurementsMm?: MeasurementsMm }>(sizes: readonly T[]): T[] {
	const indexed = sizes.map((s, i) => ({ s, i }));
	indexed.sort((a, b) => {
		const ma = a.s.measurementsMm;
		const mb = b.s.measurementsMm;
		if (!ma || !mb) return ma ? -1 : mb ? 1 : a.i - b.i;
		for (const id of GIRTHS_FIRST) {
			const d = (ma[id] ?? 0) - (mb[id] ?? 0);
			if (Math.abs(d) > 1e-9) return d;
		}
		return a.i - b.i;
	});
	return indexed.map((x) => x.s);
}

function row(label: string, kind: RowKind, base: number | null, sizes: readonly TableSize[], value: (s: TableSize) => number | null): TableRow {
	return {
		label,
		kind,
		base,
		cells: sizes.map((s) => {
			const v = value(s);
			return { key: s.key, value: v, diff: v === null || base === null ? null : v - base };
		})
	};
}

/** One row per measurement that the base or any size has, in the order of the measurement list. */
export function measurementRows(base: TableBase | null, sizes: readonly TableSize[]): TableRow[] {
	const present = (id: MeasurementId) => base?.measurementsMm[id] !== undefined || sizes.some((s) => s.measurementsMm?.[id] !== undefined);
	return measurementIds.filter(present).map((id) => row(measurementDefinitions[id].label, 'length', base?.measurementsMm[id] ?? null, sizes, (s) => s.measurementsMm?.[id] ?? null));
}

const metricsOf = (pieces: TableSize['pieces'], pieceId: string) => pieces?.find((p) => p.pieceId === pieceId)?.metrics ?? null;

/**
 * One piece across the sizes: its area, its seams in all, each named seam (the base's seams first, in
 * its order, then any a size names otherwise) and the total shaping at each apex (darts, pleats and the
 * panel seams' wedges there, as the server measured it).
 */
export function pieceRows(base: TableBase | null, sizes: readonly TableSize[], pieceId: string): TableRow[] {
	const b = base ? metricsOf(base.pieces, pieceId) : null;
	const per = sizes.map((s) => metricsOf(s.pieces, pieceId));
	const bySize = (s: TableSize) => per[sizes.indexOf(s)];
	const rows: TableRow[] = [
		row('Area', 'area', b?.areaMm2 ?? null, sizes, (s) => bySize(s)?.areaMm2 ?? null),
		row('Seams in all', 'length', b?.seamLengthMm ?? null, sizes, (s) => bySize(s)?.seamLengthMm ?? null)
	];
	const seamNames = [...new Set([...(b?.seams ?? []), ...per.flatMap((m) => m?.seams ?? [])].map((x) => x.name))];
	for (const name of seamNames) {
		const len = (m: PieceMetrics | null) => m?.seams.find((x) => x.name === name)?.lengthMm ?? null;
		rows.push(row(`Seam: ${name}`, 'length', len(b), sizes, (s) => len(bySize(s))));
	}
	const apexes = new Map<string, string>();
	for (const m of [b, ...per]) for (const a of m?.apexes ?? []) if (!apexes.has(a.apexId)) apexes.set(a.apexId, a.label);
	for (const [apexId, label] of apexes) {
		const deg = (m: PieceMetrics | null) => m?.apexes.find((x) => x.apexId === apexId)?.totalAngleDeg ?? null;
		rows.push(row(`Shaping at ${label}`, 'angle', deg(b), sizes, (s) => deg(bySize(s))));
	}
	return rows;
}
