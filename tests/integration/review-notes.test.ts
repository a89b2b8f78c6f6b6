// The review of a version (propose, withdraw, sign off with acknowledgements, send back), its comment
// thread, fit notes pinned to a piece version (open → in hand → done by a later version), and the
// e-mails each step sends (read from the in-process fake SMTP server), with the per-user settings.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { recipeStepApply } from '../../src/lib/pattern/recipe/registry';
import { startApp, type RunningApp } from './app-server';
import { fittingWorld, storageEnvUse, type FittingWorld } from './fittings-support';
import { testDbClose } from './helpers';

let app: RunningApp;
let w: FittingWorld;

beforeAll(async () => {
	storageEnvUse();
	app = await startApp();
	w = await fittingWorld(app.baseUrl, 'Review');
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const api = () => `/api/studios/${w.studioId}`;
const state = (v: string) => `${api()}/pieces/${w.pieceId}/versions/${v}/state`;

/** A new draft version of the piece (its grainline drawn again), saved by the cutter on the current head. */
let drafts = 0;
async function draft(message: string): Promise<{ id: string; number: number }> {
	const head = (await (await w.as.patterncutter.api('GET', `${api()}/pieces/${w.pieceId}`)).json()).piece;
	const base = (await (await w.as.patterncutter.api('GET', `${api()}/pieces/${w.pieceId}/versions/${head.headVersionId}`)).json()).version.geometry;
	drafts += 1;
	const step = { op: 'grain', params: { through: { x: 120, y: 250 }, lengthMm: 100 + drafts } };
	const r0 = recipeStepApply(base ?? frontBodiceBlock(), step);
	if (!r0.ok) throw new Error(r0.error.message);
	const r = await w.as.patterncutter.api('POST', `${api()}/pieces/${w.pieceId}/versions`, { baseVersionId: head.headVersionId, message, geometry: r0.piece, recipe: [step] });
	const body = await r.json();
	expect(r.status, JSON.stringify(body)).toBe(201);
	return body.version;
}

describe('the review of a version', () => {
	it('signs off only a proposed version: a draft is refused, saying it must be proposed first', async () => {
		const v = await draft('let out at the side seam');
		const r = await w.as.designer.api('POST', state(v.id), { action: 'sign_off' });
		expect(r.status).toBe(409);
		expect((await r.json()).error).toMatchObject({ code: 'not_proposed', message: expect.stringMatching(/only a proposed version can be signed off.*proposes it first/) });
	});

	it('asks the signers to review a proposal by e-mail, linking to the exact version', async () => {
		app.mailbox.messages.length = 0;
		const v = await draft('band lengthened 8 mm');
		expect((await w.as.patterncutter.api('POST', state(v.id), { action: 'propose', comment: 'Please check the band.' })).status).toBe(200);
		for (const who of [w.users.designer, w.users.owner]) {
			const m = await app.mailbox.waitFor(who.email);
			expect(m.subject).toMatch(new RegExp(`Review: Midriff band version ${v.number}`));
			expect(m.links).toContain(`${app.baseUrl}/studios/${w.studioId}/styles/${w.styleId}/pieces/${w.pieceId}/versions/${v.id}`);
		}
		const thread = (await (await w.as.designer.api('GET', `${api()}/pieces/${w.pieceId}/versions/${v.id}/comments`)).json()).comments;
		expect(thread.map((c: { body: string }) => c.body)).toEqual(['Please check the band.']);
	});

	it('sends a proposal back with a reason (to draft), recorded, and tells the author', async () => {
		const v = await draft('shortened');
		await w.as.patterncutter.api('POST', state(v.id), { action: 'propose' });
		const noReason = await w.as.designer.api('POST', state(v.id), { action: 'send_back', reason: '  ' });
		expect(noReason.status).toBe(400);
		app.mailbox.messages.length = 0;
		expect((await w.as.designer.api('POST', state(v.id), { action: 'send_back', reason: 'The band rides up at centre front.' })).status).toBe(200);
		const m = await app.mailbox.waitFor(w.users.patterncutter.email);
		expect(m.subject).toMatch(/sent back/);
		expect(m.text).toContain('Reason: The band rides up at centre front.');
		const review = await (await w.as.patterncutter.api('GET', `${api()}/pieces/${w.pieceId}/versions/${v.id}/review`)).json();
		expect(review.state).toBe('draft');
		expect(review.reviews.map((r: { kind: string; comment: string }) => [r.kind, r.comment])).toEqual([
			['proposed', ''],
			['sent_back', 'The band rides up at centre front.']
		]);
	});

	it('lets the author withdraw a proposal, not another editor', async () => {
		const v = await draft('to withdraw');
		await w.as.patterncutter.api('POST', state(v.id), { action: 'propose' });
		const other = await w.as.owner.api('POST', state(v.id), { action: 'withdraw' });
		expect(other.status).toBe(403);
		expect((await other.json()).error.message).toMatch(/Only the author/);
		expect((await w.as.patterncutter.api('POST', state(v.id), { action: 'withdraw' })).status).toBe(200);
		expect((await w.as.designer.api('POST', state(v.id), { action: 'sign_off' })).status).toBe(409);
	});

	it('keeps each e-mail kind off for a user who turned it off', async () => {
		const off = await w.as.designer.api('PATCH', '/api/me/notifications', { version_proposed: false });
		expect((await off.json()).notifications).toEqual({ version_proposed: false, version_reviewed: true, fit_note_assigned: true });
		app.mailbox.messages.length = 0;
		const v = await draft('quiet proposal');
		await w.as.patterncutter.api('POST', state(v.id), { action: 'propose' });
		await app.mailbox.waitFor(w.users.owner.email);
		expect(app.mailbox.messages.some((m) => m.to.includes(w.users.designer.email.toLowerCase()))).toBe(false);
		await w.as.designer.api('PATCH', '/api/me/notifications', { version_proposed: true });
		await w.as.patterncutter.api('POST', state(v.id), { action: 'withdraw' });
	});
});

describe('fit notes pinned to the pattern', () => {
	it('pins a note, mails the assigned pattern cutter, asks the signer to acknowledge it, and is done by a later version', async () => {
		const fitting = (
			await (await w.as.sampleroom.api('POST', `${api()}/styles/${w.styleId}/fittings`, { fittedOn: '2026-12-03', title: 'Second fitting', fitModel: 'Fit model A' })).json()
		).fitting;
		// the sample room sees signed-off versions only: it pins on version 1
		const pinned = { headVersionId: w.v1, headNumber: 1 };
		app.mailbox.messages.length = 0;
		const r = await w.as.sampleroom.api('POST', `${api()}/fittings/${fitting.id}/notes`, {
			pieceId: w.pieceId,
			versionId: pinned.headVersionId,
			xMm: 120,
			yMm: 260,
			category: 'too_tight',
			amountMm: 6,
			body: 'let out 6 mm at the side seam, waist level',
			assignedTo: w.users.patterncutter.id
		});
		expect(r.status).toBe(201);
		const { note } = await r.json();
		expect(note).toMatchObject({ status: 'open', category: 'too_tight', amountMm: 6, versionNumber: pinned.headNumber });
		const m = await app.mailbox.waitFor(w.users.patterncutter.email);
		expect(m.subject).toBe('Fit note on Midriff band: too tight');
		expect(m.links).toContain(`${app.baseUrl}/studios/${w.studioId}/fittings/${fitting.id}#note-${note.id}`);

		const notePath = `${api()}/fittings/${fitting.id}/notes/${note.id}`;
		expect((await w.as.patterncutter.api('PATCH', notePath, { status: 'in_hand' })).status).toBe(200);
		// a later version, proposed: the open note shows on it and must be acknowledged
		const v = await draft('let out 6 mm at the side seam');
		await w.as.patterncutter.api('POST', state(v.id), { action: 'propose' });
		const shows = (await (await w.as.designer.api('GET', `${api()}/pieces/${w.pieceId}/fit-notes?versionId=${v.id}`)).json()).notes;
		expect(shows.map((n: { id: string }) => n.id)).toEqual([note.id]);
		const refused = await w.as.designer.api('POST', state(v.id), { action: 'sign_off' });
		expect(refused.status).toBe(409);
		expect((await refused.json()).error.fields.acknowledged).toEqual([`note:${note.id}`]);
		// only the pattern cutter or the owner marks it done, and only by a later version
		expect((await w.as.sampleroom.api('POST', `${notePath}/done`, { versionId: v.id })).status).toBe(403);
		const same = await w.as.patterncutter.api('POST', `${notePath}/done`, { versionId: pinned.headVersionId });
		expect(same.status).toBe(409);
		expect((await same.json()).error.message).toMatch(/resolved by a later version/);
		const done = await w.as.patterncutter.api('POST', `${notePath}/done`, { versionId: v.id });
		expect(done.status).toBe(200);
		expect((await done.json()).note).toMatchObject({ status: 'done', resolvedVersionNumber: v.number });
		// done: no longer on the resolving version, still on the one it was pinned on
		expect((await (await w.as.designer.api('GET', `${api()}/pieces/${w.pieceId}/fit-notes?versionId=${v.id}`)).json()).notes).toEqual([]);
		expect((await (await w.as.designer.api('GET', `${api()}/pieces/${w.pieceId}/fit-notes?versionId=${pinned.headVersionId}`)).json()).notes).toHaveLength(1);
		expect((await w.as.designer.api('POST', state(v.id), { action: 'sign_off', comment: 'Fits now.' })).status).toBe(200);
		const signedMail = await app.mailbox.waitFor(w.users.patterncutter.email);
		expect(signedMail.subject).toBe(`Midriff band version ${v.number} signed off`);
	});

	it('refuses a note on a piece of another style, an unknown category, or an assignee who is not a pattern cutter', async () => {
		const fitting = (await (await w.as.sampleroom.api('POST', `${api()}/styles/${w.styleId}/fittings`, { fittedOn: '2026-12-03', title: 'Checks', fitModel: 'A' })).json()).fitting;
		const path = `${api()}/fittings/${fitting.id}/notes`;
		const base = { pieceId: w.pieceId, versionId: w.v1, xMm: 1, yMm: 2, body: 'x' };
		expect((await w.as.designer.api('POST', path, { ...base, category: 'baggy' })).status).toBe(400);
		expect((await w.as.designer.api('POST', path, { ...base, category: 'other', pieceId: crypto.randomUUID() })).status).toBe(404);
		const r = await w.as.designer.api('POST', path, { ...base, category: 'other', assignedTo: w.users.sampleroom.id });
		expect(r.status).toBe(400);
		expect((await r.json()).error.fields.assignedTo[0]).toMatch(/pattern cutter or the owner/);
	});
});
