// Styles, pieces and versions through the API, verified on the server (real PostgreSQL, built app).
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { anchorBody } from '../../src/lib/pattern/anchors/anchor';
import { anchoredPoint } from '../../src/lib/pattern/anchors/anchor-pick';
import { pivot } from '../../src/lib/pattern/operations/pivot';
import { reshape } from '../../src/lib/pattern/verify/reshape';
import { reshapeChanges, reshapeDeclaredEntries } from '../../src/lib/pattern/reshape-declaration';
import { pieceMetrics } from '../../src/lib/pattern/metrics';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { versionSave } from '../../src/lib/server/versions/save';
import { startApp, type RunningApp } from './app-server';
import { Client, memberAdd, signedInClient, studioMake, studioOnStudioPlan, testDb, testDbClose, throttleAddressReset, userMake, type TestUser } from './helpers';

let app: RunningApp;
let studioId: string;
let cutter: TestUser;
let designer: TestUser;
let c: Client;

/** Pivot the shoulder dart of the demo block to a point on the side seam (the move of trade-primer §1). */
function pivotStep(piece: Piece) {
	const params = { dartId: 'shoulder-dart', to: { x: 235 - 10 / 3, y: 300 } };
	const r = pivot(piece, params);
	if (!r.ok) throw new Error(r.error.message);
	return { step: { op: 'pivot', params }, piece: r.piece };
}

async function styleWithPiece(client = c) {
	const s = await client.api('POST', `/api/studios/${studioId}/styles`, { name: 'Juniper bodice', code: 'LR-101', season: 'AW27' });
	expect(s.status).toBe(201);
	const style = (await s.json()).style;
	const p = await client.api('POST', `/api/studios/${studioId}/styles/${style.id}/pieces`, {
		name: 'Front',
		geometry: frontBodiceBlock(),
		origin: { op: 'draft', params: { note: 'demo block' } }
	});
	expect(p.status).toBe(201);
	const body = await p.json();
	return { styleId: style.id as string, pieceId: body.piece.id as string, v1: body.version.id as string };
}

async function headOf(pieceId: string) {
	const r = await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}`);
	return (await r.json()).piece as { headVersionId: string; headNumber: number };
}

beforeAll(async () => {
	app = await startApp();
	await throttleAddressReset();
	const studio = await studioMake('Versions');
	studioId = studio.id;
	await studioOnStudioPlan(studioId); // these tests make many styles: past the free plan's five
	cutter = await userMake('cutter');
	designer = await userMake('designer');
	await memberAdd(studioId, cutter.id, 'patterncutter');
	await memberAdd(studioId, designer.id, 'designer');
	c = await signedInClient(app.baseUrl, cutter);
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

describe('saving versions', () => {
	it('creates a style, a piece with version 1, and version 2 from a pivot, with metrics computed on the server', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const { step, piece } = pivotStep(frontBodiceBlock());
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			baseVersionId: v1,
			message: 'Shoulder dart to the side seam',
			geometry: piece,
			recipe: [step],
			metrics: { areaMm2: 1 } // a client's claim: ignored
		});
		expect(r.status).toBe(201);
		const body = await r.json();
		expect(body.version.number).toBe(2);
		const v = await (await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions/${body.version.id}`)).json();
		expect(v.version.metrics.areaMm2).toBeGreaterThan(50_000);
		expect(v.version.metrics.ledger).toHaveLength(2);
		expect((await headOf(pieceId)).headNumber).toBe(2);
	});

	it('refuses (422) a version whose geometry is not what its recipe gives', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const { step, piece } = pivotStep(frontBodiceBlock());
		// Nudge one Bézier handle by 0.5 mm: a sound piece, but not what the pivot gives.
		const k = piece.outline.segments.findIndex((x) => x.kind === 'cubic');
		const segs = piece.outline.segments.map((x, i) => (i === k && x.kind === 'cubic' ? { ...x, p1: { x: x.p1.x + 0.5, y: x.p1.y } } : x));
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			baseVersionId: v1,
			message: 'claims a pivot but nudged a point',
			geometry: { ...piece, outline: { segments: segs } },
			recipe: [step]
		});
		expect(r.status).toBe(422);
		const body = await r.json();
		expect(body.error.code).toBe('replay_mismatch');
		expect(body.error.message).toMatch(/not what its recipe gives/);
		expect((await headOf(pieceId)).headNumber).toBe(1);
	});

	it('stores a step\'s point with the anchor the editor read it as, and refuses (422) an anchor that says another place than its point', async () => {
		const { styleId, pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const to = anchoredPoint(anchorBody(block), { x: 235 - 10 / 3, y: 300 });
		expect(to.anchor).toMatchObject({ kind: 'edge', edge: 'side seam' });
		const params = { dartId: 'shoulder-dart', to };
		const r = pivot(block, params);
		if (!r.ok) throw new Error(r.error.message);
		const lying = { ...params, to: { ...to, anchor: { kind: 'landmark', name: 'side waist' } } };
		const refused = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: 'anchored elsewhere', geometry: r.piece, recipe: [{ op: 'pivot', params: lying }] });
		expect(refused.status).toBe(422);
		expect((await refused.json()).error.message).toMatch(/^Step 1 \(pivot\): the point .* is anchored at the side waist, which is [\d.]+ mm away from it/);
		expect((await headOf(pieceId)).headNumber).toBe(1);
		const saved = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: 'anchored on the side seam', geometry: r.piece, recipe: [{ op: 'pivot', params }] });
		expect(saved.status).toBe(201);
		const id = (await saved.json()).version.id;
		const v = await (await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions/${id}`)).json();
		expect(v.version.recipe[0].params.to.anchor).toEqual(to.anchor);
		// the version's page says it in words, beside the recipe
		const page = await c.get(`/studios/${studioId}/styles/${styleId}/pieces/${pieceId}/versions/${id}`);
		expect(page.status).toBe(200);
		expect(await page.text()).toMatch(/Step 1 \(pivot\) at side seam, [\d.]+ % from the /);
	});

	it('refuses (422) an unbalanced ledger with an explanation naming the apex and the degrees', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const dart = block.darts.find((d) => d.id === 'shoulder-dart')!;
		// Drag one shoulder-dart leg end 8 mm along the shoulder by hand: the dart narrows, shaping is lost.
		const to = { x: dart.leg2End.x + 8, y: dart.leg2End.y + 2 };
		const params = { moves: [{ from: dart.leg2End, to }] };
		const moved = reshape(block, params);
		if (!moved.ok) throw new Error(moved.error.message);
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			baseVersionId: v1,
			message: 'narrowed the dart by hand',
			geometry: moved.piece,
			recipe: [{ op: 'reshape', params }]
		});
		expect(r.status).toBe(422);
		const body = await r.json();
		expect(body.error.code).toBe('shaping_not_kept');
		expect(body.error.message).toMatch(/Bust point/);
		expect(body.error.message).toMatch(/°/);
		expect(body.error.message).toMatch(/mm²/);
	});

	it('accepts that hand change once the lost shaping and area are declared as removed ease', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const dart = block.darts.find((d) => d.id === 'shoulder-dart')!;
		const params = { moves: [{ from: dart.leg2End, to: { x: dart.leg2End.x + 8, y: dart.leg2End.y + 2 } }] };
		const moved = reshape(block, params);
		if (!moved.ok) throw new Error(moved.error.message);
		const before = pieceMetrics(block);
		const after = pieceMetrics(moved.piece);
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			baseVersionId: v1,
			message: 'less bust shaping after the first fitting',
			geometry: moved.piece,
			recipe: [{ op: 'reshape', params }],
			declared: [
				{
					apexId: 'bp',
					kind: 'removed_ease',
					refId: 'shoulder-dart',
					label: 'bust shaping reduced after fitting',
					angleRad: after.apexTotals[0].totalAngleRad - before.apexTotals[0].totalAngleRad,
					areaMm2: after.areaMm2 - before.areaMm2,
					lengthMm: after.seamLengthMm - before.seamLengthMm
				}
			]
		});
		expect(r.status).toBe(201);
	});

	it('accepts a hand reshape of the waist with the entries the reshape declaration proposes, and refuses it without', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const params = { moves: [{ from: { x: 225, y: 440 }, to: { x: 225, y: 446 } }] };
		const moved = reshape(block, params);
		if (!moved.ok) throw new Error(moved.error.message);
		const body = { baseVersionId: v1, message: 'side waist lowered after the fitting', geometry: moved.piece, recipe: [{ op: 'reshape', params }] };
		const bare = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, body);
		expect(bare.status).toBe(422);
		expect((await bare.json()).error.code).toBe('shaping_not_kept');
		const changes = reshapeChanges(block, moved.piece);
		const declared = reshapeDeclaredEntries(changes, { area: { choice: 'other', note: 'longer at the side for the toile' } });
		if (!declared.ok) throw new Error('expected entries');
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { ...body, declared: declared.entries });
		expect(r.status).toBe(201);
		const saved = await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions/${(await r.json()).version.id}`);
		const ledger = (await saved.json()).version.metrics.ledger as { kind: string; note?: string }[];
		expect(ledger).toContainEqual(expect.objectContaining({ kind: 'other', note: 'longer at the side for the toile' }));
	});

	it('refuses (400) a change declared as "other" without a note, naming the field', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const params = { moves: [{ from: { x: 225, y: 440 }, to: { x: 225, y: 446 } }] };
		const moved = reshape(block, params);
		if (!moved.ok) throw new Error(moved.error.message);
		const declared = reshapeDeclaredEntries(reshapeChanges(block, moved.piece));
		if (!declared.ok) throw new Error('expected entries');
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			baseVersionId: v1,
			message: 'side waist lowered',
			geometry: moved.piece,
			recipe: [{ op: 'reshape', params }],
			declared: declared.entries.map((e) => ({ ...e, kind: 'other', note: undefined }))
		});
		expect(r.status).toBe(400);
		const err = (await r.json()).error;
		expect(JSON.stringify(err.fields)).toMatch(/note/);
	});

	it('stores a seam pair out of tolerance as a warning and refuses sign-off until it is trued', async () => {
		const { styleId, pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		// The waist of the front (side waist → waist dart) against the centre front: a different length,
		// and both stay where they are when the shoulder dart is pivoted to the side seam.
		const side = block.outline.segments[7];
		const cf = block.outline.segments[11];
		const pair = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/seam-pairs`, {
			label: 'waist to centre front',
			a: { pieceId, from: side.p0, to: side.kind === 'line' ? side.p1 : side.p3 },
			b: { pieceId, from: cf.p0, to: cf.kind === 'line' ? cf.p1 : cf.p3 },
			toleranceMm: 1.6
		});
		expect(pair.status).toBe(201);
		const { step, piece } = pivotStep(block);
		const saved = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			baseVersionId: v1,
			message: 'pivot',
			geometry: piece,
			recipe: [step]
		});
		expect(saved.status).toBe(201);
		const body = await saved.json();
		expect(body.warnings).toHaveLength(1);
		expect(body.warnings[0].message).toMatch(/waist to centre front: .* mm/);
		const d = await signedInClient(app.baseUrl, designer);
		const state = `/api/studios/${studioId}/pieces/${pieceId}/versions/${body.version.id}/state`;
		expect((await c.api('POST', state, { action: 'propose' })).status).toBe(200);
		// the signer must acknowledge the seam out of tolerance; the acknowledgement is recorded
		const sign = await d.api('POST', state, { action: 'sign_off' });
		expect(sign.status).toBe(409);
		const refusal = (await sign.json()).error;
		expect(refusal.code).toBe('needs_acknowledgement');
		expect(refusal.message).toMatch(/waist to centre front: .* mm/);
		expect(refusal.fields.acknowledged).toEqual([`seam:${(await pair.json()).seamPair.id}`]);
		const acknowledged = await d.api('POST', state, { action: 'sign_off', comment: 'Eased in at the sewing stage.', acknowledged: refusal.fields.acknowledged });
		expect(acknowledged.status).toBe(200);
		const review = await (await d.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions/${body.version.id}/review`)).json();
		const signedOff = review.reviews.find((r: { kind: string }) => r.kind === 'signed_off');
		expect(signedOff.comment).toBe('Eased in at the sewing stage.');
		expect(signedOff.acknowledged.map((a: { id: string }) => a.id)).toEqual(refusal.fields.acknowledged);
	});

	it('allows sign-off once the seam pair is corrected (its ease or moved edge ends patched)', async () => {
		const { styleId, pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const waist = block.outline.segments[7];
		const cf = block.outline.segments[11];
		const created = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/seam-pairs`, {
			label: 'waist to centre front',
			a: { pieceId, from: waist.p0, to: waist.kind === 'line' ? waist.p1 : waist.p3 },
			b: { pieceId, from: cf.p0, to: cf.kind === 'line' ? cf.p1 : cf.p3 },
			toleranceMm: 1.6
		});
		const pair = (await created.json()).seamPair;
		const d = await signedInClient(app.baseUrl, designer);
		expect((await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions/${v1}/state`, { action: 'propose' })).status).toBe(200);
		const refused = await d.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions/${v1}/state`, { action: 'sign_off' });
		expect(refused.status).toBe(409);
		expect((await refused.json()).error.code).toBe('needs_acknowledgement');
		const aLen = Math.hypot(waist.p0.x - (waist.kind === 'line' ? waist.p1.x : waist.p3.x), waist.p0.y - (waist.kind === 'line' ? waist.p1.y : waist.p3.y));
		const bLen = Math.hypot(cf.p0.x - (cf.kind === 'line' ? cf.p1.x : cf.p3.x), cf.p0.y - (cf.kind === 'line' ? cf.p1.y : cf.p3.y));
		// the centre-front edge now ends where its length equals the waist's (as after truing an end)
		const cfEnd = cf.kind === 'line' ? cf.p1 : cf.p3;
		const along = { x: cf.p0.x + ((cfEnd.x - cf.p0.x) * aLen) / bLen, y: cf.p0.y + ((cfEnd.y - cf.p0.y) * aLen) / bLen };
		const patched = await c.api('PATCH', `/api/studios/${studioId}/styles/${styleId}/seam-pairs/${pair.id}`, { b: { from: cf.p0, to: along } });
		expect(patched.status).toBe(200);
		expect((await d.api('PATCH', `/api/studios/${studioId}/styles/${styleId}/seam-pairs/${pair.id}`, { toleranceMm: 3 })).status).toBe(403);
		expect((await c.api('PATCH', `/api/studios/${studioId}/styles/${styleId}/seam-pairs/${pair.id}`, {})).status).toBe(400);
		const signed = await d.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions/${v1}/state`, { action: 'sign_off' });
		expect(signed.status).toBe(200);
	});

	it('unpairs two seams: an editor removes the pair (204), a designer may not (403), a second time is 404', async () => {
		const { styleId, pieceId } = await styleWithPiece();
		const block = frontBodiceBlock();
		const [e1, e2] = [block.outline.segments[7], block.outline.segments[11]];
		const end = (e: typeof e1) => (e.kind === 'line' ? e.p1 : e.p3);
		const created = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/seam-pairs`, {
			label: 'to unpair',
			a: { pieceId, from: e1.p0, to: end(e1) },
			b: { pieceId, from: e2.p0, to: end(e2) },
			toleranceMm: 1.6
		});
		const pair = (await created.json()).seamPair;
		const url = `/api/studios/${studioId}/styles/${styleId}/seam-pairs/${pair.id}`;
		const d = await signedInClient(app.baseUrl, designer);
		expect((await d.api('DELETE', url)).status).toBe(403);
		expect((await c.api('DELETE', url)).status).toBe(204);
		const after = await (await c.api('GET', `/api/studios/${studioId}/styles/${styleId}/seam-pairs`)).json();
		expect(after.seamPairs.some((x: { id: string }) => x.id === pair.id)).toBe(false);
		expect((await c.api('DELETE', url)).status).toBe(404);
		expect((await c.api('DELETE', `/api/studios/${studioId}/styles/${styleId}/seam-pairs/not-a-uuid`)).status).toBe(400);
	});

	it('lets a designer sign off a version; the earlier signed-off one becomes superseded', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const d = await signedInClient(app.baseUrl, designer);
		const state = (v: string) => `/api/studios/${studioId}/pieces/${pieceId}/versions/${v}/state`;
		expect((await c.api('POST', state(v1), { action: 'propose' })).status).toBe(200);
		expect((await d.api('POST', state(v1), { action: 'sign_off' })).status).toBe(200);
		const { step, piece } = pivotStep(frontBodiceBlock());
		const v2 = (await (await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: 'pivot', geometry: piece, recipe: [step] })).json()).version.id;
		expect((await c.api('POST', state(v2), { action: 'propose' })).status).toBe(200);
		expect((await c.api('POST', state(v2), { action: 'sign_off' })).status).toBe(403);
		expect((await d.api('POST', state(v2), { action: 'sign_off' })).status).toBe(200);
		const list = (await (await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions`)).json()).versions as { number: number; state: string }[];
		expect(list.map((v) => [v.number, v.state])).toEqual([
			[2, 'signed_off'],
			[1, 'superseded']
		]);
	});
});

describe('refusals a person understands', () => {
	it('answers 400 with field errors for a body that does not fit the schema', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: '', geometry: {}, recipe: [] });
		expect(r.status).toBe(400);
		const body = await r.json();
		expect(Object.keys(body.error.fields)).toEqual(expect.arrayContaining(['message', 'geometry']));
	});

	it('answers 413 for a body over the size limit and for too many outline segments', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const huge = 'x'.repeat(5 * 1024 * 1024);
		const big = await c.request('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, {
			body: JSON.stringify({ baseVersionId: v1, message: huge }),
			headers: { 'content-type': 'application/json' }
		});
		expect(big.status).toBe(413);
		const block = frontBodiceBlock();
		const many = Array.from({ length: 50_001 }, (_, i) => ({ kind: 'line' as const, p0: { x: i, y: 0 }, p1: { x: i + 1, y: 0 } }));
		const r = await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: 'many', geometry: { ...block, outline: { segments: many } }, recipe: [{ op: 'reshape' }] });
		expect([413]).toContain(r.status);
		expect((await r.json()).error.message).toMatch(/segments|larger/);
	});

	it('answers 422 saying where an outline crosses itself', async () => {
		const { styleId } = await styleWithPiece();
		const block = frontBodiceBlock();
		const bow = {
			...block,
			apexes: [],
			darts: [],
			notches: [],
			grainline: null,
			foldLine: null,
			labels: [],
			outline: {
				segments: [
					{ kind: 'line', p0: { x: 0, y: 0 }, p1: { x: 100, y: 100 } },
					{ kind: 'line', p0: { x: 100, y: 100 }, p1: { x: 100, y: 0 } },
					{ kind: 'line', p0: { x: 100, y: 0 }, p1: { x: 0, y: 100 } },
					{ kind: 'line', p0: { x: 0, y: 100 }, p1: { x: 0, y: 0 } }
				]
			}
		};
		const r = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, { name: 'Bow', geometry: bow, origin: { op: 'import' } });
		expect(r.status).toBe(422);
		const body = await r.json();
		expect(body.error.code).toBe('invalid_geometry');
		expect(body.error.message).toMatch(/cross/i);
		expect(body.error.message).toMatch(/50(\.0+)?/); // the crossing at (50, 50) mm
	});
});

describe('concurrency and failure', () => {
	it('eight saves from the same base at once give exactly one new version and seven 409s', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const { step, piece } = pivotStep(frontBodiceBlock());
		const results = await Promise.all(
			Array.from({ length: 8 }, (_, i) =>
				c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: `save ${i}`, geometry: piece, recipe: [step] })
			)
		);
		const statuses = results.map((r) => r.status).sort();
		expect(statuses).toEqual([201, 409, 409, 409, 409, 409, 409, 409]);
		const conflict = await results.find((r) => r.status === 409)!.json();
		expect(conflict.error.message).toMatch(/saved version 2/);
		const versions = (await (await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions`)).json()).versions;
		expect(versions).toHaveLength(2);
		expect((await headOf(pieceId)).headNumber).toBe(2);
	});

	it('a save that fails after the insert leaves the head unchanged and stores nothing', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const { step, piece } = pivotStep(frontBodiceBlock());
		await expect(
			versionSave(
				testDb(),
				{ studioId, pieceId, baseVersionId: v1, message: 'dies half-way', geometry: piece, recipe: [step], authorId: cutter.id },
				{ afterInsert: () => { throw new Error('simulated crash after the insert'); } }
			)
		).rejects.toThrow('simulated crash');
		const head = await headOf(pieceId);
		expect(head.headVersionId).toBe(v1);
		expect(head.headNumber).toBe(1);
		const versions = (await (await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions`)).json()).versions;
		expect(versions).toHaveLength(1);
	});

	it('random JSON bodies to the save route always answer 4xx, never 500, and store nothing', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const block = frontBodiceBlock();
		const body = fc.oneof(
			fc.jsonValue(),
			fc.record({ baseVersionId: fc.oneof(fc.constant(v1), fc.uuid(), fc.string()), message: fc.string(), geometry: fc.jsonValue(), recipe: fc.jsonValue() }),
			fc.record({ baseVersionId: fc.constant(v1), message: fc.string({ minLength: 1 }), geometry: fc.constant(block), recipe: fc.array(fc.record({ op: fc.constantFrom('pivot', 'share', 'pleat', 'reshape', 'nope'), params: fc.jsonValue() }), { maxLength: 3 }) })
		);
		await fc.assert(
			fc.asyncProperty(body, async (b) => {
				const r = await c.request('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { body: JSON.stringify(b), headers: { 'content-type': 'application/json' } });
				expect(r.status).toBeGreaterThanOrEqual(400);
				expect(r.status).toBeLessThan(500);
			}),
			{ numRuns: 60 }
		);
		expect((await headOf(pieceId)).headNumber).toBe(1);
	});
});

describe('compare and export', () => {
	it('compares two versions side by side with the differences', async () => {
		const { pieceId, v1 } = await styleWithPiece();
		const { step, piece } = pivotStep(frontBodiceBlock());
		const v2 = (await (await c.api('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: v1, message: 'pivot', geometry: piece, recipe: [step] })).json()).version.id;
		const r = await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/compare?a=${v1}&b=${v2}`);
		expect(r.status).toBe(200);
		const body = await r.json();
		const area = body.rows.find((x: { label: string }) => x.label === 'Area outside the darts');
		expect(Math.abs(area.difference)).toBeLessThan(0.5); // a pivot keeps the area (trade-primer §1)
		const apex = body.rows.find((x: { group: string }) => x.group === 'apex');
		expect(Math.abs(apex.difference)).toBeLessThan(0.01);
	});

	it('serves a piece as an SVG download with a sensible file name', async () => {
		const { pieceId } = await styleWithPiece();
		const r = await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/export.svg`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toMatch(/image\/svg\+xml/);
		expect(r.headers.get('content-disposition')).toMatch(/attachment; filename="lr-101-front-v1\.svg"/);
		expect(await r.text()).toMatch(/<svg [^>]*width="[\d.]+mm"/);
	});
});
