// Object first from the keyboard: what is clicked on the table offers its moves beside it; Tab from the
// canvas reaches them, Enter starts the one focused; every move's key is on its button and in the help.
import { describe, expect, it } from 'vitest';
import { vecLerp } from '../../src/lib/geometry';
import { frontBodiceBlock, FRONT_BLOCK_BUST_POINT } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { pageScreenshot } from './chromium';
import { clickOnPiece, editorBrowserUse, editorOpen, editorSetUp, firstKey } from './editor-helpers';

describe('editor: the moves of the selection, by keyboard', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('a dart clicked offers its moves beside it; Tab reaches them from the canvas and Enter starts one; the keys are shown', async () => {
		const block = frontBodiceBlock();
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		const key = await firstKey(page);
		const waist = block.darts.find((d) => d.id === 'waist-dart')!;
		await clickOnPiece(page, key, vecLerp(FRONT_BLOCK_BUST_POINT, waist.leg1End, 0.6));
		const beside = page.locator('[data-testid="selection-moves"]');
		await beside.waitFor();
		expect(await beside.locator('button').allTextContents()).toEqual(['Pivot P', 'Share H', 'Pleats L', 'Pull back B', 'Cap C']);
		await pageScreenshot(page, 'editor-dart-selected');
		await page.keyboard.press('Tab');
		expect(await page.evaluate(() => document.activeElement?.getAttribute('data-offer'))).toBe('pivot');
		await page.keyboard.press('Tab');
		await page.keyboard.press('Enter');
		expect(await page.getAttribute('[data-tool="share"]', 'aria-pressed')).toBe('true');
		expect(await page.inputValue('#tool-dart')).toBe('waist-dart');
		await page.keyboard.press('Escape');
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('Shift+?');
		const help = page.getByRole('dialog', { name: 'Keyboard shortcuts' });
		await help.waitFor();
		const text = await help.textContent();
		for (const words of ['Pivot', 'Pleat', 'Carry', 'Mark the selected apex as a divergence point', 'Pair the selected seam with']) expect(text).toContain(words);
	});
});
