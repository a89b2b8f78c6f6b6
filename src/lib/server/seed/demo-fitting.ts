import { pathBoundingBox } from '$lib/geometry';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import type { Db } from '../db';
import { fittingsOfStyle } from '../repositories/fittings';
import { fitNotesInsert, fitNotesUpdate } from '../repositories/fit-notes';
import { photosKeysOfFitting } from '../repositories/fitting-photos';
import { piecesOfStyle } from '../repositories/pieces';
import { versionsById, versionsOfPiece } from '../repositories/versions';
import { fittingCreate, fittingDelete, photoUpload } from '../fittings/fittings';
import { storageExists } from '../storage';
import { toilePhotoJpeg, type ToileView } from './toile-photo';

/** The demo style's fitting, of our own scenario: a fit model's form, a calico toile, photos we drew. */
export const DEMO_FITTING = {
	title: 'First toile fitting',
	fittedOn: '2026-11-27',
	fitModel: 'Fit model A (dress form, misses size 10)',
	fabric: 'calico, medium weight, boned with 7 mm plastic',
	remarks: 'Laced to a 2 cm gap at centre back. Bodice sits well at the neckline; the band is snug at the waist.',
	photos: ['front', 'three-quarter', 'back'] as ToileView[]
};

/** A point of the piece 15 mm in from its outline on the side away from centre front (largest x). */
function sidePoint(piece: Piece): { x: number; y: number } {
	const box = pathBoundingBox(piece.outline);
	const ends = piece.outline.segments.map((s) => s.p0);
	const side = ends.reduce((a, b) => (b.x > a.x ? b : a));
	const cx = (box.minX + box.maxX) / 2;
	const cy = (box.minY + box.maxY) / 2;
	const d = Math.hypot(cx - side.x, cy - side.y) || 1;
	return { x: side.x + ((cx - side.x) * 15) / d, y: side.y + ((cy - side.y) * 15) / d };
}

/**
 * Is the demo fitting there whole: every photo's display size and thumbnail in the object store? The
 * database and the store are kept apart (the store's folder can be emptied while the database stays).
 */
async function demoFittingWhole(db: Db, fittingId: string): Promise<boolean> {
	const keys = await photosKeysOfFitting(db, fittingId);
	if (keys.length !== DEMO_FITTING.photos.length * 2) return false;
	for (const key of keys) if (!(await storageExists(key))) return false;
	return true;
}

/**
 * Seeds one fitting of the demo style (idempotent: skipped when the style has it whole; made again when
 * its photos are missing from the object store, so a store emptied under a kept database heals): the toile cut from
 * the signed-off midriff band and the upper front before its pleats, three photos of our own drawing,
 * and two fit notes: the band too tight at the side (in hand, for the pattern cutter), and the bust dart
 * standing away at the apex, done: resolved by the version that folded it into pleats.
 */
export async function demoFittingSeed(db: Db, studioId: string, styleId: string, users: { sampleroom: string; patterncutter: string }): Promise<boolean> {
	const existing = (await fittingsOfStyle(db, styleId)).find((f) => f.title === DEMO_FITTING.title);
	if (existing) {
		if (await demoFittingWhole(db, existing.id)) return false;
		await fittingDelete(db, studioId, existing.id);
	}
	const pieces = await piecesOfStyle(db, styleId);
	const band = pieces.find((p) => p.name === 'Midriff band');
	const upper = pieces.find((p) => p.name === 'Upper front');
	if (!band || !upper) throw new Error('Demo fitting: the demo style has no midriff band or upper front.');
	const bandSigned = (await versionsOfPiece(db, band.id, true))[0];
	const upperVersions = (await versionsOfPiece(db, upper.id)).sort((a, b) => a.number - b.number);
	const [upperCut, upperPleats] = [upperVersions[1], upperVersions[2]];
	if (!bandSigned || !upperCut || !upperPleats) throw new Error('Demo fitting: the demo style lacks the versions the toile was cut from.');
	const fitting = await fittingCreate(db, {
		studioId,
		styleId,
		userId: users.sampleroom,
		role: 'owner',
		body: {
			fittedOn: DEMO_FITTING.fittedOn,
			title: DEMO_FITTING.title,
			measurementSetId: null,
			fitModel: DEMO_FITTING.fitModel,
			versionIds: [bandSigned.id, upperCut.id],
			fabric: DEMO_FITTING.fabric,
			remarks: DEMO_FITTING.remarks
		}
	});
	try {
		for (const view of DEMO_FITTING.photos) {
			const bytes = await toilePhotoJpeg(view, 900, 1200);
			await photoUpload(db, { studioId, fittingId: fitting.id, userId: users.sampleroom, name: `toile-${view}.jpg`, bytes });
		}
		const bandGeometry = pieceSchema.parse((await versionsById(db, band.id, bandSigned.id))!.geometry);
		const at = sidePoint(bandGeometry);
		const tight = await fitNotesInsert(db, {
			fittingId: fitting.id,
			pieceId: band.id,
			versionId: bandSigned.id,
			xMm: Math.round(at.x * 10) / 10,
			yMm: Math.round(at.y * 10) / 10,
			category: 'too_tight',
			amountMm: 6,
			body: 'Let out 6 mm at the side seam, waist level: the band pulls across the side panel.',
			assignedTo: users.patterncutter,
			createdBy: users.sampleroom
		});
		await fitNotesUpdate(db, tight.id, { status: 'in_hand' });
		const upperGeometry = pieceSchema.parse((await versionsById(db, upper.id, upperCut.id))!.geometry);
		const apex = upperGeometry.apexes[0]?.point ?? sidePoint(upperGeometry);
		const dart = await fitNotesInsert(db, {
			fittingId: fitting.id,
			pieceId: upper.id,
			versionId: upperCut.id,
			xMm: Math.round(apex.x * 10) / 10,
			yMm: Math.round(apex.y * 10) / 10,
			category: 'too_loose',
			amountMm: null,
			body: 'The shoulder dart stands away at the bust point; spread its intake into pleats toward the shoulder.',
			assignedTo: users.patterncutter,
			createdBy: users.sampleroom
		});
		await fitNotesUpdate(db, dart.id, { status: 'done', resolvedVersionId: upperPleats.id });
	} catch (e) {
		await fittingDelete(db, studioId, fitting.id);
		throw e;
	}
	return true;
}
