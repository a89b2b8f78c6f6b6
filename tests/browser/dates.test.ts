// Dates read one way everywhere: the reader's locale's medium date with the month named, in the
// reader's time zone, never the all-numeric "12/3/2026" form.
import { describe, expect, it } from 'vitest';
import { demoBrowserUse, demoSignIn } from './demo-studio';

describe('dates', () => {
	const { browser, demo, baseUrl } = demoBrowserUse();

	async function datesShown(locale: string, path: string, selector: string): Promise<string[]> {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'owner', { locale, timezoneId: 'Europe/London' });
		await page.goto(baseUrl() + path);
		await page.waitForSelector(selector, { state: 'attached' });
		const texts = await page.locator(selector).allTextContents();
		await context.close();
		return texts.map((t) => t.trim());
	}

	it('the members table and the version history write dates in the reader locale, with the month named', { timeout: 90_000 }, async () => {
		const us = await datesShown('en-US', `/studios/${demo().studioId}/members`, 'main table time');
		const gb = await datesShown('en-GB', `/studios/${demo().studioId}/members`, 'main table time');
		expect(us.length).toBeGreaterThan(0);
		for (const t of us) expect(t).toMatch(/^[A-Z][a-z]{2} \d{1,2}, \d{4}$/); // "Dec 3, 2026"
		for (const t of gb) expect(t).toMatch(/^\d{1,2} [A-Z][a-z]{2} \d{4}$/); // "3 Dec 2026"
		const history = await datesShown('en-GB', `/studios/${demo().studioId}/styles/${demo().styleId}`, 'main details time');
		expect(history.length).toBeGreaterThan(0);
		for (const t of history) expect(t).toMatch(/^\d{1,2} [A-Z][a-z]{2} \d{4}$/);
	});

	it('the page rendered on the server and the page in the browser show the same date text', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'owner', { locale: 'en-US', timezoneId: 'UTC' });
		const html = await (await page.request.get(`${baseUrl()}/studios/${demo().studioId}/styles/${demo().styleId}`, { headers: { 'accept-language': 'en-US' } })).text();
		await page.goto(`${baseUrl()}/studios/${demo().studioId}/styles/${demo().styleId}`);
		const shown = (await page.locator('main details time').allTextContents()).map((t) => t.trim());
		for (const t of shown) expect(html).toContain(`>${t}</time>`);
		await context.close();
	});
});
