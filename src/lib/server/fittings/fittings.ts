import type { z } from 'zod';
import type { Db, DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { fitNotesOfFitting } from '../repositories/fit-notes';
import { photosCount, photosDelete, photosInsert, photosKeysOfFitting, photosOfFitting } from '../repositories/fitting-photos';
import { fittingsCreate, fittingsDelete, fittingsInStudio, fittingsLock, fittingVersions, type FittingRow } from '../repositories/fittings';
import { measurementSetsInStudio } from '../repositories/measurement-sets';
import { seesOnlySignedOff, styleOr404 } from '../versions/access';
import { storageDelete, storageKeyNew, storagePut } from '../storage';
import { photoProcess } from './photo-process';
import type { fittingCreateSchema } from './schemas';
import { fitNoteJson, fittingJson, photoJson } from './view';

/** Photos one fitting may hold. */
export const FITTING_MAX_PHOTOS = 30;

export async function fittingOr404(db: DbOrTx, studioId: string, fittingId: string): Promise<FittingRow> {
	const f = await fittingsInStudio(db, studioId, fittingId);
	if (!f) throw new ApiError(404, 'not_found', 'No such fitting in this studio.');
	return f;
}

/** Records a fitting of a style: the piece versions must be the style's (and, for the sample room, signed off). */
export async function fittingCreate(
	db: Db,
	input: { studioId: string; styleId: string; userId: string; role: Role; body: z.output<typeof fittingCreateSchema> }
) {
	await styleOr404(db, input.studioId, input.styleId);
	const { body } = input;
	if (body.measurementSetId && !(await measurementSetsInStudio(db, input.studioId, body.measurementSetId))) {
		throw new ApiError(400, 'invalid', 'Some fields are not valid.', { measurementSetId: ['No such measurement set in this studio.'] });
	}
	const versionIds = [...new Set(body.versionIds)];
	if (versionIds.length > 0) {
		const found = await db
			.selectFrom('piece_versions')
			.innerJoin('pieces', 'pieces.id', 'piece_versions.piece_id')
			.select(['piece_versions.id', 'piece_versions.state'])
			.where('pieces.style_id', '=', input.styleId)
			.where('piece_versions.id', 'in', versionIds)
			.execute();
		const visible = found.filter((v) => !seesOnlySignedOff(input.role) || v.state === 'signed_off');
		if (visible.length !== versionIds.length) {
			throw new ApiError(400, 'invalid', 'Some fields are not valid.', { versionIds: ['Every version must be a version of a piece of this style that you can see.'] });
		}
	}
	const made = await db.transaction().execute((tx) =>
		fittingsCreate(
			tx,
			{
				styleId: input.styleId,
				fittedOn: body.fittedOn,
				title: body.title,
				measurementSetId: body.measurementSetId,
				fitModel: body.fitModel,
				fabric: body.fabric,
				notes: body.remarks,
				createdBy: input.userId
			},
			versionIds
		)
	);
	return fittingDetail(db, input.studioId, made.id);
}

/** The fitting with the versions its toile was cut from, its photos (with fresh links) and its fit notes. */
export async function fittingDetail(db: DbOrTx, studioId: string, fittingId: string) {
	const f = await fittingOr404(db, studioId, fittingId);
	const [versions, photos, notes] = await Promise.all([fittingVersions(db, f.id), photosOfFitting(db, f.id), fitNotesOfFitting(db, f.id)]);
	const now = new Date();
	return {
		...fittingJson(f),
		versions,
		photos: await Promise.all(photos.map((p) => photoJson(p, now))),
		notes: notes.map(fitNoteJson)
	};
}

/** Deletes the fitting, its photos' objects in the store, its notes. */
export async function fittingDelete(db: Db, studioId: string, fittingId: string): Promise<void> {
	const f = await fittingOr404(db, studioId, fittingId);
	const keys = await db.transaction().execute(async (tx) => {
		await fittingsLock(tx, f.id);
		const k = await photosKeysOfFitting(tx, f.id);
		await fittingsDelete(tx, f.id);
		return k;
	});
	await storageDelete(keys);
}

function tooMany(): ApiError {
	return new ApiError(409, 'too_many_photos', `This fitting already has ${FITTING_MAX_PHOTOS} photos, the most one fitting holds. Delete one before adding another.`);
}

/** Checks, re-encodes and stores one photo of a fitting (see photoProcess for what is refused). */
export async function photoUpload(db: Db, input: { studioId: string; fittingId: string; userId: string; name: string; bytes: Uint8Array }) {
	const f = await fittingOr404(db, input.studioId, input.fittingId);
	if ((await photosCount(db, f.id)) >= FITTING_MAX_PHOTOS) throw tooMany();
	const { display, thumb } = await photoProcess(input.name, input.bytes);
	const displayKey = storageKeyNew('photos');
	const thumbKey = storageKeyNew('photos');
	await storagePut(displayKey, display.bytes, display.contentType);
	await storagePut(thumbKey, thumb.bytes, thumb.contentType);
	try {
		const row = await db.transaction().execute(async (tx) => {
			if (!(await fittingsLock(tx, f.id))) throw new ApiError(404, 'not_found', 'No such fitting in this studio.');
			if ((await photosCount(tx, f.id)) >= FITTING_MAX_PHOTOS) throw tooMany();
			return photosInsert(tx, {
				fittingId: f.id,
				displayKey,
				thumbKey,
				contentType: display.contentType,
				width: display.width,
				height: display.height,
				thumbWidth: thumb.width,
				thumbHeight: thumb.height,
				bytes: display.bytes.byteLength,
				caption: '',
				createdBy: input.userId
			});
		});
		return photoJson(row);
	} catch (e) {
		await storageDelete([displayKey, thumbKey]).catch(() => undefined);
		throw e;
	}
}

export async function photoDelete(db: Db, studioId: string, fittingId: string, photoId: string): Promise<void> {
	const f = await fittingOr404(db, studioId, fittingId);
	const keys = await photosDelete(db, f.id, photoId);
	if (!keys) throw new ApiError(404, 'not_found', 'No such photo of this fitting.');
	await storageDelete(keys);
}
