// The editor saves a multi-piece change through the change endpoint: carry two panels, name the new
// pieces, save once (one POST …/changes), reload and find the change as stored.
import { describe, expect, it } from 'vitest';
import { pathBoundingBox, pathFromPolyline, pathLength, outlineBetween, type Vec } from '../../src/lib/geometry';
import { outlineNearestLocation } from '../../src/lib/pattern/kernel';
import { underStructurePanels } from '../../src/lib/pattern/panels/fixtures/under-structure-panels';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { pageScreenshot } from './chromium';
import { dragOnPiece, editorBrowserUse, editorOpen, saveFromPanel, signUp, styleWithPieces } from './editor-helpers';

// The 6-panel boned under-structure drafted from the ASTM D5585 misses chart, size 10 curvy: two panels of it.
const six = underStructurePanels(6);

function inOutlineOrder(piece: Piece, pts: readonly Vec[]): { from: Vec; to: Vec } {
	const [from, to] = [pts[0], pts[pts.length - 1]];
	const loc = (p: Vec) => outlineNearestLocation(piece.outline, p);
	const fwd = pathLength(outlineBetween(piece.outline, loc(from), loc(to)));
	return fwd <= pathLength(pathFromPolyline([...pts])) + 0.5 ? { from, to } : { from: to, to: from };
}

describe('pattern editor: a multi-piece change saved as one', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('carries two panels, asks each new piece\'s name and cut, saves them through the change endpoint, and finds them after a reload', async () => {
		const { context, page } = await signUp(browser(), baseUrl());
		const panels = six.panels.slice(0, 2);
		const s = await styleWithPieces(page, baseUrl(), panels.map((p) => ({ name: p.name, geometry: p })), 'Carried bodice');
		const seam = six.draft.seams.find((x) => x.leftPanelId === panels[0].id && x.rightPanelId === panels[1].id)!;
		const sp = await page.request.post(`${baseUrl()}/api/studios/${s.studioId}/styles/${s.styleId}/seam-pairs`, {
			data: {
				label: seam.id,
				a: { pieceId: s.pieceIds[0], ...inOutlineOrder(panels[0], [seam.left.lower[0], seam.left.lower[1], seam.left.upper[1]]) },
				b: { pieceId: s.pieceIds[1], ...inOutlineOrder(panels[1], [seam.right.lower[0], seam.right.lower[1], seam.right.upper[1]]) },
				toleranceMm: 0.5
			}
		});
		expect(sp.status()).toBe(201);
		const editorUrl = `${baseUrl()}/studios/${s.studioId}/styles/${s.styleId}/edit`;
		await editorOpen(page, editorUrl);
		const posts: string[] = [];
		page.on('request', (r) => {
			if (r.method() === 'POST' && r.url().includes('/api/')) posts.push(new URL(r.url()).pathname);
		});
		await page.keyboard.press('k');
		// carry lays the panels as drafted when it starts (the button stays for panels moved apart later)
		const lay = page.locator('button:has-text("Lay the panels as drafted")');
		if (await lay.count()) await lay.click();
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('0');
		const boxes = panels.map((p) => pathBoundingBox(p.outline));
		const minX = Math.min(...boxes.map((b) => b.minX)) - 12;
		const maxX = Math.max(...boxes.map((b) => b.maxX)) + 12;
		const low = seam.divergencePoint.y + 30;
		await dragOnPiece(page, s.pieceIds[0], { x: minX, y: low }, { x: maxX, y: low }, 10);
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').textContent()).toContain('none: the line reaches every divergence point');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.evaluate(() => window.dartelierEditor!.pieceKeys().length)).toBe(3);

		// a new piece may not keep the name of a panel it was made from
		await page.fill('#save-message', 'Panel seam carried into a midriff seam');
		await page.click('button:has-text("Save version")');
		const dialog = page.locator('[data-testid="new-pieces"]');
		await dialog.waitFor();
		await pageScreenshot(page, 'editor-change-naming');
		const inputs = dialog.locator('input[name^="new-piece-name-"]');
		expect(await inputs.count()).toBe(3);
		await inputs.nth(0).fill(panels[0].name);
		await dialog.locator('button:has-text("Save the change")').click();
		await expect.poll(() => page.locator('[data-testid="naming-error"]').textContent()).toMatch(/name of a piece it was made from/);
		const names = ['Midriff', 'Upper centre front', 'Upper middle front'];
		for (const [i, n] of names.entries()) await inputs.nth(i).fill(n);
		await dialog.locator('select[name="new-piece-cut-0"]').selectOption('on_fold');
		await dialog.locator('button:has-text("Save the change")').click();
		await page.locator('[data-testid="save-report"]').first().waitFor({ timeout: 20_000 });
		expect(await page.locator('[data-testid="save-error"]').count()).toBe(0);
		// one request stored the whole change: no piece or seam pair created one by one
		expect(posts.filter((p) => p.endsWith('/changes'))).toHaveLength(1);
		expect(posts.filter((p) => p.endsWith('/pieces') || p.endsWith('/seam-pairs'))).toEqual([]);

		await editorOpen(page, editorUrl);
		await pageScreenshot(page, 'editor-change-reloaded');
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${s.studioId}/styles/${s.styleId}`)).json();
		type P = { id: string; name: string; cut: string; shown: { id: string; geometry: Piece } };
		const made = (style.pieces as P[]).filter((p) => !s.pieceIds.includes(p.id));
		expect(made.map((p) => p.name).sort()).toEqual([...names].sort());
		const band = made.find((p) => p.name === 'Midriff')!;
		expect(band.cut).toBe('on_fold');
		// the sources' labels ("… cut 2 (a pair)") are gone; the piece says its own name and cut
		expect(band.shown.geometry.labels.map((l) => l.text)).toEqual(['Midriff — cut 1 on fold']);
		const v = await (await page.request.get(`${baseUrl()}/api/studios/${s.studioId}/pieces/${band.id}/versions/${band.shown.id}`)).json();
		expect(v.version.recipe[0].op).toBe('change_result');
		const keys = (await page.evaluate(() => window.dartelierEditor!.pieceKeys())) as string[];
		for (const p of made) expect(keys).toContain(p.id);
		await context.close();
	});
});
