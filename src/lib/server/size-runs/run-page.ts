import { sizePieceMetrics, type SizePieceResult } from '$lib/pattern/grading/size-result';
import type { MeasurementsMm } from '$lib/pattern/measurements';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import type { DbOrTx } from '../db';
import { measurementsMmOf } from '../measurements/sets';
import { measurementSetsInStudio, type SetUnit } from '../repositories/measurement-sets';
import { piecesOfStyle } from '../repositories/pieces';
import type { SizeRunRow } from '../repositories/size-runs';
import { versionsById, versionsOfPiece } from '../repositories/versions';
import type { SizeRunSizeResult } from './run';

/**
 * What a run's page shows beside the run itself: the base size (the style's own pieces at the versions
 * the run replayed, their metrics measured here on the server, and the measurement set the style is made
 * on) and, for the piece chosen for the nest view, its outline as every finished size made it.
 */

export interface RunPagePiece {
	pieceId: string;
	name: string;
}

export interface RunPageBase {
	name: string;
	unit: SetUnit | null;
	measurementsMm: MeasurementsMm;
	pieces: { pieceId: string; name: string; versionNumber: number; metrics: NonNullable<SizePieceResult['metrics']> | null }[];
}

export interface RunPageNest {
	pieceId: string;
	/** The piece at the base size (the version the run replayed). */
	base: Piece | null;
	/** Every finished size that made the piece: its key (measurement set id), name and outline. */
	sizes: { key: string; name: string; piece: Piece }[];
	/** Sizes finished before outlines were kept with runs (they have metrics, no outline). */
	withoutOutline: string[];
}

type Results = Omit<SizeRunSizeResult, 'pieces'> & { pieces: SizePieceResult[] };

/** The pieces of the run, from the first size that reports them, else the style's pieces now. */
export async function runPagePieces(db: DbOrTx, run: SizeRunRow): Promise<RunPagePiece[]> {
	const withPieces = (run.results as Results[]).find((r) => r.pieces.length > 0);
	if (withPieces) return withPieces.pieces.map((p) => ({ pieceId: p.pieceId, name: p.name }));
	return (await piecesOfStyle(db, run.styleId)).filter((p) => p.headVersionId).map((p) => ({ pieceId: p.id, name: p.name }));
}

async function versionGeometry(db: DbOrTx, pieceId: string, number: number | null): Promise<Piece | null> {
	const list = await versionsOfPiece(db, pieceId);
	const v = number === null ? list[0] : list.find((x) => x.number === number);
	if (!v) return null;
	const row = await versionsById(db, pieceId, v.id);
	const parsed = row ? pieceSchema.safeParse(row.geometry) : null;
	return parsed?.success ? parsed.data : null;
}

/** The version number the run replayed for a piece (null when no size reports it: the head is used). */
function versionReplayed(run: SizeRunRow, pieceId: string): number | null {
	for (const r of run.results as Results[]) {
		const p = r.pieces.find((x) => x.pieceId === pieceId);
		if (p) return p.versionNumber;
	}
	return null;
}

export async function runPageBase(db: DbOrTx, run: SizeRunRow, measurementSetId: string | null, pieces: readonly RunPagePiece[]): Promise<RunPageBase> {
	const set = measurementSetId ? await measurementSetsInStudio(db, run.studioId, measurementSetId) : undefined;
	const out: RunPageBase['pieces'] = [];
	for (const p of pieces) {
		const number = versionReplayed(run, p.pieceId);
		const geometry = await versionGeometry(db, p.pieceId, number);
		out.push({ pieceId: p.pieceId, name: p.name, versionNumber: number ?? 0, metrics: geometry ? sizePieceMetrics(geometry) : null });
	}
	return { name: set?.name ?? 'the style’s own pieces', unit: set?.unit ?? null, measurementsMm: set ? measurementsMmOf(set.values) : {}, pieces: out };
}

export async function runPageNest(db: DbOrTx, run: SizeRunRow, pieceId: string): Promise<RunPageNest> {
	const sizes: RunPageNest['sizes'] = [];
	const withoutOutline: string[] = [];
	for (const r of run.results as Results[]) {
		const made = r.pieces.find((p) => p.pieceId === pieceId)?.made;
		if (!made) continue;
		const head = r.heads?.[pieceId];
		if (head) sizes.push({ key: r.measurementSetId, name: r.name, piece: head });
		else withoutOutline.push(r.name);
	}
	return { pieceId, base: await versionGeometry(db, pieceId, versionReplayed(run, pieceId)), sizes, withoutOutline };
}
