import type { z } from 'zod';
import { FIT_NOTE_CATEGORY_LABELS } from '$lib/fittings/notes';
import type { Db } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { fitNotesById, fitNotesInsert, fitNotesUpdate, type FitNoteRow } from '../repositories/fit-notes';
import { membershipsRole } from '../repositories/memberships';
import { piecesInStudio } from '../repositories/pieces';
import { stylesInStudio } from '../repositories/styles';
import { versionsById } from '../repositories/versions';
import { versionOr404 } from '../versions/access';
import { fitNoteAssignedMail } from '../notify/mails';
import { notify } from '../notify/send';
import { fittingOr404 } from './fittings';
import type { fitNoteCreateSchema, fitNotePatchSchema } from './schemas';
import { fitNoteJson } from './view';

const ASSIGNABLE: readonly Role[] = ['owner', 'patterncutter'];

async function assigneeCheck(db: Db, studioId: string, userId: string | null): Promise<void> {
	if (userId === null) return;
	const role = await membershipsRole(db, studioId, userId);
	if (!role || !ASSIGNABLE.includes(role)) {
		throw new ApiError(400, 'invalid', 'Some fields are not valid.', { assignedTo: ['Assign the note to a pattern cutter or the owner of this studio.'] });
	}
}

async function noteOr404(db: Db, fittingId: string, noteId: string): Promise<FitNoteRow> {
	const n = await fitNotesById(db, fittingId, noteId);
	if (!n) throw new ApiError(404, 'not_found', 'No such fit note on this fitting.');
	return n;
}

export async function fitNoteCreate(
	db: Db,
	input: { studioId: string; fittingId: string; user: { id: string; name: string }; role: Role; origin: string; body: z.output<typeof fitNoteCreateSchema> }
) {
	const fitting = await fittingOr404(db, input.studioId, input.fittingId);
	const { body } = input;
	const piece = await piecesInStudio(db, input.studioId, body.pieceId);
	if (!piece || piece.styleId !== fitting.styleId) throw new ApiError(404, 'not_found', 'No such piece in the style of this fitting.');
	await versionOr404(db, piece.id, body.versionId, input.role);
	await assigneeCheck(db, input.studioId, body.assignedTo);
	const { id } = await fitNotesInsert(db, {
		fittingId: fitting.id,
		pieceId: piece.id,
		versionId: body.versionId,
		xMm: body.xMm,
		yMm: body.yMm,
		category: body.category,
		amountMm: body.amountMm,
		body: body.body,
		assignedTo: body.assignedTo,
		createdBy: input.user.id
	});
	const note = await noteOr404(db, fitting.id, id);
	await noteAssignedNotify(db, input.studioId, fitting.styleId, note, input.user, input.origin);
	return fitNoteJson(note);
}

export async function fitNotePatch(
	db: Db,
	input: { studioId: string; fittingId: string; noteId: string; user: { id: string; name: string }; origin: string; body: z.output<typeof fitNotePatchSchema> }
) {
	const fitting = await fittingOr404(db, input.studioId, input.fittingId);
	const before = await noteOr404(db, fitting.id, input.noteId);
	if (before.status === 'done' && input.body.status !== undefined) {
		throw new ApiError(409, 'note_done', `This note is done (resolved by version ${before.resolvedVersionNumber}); it cannot be reopened here.`);
	}
	if (input.body.assignedTo !== undefined) await assigneeCheck(db, input.studioId, input.body.assignedTo);
	await fitNotesUpdate(db, before.id, input.body);
	const after = await noteOr404(db, fitting.id, before.id);
	if (after.assignedTo && after.assignedTo !== before.assignedTo) {
		await noteAssignedNotify(db, input.studioId, fitting.styleId, after, input.user, input.origin);
	}
	return fitNoteJson(after);
}

/** Marks the note done, resolved by a later version of its piece. */
export async function fitNoteDone(db: Db, input: { studioId: string; fittingId: string; noteId: string; versionId: string }) {
	const fitting = await fittingOr404(db, input.studioId, input.fittingId);
	const note = await noteOr404(db, fitting.id, input.noteId);
	const v = await versionsById(db, note.pieceId, input.versionId);
	if (!v) throw new ApiError(404, 'not_found', `No such version of ${note.pieceName}.`);
	if (v.number <= note.versionNumber) {
		throw new ApiError(
			409,
			'not_a_later_version',
			`The note was pinned on version ${note.versionNumber} of ${note.pieceName}; it is resolved by a later version, not version ${v.number}.`
		);
	}
	await fitNotesUpdate(db, note.id, { status: 'done', resolvedVersionId: v.id });
	return fitNoteJson(await noteOr404(db, fitting.id, note.id));
}

/** Tells the assignee by e-mail (unless they turned it off), linking to the note on the fitting's page. */
async function noteAssignedNotify(db: Db, studioId: string, styleId: string, n: FitNoteRow, by: { id: string; name: string }, origin: string) {
	if (!n.assignedTo) return;
	const style = await stylesInStudio(db, studioId, styleId);
	const link = `${origin}/studios/${studioId}/fittings/${n.fittingId}#note-${n.id}`;
	await notify(db, 'fit_note_assigned', [n.assignedTo], by.id, (to) =>
		fitNoteAssignedMail(to.email, {
			styleName: style?.name ?? 'the style',
			pieceName: n.pieceName,
			fittingTitle: n.fittingTitle,
			category: FIT_NOTE_CATEGORY_LABELS[n.category],
			body: n.body,
			byName: by.name,
			link
		})
	);
}
