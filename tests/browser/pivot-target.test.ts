// The pivot form: the new opening typed as a point on a named seam, previewed while typing, never a
// negative length, and said as what it is anchored to; nothing opens on the fold (built app, Debian's Chromium).
import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { pageScreenshot } from './chromium';
import { dragOnPiece, editorBrowserUse, editorOpen, editorSetUp, firstKey, lerp } from './editor-helpers';

const block = frontBodiceBlock();
const shoulder = block.darts.find((d) => d.id === 'shoulder-dart')!;
const bp = block.apexes[0].point;

describe('pivot target on a named seam', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('types the new opening as a seam, an end and a distance, previews each keystroke, and shows no negative length', { timeout: 120_000 }, async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		await editorOpen(page, f.editorUrl);
		await page.click('[data-tool="pivot"]');
		await page.selectOption('#tool-dart', 'shoulder-dart');

		// the seams are offered by name; the fold is there but cannot be chosen
		const seams = await page.locator('#pivot-seam option').allTextContents();
		expect(seams).toEqual(expect.arrayContaining(['shoulder', 'armhole', 'side seam', 'waist', 'neckline']));
		expect(await page.locator('#pivot-seam option', { hasText: 'fold' }).isDisabled()).toBe(true);

		await page.selectOption('#pivot-seam', 'side seam');
		expect(await page.locator('#pivot-from option').allTextContents()).toEqual(['from the armhole end', 'from the waist end']);
		await page.selectOption('#pivot-from', 'start');
		const readouts = page.locator('[data-testid="tool-readouts"]');
		// the preview follows each keystroke: "6", then "60"
		await page.locator('#pivot-distance').pressSequentially('6');
		await expect.poll(() => readouts.textContent()).toContain('side seam, 6.0 mm from the armhole end');
		await page.locator('#pivot-distance').pressSequentially('0');
		await expect.poll(() => readouts.textContent()).toContain('side seam, 60.0 mm from the armhole end');
		await pageScreenshot(page, 'pivot-target-typed');

		// a negative distance is refused in words, never shown
		await page.fill('#pivot-distance', '-5');
		await expect.poll(() => page.getByTestId('pivot-target').textContent()).toContain('never negative');
		expect(await readouts.textContent()).not.toMatch(/[−-]\d/);
		await page.fill('#pivot-distance', '60');
		await expect.poll(() => readouts.textContent()).toContain('side seam, 60.0 mm from the armhole end');
		// what the opening is anchored to (what a size run finds it by): the distance typed, from that end
		await expect.poll(() => page.getByTestId('anchor-line').textContent()).toMatch(/^New opening anchored to: 60\.0 mm (from the underarm along the side seam|along the side seam from the armhole)$/);
		await page.click('button:has-text("Apply")');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pivot');
		expect(await page.getByTestId('recipe-anchors').first().textContent()).toMatch(/^at 60\.0 mm (from the underarm along the side seam|along the side seam from the armhole)$/);
		const key = await firstKey(page);
		const geometry = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
		expect(geometry.darts.find((d) => d.id === 'shoulder-dart')!.leg1End.x).toBeGreaterThan(200);
		expect(geometry.foldLine).toEqual(block.foldLine);
		expect(problems).toEqual([]);
		await f.context.close();
	});

	it('shares a dart out to points typed on named seams', { timeout: 120_000 }, async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		await page.click('[data-tool="share"]');
		await page.selectOption('#tool-dart', 'shoulder-dart');
		await page.selectOption('#share-at-seam', 'side seam');
		await page.fill('#share-at-distance', '50');
		await page.click('button:has-text("Add part")');
		await page.selectOption('#share-at-seam', 'armhole');
		await page.selectOption('#share-at-from', 'end');
		await page.fill('#share-at-distance', '40');
		await page.click('button:has-text("Add part")');
		await expect.poll(() => page.locator('label', { hasText: 'Part 2 share' }).count()).toBe(1);
		await page.click('button:has-text("Apply")');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Share');
		await f.context.close();
	});

	it('places pleats on a side of the dart named by the seam end it faces, with an unsigned distance', { timeout: 120_000 }, async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		await page.click('[data-tool="pleat"]');
		await page.selectOption('#tool-dart', 'shoulder-dart');
		expect(await page.locator('#pleat-side option').allTextContents()).toEqual(['toward the armhole end', 'toward the neckline end']);
		await page.selectOption('#pleat-side', 'leg1');
		await page.fill('#pleat-count', '2');
		await page.fill('#pleat-first', '10');
		await page.press('#pleat-first', 'Tab');
		await page.fill('#pleat-spacing', '20');
		await page.press('#pleat-spacing', 'Tab');
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').textContent()).toContain('Pleat 2 intake');
		expect(await page.inputValue('#pleat-first')).toBe('10');
		expect(await page.inputValue('#pleat-side')).toBe('leg1');
		await page.click('button:has-text("Apply")');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pleat');
		const key = await firstKey(page);
		const geometry = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
		// the pleats opened on the neckline side: the farther one's edge on the still part lies between the neck and the old dart
		expect(geometry.pleats).toHaveLength(2);
		expect(Math.min(...geometry.pleats.map((p) => p.leg1End.x))).toBeLessThan(shoulder.leg1End.x);
		expect(geometry.foldLine).toEqual(block.foldLine);
		await f.context.close();
	});

	it('dragging a dart onto the fold line shows the refusal in the preview and applies nothing', { timeout: 120_000 }, async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		const key = await firstKey(page);
		await page.click('[data-tool="pivot"]');
		await dragOnPiece(page, key, lerp(bp, shoulder.leg1End, 0.85), { x: 0, y: 250 });
		await expect.poll(() => page.locator('[role="alert"]').allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining('on the fold line')]));
		expect(await page.locator('button:has-text("Apply")').isDisabled()).toBe(true);
		expect(await page.locator('[data-testid="recipe"] li').first().textContent()).toContain('No steps yet');
		await pageScreenshot(page, 'pivot-onto-fold-refused');
		await f.context.close();
	});
});
