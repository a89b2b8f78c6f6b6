// Fittings and their photos through the API, against the real PostgreSQL and the local S3 fake: upload,
// read back through the short-lived links, thumbnails, EXIF (GPS included) removed, objects removed
// with their photo or fitting, and every refusal of the issue (415, 413, 409, 422, SVG, other studio).
import { readFileSync } from 'node:fs';
import exifr from 'exifr';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { storageExists, storageSignedGetUrl } from '../../src/lib/server/storage';
import { toilePhotoJpeg } from '../../src/lib/server/seed/toile-photo';
import { startApp, type RunningApp } from './app-server';
import { fittingWorld, sessionHeaders, storageEnvUse, upload, type FittingWorld } from './fittings-support';
import { testDb, testDbClose } from './helpers';

let app: RunningApp;
let w: FittingWorld;
const GPS_PHOTO = readFileSync('fixtures/photos/toile-with-gps.jpg');

beforeAll(async () => {
	storageEnvUse();
	app = await startApp();
	w = await fittingWorld(app.baseUrl, 'Fittings');
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

async function fittingMake(title = 'First toile fitting') {
	const r = await w.as.sampleroom.api('POST', `/api/studios/${w.studioId}/styles/${w.styleId}/fittings`, {
		fittedOn: '2026-12-02',
		title,
		fitModel: 'Fit model A (size 10)',
		versionIds: [w.v1],
		fabric: 'calico, medium weight',
		remarks: 'Bones in, laced to 2 cm gap.'
	});
	expect(r.status).toBe(201);
	return (await r.json()).fitting as { id: string; photos: unknown[]; notes: unknown[]; versions: { versionId: string }[] };
}

const photosPath = (fittingId: string) => `/api/studios/${w.studioId}/fittings/${fittingId}/photos`;

async function keysOf(photoId: string) {
	return testDb().selectFrom('fitting_photos').select(['display_key', 'thumb_key']).where('id', '=', photoId).executeTakeFirstOrThrow();
}

describe('a fitting with photos', () => {
	it('records a fitting (201) and reads it back with its versions, no photos and no notes yet', async () => {
		const f = await fittingMake();
		expect(f.versions.map((v) => v.versionId)).toEqual([w.v1]);
		const r = await w.as.designer.api('GET', `/api/studios/${w.studioId}/fittings/${f.id}`);
		expect(r.status).toBe(200);
		const body = await r.json();
		expect(body.fitting).toMatchObject({ id: f.id, title: 'First toile fitting', fittedOn: '2026-12-02', fitModel: 'Fit model A (size 10)', photos: [], notes: [] });
	});

	it('refuses a fitting that says nobody was fitted, or a version of another style', async () => {
		const base = `/api/studios/${w.studioId}/styles/${w.styleId}/fittings`;
		const nobody = await w.as.sampleroom.api('POST', base, { fittedOn: '2026-12-02', title: 'x' });
		expect(nobody.status).toBe(400);
		expect((await nobody.json()).error.fields.fitModel[0]).toMatch(/who was fitted/);
		const wrong = await w.as.sampleroom.api('POST', base, { fittedOn: '2026-12-02', title: 'x', fitModel: 'A', versionIds: [crypto.randomUUID()] });
		expect(wrong.status).toBe(400);
	});

	it('stores an upload re-encoded: orientation applied, EXIF and GPS gone (read with exifr), a display size and a thumbnail', async () => {
		const f = await fittingMake();
		// the fixture is stored lying on its side (800 × 600) with EXIF orientation 6 and GPS tags
		expect((await exifr.parse(GPS_PHOTO, { gps: true })).latitude).toBeCloseTo(51.5, 6);
		const r = await upload(w.as.sampleroom, photosPath(f.id), GPS_PHOTO, 'IMG_0042.jpg', 'image/jpeg');
		expect(r.status).toBe(201);
		const { photo } = await r.json();
		expect([photo.width, photo.height]).toEqual([600, 800]);
		expect([photo.thumbWidth, photo.thumbHeight]).toEqual([240, 320]);
		const display = new Uint8Array(await (await fetch(photo.url)).arrayBuffer());
		const thumb = new Uint8Array(await (await fetch(photo.thumbUrl)).arrayBuffer());
		for (const [bytes, size] of [[display, [600, 800]], [thumb, [240, 320]]] as const) {
			const meta = await sharp(bytes).metadata();
			expect([meta.format, meta.width, meta.height]).toEqual(['jpeg', ...size]);
			expect(meta.exif).toBeUndefined();
			expect(await exifr.parse(bytes, { gps: true }).catch(() => undefined)).toBeUndefined();
		}
		// object keys are random, never the file's name
		const keys = await keysOf(photo.id);
		for (const k of [keys.display_key, keys.thumb_key]) expect(k).toMatch(/^photos\/[0-9a-f]{32}$/);
		// the fitting lists it with fresh links
		const detail = (await (await w.as.designer.api('GET', `/api/studios/${w.studioId}/fittings/${f.id}`)).json()).fitting;
		expect(detail.photos.map((p: { id: string }) => p.id)).toEqual([photo.id]);
	});

	it('gives links that expire: 15 minutes, and an expired one is refused by the store', async () => {
		const f = await fittingMake();
		const { photo } = await (await upload(w.as.sampleroom, photosPath(f.id), await toilePhotoJpeg('back', 300, 400), 'back.jpg')).json();
		expect(new URL(photo.url).searchParams.get('X-Amz-Expires')).toBe('900');
		const keys = await keysOf(photo.id);
		const old = await storageSignedGetUrl(keys.display_key, 60, new Date(Date.now() - 3600_000));
		expect((await fetch(old)).status).toBe(403);
		expect((await fetch(photo.url)).status).toBe(200);
	});

	it('removes a photo\'s objects with the photo, and every object of a fitting with the fitting', async () => {
		const f = await fittingMake();
		const a = (await (await upload(w.as.sampleroom, photosPath(f.id), await toilePhotoJpeg('front', 300, 400), 'a.jpg')).json()).photo;
		const b = (await (await upload(w.as.sampleroom, photosPath(f.id), await toilePhotoJpeg('three-quarter', 300, 400), 'b.jpg')).json()).photo;
		const [ka, kb] = [await keysOf(a.id), await keysOf(b.id)];
		expect(await storageExists(ka.display_key)).toBe(true);
		expect((await w.as.sampleroom.api('DELETE', `${photosPath(f.id)}/${a.id}`)).status).toBe(204);
		expect(await storageExists(ka.display_key)).toBe(false);
		expect(await storageExists(ka.thumb_key)).toBe(false);
		expect(await storageExists(kb.display_key)).toBe(true);
		expect((await w.as.sampleroom.api('DELETE', `${photosPath(f.id)}/${a.id}`)).status).toBe(404);
		expect((await w.as.sampleroom.api('DELETE', `/api/studios/${w.studioId}/fittings/${f.id}`)).status).toBe(204);
		expect(await storageExists(kb.display_key)).toBe(false);
		expect(await storageExists(kb.thumb_key)).toBe(false);
		expect((await w.as.designer.api('GET', `/api/studios/${w.studioId}/fittings/${f.id}`)).status).toBe(404);
	});
});

describe('refusals', () => {
	let fittingId: string;
	beforeAll(async () => {
		fittingId = (await fittingMake('Refusals')).id;
	});

	it('answers 415 for a file that is not an image, whatever its name or declared type', async () => {
		const r = await upload(w.as.sampleroom, photosPath(fittingId), new TextEncoder().encode('just some notes from the fitting'), 'photo.jpg', 'image/jpeg');
		expect(r.status).toBe(415);
		expect((await r.json()).error.message).toMatch(/photo\.jpg.*JPEG, PNG or WebP/);
		const pdf = await upload(w.as.sampleroom, photosPath(fittingId), new TextEncoder().encode('%PDF-1.4\n%âãÏÓ\n1 0 obj\n<<>>\nendobj\n'), 'scan.png', 'image/png');
		expect(pdf.status).toBe(415);
	});

	it('does not take SVG as a photo (415, saying so)', async () => {
		const svg = new TextEncoder().encode('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>');
		const r = await upload(w.as.sampleroom, photosPath(fittingId), svg, 'toile.jpg', 'image/jpeg');
		expect(r.status).toBe(415);
		expect((await r.json()).error.message).toMatch(/SVG/);
	});

	it('answers 415 for a body that is not multipart', async () => {
		const r = await w.as.sampleroom.api('POST', photosPath(fittingId), { file: 'x' });
		expect(r.status).toBe(415);
	});

	it('answers 413 past 15 MB, by its Content-Length and, streamed without one, by counting', async () => {
		const big = new Uint8Array(15.5 * 1024 * 1024);
		big.set([0xff, 0xd8, 0xff, 0xe0]);
		const declared = await upload(w.as.sampleroom, photosPath(fittingId), big, 'huge.jpg', 'image/jpeg');
		expect(declared.status).toBe(413);
		expect((await declared.json()).error.message).toMatch(/15 MB/);
		// chunked: no Content-Length, 1 MB at a time
		const boundary = 'fittingboundary42';
		const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
		let sent = 0;
		const body = new ReadableStream<Uint8Array>({
			pull(controller) {
				if (sent === 0) controller.enqueue(head);
				if (sent >= 15.5 * 1024 * 1024) return controller.close();
				controller.enqueue(new Uint8Array(1024 * 1024));
				sent += 1024 * 1024;
			}
		});
		const streamed = await fetch(app.baseUrl + photosPath(fittingId), {
			method: 'POST',
			headers: { ...sessionHeaders(w.as.sampleroom), 'content-type': `multipart/form-data; boundary=${boundary}` },
			body,
			duplex: 'half'
		} as RequestInit);
		expect(streamed.status).toBe(413);
	});

	it('answers 422 for an image of more than 50 megapixels', async () => {
		const png = await sharp({ create: { width: 8000, height: 6500, channels: 3, background: '#f3ead6' } }).png({ compressionLevel: 9 }).toBuffer();
		const r = await upload(w.as.sampleroom, photosPath(fittingId), png, 'panorama.png', 'image/png');
		expect(r.status).toBe(422);
		expect((await r.json()).error.message).toMatch(/8000 × 6500 px \(52\.0 megapixels\)/);
	});

	it('answers 409 for the 31st photo, with a clear message', async () => {
		const f = await fittingMake('Thirty photos');
		const rows = Array.from({ length: 30 }, (_, i) => ({
			fitting_id: f.id,
			display_key: `photos/test-${f.id}-${i}-d`,
			thumb_key: `photos/test-${f.id}-${i}-t`,
			content_type: 'image/jpeg',
			width: 1,
			height: 1,
			thumb_width: 1,
			thumb_height: 1,
			bytes: 1
		}));
		await testDb().insertInto('fitting_photos').values(rows).execute();
		const r = await upload(w.as.sampleroom, photosPath(f.id), await toilePhotoJpeg('front', 150, 200), 'one-more.jpg');
		expect(r.status).toBe(409);
		expect((await r.json()).error.message).toMatch(/already has 30 photos.*Delete one/);
		await testDb().deleteFrom('fitting_photos').where('fitting_id', '=', f.id).execute();
	});

	it("answers 404 for another studio's fitting or photo, asked through one's own studio", async () => {
		const f = await fittingMake('Not yours');
		const { photo } = await (await upload(w.as.sampleroom, photosPath(f.id), await toilePhotoJpeg('front', 150, 200), 'a.jpg')).json();
		const mine = `/api/studios/${w.otherStudioId}/fittings/${f.id}`;
		expect((await w.as.outsider.api('GET', mine)).status).toBe(404);
		expect((await w.as.outsider.api('DELETE', `${mine}/photos/${photo.id}`)).status).toBe(404);
		expect((await upload(w.as.outsider, `${mine}/photos`, await toilePhotoJpeg('front', 150, 200), 'b.jpg')).status).toBe(404);
		expect((await w.as.outsider.api('GET', `/api/studios/${w.studioId}/fittings/${f.id}`)).status).toBe(404);
	});
});
