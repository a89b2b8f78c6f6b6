// Measurement sets through the JSON API and drafting a block into a new style through the page
// action (real PostgreSQL, built app).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHART_SET_COUNT } from '../../src/lib/server/measurements/charts';
import { startApp, type RunningApp } from './app-server';
import { Client, memberAdd, signedInClient, studioMake, testDb, testDbClose, throttleAddressReset, userMake } from './helpers';

let app: RunningApp;
let studioId: string;
let otherStudioId: string;
let cutter: Client;
let designer: Client;
let outsider: Client;

const base = () => `/api/studios/${studioId}/measurement-sets`;

/** A plausible client (cm, one value in inches with eighths). */
const clientBody = {
	name: 'Fitting 1',
	clientRef: 'C-0042',
	notes: 'Taken over a light bra, standing.',
	unit: 'cm',
	values: { bust: '92.5', underbust: '76', waist: '71', neck_base: '37 cm', back_length: '16 1/8 in', armhole_depth: 205 }
};

beforeAll(async () => {
	app = await startApp();
	await throttleAddressReset();
	studioId = (await studioMake('Measures')).id;
	otherStudioId = (await studioMake('Elsewhere')).id;
	const c = await userMake('cutter');
	const d = await userMake('designer');
	const o = await userMake('outsider');
	await memberAdd(studioId, c.id, 'patterncutter');
	await memberAdd(studioId, d.id, 'designer');
	await memberAdd(otherStudioId, o.id, 'owner');
	cutter = await signedInClient(app.baseUrl, c);
	designer = await signedInClient(app.baseUrl, d);
	outsider = await signedInClient(app.baseUrl, o);
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

describe('client measurement sets through the API', () => {
	it('creates, reads, updates, duplicates and deletes a client set', async () => {
		const created = await cutter.api('POST', base(), clientBody);
		expect(created.status).toBe(201);
		const set = (await created.json()).measurementSet;
		expect(set).toMatchObject({ kind: 'client', kindLabel: 'client', clientRef: 'C-0042', unit: 'cm', readOnly: false });
		const mm = Object.fromEntries(set.measurements.map((m: { id: string; valueMm: number }) => [m.id, m.valueMm]));
		expect(mm.bust).toBeCloseTo(925, 6);
		expect(mm.neck_base).toBeCloseTo(370, 6);
		expect(mm.back_length).toBeCloseTo(16.125 * 25.4, 6); // "16 1/8 in"
		expect(mm.armhole_depth).toBe(205); // a number is mm
		expect(set.cupCode.code).toBe('75C'); // 16.5 cm difference, band 75
		// derived values are reported apart, each with its rule, never stored with the set
		expect(set.derived.map((d: { id: string }) => d.id)).toContain('shoulder_length');
		expect(set.derived.every((d: { rule: string }) => d.rule.length > 0)).toBe(true);
		expect(set.measurements.some((m: { derived: boolean }) => m.derived)).toBe(false);

		const read = await cutter.api('GET', `${base()}/${set.id}`);
		expect(read.status).toBe(200);
		expect((await read.json()).measurementSet.name).toBe('Fitting 1');

		const patched = await cutter.api('PATCH', `${base()}/${set.id}`, { name: 'Fitting 2', unit: 'in', values: { bust: '36 3/8', underbust: '30', waist: '28' } });
		expect(patched.status).toBe(200);
		const p = (await patched.json()).measurementSet;
		expect(p.name).toBe('Fitting 2');
		expect(p.unit).toBe('in');
		expect(p.measurements.find((m: { id: string }) => m.id === 'bust').valueMm).toBeCloseTo(36.375 * 25.4, 6);
		expect(p.measurements).toHaveLength(3);

		const dup = await cutter.api('POST', `${base()}/${set.id}/duplicate`);
		expect(dup.status).toBe(201);
		const copy = (await dup.json()).measurementSet;
		expect(copy.id).not.toBe(set.id);
		expect(copy.name).toBe('Fitting 2 (copy)');
		expect(copy.clientRef).toBe('C-0042');
		expect(copy.measurements).toEqual(p.measurements);

		const del = await cutter.api('DELETE', `${base()}/${set.id}`);
		expect(del.status).toBe(204);
		expect((await cutter.api('GET', `${base()}/${set.id}`)).status).toBe(404);
		expect((await cutter.api('GET', `${base()}/${copy.id}`)).status).toBe(200);
	});

	it('answers 400 with field errors for what is not a length or not a reference', async () => {
		const r = await cutter.api('POST', base(), { ...clientBody, clientRef: 'Jane Doe', values: { bust: 'ninety' } });
		expect(r.status).toBe(400);
		const e = (await r.json()).error;
		expect(e.fields.clientRef?.[0]).toMatch(/reference code/);
		const r2 = await cutter.api('POST', base(), { ...clientBody, values: { bust: 'ninety' } });
		expect(r2.status).toBe(400);
		expect((await r2.json()).error.fields['values.bust'][0]).toMatch(/is not a number/);
	});

	it('tells negative, zero and non-numbers apart, typed or sent as numbers', async () => {
		const r = await cutter.api('POST', base(), { ...clientBody, values: { bust: '92', waist: '-70', hip: '0', neck_base: 'x', back_length: -410, armhole_depth: 0 } });
		expect(r.status).toBe(400);
		const f = (await r.json()).error.fields;
		expect(f['values.waist'][0]).toMatch(/cannot be negative/);
		expect(f['values.hip'][0]).toMatch(/is zero/);
		expect(f['values.neck_base'][0]).toMatch(/is not a number/);
		expect(f['values.back_length'][0]).toMatch(/cannot be negative/);
		expect(f['values.armhole_depth'][0]).toMatch(/is zero/);
	});

	it('answers 422 with clear messages for implausible values; warnings can be confirmed', async () => {
		const swapped = await cutter.api('POST', base(), { ...clientBody, values: { bust: '76', underbust: '92.5' } });
		expect(swapped.status).toBe(422);
		const e = (await swapped.json()).error;
		expect(e.code).toBe('implausible');
		expect(e.fields['values.underbust'][0]).toMatch(/larger than bust.*swapped/);

		// 925 typed into a cm set (9.25 m): no human body measures that → an error that cannot be confirmed
		const range = await cutter.api('POST', base(), { ...clientBody, values: { bust: '925' } });
		expect(range.status).toBe(422);
		expect((await range.json()).error.message).toMatch(/larger than any human body measures.*Check the value and its unit/);
		const waist = await cutter.api('POST', base(), { ...clientBody, values: { bust: '92', waist: '5000' }, acceptWarnings: true });
		expect(waist.status).toBe(422);
		expect((await waist.json()).error.fields['values.waist'][0]).toMatch(/^Waist girth is 5000\.0 cm: larger than any human body measures/);
		// 190 cm bust: unusual but human → a warning that refuses until confirmed
		const unusual = await cutter.api('POST', base(), { ...clientBody, values: { bust: '190' } });
		expect(unusual.status).toBe(422);
		expect((await unusual.json()).error.message).toMatch(/outside the usual adult range/);
		const confirmed = await cutter.api('POST', base(), { ...clientBody, name: 'Unusual', values: { bust: '135' }, acceptWarnings: true });
		expect(confirmed.status).toBe(201);
		const stillWrong = await cutter.api('POST', base(), { ...clientBody, values: { bust: '76', underbust: '92.5' }, acceptWarnings: true });
		expect(stillWrong.status).toBe(422);
	});
});

describe('the client set form (page action)', () => {
	it('saves typed values in inches with eighths, refuses implausible ones with the message, and lets warnings be confirmed', async () => {
		const form = { name: 'Form fitting', clientRef: 'C-0077', notes: '', unit: 'in', bust: '36 3/8', underbust: '30', waist: '29 1/2' };
		const bad = await cutter.post(`/studios/${studioId}/measurements/new`, { ...form, underbust: '37' });
		expect(bad.status).toBe(422);
		expect(await bad.text()).toContain('larger than bust');
		const odd = await cutter.post(`/studios/${studioId}/measurements/new`, { ...form, bust: '80' });
		expect(odd.status).toBe(422);
		expect(await odd.text()).toContain('outside the usual adult range');
		const confirmed = await cutter.post(`/studios/${studioId}/measurements/new`, { ...form, name: 'Confirmed', bust: '80', underbust: '', acceptWarnings: 'on' });
		expect(confirmed.status).toBe(303);
		const ok = await cutter.post(`/studios/${studioId}/measurements/new`, form);
		expect(ok.status).toBe(303);
		const setId = /measurements\/([0-9a-f-]{36})$/.exec(ok.headers.get('location') ?? '')![1];
		const set = (await (await cutter.api('GET', `${base()}/${setId}`)).json()).measurementSet;
		expect(set.measurements.find((m: { id: string }) => m.id === 'bust').valueMm).toBeCloseTo(36.375 * 25.4, 6);
		expect(set.cupCode.code).toBe('75C');
		expect((await designer.post(`/studios/${studioId}/measurements/new`, form)).status).toBe(403);
	});
});

describe('charts', () => {
	it('every studio gets the ASTM D5585 charts once, read-only (409 on change or delete), with the source named', async () => {
		const list = (await (await cutter.api('GET', base())).json()).measurementSets as {
			id: string;
			kind: string;
			readOnly: boolean;
			chartSource: { standard: string; table: string; size: string; variant: string } | null;
			measurements: { id: string; printedInches?: string }[];
		}[];
		const charts = list.filter((s) => s.kind === 'chart');
		expect(charts).toHaveLength(CHART_SET_COUNT);
		expect(charts.every((s) => s.readOnly && s.chartSource?.standard === 'ASTM D5585-11e1')).toBe(true);
		const size12 = charts.find((s) => s.chartSource?.size === '12' && s.chartSource.variant === 'curvy waist')!;
		expect(size12.measurements.find((m) => m.id === 'bust')?.printedInches).toBe('38 3/4');
		// listing again does not seed twice
		await cutter.api('GET', base());
		const n = await testDb().selectFrom('measurement_sets').select((e) => e.fn.countAll<number>().as('n')).where('studio_id', '=', studioId).where('kind', '=', 'chart').executeTakeFirstOrThrow();
		expect(Number(n.n)).toBe(CHART_SET_COUNT);

		const patch = await cutter.api('PATCH', `${base()}/${size12.id}`, { name: 'mine now' });
		expect(patch.status).toBe(409);
		expect((await patch.json()).error.code).toBe('read_only');
		expect((await cutter.api('DELETE', `${base()}/${size12.id}`)).status).toBe(409);

		const dup = await cutter.api('POST', `${base()}/${size12.id}/duplicate`, { name: 'Size 12, adjusted' });
		expect(dup.status).toBe(201);
		const copy = (await dup.json()).measurementSet;
		expect(copy).toMatchObject({ kind: 'client', kindLabel: 'custom', readOnly: false, name: 'Size 12, adjusted' });
		expect(copy.source).toMatch(/ASTM D5585-11e1.*size 12/);
		const edit = await cutter.api('PATCH', `${base()}/${copy.id}`, { values: { bust: 985, underbust: 826, waist: 781 } });
		expect(edit.status).toBe(200);
	});
});

describe('access', () => {
	it("another studio's set answers 404; a designer may read but not create (403)", async () => {
		const set = (await (await cutter.api('POST', base(), { ...clientBody, name: 'Private' })).json()).measurementSet;
		const foreign = `/api/studios/${otherStudioId}/measurement-sets/${set.id}`;
		expect((await outsider.api('GET', foreign)).status).toBe(404);
		expect((await outsider.api('PATCH', foreign, { name: 'x' })).status).toBe(404);
		expect((await outsider.api('DELETE', foreign)).status).toBe(404);
		expect((await outsider.api('POST', `${foreign}/duplicate`)).status).toBe(404);
		expect((await outsider.api('GET', `${base()}/${set.id}`)).status).toBe(404);

		expect((await designer.api('GET', `${base()}/${set.id}`)).status).toBe(200);
		const denied = await designer.api('POST', base(), clientBody);
		expect(denied.status).toBe(403);
		expect((await denied.json()).error.code).toBe('forbidden');
		expect((await designer.api('PATCH', `${base()}/${set.id}`, { name: 'x' })).status).toBe(403);
		expect((await designer.api('POST', `${base()}/${set.id}/duplicate`)).status).toBe(403);
	});
});

describe('drafting a block into a new style', () => {
	it('creates the style with Front and Back version 1 whose recipe records the set and the ease', async () => {
		const set = (await (await cutter.api('POST', base(), { ...clientBody, name: 'For drafting' })).json()).measurementSet;
		const r = await cutter.post(`/studios/${studioId}/styles/new`, {
			measurementSetId: set.id,
			name: 'Boned bodice',
			code: 'LR-210',
			season: 'AW27',
			easeBust: '50.8',
			easeWaist: '-40',
			easeUnderbust: '-20',
			bustDart: 'side',
			frontCut: 'pair',
			backCut: 'pair',
			underStructure: '4'
		});
		expect(r.status).toBe(303);
		const m = /\/studios\/[^/]+\/styles\/([0-9a-f-]{36})$/.exec(r.headers.get('location') ?? '');
		expect(m).not.toBeNull();
		const styleId = m![1];
		const overview = await (await cutter.api('GET', `/api/studios/${studioId}/styles/${styleId}`)).json();
		expect(overview.style.measurementSetId).toBe(set.id);
		const names = overview.pieces.map((p: { name: string }) => p.name);
		expect(names.slice(0, 2)).toEqual(['Front', 'Back']);
		expect(names).toHaveLength(4); // Front, Back and two under-structure panels (4 for the whole front)
		for (const p of overview.pieces) {
			expect(p.headNumber).toBe(1);
			const v = (await (await cutter.api('GET', `/api/studios/${studioId}/pieces/${p.id}/versions/${p.headVersionId}`)).json()).version;
			expect(v.number).toBe(1);
			expect(v.recipe[0].op).toBe('draft');
			expect(v.recipe[0].params.measurementSetId).toBe(set.id);
			expect(v.recipe[0].params.ease).toEqual({ bustMm: 50.8, waistMm: -40, underbustMm: -20 });
			expect(v.recipe[0].params.options).toMatchObject({ bustDart: 'side', frontCut: 'pair', underStructure: 4 });
		}
		const front = overview.pieces.find((p: { name: string }) => p.name === 'Front');
		expect(front.cut).toBe('pair');
		// the seam between the two panels is stored, sewn to match, and both panels mark where it parts
		expect(overview.seamPairs).toHaveLength(1);
		const sp = overview.seamPairs[0];
		const panelIds = overview.pieces.filter((p: { name: string }) => p.name.startsWith('Under-structure')).map((p: { id: string }) => p.id);
		expect([sp.aPieceId, sp.bPieceId]).toEqual(panelIds);
		expect(sp.label).toBe('panel seam A');
		expect(sp.allowedEaseMm).toBe(0);
		for (const id of panelIds) {
			const p = overview.pieces.find((x: { id: string }) => x.id === id);
			const v = (await (await cutter.api('GET', `/api/studios/${studioId}/pieces/${id}/versions/${p.headVersionId}`)).json()).version;
			expect(v.geometry.apexes.some((a: { kind: string }) => a.kind === 'divergence')).toBe(true);
		}
	});

	it('a draft that fails names the measurement that made it fail', async () => {
		// a waist of 300 cm with a 90 cm bust: a human size, confirmed, but no bodice block can be drawn from it
		const made = await cutter.api('POST', base(), { ...clientBody, name: 'Odd waist', values: { bust: '90', waist: '300' }, acceptWarnings: true });
		expect(made.status).toBe(201);
		const set = (await made.json()).measurementSet;
		const r = await cutter.post(`/studios/${studioId}/styles/new`, { measurementSetId: set.id, name: 'Odd', easeBust: '50', easeWaist: '30' });
		expect(r.status).toBe(422);
		expect(await r.text()).toContain('The draft fails because of the waist girth (300.0 cm)');
		// a set saved before such values were refused: drafting names the value no body measures
		const old = await cutter.api('POST', base(), { ...clientBody, name: 'Saved before the rule' });
		const oldId = (await old.json()).measurementSet.id as string;
		const row = await testDb().selectFrom('measurement_sets').select('values').where('id', '=', oldId).executeTakeFirstOrThrow();
		const values = (row.values as { id: string; valueMm: number }[]).map((v) => (v.id === 'waist' ? { ...v, valueMm: 50_000 } : v));
		await testDb().updateTable('measurement_sets').set({ values: JSON.stringify(values) }).where('id', '=', oldId).execute();
		const refused = await cutter.post(`/studios/${studioId}/styles/new`, { measurementSetId: oldId, name: 'Huge', easeBust: '50', easeWaist: '30' });
		expect(refused.status).toBe(422);
		expect(await refused.text()).toContain('Waist girth is 5000.0 cm: larger than any human body measures');
	});

	it('drafts from a chart too, refuses a designer, and answers 400 without a set', async () => {
		const list = (await (await cutter.api('GET', base())).json()).measurementSets as { id: string; kind: string }[];
		const chart = list.find((s) => s.kind === 'chart')!;
		const ok = await cutter.post(`/studios/${studioId}/styles/new`, { measurementSetId: chart.id, name: 'Chart block', easeBust: '50.8', easeWaist: '25.4' });
		expect(ok.status).toBe(303);
		const bad = await cutter.post(`/studios/${studioId}/styles/new`, { measurementSetId: '', name: 'No set', easeBust: '50.8', easeWaist: '25.4' });
		expect(bad.status).toBe(400);
		const denied = await designer.post(`/studios/${studioId}/styles/new`, { measurementSetId: chart.id, name: 'Nope', easeBust: '50.8', easeWaist: '25.4' });
		expect(denied.status).toBe(403);
		const stylesBefore = await testDb().selectFrom('styles').select('id').where('studio_id', '=', studioId).where('name', '=', 'Nope').execute();
		expect(stylesBefore).toHaveLength(0);
	});
});
