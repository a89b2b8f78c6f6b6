// The 403 and 404 pages are pages of the app: its header and layout, what happened in words and what
// the reader can do next. The JSON API keeps its JSON errors.
import { describe, expect, it } from 'vitest';
import { pageScreenshot } from './chromium';
import { demoBrowserUse, demoSignIn } from './demo-studio';

describe('error pages', () => {
	const { browser, demo, baseUrl } = demoBrowserUse();

	it('a page the role may not open answers 403 in the app layout, names the role and links back to the studio', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'designer');
		const res = await page.goto(`${baseUrl()}/studios/${demo().studioId}/measurements/new`);
		expect(res?.status()).toBe(403);
		expect(res?.headers()['content-type']).toContain('text/html');
		expect(await page.getByRole('banner').isVisible()).toBe(true);
		expect(await page.getByRole('link', { name: 'Skip to main content' }).count()).toBe(1);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Not open to your role');
		const text = await page.getByTestId('error-page').textContent();
		expect(text).toContain('Your role (designer) does not allow this');
		expect(await page.getByRole('link', { name: 'members page' }).getAttribute('href')).toBe(`/studios/${demo().studioId}/members`);
		expect(await page.getByRole('link', { name: /^styles of / }).getAttribute('href')).toBe(`/studios/${demo().studioId}`);
		expect(await page.title()).toContain('Not open to your role');
		await pageScreenshot(page, 'error-403');
		await context.close();
	});

	it('an unknown page answers 404 in the app layout and offers the reader their studios', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'sampleroom');
		const res = await page.goto(`${baseUrl()}/studios/${demo().studioId}/no-such-page`);
		expect(res?.status()).toBe(404);
		expect(await page.getByRole('banner').isVisible()).toBe(true);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Page not found');
		expect(await page.getByTestId('error-page').textContent()).toContain('Check the address');
		expect(await page.getByRole('link', { name: /^styles of Linden Row Studio/ }).count()).toBeGreaterThan(0);
		await pageScreenshot(page, 'error-404');
		await context.close();
	});

	it('another studio answers 404 like a missing one, and a signed-out visitor is offered sign-in', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'designer');
		const other = `${baseUrl()}/studios/00000000-0000-4000-8000-000000000000/members`;
		expect((await page.goto(other))?.status()).toBe(404);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Page not found');
		await context.close();

		const guest = await browser().newContext();
		const p = await guest.newPage();
		expect((await p.goto(`${baseUrl()}/nothing-here`))?.status()).toBe(404);
		expect(await p.getByRole('banner').isVisible()).toBe(true);
		expect(await p.getByRole('link', { name: 'Sign in', exact: true }).count()).toBeGreaterThan(0);
		expect(await p.getByRole('link', { name: 'home page' }).getAttribute('href')).toBe('/');
		await guest.close();
	});

	it('the JSON API keeps answering its errors in JSON', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'designer');
		const denied = await page.request.post(`${baseUrl()}/api/studios/${demo().studioId}/measurement-sets`, { data: {} });
		expect(denied.status()).toBe(403);
		expect((await denied.json()).error.code).toBe('forbidden');
		const missing = await page.request.get(`${baseUrl()}/api/no-such-route`);
		expect(missing.status()).toBe(404);
		expect((await missing.json()).error.code).toBe('not_found');
		await context.close();
	});
});
