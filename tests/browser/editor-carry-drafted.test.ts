// A new user's path to the product's central move: draft a block with a 6-panel boned under-structure
// through the form, open the editor, carry the panel shaping into one underbust seam, save, reload.
// Nothing is seeded: the seam pairs and divergence points are the ones drafting stored.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { pathBoundingBox } from '../../src/lib/geometry';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { pageScreenshot } from './chromium';
import { clickOnPiece, dragOnPiece, editorBrowserUse, editorOpen, lerp, saveFromPanel, signUp } from './editor-helpers';

const readouts = (page: Page) => page.locator('[data-testid="tool-readouts"]').textContent();

/** Drafts a block with a boned under-structure through the form, from the size 10 chart row (ASTM D5585 misses, reference-values row 1, C). */
async function draftThroughTheForm(page: Page, baseUrl: string, studioId: string, panels: 4 | 6): Promise<string> {
	await page.goto(`${baseUrl}/studios/${studioId}/styles/new`);
	const setId = await page.$$eval('#measurementSetId option', (os) => {
		const all = os as HTMLOptionElement[];
		return (all.find((o) => /curvy/i.test(o.textContent ?? '') && /size 10$/.test(o.textContent ?? '')) ?? all.find((o) => /size 10$/.test(o.textContent ?? '')))?.value ?? '';
	});
	expect(setId).not.toBe('');
	await page.selectOption('#measurementSetId', setId);
	await page.fill('#name', `Boned bodice, ${panels} panels`);
	await page.fill('#easeWaist', '-40');
	await page.check(`input[name="underStructure"][value="${panels}"]`);
	await Promise.all([page.waitForURL(/\/styles\/[0-9a-f-]{36}$/, { timeout: 30_000 }), page.click('button[type=submit]')]);
	return /\/styles\/([0-9a-f-]{36})$/.exec(page.url())![1];
}

describe('carry on a style drafted in the test, from the interface', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('drafts a 6-panel under-structure, draws the underbust line, carries, saves, reloads and finds the band and the upper panels with their ledgers balanced', { timeout: 150_000 }, async () => {
		const { context, page } = await signUp(browser(), baseUrl());
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		const studioId = (await (await page.request.get(`${baseUrl()}/api/studios`)).json()).studios[0].id as string;

		const styleId = await draftThroughTheForm(page, baseUrl(), studioId, 6);
		const editorUrl = `${baseUrl()}/studios/${studioId}/styles/${styleId}/edit`;

		await editorOpen(page, editorUrl);
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('k');
		expect(await page.getAttribute('[data-tool="carry"]', 'aria-pressed')).toBe('true');
		// carry ticks the three panels of the row, in seam order, and nothing else
		const ticked = await page.locator('[data-testid="carry-panels"] input[type="checkbox"]:checked').evaluateAll((els) => els.map((e) => e.parentElement?.textContent?.trim() ?? ''));
		expect(ticked).toEqual(['Under-structure panel 1', 'Under-structure panel 2', 'Under-structure panel 3']);
		// ...and lays them as drafted, so one style line can be drawn across them
		const keys = await page.evaluate(() => ['Under-structure panel 1', 'Under-structure panel 2', 'Under-structure panel 3'].map((n) => window.dartelierEditor!.pieceNamed(n)!));
		const panels = (await page.evaluate((ks) => ks.map((k) => window.dartelierEditor!.geometry(k)), keys)) as Piece[];
		const placed = await page.evaluate((ks) => ks.map((k) => window.dartelierEditor!.toPage(k, { x: 0, y: 0 })), keys);
		for (const p of placed) expect(Math.hypot(p.x - placed[0].x, p.y - placed[0].y)).toBeLessThan(0.5);

		// the underbust line: below every divergence point the drafting marked, across every panel
		await page.keyboard.press('0');
		const boxes = panels.map((p) => pathBoundingBox(p.outline));
		const minX = Math.min(...boxes.map((b) => b.minX)) - 12;
		const maxX = Math.max(...boxes.map((b) => b.maxX)) + 12;
		const Ds = panels.flatMap((p) => p.apexes.filter((a) => a.kind === 'divergence').map((a) => a.point.y));
		expect(Ds.length).toBeGreaterThanOrEqual(2);
		const y = Math.max(...Ds) + 30;
		await dragOnPiece(page, keys[0], { x: minX, y }, { x: maxX, y }, 10);
		await expect.poll(() => readouts(page)).toContain('none: the line reaches every divergence point');
		await pageScreenshot(page, 'editor-carry-drafted');
		await page.keyboard.press('Enter');
		// Front, Back, the band below the line and the three parts above it
		await expect.poll(() => page.evaluate(() => window.dartelierEditor!.pieceKeys().length)).toBe(6);

		// one change through the change endpoint; each new piece is named on saving (none keeps a panel's label)
		const changes: number[] = [];
		page.on('response', (r) => {
			if (r.request().method() === 'POST' && r.url().endsWith('/changes')) changes.push(r.status());
		});
		await saveFromPanel(page, 'Panel shaping carried into the underbust seam', ['Midriff band', 'Upper front, centre', 'Upper front, middle', 'Upper front, side']);
		expect(await page.locator('[role="alert"]').count()).toBe(0);
		expect(changes).toEqual([201]);

		// reload: the band and the upper panels are there, every stored check passed, every ledger balanced
		await editorOpen(page, editorUrl);
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${studioId}/styles/${styleId}`)).json();
		const shown = (style.pieces as { id: string; name: string; shown: { checks: { passed: boolean }[] } | null }[]).filter((p) => p.shown);
		const made = shown.filter((p) => !['Front', 'Back'].includes(p.name) && !/^Under-structure panel \d$/.test(p.name));
		expect(made).toHaveLength(4);
		expect(made.map((p) => p.name).sort()).toEqual(['Midriff band', 'Upper front, centre', 'Upper front, middle', 'Upper front, side']);
		for (const p of made) expect(p.shown!.checks.filter((c) => !c.passed)).toEqual([]);
		const carried = (style.seamPairs as { label: string; aPieceId: string; bPieceId: string }[]).filter((sp) => sp.label.startsWith('style seam'));
		expect(carried).toHaveLength(3);
		const band = made.find((p) => carried.every((sp) => sp.aPieceId === p.id))!;
		expect(band).toBeTruthy();
		expect(new Set(carried.map((sp) => sp.bPieceId))).toEqual(new Set(made.filter((p) => p !== band).map((p) => p.id)));
		const visible = await page.evaluate(() => window.dartelierEditor!.pieceKeys());
		for (const p of made) expect(visible).toContain(p.id);
		for (const p of made) {
			await page.locator('section[aria-labelledby="pieces-title"] button', { hasText: p.name }).first().click();
			const states = await page.locator('[data-testid="ledger-state"]').allTextContents();
			expect(states.every((t) => t.startsWith('Balanced'))).toBe(true);
		}
		await pageScreenshot(page, 'editor-carry-drafted-reloaded');
		expect(problems).toEqual([]);
		await context.close();
	});
	it('unpairs a drafted seam, pairs it again by picking its edges, and marks the bust point of the front as a divergence point that the server replays', { timeout: 150_000 }, async () => {
		const { context, page } = await signUp(browser(), baseUrl());
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		const studioId = (await (await page.request.get(`${baseUrl()}/api/studios`)).json()).studios[0].id as string;
		const styleId = await draftThroughTheForm(page, baseUrl(), studioId, 4);
		const pairsUrl = `${baseUrl()}/api/studios/${studioId}/styles/${styleId}/seam-pairs`;
		await editorOpen(page, `${baseUrl()}/studios/${studioId}/styles/${styleId}/edit`);
		const [k1, k2, front] = await page.evaluate(() => ['Under-structure panel 1', 'Under-structure panel 2', 'Front'].map((n) => window.dartelierEditor!.pieceNamed(n)!));

		// the seams of a piece are listed beside it; unpairing removes the pair from the style
		await page.locator('section[aria-labelledby="pieces-title"] button', { hasText: 'Under-structure panel 1' }).click();
		await expect.poll(() => page.getByTestId('piece-seam-pairs').textContent()).toContain('panel seam A — sewn to Under-structure panel 2');
		await page.getByTestId('piece-seam-pairs').getByRole('button', { name: 'Unpair' }).click();
		await expect.poll(async () => (await (await page.request.get(pairsUrl)).json()).seamPairs.length).toBe(0);
		await expect.poll(() => page.getByTestId('piece-seam-pairs').textContent()).toContain('No seam of this piece is paired yet');

		// pair it again: the Join tool, two ends of the seam edge on each panel, then "Pair these seams"
		const g1 = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), k1)) as Piece;
		const g2 = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), k2)) as Piece;
		const D = g1.apexes.find((a) => a.kind === 'divergence')!.point;
		// each panel's seam: from its waist corner up through D to the shoulder (the corner next to D on each side)
		const seamEnds = (g: Piece) => {
			const segs = g.outline.segments;
			const i = segs.findIndex((q) => Math.hypot(q.p0.x - D.x, q.p0.y - D.y) < 1e-6);
			const before = segs[(i - 1 + segs.length) % segs.length].p0;
			const after = segs[i].kind === 'line' ? segs[i].p1 : segs[i].p3;
			return before.y > after.y ? { waist: before, top: after } : { waist: after, top: before };
		};
		const e1 = seamEnds(g1);
		const e2 = seamEnds(g2);
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('j');
		await page.selectOption('#seam-pair', '');
		await clickOnPiece(page, k1, lerp(e1.waist, D, 0.02));
		await clickOnPiece(page, k1, lerp(D, e1.top, 0.98));
		await clickOnPiece(page, k2, lerp(e2.waist, D, 0.02));
		await clickOnPiece(page, k2, lerp(D, e2.top, 0.98));
		await page.fill('#pair-label', 'side front seam');
		await page.click('button:has-text("Pair these seams")');
		await expect.poll(async () => (await (await page.request.get(pairsUrl)).json()).seamPairs.map((x: { label: string }) => x.label)).toEqual(['side front seam']);
		await pageScreenshot(page, 'editor-seams-paired');
		// carry finds the row again through the new pair
		await page.keyboard.press('Escape');
		await page.keyboard.press('Escape');
		await page.keyboard.press('k');
		const ticked = await page.locator('[data-testid="carry-panels"] input[type="checkbox"]:checked').evaluateAll((els) => els.map((e) => e.parentElement?.textContent?.trim() ?? ''));
		expect(ticked).toEqual(['Under-structure panel 1', 'Under-structure panel 2']);
		await page.keyboard.press('Escape');
		await page.keyboard.press('Escape');

		// the bust point of the front lies on its outline (both darts are cut to it): mark it, save, the server replays the step
		await page.locator('section[aria-labelledby="pieces-title"] button', { hasText: /^Front/ }).click();
		await page.getByRole('button', { name: 'Mark as a divergence point' }).first().click();
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Divergence point');
		const marked = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), front)) as Piece;
		expect(marked.apexes.find((a) => a.label === 'BP')?.kind).toBe('divergence');
		await page.fill('#save-message', 'Bust point marked as a divergence point');
		await page.click('button:has-text("Save version")');
		await page.waitForSelector('[data-testid="save-report"]', { timeout: 30_000 });
		expect(await page.locator('[data-testid="save-report"]').textContent()).toContain('version 2 saved');
		expect(problems).toEqual([]);
		await context.close();
	});
});
