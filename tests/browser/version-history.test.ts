import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { pivot } from '../../src/lib/pattern/operations/pivot';
import { browserLaunch, pageScreenshot } from './chromium';
import { signUp, styleWithPieces } from './editor-helpers';

const block = frontBodiceBlock();
const pivotParams = { dartId: 'shoulder-dart', to: { x: 235 - 10 / 3, y: 300 } };

describe('a piece history: open a version, compare it with the head', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('opens version 1 from the history, read only with its checks and ledger, and compares it with the head by named sewn seams, flagging nothing after a pivot', async () => {
		const baseUrl = inject('baseUrl');
		const { context, page } = await signUp(browser, baseUrl);
		const { studioId, styleId, pieceIds } = await styleWithPieces(page, baseUrl, [{ name: 'Front bodice', geometry: block }], 'History bodice');
		const api = `${baseUrl}/api/studios/${studioId}/pieces/${pieceIds[0]}`;
		const v1 = (await (await page.request.get(`${api}/versions`)).json()).versions[0].id as string;
		const moved = pivot(block, pivotParams);
		if (!moved.ok) throw new Error(moved.error.message);
		const saved = await page.request.post(`${api}/versions`, {
			data: { baseVersionId: v1, message: 'Shoulder dart turned to the side seam', geometry: moved.piece, recipe: [{ op: 'pivot', params: pivotParams }] }
		});
		expect(saved.ok()).toBe(true);
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));

		// the history on the style page: each line opens its version
		await page.goto(`${baseUrl}/studios/${studioId}/styles/${styleId}`);
		await page.getByText('History (2 versions)').click();
		await page.getByRole('link', { name: 'v1', exact: true }).click();
		await page.getByTestId('version-page').waitFor();
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('version 1');
		expect(await page.getByTestId('read-only').textContent()).toContain('Read only');
		// version 1 was drafted: its checks are listed; nothing was moved in it
		expect(await page.getByText('Shaping ledger of this version').isVisible()).toBe(true);
		expect(await page.getByRole('img', { name: 'Front bodice, version 1' }).isVisible()).toBe(true);
		await pageScreenshot(page, 'version-1-read-only');

		// version 2 (the head) has the pivot's ledger and its checks
		await page.getByRole('link', { name: 'v2 →' }).click();
		await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('version 2');
		expect(await page.getByTestId('read-only').textContent()).toContain('the head version');
		expect(await page.getByTestId('ledger').locator('tbody tr').count()).toBeGreaterThanOrEqual(2);
		expect(await page.getByTestId('checks-summary').textContent()).toMatch(/All \d+ checks passed/);

		// back to version 1, then compare it with the head
		await page.getByRole('link', { name: '← v1' }).click();
		await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('version 1');
		await page.getByRole('link', { name: /Compare with the head \(v2\)/ }).click();
		await page.getByTestId('compare-verdict').waitFor();
		await pageScreenshot(page, 'compare-with-head');
		const labels = await page.locator('tr[data-group="seam"] td:first-child').allTextContents();
		expect(labels).toEqual(expect.arrayContaining(['Side seam', 'Armhole', 'Shoulder', 'Waist', 'Neckline']));
		expect(labels.some((l) => /^Seam \d/.test(l))).toBe(false);
		expect(await page.getByText('Perimeter').count()).toBe(0);
		expect(await page.locator('tr[data-flagged="true"]').count()).toBe(0);
		expect(await page.getByTestId('compare-verdict').textContent()).toContain('Nothing here a pattern cutter needs to check');
		expect(await page.getByTestId('compare-thresholds').textContent()).toContain('common practice');
		// long version messages stay inside their chooser: the page never scrolls sideways
		const overflowPx = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
		expect(overflowPx).toBeLessThanOrEqual(0);
		expect(problems).toEqual([]);
		await context.close();
	});
});
