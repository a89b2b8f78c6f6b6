// Every page of the app, in every demo role's view and signed out, checked with axe (WCAG 2.x A/AA
// rules as axe-core implements them): no serious or critical violation anywhere, error pages included.
// The list of pages is held against the authorization table, so a new page cannot be left out.
import { existsSync } from 'node:fs';
import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { ROLES, roleLabel, type Role } from '../../src/lib/roles';
import { AUTHZ } from '../../src/lib/server/authz';
import { pageScreenshot } from './chromium';
import { demoBrowserUse, demoSignIn, type DemoStudio } from './demo-studio';

/** Every page route (route id → the address to open), with what each role may see. */
function pages(d: DemoStudio): Record<string, string> {
	const s = `/studios/${d.studioId}`;
	return {
		'/': '/',
		'/(auth)/signup': '/signup',
		'/(auth)/signin': '/signin',
		'/(auth)/signout': '/signout',
		'/(auth)/reset': '/reset',
		'/(auth)/reset/[token]': '/reset/no-such-link', // the page for a link that does not work
		'/(auth)/invite/[token]': '/invite/no-such-invitation',
		'/studios/new': '/studios/new',
		'/studios/[studioId]': s,
		'/studios/[studioId]/members': `${s}/members`,
		'/studios/[studioId]/billing': `${s}/billing`,
		'/studios/[studioId]/styles/[styleId]': `${s}/styles/${d.styleId}`,
		'/studios/[studioId]/styles/[styleId]/compare': `${s}/styles/${d.styleId}/compare`,
		'/studios/[studioId]/styles/[styleId]/edit': `${s}/styles/${d.styleId}/edit`,
		'/studios/[studioId]/styles/[styleId]/print': `${s}/styles/${d.styleId}/print`,
		'/studios/[studioId]/styles/[styleId]/cutting-list': `${s}/styles/${d.styleId}/cutting-list`,
		'/studios/[studioId]/styles/[styleId]/import': `${s}/styles/${d.styleId}/import`,
		'/studios/[studioId]/styles/[styleId]/pieces/[pieceId]/versions/[versionId]': `${s}/styles/${d.styleId}/pieces/${d.signedOff.pieceId}/versions/${d.signedOff.versionId}`,
		'/studios/[studioId]/styles/new': `${s}/styles/new?set=${d.setIds[0]}`,
		'/studios/[studioId]/measurements': `${s}/measurements`,
		'/studios/[studioId]/measurements/new': `${s}/measurements/new`,
		'/studios/[studioId]/measurements/compare': `${s}/measurements/compare?a=${d.setIds[0]}&b=${d.setIds[1]}`,
		'/studios/[studioId]/measurements/[setId]': `${s}/measurements/${d.setIds[0]}`,
		'/studios/[studioId]/measurements/[setId]/edit': `${s}/measurements/${d.clientSetId}/edit`,
		'/studios/[studioId]/fittings/[fittingId]': `${s}/fittings/${d.fittingId}`,
		'/studios/[studioId]/styles/[styleId]/size-runs': `${s}/styles/${d.styleId}/size-runs`,
		'/studios/[studioId]/size-runs/[sizeRunId]': `${s}/size-runs/${d.sizeRunId}`,
		'/studios/[studioId]/size-sets/[sizeSetId]': `${s}/size-sets/${d.sizeSetId}`,
		'/settings/notifications': '/settings/notifications',
		'/settings/account': '/settings/account'
	};
}

const PUBLIC_ONLY = ['/(auth)/signup', '/(auth)/signin', '/(auth)/reset', '/(auth)/reset/[token]', '/(auth)/invite/[token]', '/(auth)/signout'];

interface Finding {
	url: string;
	rule: string;
	impact: string;
	targets: string[];
}

async function axeSerious(page: Page, url: string): Promise<Finding[]> {
	const r = await new AxeBuilder({ page }).analyze();
	return r.violations
		.filter((v) => v.impact === 'serious' || v.impact === 'critical')
		.map((v) => ({ url, rule: v.id, impact: v.impact ?? '', targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')) }));
}

/** Opens a page and waits for what it loads in the browser (the editor's drawing, the members table). */
async function open(page: Page, url: string): Promise<number> {
	const res = await page.goto(url, { waitUntil: 'load', timeout: 30_000 });
	const status = res?.status() ?? 0;
	if (status === 200 && /\/styles\/[^/]+\/edit$/.test(url)) {
		await page.waitForSelector('[data-testid="editor"][data-loaded="true"]', { timeout: 20_000 });
	}
	if (status === 200 && url.endsWith('/members')) await page.waitForSelector('main table', { timeout: 20_000 });
	return status;
}

describe('accessibility of every page, in every role', () => {
	const { browser, demo, baseUrl } = demoBrowserUse();

	it('lists every page route of the authorization table', () => {
		// every route with a GET but the API and the endpoints that are no page (/healthz, /readyz: a +server.ts)
		const pageRoutes = Object.keys(AUTHZ).filter((id) => !id.startsWith('/api/') && AUTHZ[id].GET && !existsSync(`src/routes${id}/+server.ts`));
		expect(Object.keys(pages(demo())).sort()).toEqual(pageRoutes.sort());
	});

	it('signed out: every public page and the page-not-found page have no serious or critical axe violation', { timeout: 180_000 }, async () => {
		const context = await browser().newContext({ viewport: { width: 1440, height: 900 } });
		const page = await context.newPage();
		const findings: Finding[] = [];
		const all = pages(demo());
		for (const id of ['/', ...PUBLIC_ONLY]) {
			await open(page, baseUrl() + all[id]);
			findings.push(...(await axeSerious(page, all[id])));
		}
		expect(await open(page, `${baseUrl()}/no-such-page`)).toBe(404);
		findings.push(...(await axeSerious(page, '/no-such-page')));
		expect(findings).toEqual([]);
		await context.close();
	});

	for (const role of ROLES) {
		it(`as ${roleLabel(role)}: every page, and the error pages of what the role may not open, have no serious or critical axe violation`, { timeout: 300_000 }, async () => {
			const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), role);
			const problems: string[] = [];
			page.on('pageerror', (e) => problems.push(e.message));
			const findings: Finding[] = [];
			const seen: string[] = [];
			for (const [id, url] of Object.entries(pages(demo()))) {
				if (PUBLIC_ONLY.includes(id) || id === '/') continue;
				const status = await open(page, baseUrl() + url);
				const rule = AUTHZ[id].GET!;
				const allowed = rule === 'signed_in' || (Array.isArray(rule) && rule.includes(role));
				expect(status, `${url} as ${role}`).toBe(allowed ? 200 : 403);
				seen.push(`${status} ${id}`);
				findings.push(...(await axeSerious(page, url)));
				if (role === 'designer' && !allowed) await pageScreenshot(page, `error-403-${id.replace(/[^a-z]+/g, '-')}`);
			}
			expect(findings).toEqual([]);
			expect(problems).toEqual([]);
			expect(seen.length).toBeGreaterThanOrEqual(11);
			await context.close();
		});
	}

	it('the header names the role in words in every role view', { timeout: 120_000 }, async () => {
		for (const role of ROLES) {
			const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), role);
			await page.goto(`${baseUrl()}/studios/${demo().studioId}`);
			const badge = await page.getByTestId('role-badge').textContent();
			expect(badge?.replace(/^Your role:\s*/, '').trim()).toBe(roleLabel(role as Role));
			expect(badge).not.toMatch(/patterncutter|sampleroom/);
			await context.close();
		}
	});

	it('a skip link is the first stop of the keyboard and takes focus to the main content', async () => {
		const { context, page } = await demoSignIn(browser(), baseUrl(), demo(), 'patterncutter');
		await page.goto(`${baseUrl()}/studios/${demo().studioId}/measurements`);
		await page.keyboard.press('Tab');
		const link = page.getByRole('link', { name: 'Skip to main content' });
		expect(await link.evaluate((el) => el === document.activeElement)).toBe(true);
		expect(await link.isVisible()).toBe(true);
		await pageScreenshot(page, 'skip-link-focused');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('main');
		// the next Tab goes on from the main content, past the header
		await page.keyboard.press('Tab');
		expect(await page.evaluate(() => Boolean(document.activeElement?.closest('main')))).toBe(true);
		await context.close();
	});
});
