// Exports of a size set against the built app: the SVG, DXF and print PDF hold every piece of every kept
// size, each labelled with its size; the DXF read back with dxf-parser (a general-purpose DXF reader) has
// one block per piece and size with the size in its Size field (ASTM D6673 layout as the style export
// writes it, status M); the PDF read back with pdfjs-dist; the sample room gets signed-off sizes only.
import DxfParser from 'dxf-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dxfBlockName } from '../../src/lib/export/dxf-writer';
import { pdfRead } from '../../src/lib/export/test-support/pdf-read';
import { outlineArea } from '../../src/lib/pattern/kernel';
import { outlinePleatsAcross } from '../../src/lib/pattern/export/pleat-marks';
import { pieceSchema } from '../../src/lib/pattern/piece-schema';
import { sizeRunsInsert } from '../../src/lib/server/repositories/size-runs';
import { demoStyleSeed } from '../../src/lib/server/seed/demo-style';
import { sizeRunExecute } from '../../src/lib/server/size-runs/run';
import { startApp, type RunningApp } from './app-server';
import { testDb, testDbClose, type Client } from './helpers';
import { sizeRunWorld } from './size-run-support';

type RoleName = 'owner' | 'designer' | 'sampleroom';
let app: RunningApp;
let studioId: string;
let c: Record<RoleName, Client>;
interface SetOut { id: string; sizes: { id: string; name: string; pieces: { id: string; name: string }[] }[] }
let set: SetOut;
const base = () => `/api/studios/${studioId}/size-sets/${set.id}`;
/** The block the DXF names for a piece of a size (characters DXF refuses in names replaced). */
const blockOf = (piece: string, size: string) => dxfBlockName(`${piece} ${size}`, new Set());

beforeAll(async () => {
	app = await startApp();
	const world = await sizeRunWorld(app.baseUrl, 'Size set exports', ['owner', 'designer', 'sampleroom']);
	({ studioId, as: c } = world);
	const { users, sets } = world;
	const { styleId } = await demoStyleSeed(testDb(), studioId, { patterncutter: users.owner, designer: users.designer });
	const sizes = ['astm-d5585/curvy/8', 'astm-d5585/curvy/14'].map((k) => ({ measurementSetId: sets.get(k)!, name: k }));
	const run = await sizeRunsInsert(testDb(), { studioId, styleId, createdBy: users.owner, sizes });
	await sizeRunExecute(testDb(), run.id);
	const r = await c.owner.api('POST', `/api/studios/${studioId}/size-runs/${run.id}/keep`, {});
	expect(r.status).toBe(201);
	set = ((await r.json()) as { sizeSet: SetOut }).sizeSet;
}, 120_000);

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const everyPiece = () => set.sizes.flatMap((s) => s.pieces.map((p) => ({ size: s, piece: p })));

describe('exports of a size set', () => {
	it('SVG: one group per piece of each size, its label naming the size', async () => {
		const r = await c.designer.api('GET', `${base()}/export.svg`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toMatch(/^image\/svg\+xml/);
		const svg = await r.text();
		const groups = svg.split('<g id="piece-').slice(1);
		expect(groups).toHaveLength(everyPiece().length);
		for (const { size, piece } of everyPiece()) {
			const g = groups.find((x) => x.startsWith(`${piece.id}"`));
			expect(g, `${size.name} ${piece.name}`).toBeDefined();
			expect(g).toContain(`data-name="${piece.name}"`);
			expect(g).toContain(`<text`);
			expect(g).toContain(`>${size.name}</text>`);
		}
	});

	it('DXF: parses, one block per piece and size with the size in its Size field, each boundary the kept piece’s cut area', async () => {
		const r = await c.designer.api('GET', `${base()}/export.dxf`);
		expect(r.status).toBe(200);
		const parsed = new DxfParser().parseSync(await r.text()) as unknown as {
			header: Record<string, unknown>;
			blocks: Record<string, { entities?: { type: string; layer: string; text?: string; vertices?: { x: number; y: number }[] }[] }>;
			entities: { type: string; name: string }[];
		};
		expect(parsed.header.$INSUNITS).toBe(4);
		const inserts = parsed.entities.filter((e) => e.type === 'INSERT');
		expect(inserts).toHaveLength(everyPiece().length);
		const rows = await testDb().selectFrom('size_set_versions').select(['id', 'geometry']).where('id', 'in', everyPiece().map((x) => x.piece.id)).execute();
		for (const [i, { size, piece }] of everyPiece().entries()) {
			const block = parsed.blocks[inserts[i].name];
			expect(inserts[i].name).toBe(blockOf(piece.name, size.name));
			const texts = (block.entities ?? []).filter((e) => e.type === 'TEXT' && e.layer === '15').map((e) => e.text);
			expect(texts).toContain(`Piece Name: ${piece.name}`);
			expect(texts).toContain(`Size: ${size.name}`);
			const kept = pieceSchema.parse(rows.find((x) => x.id === piece.id)!.geometry);
			const want = outlineArea(kept.seamAllowance?.cutLine ?? outlinePleatsAcross(kept));
			const boundary = (block.entities ?? []).find((e) => e.type === 'LWPOLYLINE' && e.layer === '1')!;
			let a = 0;
			const vs = boundary.vertices!;
			for (let k = 0; k < vs.length; k++) a += vs[k].x * vs[(k + 1) % vs.length].y - vs[(k + 1) % vs.length].x * vs[k].y;
			expect(Math.abs(Math.abs(a) / 2 - want) / want).toBeLessThan(0.001);
		}
	});

	it('PDF: every piece of each size printed with its name followed by its size', async () => {
		const r = await c.designer.api('GET', `${base()}/export.pdf?paper=a0`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toBe('application/pdf');
		const pages = await pdfRead(new Uint8Array(await r.arrayBuffer()));
		const text = pages.flatMap((p) => p.text).filter((t) => t.trim() !== '');
		for (const { size, piece } of everyPiece()) {
			const at = text.flatMap((t, k) => (t === piece.name && text[k + 1] === size.name ? [k] : []));
			expect(at.length, `${piece.name}, size ${size.name}`).toBeGreaterThan(0);
		}
	});

	it('exports only the sizes asked for, and refuses a size of no set (400)', async () => {
		const one = set.sizes[1];
		const r = await c.designer.api('GET', `${base()}/export.dxf?sizes=${one.id}`);
		expect(r.status).toBe(200);
		const parsed = new DxfParser().parseSync(await r.text()) as unknown as { entities: { type: string; name: string }[] };
		expect(parsed.entities.filter((e) => e.type === 'INSERT').map((e) => e.name)).toEqual(one.pieces.map((p) => blockOf(p.name, one.name)));
		expect((await c.designer.api('GET', `${base()}/export.svg?sizes=00000000-0000-4000-8000-000000000000`)).status).toBe(400);
		expect((await c.designer.api('GET', `${base()}/export.pdf?paper=napkin`)).status).toBe(400);
	});

	it('the sample room exports signed-off sizes only (404 before any is signed off)', async () => {
		expect((await c.sampleroom.api('GET', `${base()}/export.svg`)).status).toBe(404);
		expect((await c.designer.api('POST', `${base()}/sign-off`, { sizes: [set.sizes[0].id] })).status).toBe(200);
		const r = await c.sampleroom.api('GET', `${base()}/export.dxf`);
		expect(r.status).toBe(200);
		const parsed = new DxfParser().parseSync(await r.text()) as unknown as { entities: { type: string; name: string }[] };
		expect(parsed.entities.filter((e) => e.type === 'INSERT').map((e) => e.name)).toEqual(set.sizes[0].pieces.map((p) => blockOf(p.name, set.sizes[0].name)));
	});
});
