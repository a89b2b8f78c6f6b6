// A pattern cutter records a client's measurements through the form, drafts a block from them and
// finds the pieces in the new style (built app, Debian's Chromium).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { browserLaunch, pageScreenshot } from './chromium';

describe('measurement sets and drafting a block', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('creates a client set through the form, drafts a block from it and lists the pieces in the new style', { timeout: 120_000 }, async () => {
		const baseUrl = inject('baseUrl');
		const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
		const page = await context.newPage();
		page.setDefaultTimeout(15_000);
		const problems: string[] = [];
		page.on('console', (m) => {
			if (m.type() === 'error') problems.push(m.text());
		});
		page.on('pageerror', (e) => problems.push(e.message));

		// a new owner with a studio of their own
		const id = `${Date.now().toString(36)}-${process.pid}`;
		await page.goto(`${baseUrl}/signup`);
		await page.fill('#name', 'Mara Cutter');
		await page.fill('#email', `measures-${id}@test.example`);
		await page.fill('#password', 'linden-measures-2026');
		await page.fill('#studioName', `Measures studio ${id}`);
		await Promise.all([page.waitForURL((u) => /^\/studios\/[0-9a-f-]{36}$/.test(u.pathname), { timeout: 20_000 }), page.click('button[type=submit]')]);
		const studioPath = new URL(page.url()).pathname;

		// the sets table, with the charts seeded on first visit
		await page.getByRole('link', { name: 'Measurements' }).click();
		await page.waitForURL(`**${studioPath}/measurements`);
		await page.waitForSelector('[data-testid="set-row"]');
		expect(await page.locator('[data-testid="set-row"]').count()).toBe(24);
		await page.fill('input[type=search]', 'straight');
		await expect.poll(() => page.locator('[data-testid="set-row"]').count()).toBe(12);
		await page.fill('input[type=search]', '');
		await pageScreenshot(page, 'measurement-sets-table');

		// the client form: inches with eighths, definitions beside the fields, live cup code and checks
		await page.getByRole('link', { name: 'New client set' }).click();
		await page.waitForURL(`**${studioPath}/measurements/new`);
		await page.waitForFunction(() => document.querySelector('form select[name="unit"]') !== null);
		await page.fill('input[name="name"]', 'First fitting');
		await page.fill('input[name="clientRef"]', 'C-0107');
		await page.selectOption('select[name="unit"]', 'in');
		await page.fill('input[name="bust"]', '36 3/8');
		await page.fill('input[name="underbust"]', '36 7/8');
		await expect.poll(() => page.getByLabel('Plausibility').textContent()).toMatch(/larger than bust/);
		await page.fill('input[name="underbust"]', '30');
		await page.fill('input[name="waist"]', '29 1/2');
		await page.fill('input[name="back_length"]', '16 1/4');
		await expect.poll(() => page.getByTestId('cup-code').textContent()).toBe('75C');
		await expect.poll(() => page.getByTestId('readout-bust').textContent()).toContain('924 mm');
		expect(await page.getByText('The largest horizontal girth of the torso').isVisible()).toBe(true);
		await pageScreenshot(page, 'measurement-set-form');
		await Promise.all([page.waitForURL(/\/measurements\/[0-9a-f-]{36}$/, { timeout: 20_000 }), page.click('button[type=submit]')]);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('First fitting');
		expect(await page.getByTestId('cup-code').textContent()).toContain('75C');
		expect(await page.getByTestId('derived').textContent()).toContain('rule of thumb');
		await pageScreenshot(page, 'measurement-set-page');
		const setUrl = page.url();

		// compare it with a chart, side by side, in inches
		await page.getByRole('link', { name: 'Measurements' }).click();
		await page.waitForSelector('[data-testid="set-row"]');
		await page.getByLabel('Show in').selectOption('in');
		await page.getByLabel('Compare First fitting').check();
		await page.getByLabel('Compare ASTM D5585 misses, curvy waist, size 10').check();
		await Promise.all([page.waitForURL(/\/measurements\/compare\?/), page.getByRole('button', { name: 'Compare', exact: true }).click()]);
		const compare = await page.getByTestId('compare').textContent();
		expect(compare).toContain('36 3/8 in');
		expect(compare).toContain('37 1/4 in'); // chart size 10 bust as printed
		expect(compare).toContain('+7/8 in'); // B − A
		await pageScreenshot(page, 'measurement-sets-compare');
		await page.goto(setUrl);

		// draft a block from it: negative waist ease shows the cautions beside the ease values
		await page.getByRole('link', { name: 'Draft a block from this set' }).click();
		await page.waitForURL(/\/styles\/new\?set=/);
		await page.fill('#name', 'Boned bodice C-0107');
		await page.fill('#easeWaist', '-60');
		await expect.poll(() => page.getByTestId('cautions').textContent()).toMatch(/boned, close-fitting.*toile/s);
		await page.check('input[name="underStructure"][value="6"]');
		await pageScreenshot(page, 'draft-a-block');
		await Promise.all([page.waitForURL(/\/styles\/[0-9a-f-]{36}$/, { timeout: 30_000 }), page.click('button[type=submit]')]);
		const body = await page.locator('main, body').first().textContent();
		expect(body).toContain('Boned bodice C-0107');
		for (const name of ['Front', 'Back', 'Under-structure panel 1', 'Under-structure panel 2', 'Under-structure panel 3']) {
			expect(body).toContain(name);
		}
		await pageScreenshot(page, 'drafted-style');
		expect(problems).toEqual([]);
		await context.close();
	});
});
