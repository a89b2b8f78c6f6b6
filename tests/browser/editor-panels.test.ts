import { describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { outlineBetween, pathBoundingBox, pathLength, pathFromPolyline, vecDistance, type Vec } from '../../src/lib/geometry';
import { outlineNearestLocation } from '../../src/lib/pattern/kernel';
import { underStructurePanels } from '../../src/lib/pattern/panels/fixtures/under-structure-panels';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { pageScreenshot } from './chromium';
import { dragOnPiece, editorBrowserUse, editorOpen, saveFromPanel, signUp, styleWithPieces } from './editor-helpers';

// The 6-panel boned under-structure drafted from the ASTM D5585 misses chart, size 10 curvy.
const six = underStructurePanels(6);

/** A seam edge as the server stores it: from → to in the piece's outline order. */
function inOutlineOrder(piece: Piece, pts: readonly Vec[]): { from: Vec; to: Vec } {
	const [from, to] = [pts[0], pts[pts.length - 1]];
	const loc = (p: Vec) => outlineNearestLocation(piece.outline, p);
	const fwd = pathLength(outlineBetween(piece.outline, loc(from), loc(to)));
	return fwd <= pathLength(pathFromPolyline([...pts])) + 0.5 ? { from, to } : { from: to, to: from };
}

async function panelsStyle(browser: Browser, baseUrl: string, count: number, allowedEaseMm = 0) {
	const { context, page } = await signUp(browser, baseUrl);
	const panels = six.panels.slice(0, count);
	const s = await styleWithPieces(page, baseUrl, panels.map((p) => ({ name: p.name, geometry: p })), 'Corset under-structure');
	const keyOf = new Map(panels.map((p, i) => [p.id, s.pieceIds[i]]));
	for (const sp of six.draft.seams) {
		const a = panels.find((p) => p.id === sp.leftPanelId);
		const b = panels.find((p) => p.id === sp.rightPanelId);
		if (!a || !b) continue;
		const ea = inOutlineOrder(a, [sp.left.lower[0], sp.left.lower[1], sp.left.upper[1]]);
		const eb = inOutlineOrder(b, [sp.right.lower[0], sp.right.lower[1], sp.right.upper[1]]);
		const r = await page.request.post(`${baseUrl}/api/studios/${s.studioId}/styles/${s.styleId}/seam-pairs`, {
			data: { label: sp.id, a: { pieceId: keyOf.get(a.id), ...ea }, b: { pieceId: keyOf.get(b.id), ...eb }, allowedEaseMm, toleranceMm: 0.5 }
		});
		if (!r.ok()) throw new Error(`seam pair: ${r.status()} ${await r.text()}`);
	}
	return { context, page, ...s, editorUrl: `${baseUrl}/studios/${s.studioId}/styles/${s.styleId}/edit` };
}

type StoredPair = { id: string; label: string; aPieceId: string; bPieceId: string; aEdge: { from: Vec; to: Vec }; bEdge: { from: Vec; to: Vec }; toleranceMm: number };

/** The length along a piece's outline from `from` forward to `to` (as the server walks a stored edge). */
function forward(piece: Piece, e: { from: Vec; to: Vec }): number {
	const loc = (p: Vec) => outlineNearestLocation(piece.outline, p);
	return pathLength(outlineBetween(piece.outline, loc(e.from), loc(e.to)));
}

const readouts = (page: Page) => page.locator('[data-testid="tool-readouts"]').textContent();

async function saveAll(page: Page, message: string) {
	await saveFromPanel(page, message);
	const err = page.locator('[role="alert"]');
	if (await err.count()) throw new Error(`save: ${await err.allTextContents()}`);
}

describe('pattern editor: panel tools', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('joins two panels along their stored seam pair, closing the wedge or keeping it as a dart, and saves the new piece', async () => {
		const f = await panelsStyle(browser(), baseUrl(), 2);
		const { page } = f;
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		await editorOpen(page, f.editorUrl);
		await page.keyboard.press('j');
		expect(await page.getAttribute('[data-tool="join"]', 'aria-pressed')).toBe('true');
		await expect.poll(() => readouts(page)).toContain('Wedge at the divergence point');
		await pageScreenshot(page, 'editor-join-closed');
		const canvas = page.locator('[data-testid="editor-canvas"]');
		const closedPixels = await canvas.screenshot();
		await page.check('input[name="join-wedge"][value="keep_as_dart"]');
		await expect.poll(() => readouts(page)).toMatch(/Kept as a dart\s*\S+-dart/);
		// the preview on the canvas follows the choice, not only the readouts
		await expect.poll(async () => Buffer.compare(await canvas.screenshot(), closedPixels) !== 0, { timeout: 10_000 }).toBe(true);
		await pageScreenshot(page, 'editor-join-dart');
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('Enter');
		await expect.poll(() => page.evaluate(() => window.dartelierEditor!.pieceKeys().length)).toBe(1);
		await saveAll(page, 'Centre front and side front joined');
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${f.studioId}/styles/${f.styleId}`)).json();
		expect(style.pieces.some((p: { name: string }) => p.name.includes(' + '))).toBe(true);
		expect(problems).toEqual([]);
		await f.context.close();
	});

	it('carries the 6-panel under-structure (three panels a side) into one underbust seam: residuals live while the line is high, none at the reach line', async () => {
		const f = await panelsStyle(browser(), baseUrl(), 6);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		await page.keyboard.press('k');
		// carry lays the panels as drafted when it starts (the button stays for panels moved apart later)
		const lay = page.locator('button:has-text("Lay the panels as drafted")');
		if (await lay.count()) await lay.click();
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('0');
		const key = f.pieceIds[0];
		const boxes = six.panels.map((p) => pathBoundingBox(p.outline));
		const minX = Math.min(...boxes.map((b) => b.minX)) - 12;
		const maxX = Math.max(...boxes.map((b) => b.maxX)) + 12;
		const Ds = six.draft.seams.map((s) => s.divergencePoint.y);
		const high = Math.min(...Ds) - 25;
		const low = Math.max(...Ds) + 30;
		// a line above the divergence points: the residuals are reported while it is dragged
		await dragOnPiece(page, key, { x: minX, y: high }, { x: maxX, y: high }, 10);
		await expect.poll(() => readouts(page)).toContain('Residual at');
		await pageScreenshot(page, 'editor-carry-residual');
		// drag both ends down below every divergence point
		await dragOnPiece(page, key, { x: maxX, y: high }, { x: maxX, y: low }, 8);
		await dragOnPiece(page, key, { x: minX, y: high }, { x: minX, y: low }, 8);
		await expect.poll(() => readouts(page)).toContain('none: the line reaches every divergence point');
		await pageScreenshot(page, 'editor-carry-reached');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.evaluate(() => window.dartelierEditor!.pieceKeys().length)).toBe(4);
		await pageScreenshot(page, 'editor-carried');
		await saveAll(page, 'Panel shaping carried into the underbust seam');
		await pageScreenshot(page, 'editor-carry-saved');
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${f.studioId}/styles/${f.styleId}`)).json();
		// three panels (hidden here) and four new pieces: the band below the line and the three parts above
		expect(style.pieces.length).toBe(7);
		// the style seam is stored: one seam pair from the joined band to each part above the line
		const made = (style.pieces as { id: string; shown: { geometry: Piece } }[]).filter((p) => !f.pieceIds.includes(p.id));
		const carried = (style.seamPairs as StoredPair[]).filter((sp) => sp.label.startsWith('style seam'));
		expect(carried).toHaveLength(3);
		const band = made.find((p) => carried.every((sp) => sp.aPieceId === p.id));
		expect(band).toBeTruthy();
		expect(new Set(carried.map((sp) => sp.bPieceId)).size).toBe(3);
		for (const sp of carried) {
			expect(made.some((p) => p.id === sp.bPieceId)).toBe(true);
			const la = forward(made.find((p) => p.id === sp.aPieceId)!.shown.geometry, sp.aEdge);
			const lb = forward(made.find((p) => p.id === sp.bPieceId)!.shown.geometry, sp.bEdge);
			expect(Math.abs(la - lb)).toBeLessThan(sp.toleranceMm);
		}
		await f.context.close();
	});

	it('trues a seam: lengths with darts folded out against the allowed ease, one end moved, saved as a new version', async () => {
		const f = await panelsStyle(browser(), baseUrl(), 2, 3);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		await page.keyboard.press('t');
		await expect.poll(() => readouts(page)).toContain('Allowed ease');
		expect(await readouts(page)).toContain('3.0 mm');
		await page.selectOption('#true-adjust', 'a-end');
		await expect.poll(() => readouts(page)).toContain('After: difference a − b');
		expect(await readouts(page)).toMatch(/After: difference a − b\s*\+3\.0 mm/);
		await pageScreenshot(page, 'editor-true-seam');
		await page.click('button:has-text("Apply")');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Reshape');
		await pageScreenshot(page, 'editor-true-seam-applied');
		const checks = await page.locator('[data-testid="verify-checks"] li').allTextContents();
		expect(checks.filter((c) => !c.startsWith('✓'))).toEqual([]);
		const before = ((await (await page.request.get(`${baseUrl()}/api/studios/${f.studioId}/styles/${f.styleId}`)).json()).seamPairs as StoredPair[])[0];
		await saveAll(page, 'Seam trued with 3 mm ease');
		expect(await page.locator('[data-testid="save-report"]').textContent()).toContain('version 2 saved');
		// the stored pair follows the trued edge: its moved end is where the truing put it, the other end stays
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${f.studioId}/styles/${f.styleId}`)).json();
		const after = (style.seamPairs as StoredPair[]).find((sp) => sp.id === before.id)!;
		expect(after.bEdge).toEqual(before.bEdge);
		const movedEnds = [vecDistance(after.aEdge.from, before.aEdge.from), vecDistance(after.aEdge.to, before.aEdge.to)];
		expect(movedEnds.filter((d) => d > 0.01)).toHaveLength(1);
		// measured again from the stored pair, the seam reads true
		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('t');
		await expect.poll(() => readouts(page)).toMatch(/Reads\s*true/);
		expect(await readouts(page)).toMatch(/Difference a − b\s*\+3\.0 mm/);
		const a = (style.pieces as { id: string; shown: { geometry: Piece } }[]).find((p) => p.id === after.aPieceId)!.shown.geometry;
		const b = (style.pieces as { id: string; shown: { geometry: Piece } }[]).find((p) => p.id === after.bPieceId)!.shown.geometry;
		expect(forward(a, after.aEdge)).toBeGreaterThan(forward(b, after.bEdge));
		await f.context.close();
	});
});
