import { fileTypeFromBuffer } from 'file-type';
import sharp, { type Metadata } from 'sharp';
import { ApiError } from '../http-errors';

/** Photos are taken as JPEG, PNG or WebP (judged from the bytes, never the name or the header). */
const ACCEPTED = new Map([
	['image/jpeg', 'JPEG'],
	['image/png', 'PNG'],
	['image/webp', 'WebP']
]);
/** An image that decodes to more pixels than this is refused (422). */
export const PHOTO_MAX_PIXELS = 50_000_000;
/** The longer side of the display size and of the thumbnail (px). */
export const PHOTO_DISPLAY_PX = 2048;
export const PHOTO_THUMB_PX = 320;

export interface ProcessedImage {
	bytes: Uint8Array;
	width: number;
	height: number;
	contentType: 'image/jpeg';
}

export interface ProcessedPhoto {
	display: ProcessedImage;
	thumb: ProcessedImage;
}

function looksLikeSvg(bytes: Uint8Array): boolean {
	const head = new TextDecoder('utf-8', { fatal: false }).decode(bytes.subarray(0, 1024)).replace(/^\uFEFF/, '');
	return /^\s*(<\?xml[^>]*>\s*)?(<!--[\s\S]*?-->\s*|<!DOCTYPE[^>]*>\s*)*<svg[\s>]/i.test(head);
}

/**
 * Checks what the bytes are, then re-encodes them with sharp: the EXIF orientation applied to the pixels
 * (`rotate()`), every piece of metadata dropped (EXIF, GPS, XMP, ICC: sharp writes none unless asked),
 * a display size and a thumbnail, both JPEG on white. Refusals: 415 not a JPEG/PNG/WebP (SVG named as
 * such), 422 over 50 megapixels or not decodable.
 */
export async function photoProcess(name: string, bytes: Uint8Array): Promise<ProcessedPhoto> {
	const type = await fileTypeFromBuffer(bytes);
	if (!type || !ACCEPTED.has(type.mime)) {
		if (looksLikeSvg(bytes) || type?.mime === 'image/svg+xml') {
			throw new ApiError(415, 'unsupported_media_type', `"${name}" is an SVG drawing; photos are taken as JPEG, PNG or WebP only.`);
		}
		const what = type ? `a ${type.mime} file` : 'not an image we can read';
		throw new ApiError(415, 'unsupported_media_type', `"${name}" is ${what} (judged by its content); send a JPEG, PNG or WebP photo.`);
	}
	let meta: Metadata;
	try {
		meta = await sharp(bytes, { limitInputPixels: false }).metadata();
	} catch {
		throw new ApiError(422, 'unreadable_image', `"${name}" looks like a ${ACCEPTED.get(type.mime)} but could not be decoded.`);
	}
	const pixels = (meta.width ?? 0) * (meta.height ?? 0);
	if (pixels > PHOTO_MAX_PIXELS) {
		throw new ApiError(
			422,
			'image_too_large',
			`"${name}" is ${meta.width} × ${meta.height} px (${(pixels / 1e6).toFixed(1)} megapixels); photos may have at most ${PHOTO_MAX_PIXELS / 1e6} megapixels.`
		);
	}
	try {
		const [display, thumb] = await Promise.all([encode(bytes, PHOTO_DISPLAY_PX, 84), encode(bytes, PHOTO_THUMB_PX, 78)]);
		return { display, thumb };
	} catch {
		throw new ApiError(422, 'unreadable_image', `"${name}" could not be decoded as a ${ACCEPTED.get(type.mime)} image.`);
	}
}

async function encode(bytes: Uint8Array, longSidePx: number, quality: number): Promise<ProcessedImage> {
	const { data, info } = await sharp(bytes, { limitInputPixels: PHOTO_MAX_PIXELS, failOn: 'error' })
		.rotate()
		.resize({ width: longSidePx, height: longSidePx, fit: 'inside', withoutEnlargement: true })
		.flatten({ background: '#ffffff' })
		.jpeg({ quality })
		.toBuffer({ resolveWithObject: true });
	return { bytes: new Uint8Array(data), width: info.width, height: info.height, contentType: 'image/jpeg' };
}
