import { dxfImport } from '$lib/export/import-dxf';
import { importedPieces, ImportRefusal } from '$lib/export/import-model';
import { svgImport } from '$lib/export/import-svg';
import { outlineArea, pathLength } from '$lib/pattern/kernel';
import type { Piece } from '$lib/pattern/piece-schema';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { piecesDelete } from '../repositories/pieces';
import { pieceCreateWithFirstVersion } from '../versions/piece-create';
import { saveRefusal } from '../versions/save-response';
import { styleOr404 } from '../versions/access';

/** The largest file an import takes. */
export const IMPORT_FILE_LIMIT_BYTES = 10 * 1024 * 1024;
/** Room for the multipart wrapping round the file. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

/** Reads a multipart body up to the limit (413 past it) and returns its one file. */
export async function importFileRead(request: Request): Promise<{ name: string; bytes: Uint8Array }> {
	const type = request.headers.get('content-type') ?? '';
	if (!/^multipart\/form-data\b/i.test(type)) throw new ApiError(415, 'unsupported_media_type', 'Send the file as multipart/form-data, in a field named "file".');
	const limit = IMPORT_FILE_LIMIT_BYTES + MULTIPART_OVERHEAD_BYTES;
	const tooLarge = () => new ApiError(413, 'file_too_large', `The file is larger than ${IMPORT_FILE_LIMIT_BYTES / 1024 / 1024} MB; nothing was imported.`);
	if (Number(request.headers.get('content-length') ?? 0) > limit) throw tooLarge();
	let form: FormData;
	try {
		const chunks: Uint8Array[] = [];
		let size = 0;
		const reader = request.body?.getReader();
		for (;;) {
			const r = await reader?.read();
			if (!r || r.done) break;
			size += r.value.byteLength;
			if (size > limit) throw tooLarge();
			chunks.push(r.value);
		}
		form = await new Response(Buffer.concat(chunks), { headers: { 'content-type': type } }).formData();
	} catch (e) {
		if (e instanceof ApiError || (e as { status?: number })?.status === 413) throw e instanceof ApiError ? e : tooLarge();
		throw new ApiError(400, 'bad_request', 'The upload could not be read as multipart form data.');
	}
	const files = [...form.values()].filter((v): v is File => typeof v !== 'string');
	if (files.length !== 1) throw new ApiError(400, 'no_file', 'Send exactly one file (a .dxf or an .svg), in a field named "file".');
	const file = files[0];
	if (file.size > IMPORT_FILE_LIMIT_BYTES) throw tooLarge();
	return { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) };
}

/** DXF or SVG, from the first bytes (the name's extension only breaks a tie). */
export function importKind(name: string, bytes: Uint8Array): 'dxf' | 'svg' {
	const head = new TextDecoder('utf-8', { fatal: false }).decode(bytes.subarray(0, 4096)).replace(/^\uFEFF/, '');
	if (head.startsWith('AutoCAD Binary DXF')) throw new ApiError(415, 'unsupported_media_type', 'This is a binary DXF; save it as an ASCII DXF and import that.');
	if (/^\s*(999\s*\r?\n[^\n]*\r?\n\s*)*0\s*\r?\n\s*SECTION\b/.test(head)) return 'dxf';
	if (/^\s*(<\?xml[^>]*>\s*)?(<!--[\s\S]*?-->\s*|<!DOCTYPE[^>]*(\[[\s\S]*?\])?\s*>\s*)*<(svg:)?svg[\s>]/i.test(head)) return 'svg';
	throw new ApiError(415, 'unsupported_media_type', `"${name}" is neither a DXF nor an SVG file (judged by its content); nothing was imported.`);
}

export interface ImportPreviewPiece {
	name: string;
	cut: Piece['cut'];
	fabric: string;
	areaNetMm2: number;
	areaCutMm2: number;
	perimeterMm: number;
	notches: number;
	grainline: boolean;
	internalLines: number;
	geometry: Piece;
}

/** Reads a file into pieces, or answers 415/422 saying what and where. Nothing is stored. */
export function importParse(name: string, bytes: Uint8Array): { kind: 'dxf' | 'svg'; pieces: Piece[] } {
	const kind = importKind(name, bytes);
	const text = new TextDecoder('utf-8').decode(bytes);
	try {
		return { kind, pieces: importedPieces(kind === 'dxf' ? dxfImport(text) : svgImport(text)) };
	} catch (e) {
		if (e instanceof ImportRefusal) throw new ApiError(e.status, e.code, e.message, e.where ? { where: [e.where] } : undefined);
		throw e;
	}
}

export function importPreview(pieces: readonly Piece[]): ImportPreviewPiece[] {
	return pieces.map((p) => ({
		name: p.name,
		cut: p.cut,
		fabric: p.fabric,
		areaNetMm2: outlineArea(p.outline),
		areaCutMm2: outlineArea(p.seamAllowance?.cutLine ?? p.outline),
		perimeterMm: pathLength(p.outline),
		notches: p.notches.length,
		grainline: p.grainline !== null,
		internalLines: p.internalLines.length,
		geometry: p
	}));
}

/** Stores every piece (version 1, origin import), or none: a refused one removes those made before it. */
export async function importSave(db: Db, input: { studioId: string; styleId: string; authorId: string; fileName: string; kind: 'dxf' | 'svg'; pieces: readonly Piece[] }) {
	await styleOr404(db, input.studioId, input.styleId);
	const made: { id: string; name: string; versionId: string }[] = [];
	for (const [index, geometry] of input.pieces.entries()) {
		const r = await pieceCreateWithFirstVersion(db, {
			studioId: input.studioId,
			styleId: input.styleId,
			authorId: input.authorId,
			name: geometry.name,
			message: `Imported from ${input.fileName.slice(0, 120)}`,
			geometry,
			origin: { op: 'import', params: { fileName: input.fileName.slice(0, 200), format: input.kind, index } }
		});
		if (!r.ok) {
			for (const m of made) await piecesDelete(db, m.id);
			const refusal = saveRefusal(r);
			throw new ApiError(refusal.status, refusal.code, `Piece ${index + 1} (${geometry.name}): ${refusal.message} Nothing was imported.`, refusal.fields);
		}
		made.push({ id: r.piece.id, name: r.piece.name, versionId: r.version.id });
	}
	return made;
}
