// The measurement set form: switching the unit never changes a typed value, and values no human body
// measures are errors that cannot be confirmed (built app, Debian's Chromium).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { browserLaunch, pageScreenshot } from './chromium';

describe('measurement set form units and limits', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('keeps 92 cm as 920 mm through inches and back, and refuses a 5,000 cm waist outright', { timeout: 120_000 }, async () => {
		const baseUrl = inject('baseUrl');
		const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
		const page = await context.newPage();
		page.setDefaultTimeout(15_000);
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		const id = `${Date.now().toString(36)}-${process.pid}`;
		await page.goto(`${baseUrl}/signup`);
		await page.fill('#name', 'Nell Cutter');
		await page.fill('#email', `units-${id}@test.example`);
		await page.fill('#password', 'linden-units-2026');
		await page.fill('#studioName', `Units studio ${id}`);
		await Promise.all([page.waitForURL((u) => /^\/studios\/[0-9a-f-]{36}$/.test(u.pathname), { timeout: 20_000 }), page.click('button[type=submit]')]);
		const studioId = new URL(page.url()).pathname.split('/')[2];

		await page.goto(`${baseUrl}/studios/${studioId}/measurements/new`);
		await page.waitForFunction(() => document.querySelector('form select[name="unit"]') !== null);
		await page.fill('input[name="name"]', 'Unit round trip');
		await page.selectOption('select[name="unit"]', 'cm');
		await page.fill('input[name="bust"]', '92');
		await page.fill('input[name="waist"]', '71');
		await expect.poll(() => page.getByTestId('readout-bust').textContent()).toContain('36 1/4 in'); // shown, never stored
		// to inches: 92 cm is not a whole number of 64ths of an inch, so it keeps its own unit
		await page.selectOption('select[name="unit"]', 'in');
		await expect.poll(() => page.inputValue('input[name="bust"]')).toBe('92 cm');
		await expect.poll(() => page.getByTestId('readout-bust').textContent()).toContain('920 mm');
		// back to cm, then mm, then cm again: always the same value
		await page.selectOption('select[name="unit"]', 'cm');
		await expect.poll(() => page.inputValue('input[name="bust"]')).toBe('92');
		await page.selectOption('select[name="unit"]', 'mm');
		await expect.poll(() => page.inputValue('input[name="bust"]')).toBe('920');
		await page.selectOption('select[name="unit"]', 'cm');
		await expect.poll(() => page.inputValue('input[name="bust"]')).toBe('92');

		// a 5,000 cm waist: an error naming the waist, with no way to confirm it
		await page.fill('input[name="waist"]', '5000');
		await expect.poll(() => page.getByLabel('Plausibility').textContent()).toMatch(/Waist girth is 5000\.0 cm: larger than any human body measures/);
		expect(await page.getByText('These values are right as typed').count()).toBe(0);
		await pageScreenshot(page, 'measurement-form-human-limits');
		await page.click('button[type=submit]');
		await expect.poll(() => page.getByRole('alert').first().textContent()).toMatch(/cannot be right/);
		expect(new URL(page.url()).pathname).toBe(`/studios/${studioId}/measurements/new`);

		// negative and zero are told apart
		await page.fill('input[name="waist"]', '-71');
		await expect.poll(() => page.getByLabel('Plausibility').textContent()).toContain('cannot be negative');
		await page.fill('input[name="waist"]', '71');
		await Promise.all([page.waitForURL(/\/measurements\/[0-9a-f-]{36}$/, { timeout: 20_000 }), page.click('button[type=submit]')]);
		const setId = new URL(page.url()).pathname.split('/').pop();
		const set = (await (await page.request.get(`${baseUrl}/api/studios/${studioId}/measurement-sets/${setId}`)).json()).measurementSet;
		expect(set.measurements.find((m: { id: string }) => m.id === 'bust').valueMm).toBe(920);
		expect(set.measurements.find((m: { id: string }) => m.id === 'waist').valueMm).toBe(710);
		expect(problems).toEqual([]);
		await context.close();
	});
});
