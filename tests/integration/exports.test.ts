// The style exports (print PDF; cutting list; DXF) through the built app: who may fetch them, what the
// sample room gets (signed-off versions only), and another studio's style answering 404.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { pdfRead } from '../../src/lib/export/test-support/pdf-read';
import type { Role } from '../../src/lib/server/db/schema';
import { startApp, type RunningApp } from './app-server';
import { Client, memberAdd, sessionClient, studioMake, testDbClose, throttleAddressReset, userMake } from './helpers';

let app: RunningApp;
let studioId: string;
let styleId: string;
let signedPieceId: string;
const clients = {} as Record<Role | 'outsider' | 'anonymous', Client>;
const ROLES: Role[] = ['owner', 'patterncutter', 'designer', 'sampleroom'];

beforeAll(async () => {
	app = await startApp();
	await throttleAddressReset();
	studioId = (await studioMake('Exports')).id;
	for (const role of ROLES) {
		const u = await userMake(role);
		await memberAdd(studioId, u.id, role);
		clients[role] = await sessionClient(app.baseUrl, u.id);
	}
	const other = await studioMake('Elsewhere');
	const outsider = await userMake('outsider');
	await memberAdd(other.id, outsider.id, 'owner');
	clients.outsider = await sessionClient(app.baseUrl, outsider.id);
	clients.anonymous = new Client(app.baseUrl);
	const c = clients.patterncutter;
	const s = await c.api('POST', `/api/studios/${studioId}/styles`, { name: 'Juniper bodice', code: 'LR-101', season: 'AW27' });
	styleId = (await s.json()).style.id;
	const made = [];
	for (const name of ['Front', 'Back draft']) {
		const p = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, {
			name,
			geometry: frontBodiceBlock(),
			origin: { op: 'draft', params: { note: 'test block' } }
		});
		expect(p.status).toBe(201);
		made.push(await p.json());
	}
	signedPieceId = made[0].piece.id;
	const state = `/api/studios/${studioId}/pieces/${signedPieceId}/versions/${made[0].version.id}/state`;
	expect((await c.api('POST', state, { action: 'propose' })).status).toBe(200);
	const r = await clients.designer.api('POST', state, { action: 'sign_off' });
	expect(r.status).toBe(200);
}, 60_000);

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const pdfPath = (query = '') => `/api/studios/${studioId}/styles/${styleId}/export.pdf${query}`;

async function pdfText(r: Response): Promise<string> {
	const pages = await pdfRead(new Uint8Array(await r.arrayBuffer()));
	return pages.map((p) => p.text.join(' ')).join(' ');
}

describe('print PDF: GET …/styles/{styleId}/export.pdf', () => {
	it.each(ROLES)('is served to the %s as a PDF download', async (role) => {
		const r = await clients[role].get(pdfPath('?paper=a4'));
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toBe('application/pdf');
		expect(r.headers.get('content-disposition')).toBe('attachment; filename="lr-101-a4.pdf"');
		const text = await pdfText(r);
		expect(text).toContain('Front');
		// the sample room sees signed-off versions only
		if (role === 'sampleroom') expect(text).not.toContain('Back draft');
		else expect(text).toContain('Back draft');
	});

	it('answers 404 to a member of another studio and 401 to someone signed out', async () => {
		expect((await clients.outsider.get(pdfPath())).status).toBe(404);
		expect((await clients.anonymous.api('GET', pdfPath())).status).toBe(401);
	});

	it('prints only the pieces asked for, on the paper asked for', async () => {
		const r = await clients.owner.get(pdfPath(`?paper=a0&pieces=${signedPieceId}&allowance=hidden&pairs=once`));
		expect(r.status).toBe(200);
		const pages = await pdfRead(new Uint8Array(await r.arrayBuffer()));
		expect(pages[0].widthPt).toBeCloseTo((841 * 72) / 25.4, 1);
		const text = pages.map((p) => p.text.join(' ')).join(' ');
		expect(text).toContain('Front');
		expect(text).not.toContain('Back draft');
	});

	it('refuses an unknown paper or a piece of another style with 400 and says why', async () => {
		const bad = await clients.owner.api('GET', pdfPath('?paper=a5'));
		expect(bad.status).toBe(400);
		expect((await bad.json()).error.fields.paper[0]).toMatch(/Choose a paper/);
		const other = await clients.owner.api('GET', pdfPath('?pieces=00000000-0000-4000-8000-000000000000'));
		expect(other.status).toBe(400);
		expect((await other.json()).error.message).toMatch(/not in this style/);
	});

	it('has an options page for every role, with the caution beside the download button', async () => {
		for (const role of ROLES) {
			const r = await clients[role].get(`/studios/${studioId}/styles/${styleId}/print`);
			expect(r.status).toBe(200);
			const html = await r.text();
			expect(html).toContain('Download PDF');
			expect(html).toMatch(/Print at 100 %/);
			expect(html).toMatch(/toile first/);
		}
		expect((await clients.outsider.get(`/studios/${studioId}/styles/${styleId}/print`)).status).toBe(404);
	});
});

describe('cutting list: JSON, CSV and the printable page', () => {
	const listPath = () => `/api/studios/${studioId}/styles/${styleId}/cutting-list`;

	it.each(ROLES)('gives the %s the pieces it may see, with areas and totals per fabric', async (role) => {
		const r = await clients[role].api('GET', listPath());
		expect(r.status).toBe(200);
		const body = await r.json();
		const names = body.pieces.map((p: { name: string }) => p.name);
		expect(names).toEqual(role === 'sampleroom' ? ['Front'] : ['Front', 'Back draft']);
		for (const p of body.pieces) {
			expect(p.areaCutMm2).toBeGreaterThanOrEqual(p.areaNetMm2);
			expect(p.quantity).toBeGreaterThan(0);
		}
		const count = body.pieces.reduce((t: number, p: { quantity: number }) => t + p.quantity, 0);
		expect(body.fabrics.reduce((t: number, f: { pieceCount: number }) => t + f.pieceCount, 0)).toBe(count);
	});

	it('serves CSV with a header row and one row per piece', async () => {
		const r = await clients.sampleroom.get(`${listPath()}.csv`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toMatch(/^text\/csv/);
		const lines = (await r.text()).trim().split('\r\n');
		expect(lines[0]).toMatch(/^row,piece,fabric,cut,quantity,grain,area_net_cm2,area_cut_cm2,total_cut_cm2/);
		expect(lines.filter((l) => l.startsWith('piece,'))).toHaveLength(1);
	});

	it('has a printable page for every role; another studio gets 404 everywhere', async () => {
		for (const role of ROLES) {
			const r = await clients[role].get(`/studios/${studioId}/styles/${styleId}/cutting-list`);
			expect(r.status).toBe(200);
			expect(await r.text()).toContain('data-testid="cutting-list"');
		}
		expect((await clients.outsider.get(`/studios/${studioId}/styles/${styleId}/cutting-list`)).status).toBe(404);
		expect((await clients.outsider.api('GET', listPath())).status).toBe(404);
		expect((await clients.outsider.get(`${listPath()}.csv`)).status).toBe(404);
		expect((await clients.anonymous.api('GET', listPath())).status).toBe(401);
	});
});

describe('DXF: GET …/styles/{styleId}/export.dxf', () => {
	const dxfPath = () => `/api/studios/${studioId}/styles/${styleId}/export.dxf`;

	it.each(ROLES)('is served to the %s, with one block per piece it may see', async (role) => {
		const r = await clients[role].get(dxfPath());
		expect(r.status).toBe(200);
		expect(r.headers.get('content-disposition')).toBe('attachment; filename="lr-101.dxf"');
		const text = await r.text();
		expect(text).toContain('Piece Name: Front');
		if (role === 'sampleroom') expect(text).not.toContain('Piece Name: Back draft');
		else expect(text).toContain('Piece Name: Back draft');
	});

	it('answers 404 to another studio and 401 when signed out', async () => {
		expect((await clients.outsider.get(dxfPath())).status).toBe(404);
		expect((await clients.anonymous.api('GET', dxfPath())).status).toBe(401);
	});
});

describe('imports: POST …/styles/{styleId}/imports', () => {
	const importPath = (sid = styleId, preview = false) => `/api/studios/${studioId}/styles/${sid}/imports${preview ? '?preview=1' : ''}`;
	const upload = (client: Client, path: string, name: string, content: string | Uint8Array, type = 'application/octet-stream') => {
		const body = new FormData();
		body.append('file', new Blob([content as BlobPart], { type }), name);
		return client.request('POST', path, { body, headers: { accept: 'application/json' } });
	};
	async function newStyle(name: string) {
		const s = await clients.patterncutter.api('POST', `/api/studios/${studioId}/styles`, { name, code: '', season: '' });
		return (await s.json()).style.id as string;
	}
	async function piecesOf(sid: string) {
		const r = await clients.owner.api('GET', `/api/studios/${studioId}/styles/${sid}/cutting-list`);
		return r.status === 404 ? [] : (await r.json()).pieces as { name: string; areaNetMm2: number; areaCutMm2: number }[];
	}

	it('previews, then stores, the pieces of the style\'s own DXF export: the same pieces back (areas within 0.1 %)', async () => {
		const dxf = await (await clients.owner.get(`/api/studios/${studioId}/styles/${styleId}/export.dxf`)).text();
		const target = await newStyle('Imported from DXF');
		const preview = await upload(clients.patterncutter, importPath(target, true), 'lr-101.dxf', dxf);
		expect(preview.status).toBe(200);
		const seen = await preview.json();
		expect(seen.kind).toBe('dxf');
		expect(seen.pieces.map((p: { name: string }) => p.name)).toEqual(['Front', 'Back draft']);
		expect(await piecesOf(target)).toEqual([]);
		const saved = await upload(clients.patterncutter, importPath(target), 'lr-101.dxf', dxf);
		expect(saved.status).toBe(201);
		const original = await piecesOf(styleId);
		const back = await piecesOf(target);
		expect(back.map((p) => p.name)).toEqual(original.map((p) => p.name));
		back.forEach((p, i) => {
			expect(Math.abs(p.areaNetMm2 - original[i].areaNetMm2) / original[i].areaNetMm2).toBeLessThan(0.001);
			expect(Math.abs(p.areaCutMm2 - original[i].areaCutMm2) / original[i].areaCutMm2).toBeLessThan(0.001);
		});
		const piece = await clients.owner.api('GET', `/api/studios/${studioId}/pieces/${(await saved.json()).pieces[0].id}`);
		expect(piece.status).toBe(200);
	});

	it('stores the pieces of the style\'s SVG export the same way', async () => {
		const svg = await (await clients.owner.get(`/api/studios/${studioId}/styles/${styleId}/export.svg`)).text();
		const target = await newStyle('Imported from SVG');
		const saved = await upload(clients.owner, importPath(target), 'lr-101.svg', svg, 'image/svg+xml');
		expect(saved.status).toBe(201);
		const original = await piecesOf(styleId);
		const back = await piecesOf(target);
		expect(back.map((p) => p.name)).toEqual(original.map((p) => p.name));
		back.forEach((p, i) => expect(Math.abs(p.areaCutMm2 - original[i].areaCutMm2) / original[i].areaCutMm2).toBeLessThan(0.001));
	});

	it('refuses what it cannot take, says why, and stores nothing', async () => {
		const target = await newStyle('Refusals');
		const cases: [string, string | Uint8Array, number, RegExp][] = [
			['notes.txt', 'just some text', 415, /neither a DXF nor an SVG/],
			['big.svg', new Uint8Array(10 * 1024 * 1024 + 1).fill(32), 413, /larger than 10 MB/],
			['empty.dxf', '0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n4\n0\nENDSEC\n0\nEOF\n', 422, /No closed boundary on layer 1/],
			['open.svg', '<svg xmlns="http://www.w3.org/2000/svg" width="10cm" height="10cm" viewBox="0 0 100 100"><g id="cut-line"><path id="edge" d="M0 0 L100 0 L100 100"/></g></svg>', 422, /<path id="edge">.*open/],
			['bow.svg', '<svg xmlns="http://www.w3.org/2000/svg" width="10cm" height="10cm" viewBox="0 0 100 100"><path d="M0 0 L100 100 L100 0 L0 100 Z"/></svg>', 422, /crosses itself/],
			['nounits.svg', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><path d="M0 0 H100 V100 H0 Z"/></svg>', 422, /cannot be told/],
			['script.svg', '<svg xmlns="http://www.w3.org/2000/svg" width="1in" height="1in"><script>alert(1)</script><path d="M0 0 H10 V10 H0 Z"/></svg>', 422, /scripts and embedded documents are refused/],
			['linked.svg', '<svg xmlns="http://www.w3.org/2000/svg" width="1in" height="1in"><image href="http://example.test/x.png"/><path d="M0 0 H10 V10 H0 Z"/></svg>', 422, /external references are refused/]
		];
		for (const [name, content, status, message] of cases) {
			const r = await upload(clients.patterncutter, importPath(target), name, content);
			expect(r.status, name).toBe(status);
			expect((await r.json()).error.message, name).toMatch(message);
		}
		const json = await clients.patterncutter.api('POST', importPath(target), {});
		expect(json.status).toBe(415);
		expect(await piecesOf(target)).toEqual([]);
	});

	it('lets only pattern cutters and owners import; another studio gets 404', async () => {
		const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="10cm" height="10cm" viewBox="0 0 100 100"><path d="M0 0 H100 V100 H0 Z"/></svg>';
		for (const role of ['designer', 'sampleroom'] as const) expect((await upload(clients[role], importPath(styleId, true), 'a.svg', svg)).status).toBe(403);
		for (const role of ['owner', 'patterncutter'] as const) expect((await upload(clients[role], importPath(styleId, true), 'a.svg', svg)).status).toBe(200);
		expect((await upload(clients.outsider, importPath(styleId, true), 'a.svg', svg)).status).toBe(404);
		expect((await upload(clients.anonymous, importPath(styleId, true), 'a.svg', svg)).status).toBe(401);
		for (const role of ROLES) {
			const page = await clients[role].get(`/studios/${studioId}/styles/${styleId}/import`);
			expect(page.status).toBe(role === 'owner' || role === 'patterncutter' ? 200 : 403);
		}
	});
});
