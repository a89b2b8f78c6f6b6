// A size run from the demo style's page of runs: a pattern cutter picks sizes of the chart, starts the
// run, and the run's page follows the job to the end without reloading.
import { describe, expect, it } from 'vitest';
import { pageScreenshot } from './chromium';
import { demoBrowserUse, demoSignIn } from './demo-studio';

describe('size runs', () => {
	const { browser, demo, baseUrl } = demoBrowserUse();

	it('a pattern cutter starts a run over three sizes and watches it finish on its page, without a reload', { timeout: 120_000 }, async () => {
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
		expect(await page.locator('tbody tr').count()).toBe(3);
		await pageScreenshot(page, 'size-run-done');
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
