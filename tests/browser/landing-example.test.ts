import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { browserLaunch, pageScreenshot } from './chromium';

describe('landing page example', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('draws what its ledger says: the shoulder dart closed into two pleats, no open shoulder dart, balanced', async () => {
		const context = await browser.newContext();
		const page = await context.newPage();
		await page.goto(inject('baseUrl'));
		const figure = page.getByTestId('landing-example');
		await figure.waitFor();
		const ledger = page.getByTestId('landing-ledger');
		const pleatRows = await ledger.locator('tr[data-kind="pleat"]').count();
		const closedDarts = await ledger.locator('tr[data-kind="dart"]').count();
		expect(pleatRows).toBe(2);
		expect(closedDarts).toBe(1);
		expect(await ledger.locator('tr[data-kind="dart"]').textContent()).toContain('shoulder dart closed');
		// one pleat drawn per pleat row; the only dart left open is the waist dart (below the bust point)
		expect(await figure.locator('[data-mark="pleat"]').count()).toBe(pleatRows);
		const darts = figure.locator('[data-mark="dart"]');
		expect(await darts.count()).toBe(1);
		const apexY = await figure.locator('svg').evaluate((svg) => {
			const d = svg.querySelector('[data-mark="dart"]')!.getAttribute('d')!;
			const ys = [...d.matchAll(/[ML][-\d.e]+ ([-\d.e]+)/g)].map((m) => Number(m[1]));
			return { apex: ys[1], ends: [ys[0], ys[2]] };
		});
		expect(Math.min(...apexY.ends)).toBeGreaterThan(apexY.apex);
		expect(await ledger.locator('tr').last().textContent()).toContain('0.0°');
		await pageScreenshot(page, 'landing-example');
		await context.close();
	});
});
