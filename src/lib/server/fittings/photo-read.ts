import { ApiError } from '../http-errors';

/** The largest photo an upload takes. */
export const PHOTO_FILE_LIMIT_BYTES = 15 * 1024 * 1024;
/** Room for the multipart wrapping round the file. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

function tooLarge(): ApiError {
	return new ApiError(
		413,
		'file_too_large',
		`The photo is larger than ${PHOTO_FILE_LIMIT_BYTES / 1024 / 1024} MB; nothing was stored. Send a smaller export of it.`
	);
}

/**
 * Reads a multipart upload (one file in the field "file") without ever holding more than the limit:
 * a declared Content-Length over it is refused before reading a byte (Node's server then reads the rest
 * and drops it, so the client, still sending, receives the 413 rather than a broken connection), and
 * the bytes are counted while they stream in; past the limit the rest is read and dropped too.
 * adapter-node's BODY_SIZE_LIMIT (16M in `npm start`) bounds what that costs.
 */
export async function photoFileRead(request: Request): Promise<{ name: string; bytes: Uint8Array }> {
	const type = request.headers.get('content-type') ?? '';
	if (!/^multipart\/form-data\b/i.test(type)) {
		throw new ApiError(415, 'unsupported_media_type', 'Send the photo as multipart/form-data, in a field named "file".');
	}
	const limit = PHOTO_FILE_LIMIT_BYTES + MULTIPART_OVERHEAD_BYTES;
	const declared = request.headers.get('content-length');
	if (declared !== null && Number(declared) > limit) throw tooLarge();
	const chunks: Uint8Array[] = [];
	let size = 0;
	let over = false;
	try {
		const reader = request.body?.getReader();
		for (;;) {
			const r = await reader?.read();
			if (!r || r.done) break;
			size += r.value.byteLength;
			if (size > limit) {
				over = true;
				chunks.length = 0;
			}
			if (!over) chunks.push(r.value);
		}
	} catch (e) {
		if (over || (e as { status?: number })?.status === 413) throw tooLarge();
		throw new ApiError(400, 'bad_request', 'The upload could not be read.');
	}
	if (over) throw tooLarge();
	let form: FormData;
	try {
		form = await new Response(Buffer.concat(chunks), { headers: { 'content-type': type } }).formData();
	} catch {
		throw new ApiError(400, 'bad_request', 'The upload could not be read as multipart form data.');
	}
	const file = form.get('file');
	if (!file || typeof file === 'string') throw new ApiError(400, 'no_file', 'Send the photo in a field named "file".');
	if (file.size > PHOTO_FILE_LIMIT_BYTES) throw tooLarge();
	return { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) };
}
