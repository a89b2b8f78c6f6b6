import type { FitNoteRow } from '../repositories/fit-notes';
import type { FittingRow } from '../repositories/fittings';
import type { PhotoRow } from '../repositories/fitting-photos';
import { STORAGE_LINK_SECONDS, storageSignedGetUrl } from '../storage';

/** A photo as the API answers it: sizes and short-lived links, never the object keys. */
export async function photoJson(p: PhotoRow, now = new Date()) {
	const [url, thumbUrl] = await Promise.all([storageSignedGetUrl(p.displayKey, STORAGE_LINK_SECONDS, now), storageSignedGetUrl(p.thumbKey, STORAGE_LINK_SECONDS, now)]);
	return {
		id: p.id,
		fittingId: p.fittingId,
		width: p.width,
		height: p.height,
		thumbWidth: p.thumbWidth,
		thumbHeight: p.thumbHeight,
		bytes: p.bytes,
		contentType: p.contentType,
		caption: p.caption,
		createdAt: p.createdAt.toISOString(),
		url,
		thumbUrl,
		linksExpireAt: new Date(now.getTime() + STORAGE_LINK_SECONDS * 1000).toISOString()
	};
}
export type PhotoJson = Awaited<ReturnType<typeof photoJson>>;

export function fitNoteJson(n: FitNoteRow) {
	return {
		id: n.id,
		fittingId: n.fittingId,
		fittingTitle: n.fittingTitle,
		pieceId: n.pieceId,
		pieceName: n.pieceName,
		versionId: n.versionId,
		versionNumber: n.versionNumber,
		xMm: n.xMm,
		yMm: n.yMm,
		category: n.category,
		amountMm: n.amountMm,
		unit: n.unit,
		body: n.body,
		status: n.status,
		resolvedVersionId: n.resolvedVersionId,
		resolvedVersionNumber: n.resolvedVersionNumber,
		assignedTo: n.assignedTo,
		assignedToName: n.assignedToName,
		createdBy: n.createdBy,
		createdByName: n.createdByName,
		createdAt: n.createdAt.toISOString(),
		updatedAt: n.updatedAt.toISOString()
	};
}
export type FitNoteJson = ReturnType<typeof fitNoteJson>;

export function fittingJson(f: FittingRow) {
	return {
		id: f.id,
		styleId: f.styleId,
		fittedOn: f.fittedOn,
		title: f.title,
		measurementSetId: f.measurementSetId,
		fitModel: f.fitModel,
		fabric: f.fabric,
		remarks: f.notes,
		createdBy: f.createdBy,
		createdByName: f.createdByName,
		createdAt: f.createdAt.toISOString()
	};
}
