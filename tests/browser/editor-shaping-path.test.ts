// The editor as a new user first meets it, on the demo style: pick the bust dart and turn it into two
// pleats, pick the under-structure panels and carry their shaping into the underbust seam, reshape the
// band's lower edge by hand and declare the change — each saved — through what the screen offers, with
// no help opened and no keyboard shortcut used.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { pathBoundingBox, vecLerp } from '../../src/lib/geometry';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { pageScreenshot } from './chromium';
import { clickOnPiece, demoStyleInOwnStudio, dragOnPiece, editorBrowserUse, editorOpen, saveFromPanel, signUp } from './editor-helpers';

const named = (page: Page, name: string) => page.evaluate((n) => window.dartelierEditor!.pieceNamed(n), name);
const geometry = async (page: Page, key: string) => (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
const readouts = (page: Page) => page.locator('[data-testid="tool-readouts"]').textContent();

describe('the shaping path on the demo style, as a new user', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('turns the bust dart into two pleats, carries the panels into the underbust seam, reshapes the band’s lower edge with a declaration, and saves each', { timeout: 240_000 }, async () => {
		const { context, page } = await signUp(browser(), baseUrl());
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		// the demo style, in the new user's own studio
		const { studioId, styleId, editorUrl } = await demoStyleInOwnStudio(page, baseUrl());
		await editorOpen(page, editorUrl);
		const offered = page.locator('[data-testid="offered-moves"]');

		// 1. the bust dart of the front block, clicked on the table, becomes two pleats
		const front = (await named(page, 'Front block'))!;
		const g = await geometry(page, front);
		const dart = g.darts.find((d) => d.id === 'bust-dart')!;
		const bp = g.apexes.find((a) => a.id === dart.apexId)!.point;
		// on one of its legs (the wedge between them is cut out of the paper)
		await clickOnPiece(page, front, vecLerp(bp, dart.leg1End, 0.6));
		await expect.poll(() => offered.locator('[data-testid="offered-on"]').textContent()).toContain('bust-dart');
		await offered.getByRole('button', { name: /Pleats/ }).click();
		expect(await page.inputValue('#pleat-count')).toBe('2');
		await expect.poll(() => readouts(page)).toContain('Pleat 2 intake');
		await page.getByRole('button', { name: 'Apply' }).click();
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pleat');
		await saveFromPanel(page, 'Bust dart turned into two pleats at the shoulder');
		expect(await page.locator('[data-testid="save-report"]').last().textContent()).toContain('version 2 saved');

		// 2. the panels picked together offer to carry; the line is drawn below every divergence point
		const panelNames = ['Under-structure: Centre front panel', 'Under-structure: Middle front panel', 'Under-structure: Side front panel'];
		const keys = await Promise.all(panelNames.map((n) => named(page, n)));
		const panels = await Promise.all(keys.map((k) => geometry(page, k!)));
		// the panel seams are paired as drafted: the first panel's seam is sewn to the middle panel
		const selectTool = page.getByRole('toolbar', { name: 'Editor tools' }).getByRole('button', { name: /Select/ });
		await selectTool.click();
		await page.locator('section[aria-labelledby="pieces-title"] button', { hasText: panelNames[0] }).click();
		await expect.poll(() => page.locator('[data-testid="piece-seam-pairs"]').textContent()).toContain('panel seam A');
		// back to selecting (the toolbar's first button), the first panel clicked, the other two picked with it (Shift+click), as the status line says
		await selectTool.click();
		// the middle of each panel's grainline lies inside the panel
		const centre = (i: number) => vecLerp(panels[i].grainline!.from, panels[i].grainline!.to, 0.5);
		await clickOnPiece(page, keys[0]!, centre(0));
		await page.keyboard.down('Shift');
		await clickOnPiece(page, keys[1]!, centre(1));
		await clickOnPiece(page, keys[2]!, centre(2));
		await page.keyboard.up('Shift');
		await pageScreenshot(page, 'editor-shaping-path-panels');
		await expect.poll(() => offered.locator('[data-testid="offered-on"]').textContent()).toContain('3 panels');
		await offered.getByRole('button', { name: /Carry/ }).click();
		expect(await offered.locator('[data-tool="carry"]').getAttribute('aria-pressed')).toBe('true');
		const boxes = panels.map((p) => pathBoundingBox(p.outline));
		const Ds = panels.flatMap((p) => p.apexes.filter((a) => a.kind === 'divergence').map((a) => a.point.y));
		const y = Math.max(...Ds) + 30;
		await page.getByRole('button', { name: 'Fit' }).click();
		await dragOnPiece(page, keys[0]!, { x: Math.min(...boxes.map((b) => b.minX)) - 12, y }, { x: Math.max(...boxes.map((b) => b.maxX)) + 12, y }, 10);
		await pageScreenshot(page, 'editor-shaping-path-carry');
		await expect.poll(() => readouts(page)).toContain('none: the line reaches every divergence point');
		await page.getByRole('button', { name: 'Apply' }).click();
		await saveFromPanel(page, 'Panel shaping carried into the underbust seam', ['Underbust band', 'Upper centre front', 'Upper middle front', 'Upper side front']);
		expect(await page.locator('[role="alert"]').count()).toBe(0);
		// one report for the one change, its checks listed once
		expect(await page.locator('[data-testid="save-report"]').last().textContent()).toContain('Underbust band v1, Upper centre front v1, Upper middle front v1, Upper side front v1: saved as one change');

		// 3. the new band's lower edge reshaped by hand: a point dragged down, the change declared, saved
		const band = (await named(page, 'Underbust band'))!;
		const bandGeometry = await geometry(page, band);
		const bottom = bandGeometry.outline.segments.map((s) => s.p0).reduce((a, b) => (b.y > a.y ? b : a));
		const lower = bandGeometry.outline.segments.map((s) => s.p0).filter((p) => Math.abs(p.y - bottom.y) < 30 && Math.abs(p.x - bottom.x) > 5);
		const point = lower.sort((a, b) => b.y - a.y)[0] ?? bottom;
		// the band chosen in the list of pieces: the piece's own moves are offered
		await page.locator('section[aria-labelledby="pieces-title"] button', { hasText: 'Underbust band' }).click();
		// the seams between the new pieces are labelled with the names given when saving; the field is empty again
		await expect.poll(() => page.locator('[data-testid="piece-seam-pairs"]').textContent()).toContain('style seam 1 (Upper centre front)');
		expect(await page.locator('[data-testid="piece-seam-pairs"]').textContent()).not.toContain('(a))');
		expect(await page.inputValue('#save-message')).toBe('');
		await offered.getByRole('button', { name: /Reshape/ }).click();
		await dragOnPiece(page, band, point, { x: point.x, y: point.y + 6 }, 8);
		await expect.poll(() => page.locator('[data-testid="reshape-moved"]').textContent()).toContain('1 point moved');
		await page.getByRole('button', { name: 'Apply' }).click();
		const form = page.locator('[data-testid="reshape-declaration"]');
		await form.waitFor();
		await form.getByLabel(/Added ease/).first().check();
		await form.getByRole('button', { name: 'Declare and apply' }).click();
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Reshape');
		await pageScreenshot(page, 'editor-shaping-path-reshaped');
		await saveFromPanel(page, 'Lower edge of the band let down by hand: added ease');
		expect(await page.locator('[role="alert"]').count()).toBe(0);
		const report = await page.locator('[data-testid="save-report"]').last().textContent();
		expect(report).toContain('Underbust band: version 2 saved');

		// the server counted the declaration: the stored version's checks all passed
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${studioId}/styles/${styleId}`)).json();
		const stored = (style.pieces as { name: string; shown: { number: number; checks: { passed: boolean }[] } | null }[]).find((p) => p.name === 'Underbust band')!;
		expect(stored.shown!.number).toBe(2);
		expect(stored.shown!.checks.every((c) => c.passed)).toBe(true);
		expect(problems).toEqual([]);
		await context.close();
	});
});
