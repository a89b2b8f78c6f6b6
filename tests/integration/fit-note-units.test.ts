// Fit-note amounts are stored in mm and shown in the measurement set's unit (the fitted client's set,
// else the style's): on the fitting page, the style page's pins and the version page, and in the API
// the editor's overlay reads. Inches are fractions to the nearest sixteenth (units.ts, lengthReadoutText).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type RunningApp } from './app-server';
import { fittingWorld, storageEnvUse, type FittingWorld } from './fittings-support';
import { testDbClose } from './helpers';

let app: RunningApp;
let w: FittingWorld;

beforeAll(async () => {
	storageEnvUse();
	app = await startApp();
	w = await fittingWorld(app.baseUrl, 'Units');
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const api = () => `/api/studios/${w.studioId}`;

/** A fitting of the style (on a client set in `unit`, or on a fit model) with one note of `amountMm`. */
async function fittingWithNote(unit: 'in' | 'cm' | null, amountMm: number) {
	let measurementSetId: string | null = null;
	if (unit) {
		const set = await w.as.patterncutter.api('POST', `${api()}/measurement-sets`, {
			name: `Client in ${unit}`,
			unit,
			values: { bust: '92.5 cm', underbust: '76 cm', waist: '71 cm' }
		});
		const made = await set.json();
		expect(set.status, JSON.stringify(made)).toBe(201);
		measurementSetId = made.measurementSet.id;
	}
	const body = { fittedOn: '2026-12-03', title: `Fitting ${unit ?? 'on the form'}`, ...(measurementSetId ? { measurementSetId } : { fitModel: 'Fit model A' }), versionIds: [w.v1] };
	const f = await w.as.sampleroom.api('POST', `${api()}/styles/${w.styleId}/fittings`, body);
	expect(f.status).toBe(201);
	const fitting = (await f.json()).fitting;
	const n = await w.as.designer.api('POST', `${api()}/fittings/${fitting.id}/notes`, {
		pieceId: w.pieceId,
		versionId: w.v1,
		xMm: 120,
		yMm: 260,
		category: 'too_tight',
		amountMm,
		body: `note of the ${unit ?? 'mm'} fitting`
	});
	expect(n.status).toBe(201);
	return { fitting, note: (await n.json()).note };
}

describe('fit-note amounts in the measurement set\'s unit', () => {
	it('shows a note of a client measured in inches in sixteenths on the fitting page, the style page and the version page', async () => {
		// 3/16 in = 4.7625 mm; 5 mm rounds to the same sixteenth
		const { fitting, note } = await fittingWithNote('in', 5);
		expect(note).toMatchObject({ amountMm: 5, unit: 'in' });
		const fittingPage = await (await w.as.patterncutter.get(`/studios/${w.studioId}/fittings/${fitting.id}`)).text();
		expect(fittingPage).toContain('too tight, let out 3/16 in');
		// the form takes amounts in the same unit
		expect(fittingPage).toMatch(/aria-label="Amount in inches"/);
		const stylePage = await (await w.as.patterncutter.get(`/studios/${w.studioId}/styles/${w.styleId}`)).text();
		expect(stylePage).toContain('too tight, let out 3/16 in');
		const versionPage = await (await w.as.patterncutter.get(`/studios/${w.studioId}/styles/${w.styleId}/pieces/${w.pieceId}/versions/${w.v1}`)).text();
		expect(versionPage).toContain('too tight, let out 3/16 in');
		// the editor's overlay reads the notes (with their unit) from the API
		const fromApi = (await (await w.as.patterncutter.api('GET', `${api()}/pieces/${w.pieceId}/fit-notes`)).json()).notes;
		expect(fromApi.find((n: { id: string }) => n.id === note.id)).toMatchObject({ amountMm: 5, unit: 'in' });
	});

	it('shows a note of a client measured in centimetres in centimetres, and one fitted on a form (no set) in millimetres', async () => {
		const cm = await fittingWithNote('cm', -3.5);
		expect(cm.note.unit).toBe('cm');
		const cmPage = await (await w.as.patterncutter.get(`/studios/${w.studioId}/fittings/${cm.fitting.id}`)).text();
		expect(cmPage).toContain('too tight, take in 0.35 cm');
		const form = await fittingWithNote(null, 6);
		expect(form.note.unit).toBe('mm');
		const formPage = await (await w.as.patterncutter.get(`/studios/${w.studioId}/fittings/${form.fitting.id}`)).text();
		expect(formPage).toContain('too tight, let out 6.0 mm');
		expect(formPage).toMatch(/aria-label="Amount in millimetres"/);
	});
});
