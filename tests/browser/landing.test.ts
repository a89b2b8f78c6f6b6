import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { browserLaunch, pageScreenshot } from './chromium';

describe('landing page for signed-out visitors', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('says what the product does and offers sign-up and sign-in, with no CSP violations', async () => {
		const context = await browser.newContext();
		const page = await context.newPage();
		const problems: string[] = [];
		page.on('console', (m) => {
			if (m.type() === 'error') problems.push(m.text());
		});
		page.on('pageerror', (e) => problems.push(e.message));
		await page.goto(inject('baseUrl'));
		await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('Keep the fit');
		expect(await page.getByRole('link', { name: 'Create a studio' }).first().isVisible()).toBe(true);
		expect(await page.getByRole('link', { name: 'Sign in' }).first().isVisible()).toBe(true);
		const font = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
		expect(font).toContain('Source Sans 3');
		await pageScreenshot(page, 'landing');
		expect(problems).toEqual([]);
		await context.close();
	});
});
