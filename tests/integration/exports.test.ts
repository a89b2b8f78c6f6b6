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
	const r = await clients.designer.api('POST', `/api/studios/${studioId}/pieces/${signedPieceId}/versions/${made[0].version.id}/state`, { state: 'signed_off' });
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
