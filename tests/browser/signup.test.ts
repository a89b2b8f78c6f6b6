import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { browserLaunch, pageScreenshot } from './chromium';

describe('a new studio from the sign-up page', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('signs up, lands in the new studio, sees the members table, signs out and signs in again', async () => {
		const context = await browser.newContext();
		const page = await context.newPage();
		const base = inject('baseUrl');
		const email = `owner-${Date.now()}@example.test`;
		const password = 'bias-binding-2026';

		await page.goto(`${base}/signup`);
		await page.getByLabel('Your name').fill('Mira Okonkwo');
		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel(/^Password/).fill(password);
		await page.getByLabel('Studio name').fill('Hollin Yard Workroom');
		await page.getByRole('button', { name: 'Create account and studio' }).click();
		await page.waitForURL(/\/studios\/[0-9a-f-]{36}$/);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('Hollin Yard Workroom');
		await pageScreenshot(page, 'studio-home');

		await page.getByRole('link', { name: 'Members' }).click();
		await page.waitForURL(/\/members$/);
		const row = page.getByRole('row', { name: new RegExp(email) });
		await row.waitFor();
		expect(await row.textContent()).toMatch(/owner/);
		await pageScreenshot(page, 'members');

		await page.getByRole('button', { name: 'Sign out' }).click();
		await page.waitForURL(`${base}/`);
		expect(await page.getByRole('link', { name: 'Sign in' }).first().isVisible()).toBe(true);

		await page.goto(`${base}/signin`);
		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel('Password').fill(password);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await page.waitForURL(/\/studios\/[0-9a-f-]{36}$/);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('Hollin Yard Workroom');
		await context.close();
	});
});
