import { sql } from 'kysely';
import type { DbOrTx } from '../db';
import { authorName } from './former-member';
import type { FitNoteCategory, FitNoteStatus } from '../db/schema';

export interface FitNoteRow {
	id: string;
	fittingId: string;
	fittingTitle: string;
	pieceId: string;
	pieceName: string;
	versionId: string;
	versionNumber: number;
	xMm: number;
	yMm: number;
	category: FitNoteCategory;
	amountMm: number | null;
	/** the unit the amount is read in: the fitted measurement set's, else the style's set's, else mm */
	unit: 'mm' | 'cm' | 'in';
	body: string;
	status: FitNoteStatus;
	resolvedVersionId: string | null;
	resolvedVersionNumber: number | null;
	assignedTo: string | null;
	assignedToName: string | null;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: Date;
	updatedAt: Date;
}

function selectNotes(db: DbOrTx) {
	return db
		.selectFrom('fit_notes')
		.innerJoin('fittings', 'fittings.id', 'fit_notes.fitting_id')
		.innerJoin('pieces', 'pieces.id', 'fit_notes.piece_id')
		.innerJoin('styles', 'styles.id', 'pieces.style_id')
		.leftJoin('measurement_sets as fitted', 'fitted.id', 'fittings.measurement_set_id')
		.leftJoin('measurement_sets as drafted', 'drafted.id', 'styles.measurement_set_id')
		.innerJoin('piece_versions as pinned', 'pinned.id', 'fit_notes.version_id')
		.leftJoin('piece_versions as resolved', 'resolved.id', 'fit_notes.resolved_version_id')
		.leftJoin('users as author', 'author.id', 'fit_notes.created_by')
		.leftJoin('users as assignee', 'assignee.id', 'fit_notes.assigned_to')
		.select([
			'fit_notes.id',
			'fit_notes.fitting_id as fittingId',
			'fittings.title as fittingTitle',
			'fit_notes.piece_id as pieceId',
			'pieces.name as pieceName',
			'fit_notes.version_id as versionId',
			'pinned.number as versionNumber',
			'fit_notes.x_mm as xMm',
			'fit_notes.y_mm as yMm',
			'fit_notes.category',
			'fit_notes.amount_mm as amountMm',
			(eb) => eb.fn.coalesce('fitted.unit', 'drafted.unit', sql<'mm'>`'mm'`).as('unit'),
			'fit_notes.body',
			'fit_notes.status',
			'fit_notes.resolved_version_id as resolvedVersionId',
			'resolved.number as resolvedVersionNumber',
			'fit_notes.assigned_to as assignedTo',
			'assignee.name as assignedToName',
			'fit_notes.created_by as createdBy',
			authorName('author.name', 'createdByName'),
			'fit_notes.created_at as createdAt',
			'fit_notes.updated_at as updatedAt'
		]);
}

export interface FitNoteInput {
	fittingId: string;
	pieceId: string;
	versionId: string;
	xMm: number;
	yMm: number;
	category: FitNoteCategory;
	amountMm: number | null;
	body: string;
	assignedTo: string | null;
	createdBy: string;
}

export async function fitNotesInsert(db: DbOrTx, n: FitNoteInput): Promise<{ id: string }> {
	return db
		.insertInto('fit_notes')
		.values({
			fitting_id: n.fittingId,
			piece_id: n.pieceId,
			version_id: n.versionId,
			x_mm: n.xMm,
			y_mm: n.yMm,
			category: n.category,
			amount_mm: n.amountMm,
			body: n.body,
			assigned_to: n.assignedTo,
			created_by: n.createdBy
		})
		.returning('id')
		.executeTakeFirstOrThrow();
}

export async function fitNotesById(db: DbOrTx, fittingId: string, noteId: string): Promise<FitNoteRow | undefined> {
	return selectNotes(db).where('fit_notes.id', '=', noteId).where('fit_notes.fitting_id', '=', fittingId).executeTakeFirst();
}

export async function fitNotesOfFitting(db: DbOrTx, fittingId: string): Promise<FitNoteRow[]> {
	return selectNotes(db).where('fit_notes.fitting_id', '=', fittingId).orderBy('fit_notes.created_at').orderBy('fit_notes.id').execute();
}

/** Every note pinned on any version of these pieces (the caller decides which versions show each). */
export async function fitNotesOfPieces(db: DbOrTx, pieceIds: readonly string[]): Promise<FitNoteRow[]> {
	if (pieceIds.length === 0) return [];
	return selectNotes(db).where('fit_notes.piece_id', 'in', pieceIds).orderBy('fit_notes.created_at').orderBy('fit_notes.id').execute();
}

export async function fitNotesUpdate(
	db: DbOrTx,
	noteId: string,
	set: { status?: FitNoteStatus; resolvedVersionId?: string | null; assignedTo?: string | null; body?: string; amountMm?: number | null }
): Promise<void> {
	await db
		.updateTable('fit_notes')
		.set({
			...(set.status !== undefined ? { status: set.status } : {}),
			...(set.resolvedVersionId !== undefined ? { resolved_version_id: set.resolvedVersionId } : {}),
			...(set.assignedTo !== undefined ? { assigned_to: set.assignedTo } : {}),
			...(set.body !== undefined ? { body: set.body } : {}),
			...(set.amountMm !== undefined ? { amount_mm: set.amountMm } : {}),
			updated_at: new Date()
		})
		.where('id', '=', noteId)
		.execute();
}

export async function fitNotesDelete(db: DbOrTx, noteId: string): Promise<void> {
	await db.deleteFrom('fit_notes').where('id', '=', noteId).execute();
}
