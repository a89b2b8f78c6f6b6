// A size run from the demo style's page of runs: a pattern cutter picks sizes of the chart, starts the
// run, and the run's page follows the job to the end without reloading; then the sizes are seen side by
// side: the nest of a piece (a toggle per size, the anchor chosen, the increments) and the table.
import { describe, expect, it } from 'vitest';
import { pageScreenshot } from './chromium';
import { demoBrowserUse, demoSignIn } from './demo-studio';

describe('size runs', () => {
	const { browser, demo, baseUrl } = demoBrowserUse();

	it('a pattern cutter starts a run over three sizes, watches it finish without a reload, then reads its nest and table', { timeout: 180_000 }, async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'patterncutter');
		await page.goto(`${baseUrl()}/studios/${demo().studioId}/styles/${demo().styleId}/size-runs`);
		const boxes = page.locator('form input[type="checkbox"]');
		expect(await boxes.count()).toBeGreaterThanOrEqual(3);
		for (let i = 0; i < 3; i++) await boxes.nth(i).check();
		await page.getByRole('button', { name: 'Make 3 sizes' }).click();
		await page.waitForURL(/\/size-runs\/[0-9a-f-]{36}$/);
		let loads = 0;
		page.on('load', () => loads++);
		await page.locator('[data-testid="run-status"]', { hasText: 'done' }).waitFor({ timeout: 60_000 });
		expect(await page.getByRole('progressbar').getAttribute('aria-valuenow')).toBe('100');
		expect(loads).toBe(0);
		expect(await page.locator('table').first().locator('tbody tr').count()).toBe(3);

		// the nest: every size's outline of the first piece, drawn once each size is made (still no reload)
		const drawing = page.locator('[data-testid="nest-drawing"]');
		await drawing.waitFor({ timeout: 30_000 });
		await expect.poll(() => drawing.locator('path[data-size]').count(), { timeout: 30_000 }).toBe(3);
		await page.locator('[data-testid="nest-piece"]').selectOption({ label: 'Front block' });
		await expect.poll(() => drawing.getAttribute('aria-label')).toMatch(/^The Front block of 3 sizes .*aligned at the centre front waist/);
		const increments = page.locator('[data-testid="nest-increments"]');
		expect(await increments.locator('thead th').count()).toBe(1 + 2); // the points, then two pairs of neighbours
		expect(await increments.locator('tbody tr').count()).toBeGreaterThan(3);
		// a size turned off with the keyboard: two outlines, one pair of neighbours
		const sizeBoxes = page.locator('[data-testid="nest-view"] fieldset').first().locator('input[type="checkbox"]');
		await sizeBoxes.nth(1).focus();
		await page.keyboard.press('Space');
		await expect.poll(() => drawing.locator('path[data-size]').count()).toBe(2);
		expect(await increments.locator('thead th').count()).toBe(1 + 1);
		await page.keyboard.press('Space');
		await expect.poll(() => drawing.locator('path[data-size]').count()).toBe(3);
		// aligned elsewhere
		await page.locator('[data-testid="nest-anchor"]').selectOption('side waist');
		expect(await drawing.getAttribute('aria-label')).toMatch(/aligned at the side waist/);
		// or at a place along a seam, at a per cent of its length
		await page.locator('[data-testid="nest-anchor"]').selectOption({ label: 'along the side seam' });
		await page.locator('[data-testid="nest-along"]').fill('40');
		await expect.poll(() => drawing.getAttribute('aria-label')).toMatch(/aligned at the side seam, 40 % from the /);
		expect(await drawing.locator('path[data-size]').count()).toBe(3);
		await page.locator('[data-testid="nest-anchor"]').selectOption('side waist');
		await expect.poll(() => drawing.getAttribute('aria-label')).toMatch(/aligned at the side waist/);

		// the table: the base and three sizes, the measurements used and the piece's area and seams
		const table = page.locator('[data-testid="size-table"] table');
		expect(await table.locator('thead th').count()).toBe(2 + 3);
		expect(await table.locator('tbody th', { hasText: /^Bust girth$/ }).count()).toBe(1);
		expect(await table.locator('tbody th', { hasText: /^Area$/ }).count()).toBe(1);
		expect(await table.locator('tbody th', { hasText: /^Seam: / }).count()).toBeGreaterThan(2);
		await page.locator('[data-testid="nest-unit"]').selectOption('in');
		await expect.poll(() => table.locator('tbody td', { hasText: / in$/ }).count()).toBeGreaterThan(3);
		await page.locator('[data-testid="nest-unit"]').selectOption('mm');

		// another piece: its outlines come from the server, the page is not reloaded
		await page.locator('[data-testid="nest-piece"]').selectOption({ label: 'Back block' });
		await page.waitForURL(/\?piece=[0-9a-f-]{36}$/);
		// the anchor chosen stays chosen where the next piece has the same landmark
		await expect.poll(() => drawing.getAttribute('aria-label')).toMatch(/^The Back block of 3 sizes .*aligned at the side waist/);
		expect(await drawing.locator('path[data-size]').count()).toBe(3);
		expect(loads).toBe(0);
		await pageScreenshot(page, 'size-run-nest');
		await context.close();
	});

	it('the designer sees the runs but is not offered to start one', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'designer');
		const r = await page.goto(`${baseUrl()}/studios/${demo().studioId}/styles/${demo().styleId}/size-runs`);
		expect(r?.status()).toBe(200);
		expect(await page.locator('form input[type="checkbox"]').count()).toBe(0);
		await context.close();
	});
});
