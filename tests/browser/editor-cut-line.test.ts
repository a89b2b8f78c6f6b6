import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { recipeStepApply } from '../../src/lib/pattern/recipe/registry';
import { pageScreenshot } from './chromium';
import { editorBrowserUse, editorOpen, editorSetUp } from './editor-helpers';

const net = frontBodiceBlock();
const withAllowance = (() => {
	const r = recipeStepApply(net, { op: 'allowance', params: { defaultWidthMm: 10 } });
	if (!r.ok) throw new Error(r.error.message);
	return r.piece;
})();
// the side seam runs from the underarm (235, 230) to the side waist (225, 440); y = 280 is clear of its notch
const sideSeamAt = (y: number) => ({ x: 235 - (10 * (y - 230)) / 210, y });

/**
 * Dark (ink or selection) pixels on the editor's canvases along a line outside the side seam, from
 * `fromMm` to `toMm` to the right of the stitching line, in the piece's own millimetres.
 */
async function inkOutsideSideSeam(page: Page, key: string, fromMm: number, toMm: number): Promise<number> {
	const points = [];
	for (let d = fromMm; d <= toMm; d += 0.25) {
		const p = sideSeamAt(280);
		points.push(await page.evaluate(([k, q]) => window.dartelierEditor!.toPage(k as string, q as { x: number; y: number }), [key, { x: p.x + d, y: p.y }] as const));
	}
	return page.evaluate((pts) => {
		let dark = 0;
		const canvases = [...document.querySelectorAll('[data-testid="editor-canvas"] canvas')] as HTMLCanvasElement[];
		for (const pt of pts) {
			for (const c of canvases) {
				const r = c.getBoundingClientRect();
				const ratio = c.width / r.width;
				const px = c.getContext('2d')!.getImageData(Math.round((pt.x - r.left) * ratio), Math.round((pt.y - r.top) * ratio), 1, 1).data;
				if (px[3] > 128 && px[0] + px[1] + px[2] < 3 * 140) {
					dark++;
					break;
				}
			}
		}
		return dark;
	}, points);
}

describe('editor: the cut line', () => {
	const { browser } = editorBrowserUse();

	it('draws no cut line round a piece without seam allowance, and the real one round a piece with it', async () => {
		const f = await editorSetUp(browser(), inject('baseUrl'), [
			{ name: 'Net front', geometry: net },
			{ name: 'Front with allowance', geometry: withAllowance }
		]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		const netKey = await page.evaluate(() => window.dartelierEditor!.pieceNamed('Net front'));
		const cutKey = await page.evaluate(() => window.dartelierEditor!.pieceNamed('Front with allowance'));
		expect(netKey).not.toBeNull();
		expect(cutKey).not.toBeNull();
		// 3 to 14 mm outside the stitching line: where a 10 mm allowance's cut line lies (once drawn)
		await expect.poll(() => inkOutsideSideSeam(page, cutKey!, 3, 14)).toBeGreaterThan(0);
		await pageScreenshot(page, 'editor-cut-line');
		expect(await inkOutsideSideSeam(page, netKey!, 3, 14)).toBe(0);
		await f.context.close();
	});
});
