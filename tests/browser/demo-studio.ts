// The demo studio of our own scenario (fixtures/demo-studio.json), seeded into the test database for
// browser tests that look at the app in each role's view, and a sign-in as one of its people.
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, inject } from 'vitest';
import { browserLaunch } from './chromium';
import billing from '../../fixtures/demo-billing.json';
import demo from '../../fixtures/demo-studio.json';
import { dbCreate } from '../../src/lib/server/db/index';
import type { Role } from '../../src/lib/roles';
import { measurementSetDuplicate } from '../../src/lib/server/measurements/sets';
import { usersByEmail } from '../../src/lib/server/repositories/users';
import { sizeRunsInsert } from '../../src/lib/server/repositories/size-runs';
import { sizeRunExecute } from '../../src/lib/server/size-runs/run';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { DEMO_STYLE } from '../../src/lib/pattern/fixtures/demo-path';
import { demoSizeSet } from './demo-size-set';

export interface DemoStudio {
	studioId: string;
	styleId: string;
	/** a signed-off version of one of its pieces (every role, the sample room included, may open it) */
	signedOff: { pieceId: string; versionId: string };
	/** measurement sets: a chart row and another, for the set pages and compare */
	setIds: [string, string];
	/** a client set (editable, unlike the charts) */
	clientSetId: string;
	/** the demo style's first fitting (photos, two notes) */
	fittingId: string;
	/** a size run of the demo style over three chart sizes (made at once for the pages, not put on the queue) */
	sizeRunId: string;
	/** a size set of the demo style (two chart sizes, the first signed off: every role may open it) */
	sizeSetId: string;
	users: { email: string; name: string; role: Role }[];
	password: string;
	/** the second demo studio, on the free Sketch plan, and its people (same password) */
	sketch: { studioId: string; users: { email: string; name: string; role: Role }[] };
}

/** Seeds the demo studio (idempotent) and finds the ids its pages need. */
export async function demoStudio(databaseUrl: string): Promise<DemoStudio> {
	const db = dbCreate(databaseUrl, 2);
	try {
		const { studioId, sketchStudioId } = await demoStudioSeed(db);
		// the demo style by its code: the test database outlives runs, and other styles of the studio may be older
		const style = await db.selectFrom('styles').select('id').where('studio_id', '=', studioId).where('code', '=', DEMO_STYLE.code).orderBy('created_at').executeTakeFirstOrThrow();
		const signed = await db
			.selectFrom('piece_versions')
			.innerJoin('pieces', 'pieces.id', 'piece_versions.piece_id')
			.select(['pieces.id as pieceId', 'piece_versions.id as versionId'])
			.where('pieces.style_id', '=', style.id)
			.where('piece_versions.state', '=', 'signed_off')
			.executeTakeFirstOrThrow();
		const sets = await db.selectFrom('measurement_sets').select('id').where('studio_id', '=', studioId).orderBy('id').limit(2).execute();
		if (sets.length < 2) throw new Error('the demo studio has fewer than two measurement sets');
		const NAME = 'Fitting copy for the page checks';
		let client = await db.selectFrom('measurement_sets').select('id').where('studio_id', '=', studioId).where('name', '=', NAME).executeTakeFirst();
		if (!client) {
			const cutter = await usersByEmail(db, demo.users.find((u) => u.role === 'patterncutter')!.email);
			client = await measurementSetDuplicate(db, studioId, sets[0].id, cutter!.id, NAME);
		}
		let run = await db.selectFrom('size_runs').select('id').where('style_id', '=', style.id).orderBy('created_at').executeTakeFirst();
		if (!run) {
			const cutter = await usersByEmail(db, demo.users.find((u) => u.role === 'patterncutter')!.email);
			const chart = await db
				.selectFrom('measurement_sets')
				.select(['id', 'name'])
				.where('studio_id', '=', studioId)
				.where('chart_key', 'in', ['astm-d5585/curvy/8', 'astm-d5585/curvy/12', 'astm-d5585/curvy/14'])
				.execute();
			const sizes = chart.length > 0 ? chart.map((c) => ({ measurementSetId: c.id, name: c.name })) : [{ measurementSetId: sets[0].id, name: 'first set' }];
			run = await sizeRunsInsert(db, { studioId, styleId: style.id, createdBy: cutter!.id, sizes });
		}
		// made here, not through the queue, so that the run's page shows its nest and table to every check
		const stored = await db.selectFrom('size_runs').select('status').where('id', '=', run.id).executeTakeFirstOrThrow();
		if (stored.status === 'queued') await sizeRunExecute(db, run.id);
		const fitting = await db.selectFrom('fittings').select('id').where('style_id', '=', style.id).orderBy('created_at').executeTakeFirstOrThrow();
		const sizeSetId = await demoSizeSet(db, studioId, style.id);
		return {
			studioId,
			fittingId: fitting.id,
			sizeRunId: run.id,
			sizeSetId,
			styleId: style.id,
			signedOff: signed,
			setIds: [sets[0].id, sets[1].id],
			clientSetId: client.id,
			users: demo.users as DemoStudio['users'],
			password: demo.password,
			sketch: { studioId: sketchStudioId, users: billing.sketch.users as DemoStudio['users'] }
		};
	} finally {
		await db.destroy();
	}
}

/** A fresh browser context signed in as the demo studio's member with this role. */
export async function demoSignIn(
	browser: Browser,
	baseUrl: string,
	studio: DemoStudio,
	role: Role,
	options: Parameters<Browser['newContext']>[0] = {}
): Promise<{ context: BrowserContext; page: Page }> {
	const user = studio.users.find((u) => u.role === role);
	if (!user) throw new Error(`the demo studio has no ${role}`);
	return demoSignInAs(browser, baseUrl, user.email, studio.password, options);
}

/** A fresh browser context signed in as one of the demo's people, by e-mail. */
export async function demoSignInAs(
	browser: Browser,
	baseUrl: string,
	email: string,
	password: string,
	options: Parameters<Browser['newContext']>[0] = {}
): Promise<{ context: BrowserContext; page: Page }> {
	const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, ...options });
	const page = await context.newPage();
	const r = await page.request.post(`${baseUrl}/signin`, {
		form: { email, password },
		headers: { origin: baseUrl, accept: 'text/html' },
		maxRedirects: 0
	});
	if (r.status() !== 303) throw new Error(`sign-in as ${email} failed: ${r.status()}`);
	return { context, page };
}

/**
 * For a describe block that looks at the demo studio: launches the browser and seeds the studio before
 * its tests, closes the browser after them. Read `browser()` and `demo()` inside the tests.
 */
export function demoBrowserUse(): { browser: () => Browser; demo: () => DemoStudio; baseUrl: () => string } {
	let browser: Browser | undefined;
	let studio: DemoStudio | undefined;
	beforeAll(async () => {
		browser = await browserLaunch();
		studio = await demoStudio(inject('databaseUrl'));
	});
	afterAll(async () => {
		await browser?.close();
	});
	return { browser: () => browser!, demo: () => studio!, baseUrl: () => inject('baseUrl') };
}
