// Shared set-up for the editor's browser tests: the browser for a describe block, a fresh user with a
// studio, a style and pieces made through the API (or the demo style), and helpers to reach points of a
// piece on the canvas.
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, inject } from 'vitest';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { dbCreate } from '../../src/lib/server/db/index';
import { demoStyleSeed } from '../../src/lib/server/seed/demo-style';
import { browserLaunch } from './chromium';

/**
 * For a describe block of editor tests: launches the browser before its tests and closes it after (as
 * `demoBrowserUse` does for the demo studio's pages). Read `browser()` and `baseUrl()` inside the tests.
 */
export function editorBrowserUse(): { browser: () => Browser; baseUrl: () => string } {
	let browser: Browser | undefined;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});
	return { browser: () => browser!, baseUrl: () => inject('baseUrl') };
}

/** The demo style seeded into the signed-in user's own studio, as a new user finds it, and its editor's address. */
export async function demoStyleInOwnStudio(page: Page, baseUrl: string): Promise<{ studioId: string; styleId: string; editorUrl: string }> {
	const me = await (await page.request.get(`${baseUrl}/api/me`)).json();
	const studioId = me.memberships[0].studioId as string;
	const db = dbCreate(inject('databaseUrl'), 2);
	const { styleId } = await demoStyleSeed(db, studioId, { patterncutter: me.user.id, designer: me.user.id }).finally(() => db.destroy());
	return { studioId, styleId, editorUrl: `${baseUrl}/studios/${studioId}/styles/${styleId}/edit` };
}

export interface EditorFixture {
	context: BrowserContext;
	page: Page;
	studioId: string;
	styleId: string;
	pieceIds: string[];
	editorUrl: string;
}

let counter = 0;

export async function signUp(browser: Browser, baseUrl: string): Promise<{ context: BrowserContext; page: Page }> {
	const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
	const page = await context.newPage();
	const id = `${Date.now().toString(36)}-${process.pid}-${counter++}`;
	// the sign-up form's action, posted as the browser would (same origin)
	const r = await page.request.post(`${baseUrl}/signup`, {
		form: { name: 'Edith Cutter', email: `editor-${id}@test.example`, password: 'linden-editor-2026', studioName: `Editor studio ${id}` },
		headers: { origin: baseUrl },
		maxRedirects: 0
	});
	if (r.status() >= 400) throw new Error(`sign-up failed: ${r.status()} ${await r.text()}`);
	const me = await page.request.get(`${baseUrl}/api/me`);
	if (!me.ok()) throw new Error(`not signed in after sign-up: ${me.status()} ${(await r.text()).slice(0, 300)}`);
	return { context, page };
}

export async function styleWithPieces(page: Page, baseUrl: string, pieces: readonly { name: string; geometry: Piece }[], styleName = 'Editor test bodice') {
	const post = async (url: string, data: unknown) => {
		const r = await page.request.post(`${baseUrl}${url}`, { data });
		if (!r.ok()) throw new Error(`${url}: ${r.status()} ${await r.text()}`);
		return r.json();
	};
	// the studio the sign-up made (the free plan includes one studio per owner)
	const mine = await page.request.get(`${baseUrl}/api/studios`);
	const owned = ((await mine.json()).studios as { id: string; role: string }[]).find((x) => x.role === 'owner');
	const studio = owned ?? (await post('/api/studios', { name: 'Editor tests' })).studio;
	const style = (await post(`/api/studios/${studio.id}/styles`, { name: styleName })).style;
	const pieceIds: string[] = [];
	for (const p of pieces) {
		const r = await post(`/api/studios/${studio.id}/styles/${style.id}/pieces`, { name: p.name, geometry: p.geometry, origin: { op: 'draft' } });
		pieceIds.push(r.piece.id);
	}
	return { studioId: studio.id as string, styleId: style.id as string, pieceIds };
}

export async function editorSetUp(browser: Browser, baseUrl: string, pieces: readonly { name: string; geometry: Piece }[]): Promise<EditorFixture> {
	const { context, page } = await signUp(browser, baseUrl);
	const s = await styleWithPieces(page, baseUrl, pieces);
	const editorUrl = `${baseUrl}/studios/${s.studioId}/styles/${s.styleId}/edit`;
	return { context, page, ...s, editorUrl };
}

export async function editorOpen(page: Page, url: string): Promise<void> {
	await page.goto(url);
	await page.waitForSelector('[data-testid="editor"][data-loaded="true"]', { timeout: 20_000 });
	await page.waitForFunction(() => (window.dartelierEditor?.pieceKeys().length ?? 0) > 0);
}

/** Page coordinates of a point of a piece (mm in the piece's own coordinates). */
export async function toPage(page: Page, pieceKey: string, p: { x: number; y: number }) {
	return page.evaluate(([k, q]) => window.dartelierEditor!.toPage(k as string, q as { x: number; y: number }), [pieceKey, p] as const);
}

export async function firstKey(page: Page): Promise<string> {
	return page.evaluate(() => window.dartelierEditor!.pieceKeys()[0]);
}

/** Drag on the canvas from one piece point to another in small steps, like a hand would. */
export async function dragOnPiece(page: Page, key: string, from: { x: number; y: number }, to: { x: number; y: number }, steps = 12) {
	const a = await toPage(page, key, from);
	const b = await toPage(page, key, to);
	await page.mouse.move(a.x, a.y);
	await page.mouse.down();
	await page.mouse.move(a.x + 4, a.y + 4);
	await page.mouse.move(b.x, b.y, { steps });
	await page.mouse.up();
}

export async function clickOnPiece(page: Page, key: string, p: { x: number; y: number }) {
	const a = await toPage(page, key, p);
	await page.mouse.click(a.x, a.y);
}

export const lerp = (a: { x: number; y: number }, b: { x: number; y: number }, t: number) => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });

/**
 * Saves from the Save panel; when the save makes new pieces (separate, join, carry), the naming dialog
 * asks for each one's name and cut: `names` are typed in (else the suggested names get " (new)" added,
 * as a new piece may not keep a name of a piece it was made from). Waits for the reports.
 */
export async function saveFromPanel(page: Page, message: string, names?: readonly string[]): Promise<void> {
	await page.fill('#save-message', message);
	await page.click('button:has-text("Save version")');
	const dialog = page.locator('[data-testid="new-pieces"]');
	const report = page.locator('[data-testid="save-report"]');
	await Promise.race([dialog.waitFor({ timeout: 20_000 }), report.first().waitFor({ timeout: 20_000 })]);
	if (await dialog.count()) {
		const inputs = dialog.locator('input[name^="new-piece-name-"]');
		for (let i = 0; i < (await inputs.count()); i++) {
			const input = inputs.nth(i);
			await input.fill(names?.[i] ?? `${await input.inputValue()} (new)`);
		}
		await dialog.locator('button:has-text("Save the change")').click();
		await report.first().waitFor({ timeout: 20_000 });
	}
	// the button says "Saving…" until the last piece is stored
	await page.waitForSelector('button:has-text("Save version")', { timeout: 20_000 });
}
