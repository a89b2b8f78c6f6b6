// The cutting-list page sorts by a column header, by mouse and by keyboard; the import page reads a DXF,
// shows what it will make, and saves it as new pieces of the style.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { styleDxf } from '../../src/lib/export/dxf-writer';
import { rectPiece } from '../../src/lib/export/test-support/rect-piece';
import { browserLaunch, pageScreenshot } from './chromium';
import { signUp, styleWithPieces } from './editor-helpers';

const rowNames = (page: Page) => page.getByTestId('cutting-row').locator('td:first-child').evaluateAll((tds) => tds.map((td) => td.firstChild?.textContent?.trim() ?? ''));
const sortOf = (page: Page, title: string) => page.locator('th', { has: page.getByRole('button', { name: title, exact: true }) }).getAttribute('aria-sort');

describe('cutting list and import pages', () => {
	let browser: Browser;
	beforeAll(async () => {
		browser = await browserLaunch();
	});
	afterAll(async () => {
		await browser?.close();
	});

	it('sorts the cutting list by a column when its header is clicked, and again from the keyboard', async () => {
		const baseUrl = inject('baseUrl');
		const { context, page } = await signUp(browser, baseUrl);
		// net areas 600, 100 and 120 cm²
		const pieces = [
			{ name: 'Back panel', geometry: rectPiece({ name: 'Back panel', w: 300, h: 200, cut: 'single' }) },
			{ name: 'Collar', geometry: rectPiece({ name: 'Collar', w: 100, h: 100, cut: 'single' }) },
			{ name: 'Band', geometry: rectPiece({ name: 'Band', w: 200, h: 60, cut: 'single' }) }
		];
		const { studioId, styleId } = await styleWithPieces(page, baseUrl, pieces, 'Cutting list bodice');
		await page.goto(`${baseUrl}/studios/${studioId}/styles/${styleId}/cutting-list`);
		await page.getByTestId('cutting-list').waitFor();
		expect((await rowNames(page)).sort()).toEqual(['Back panel', 'Band', 'Collar']);

		// a number column sorts largest first
		await page.getByRole('button', { name: 'Net area', exact: true }).click();
		await expect.poll(() => sortOf(page, 'Net area')).toBe('descending');
		expect(await rowNames(page)).toEqual(['Back panel', 'Band', 'Collar']);

		// the same header from the keyboard: focused, Enter reverses the order
		await page.getByRole('button', { name: 'Net area', exact: true }).focus();
		await page.keyboard.press('Enter');
		await expect.poll(() => rowNames(page)).toEqual(['Collar', 'Band', 'Back panel']);
		expect(await sortOf(page, 'Net area')).toBe('ascending');

		// Tab to the first header (Piece) and Space sorts by name
		await page.getByRole('button', { name: 'Piece', exact: true }).focus();
		await page.keyboard.press('Space');
		await expect.poll(() => rowNames(page)).toEqual(['Back panel', 'Band', 'Collar']);
		expect(await sortOf(page, 'Piece')).toBe('ascending');
		expect(await sortOf(page, 'Net area')).toBeNull();
		await page.keyboard.press('Space');
		await expect.poll(() => rowNames(page)).toEqual(['Collar', 'Band', 'Back panel']);
		await pageScreenshot(page, 'cutting-list-sorted');
		await context.close();
	});

	it('reads a DXF on the import page, shows the pieces it will make, and saves them into the style', async () => {
		const baseUrl = inject('baseUrl');
		const { context, page } = await signUp(browser, baseUrl);
		const { studioId, styleId } = await styleWithPieces(page, baseUrl, [{ name: 'Front', geometry: rectPiece({ name: 'Front', w: 250, h: 400, cut: 'on_fold' }) }], 'Import bodice');
		const dxf = styleDxf(
			[rectPiece({ name: 'Yoke', w: 300, h: 120, cut: 'pair', allowanceMm: 10 }), rectPiece({ name: 'Pocket', w: 140, h: 160, cut: 'single' })].map((piece) => ({
				piece,
				styleName: 'Exchange',
				sizeLabel: '10',
				quantity: piece.cut === 'pair' ? 2 : 1,
				category: 'self'
			}))
		);
		await page.goto(`${baseUrl}/studios/${studioId}/styles/${styleId}/import`);
		await page.getByLabel('File').setInputFiles({ name: 'exchange.dxf', mimeType: 'application/dxf', buffer: Buffer.from(dxf) });
		const preview = page.getByTestId('import-preview');
		await preview.waitFor();
		expect(await page.getByRole('heading', { name: '2 pieces will be made' }).isVisible()).toBe(true);
		const cards = await preview.locator('li').allTextContents();
		expect(cards.some((t) => t.includes('Yoke') && t.includes('net 360.0 cm²') && t.includes('cut 448.0 cm²'))).toBe(true);
		expect(cards.some((t) => t.includes('Pocket') && t.includes('net 224.0 cm²'))).toBe(true);
		// nothing is saved before Save
		const before = await (await page.request.get(`${baseUrl}/api/studios/${studioId}/styles/${styleId}/cutting-list`)).json();
		expect(before.pieces.map((p: { name: string }) => p.name)).toEqual(['Front']);
		await pageScreenshot(page, 'import-preview');

		await page.getByRole('button', { name: 'Save 2 pieces' }).click();
		await page.waitForURL(`${baseUrl}/studios/${studioId}/styles/${styleId}`);
		for (const name of ['Front', 'Yoke', 'Pocket']) await page.getByText(name, { exact: true }).first().waitFor();
		const after = await (await page.request.get(`${baseUrl}/api/studios/${studioId}/styles/${styleId}/cutting-list`)).json();
		expect(after.pieces.map((p: { name: string }) => p.name).sort()).toEqual(['Front', 'Pocket', 'Yoke']);
		await context.close();
	});
});
