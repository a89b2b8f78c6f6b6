import { describe, expect, it } from 'vitest';
import AxeBuilder from '@axe-core/playwright';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { outlineBetween, pathLength } from '../../src/lib/geometry';
import { outlineNearestLocation } from '../../src/lib/pattern/kernel';
import { allowanceEdges } from '../../src/lib/pattern/panels/allowance-edges';
import { pageScreenshot } from './chromium';
import { clickOnPiece, dragOnPiece, editorBrowserUse, editorOpen, editorSetUp, firstKey, lerp, saveFromPanel, toPage } from './editor-helpers';

const block = frontBodiceBlock();
const shoulder = block.darts.find((d) => d.id === 'shoulder-dart')!;
const bp = block.apexes[0].point;
// the side seam runs from the underarm (235, 230) to the side waist (225, 440)
const sideSeamAt = (y: number) => ({ x: 235 - (10 * (y - 230)) / 210, y });
// the waist from the side waist (225, 440) toward the waist dart's leg (115, …)
const waistLeg1 = block.darts.find((d) => d.id === 'waist-dart')!.leg1End;
const waistAt = (x: number) => lerp({ x: 225, y: 440 }, waistLeg1, (225 - x) / (225 - waistLeg1.x));

describe('pattern editor', () => {
	const { browser, baseUrl } = editorBrowserUse();

	it('pivots the bust dart to the side seam by dragging, keeps the ledger balanced, saves version 2', async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		const problems: string[] = [];
		page.on('pageerror', (e) => problems.push(e.message));
		await editorOpen(page, f.editorUrl);
		await pageScreenshot(page, 'editor-open');

		const axe = await new AxeBuilder({ page }).analyze();
		const serious = axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
		expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);

		await page.locator('[data-testid="editor-canvas"]').focus();
		await page.keyboard.press('Shift+?');
		await page.waitForSelector('[role="dialog"]:has-text("Keyboard shortcuts")');
		expect(await page.locator('[role="dialog"]').textContent()).toContain('Pivot tool');
		await pageScreenshot(page, 'editor-help');
		await page.keyboard.press('Escape');
		await page.waitForSelector('[role="dialog"]', { state: 'detached' });

		const key = await firstKey(page);
		// hovering the side seam says what is under the pointer
		const seam = await toPage(page, key, sideSeamAt(320));
		await page.mouse.move(seam.x, seam.y);
		await expect.poll(() => page.locator('[data-testid="hover"]').textContent()).toContain('edge');
		await page.click('[data-tool="pivot"]');
		// press on the shoulder dart near its mouth, drag to the side seam
		await dragOnPiece(page, key, lerp(bp, shoulder.leg1End, 0.85), sideSeamAt(300));
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pivot');
		const ledger = page.locator('[data-testid="ledger-state"]').first();
		await expect.poll(() => ledger.textContent()).toContain('Balanced');
		const checks = await page.locator('[data-testid="verify-checks"] li').allTextContents();
		expect(checks.length).toBeGreaterThan(0);
		expect(checks.every((c) => c.startsWith('✓'))).toBe(true);
		await pageScreenshot(page, 'editor-pivot');

		await page.fill('#save-message', 'Shoulder dart moved to the side seam');
		await page.click('button:has-text("Save version")');
		await page.waitForSelector('[data-testid="save-report"]:has-text("version 2 saved")');
		await pageScreenshot(page, 'editor-saved');

		await editorOpen(page, f.editorUrl);
		await expect.poll(() => page.locator('section[aria-labelledby="pieces-title"]').textContent()).toContain('v2');
		const geometry = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
		const moved = geometry.darts.find((d) => d.id === 'shoulder-dart')!;
		expect(moved.leg1End.x).toBeGreaterThan(200);
		expect(problems).toEqual([]);
		await f.context.close();
	});

	it('turns a dart into two pleats by typing numbers', async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		await page.click('[data-tool="pleat"]');
		await page.selectOption('#tool-dart', 'shoulder-dart');
		await page.fill('#pleat-count', '2');
		await page.fill('#pleat-first', '15');
		await page.press('#pleat-first', 'Tab');
		await page.fill('#pleat-spacing', '30');
		await page.press('#pleat-spacing', 'Tab');
		await page.selectOption('#pleat-mode', 'equal_intake');
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').textContent()).toContain('Pleat 2 intake');
		await pageScreenshot(page, 'editor-pleat-preview');
		await page.click('button:has-text("Apply")');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pleat');
		const key = await firstKey(page);
		const g = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
		expect(g.pleats).toHaveLength(2);
		expect(Math.abs(g.pleats[0].intakeMm - g.pleats[1].intakeMm)).toBeLessThan(0.01);
		await expect.poll(() => page.locator('[data-testid="ledger-state"]').first().textContent()).toContain('Balanced');
		await pageScreenshot(page, 'editor-pleats');
		await f.context.close();
	});

	it('draws a style line, separates the piece, and undoes back to the start', async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		const key = await firstKey(page);
		await page.keyboard.press('s');
		expect(await page.getAttribute('[data-tool="style_line"]', 'aria-pressed')).toBe('true');
		await clickOnPiece(page, key, sideSeamAt(280));
		await clickOnPiece(page, key, waistAt(170));
		// curve it: drag the first handle a little toward the centre
		const h1 = lerp(sideSeamAt(280), waistAt(170), 1 / 3);
		await dragOnPiece(page, key, h1, { x: h1.x - 15, y: h1.y + 5 }, 6);
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').textContent()).toContain('Line length');
		await pageScreenshot(page, 'editor-style-line');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').first().textContent()).toContain('Style line');

		await page.keyboard.press('x');
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').textContent()).toContain('Piece 2 area');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.evaluate(() => window.dartelierEditor!.pieceKeys().length)).toBe(2);
		await pageScreenshot(page, 'editor-separated');

		for (let i = 0; i < 5 && (await page.evaluate(() => window.dartelierEditor!.historyLength())) > 0; i++) {
			await page.locator('[data-testid="editor-canvas"]').focus();
			await page.keyboard.press('Control+z');
		}
		expect(await page.evaluate(() => window.dartelierEditor!.historyLength())).toBe(0);
		expect(await page.evaluate(() => window.dartelierEditor!.pieceKeys())).toEqual([key]);
		const g = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
		expect(g.internalLines).toHaveLength(0);
		expect(await page.locator('[data-testid="recipe"]').textContent()).toContain('No steps yet');
		await page.keyboard.press('Control+Shift+z');
		expect(await page.evaluate(() => window.dartelierEditor!.historyLength())).toBe(1);

		// redo the separate too and save: the two new pieces are stored with the seam pair between them
		await page.keyboard.press('Control+Shift+z');
		await expect.poll(() => page.evaluate(() => window.dartelierEditor!.pieceKeys().length)).toBe(2);
		// a notch on one new piece before saving: it is stored as made (version 1), the notch as version 2
		const [newKey] = await page.evaluate(() => window.dartelierEditor!.pieceKeys());
		const made0 = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), newKey)) as Piece;
		const s0 = made0.outline.segments[0];
		await page.keyboard.press('n');
		await clickOnPiece(page, newKey, lerp(s0.p0, s0.kind === 'line' ? s0.p1 : s0.p3, 0.5));
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('[data-testid="recipe"]').textContent()).toContain('notch');
		await saveFromPanel(page, 'Front cut along the style line');
		expect(await page.locator('[role="alert"]').count()).toBe(0);
		// one report for the change: the upper part with its notch at version 2, the lower part at version 1
		expect((await page.locator('[data-testid="save-report"]').allTextContents()).join(' ')).toMatch(/upper \(new\) v2, .*lower \(new\) v1: saved as one change/);
		const style = await (await page.request.get(`${baseUrl()}/api/studios/${f.studioId}/styles/${f.styleId}`)).json();
		type Side = { x: number; y: number };
		type Pair = { label: string; aPieceId: string; bPieceId: string; aEdge: { from: Side; to: Side }; bEdge: { from: Side; to: Side }; toleranceMm: number };
		const pairs = style.seamPairs as Pair[];
		expect(pairs).toHaveLength(1);
		const sp = pairs[0];
		expect(sp.label).toContain('separated at');
		expect(sp.toleranceMm).toBeCloseTo(1.6);
		const made = (style.pieces as { id: string; shown: { geometry: Piece } }[]).filter((p) => p.id !== key);
		expect(made.map((p) => p.id).sort()).toEqual([sp.aPieceId, sp.bPieceId].sort());
		// each edge runs forward along its piece's outline over the cut, not round the rest of the piece
		// (the rest of the two pieces differ in length, so a wrong turn on either side shows)
		const along = (id: string, e: { from: Side; to: Side }) => {
			const g = made.find((p) => p.id === id)!.shown.geometry;
			return pathLength(outlineBetween(g.outline, outlineNearestLocation(g.outline, e.from), outlineNearestLocation(g.outline, e.to)));
		};
		const la = along(sp.aPieceId, sp.aEdge);
		const lb = along(sp.bPieceId, sp.bEdge);
		expect(Math.abs(la - lb)).toBeLessThan(sp.toleranceMm);
		// the notched piece: two versions, the second replayed by the server from the notch step
		const notched = made.find((p) => p.shown.geometry.notches.length > made0.notches.length);
		expect(notched).toBeDefined();
		const versions = await (await page.request.get(`${baseUrl()}/api/studios/${f.studioId}/pieces/${notched!.id}/versions`)).json();
		expect(versions.versions.map((v: { number: number }) => v.number).sort()).toEqual([1, 2]);
		await f.context.close();
	});

	it('resolves a save conflict from a second browser context without losing either edit', async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const a = f.page;
		const other = await browser().newContext({ viewport: { width: 1440, height: 900 }, storageState: await f.context.storageState() });
		const b = await other.newPage();
		await editorOpen(a, f.editorUrl);
		await editorOpen(b, f.editorUrl);

		// B: pull the waist dart's point back 20 mm and save (version 2)
		await b.click('[data-tool="pull_back"]');
		await b.selectOption('#tool-dart', 'waist-dart');
		await b.fill('#pull-clearance', '20');
		await b.press('#pull-clearance', 'Enter');
		await expect.poll(() => b.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pull back');
		await b.fill('#save-message', 'Waist dart point pulled back');
		await b.click('button:has-text("Save version")');
		await b.waitForSelector('[data-testid="save-report"]:has-text("version 2 saved")');

		// A: pivot the shoulder dart (based on version 1) and save: the server answers 409
		const key = await firstKey(a);
		await a.click('[data-tool="pivot"]');
		await dragOnPiece(a, key, lerp(bp, shoulder.leg1End, 0.85), sideSeamAt(300));
		await expect.poll(() => a.locator('[data-testid="recipe"] li').first().textContent()).toContain('Pivot');
		await a.fill('#save-message', 'Shoulder dart to the side seam');
		await a.click('button:has-text("Save version")');
		await a.waitForSelector('[data-testid="conflict"]');
		expect(await a.locator('[data-testid="conflict"]').textContent()).toContain('Version 2');
		await pageScreenshot(a, 'editor-conflict');
		await a.click('button:has-text("Save mine on top")');
		await a.waitForSelector('[data-testid="save-report"]:has-text("version 3 saved")');

		const r = await a.request.get(`${baseUrl()}/api/studios/${f.studioId}/pieces/${key}`);
		const body = await r.json();
		expect(body.shown.number).toBe(3);
		const g = body.shown.geometry as Piece;
		expect(g.darts.find((d) => d.id === 'waist-dart')?.pullBack?.clearanceMm).toBe(20);
		expect(g.darts.find((d) => d.id === 'shoulder-dart')!.leg1End.x).toBeGreaterThan(200);
		await pageScreenshot(a, 'editor-conflict-resolved');
		await other.close();
		await f.context.close();
	});

	it('marks the piece for the sample room (notch, grainline, allowance), measures with the tape, saves', async () => {
		const f = await editorSetUp(browser(), baseUrl(), [{ name: 'Front bodice', geometry: block }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		const key = await firstKey(page);

		await page.keyboard.press('m');
		await clickOnPiece(page, key, { x: 235, y: 230 });
		await clickOnPiece(page, key, { x: 225, y: 440 });
		const tape = await page.locator('[data-testid="tool-readouts"]').textContent();
		expect(tape).toContain('Straight distance');
		expect(tape).toContain('210.2 mm');
		expect(tape).toContain('Along the outline');
		await page.selectOption('select:near(:text("Unit"))', 'in');
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').textContent()).toContain('8 1/4 in');
		await pageScreenshot(page, 'editor-tape-measure');
		await page.selectOption('select:near(:text("Unit"))', 'mm');

		await page.keyboard.press('n');
		await clickOnPiece(page, key, sideSeamAt(300));
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('[data-testid="recipe"]').textContent()).toContain('notch');
		await page.keyboard.press('g');
		await clickOnPiece(page, key, { x: 60, y: 300 });
		await page.keyboard.press('Enter');
		await page.keyboard.press('a');
		await expect.poll(() => page.locator('[data-testid="tool-readouts"]').count()).toBe(1);
		// a click on a corner gives it its own shape: folded as it will be pressed
		const corners = allowanceEdges(block).map((e) => e.path.segments[0].p0);
		await clickOnPiece(page, key, corners[1]);
		await expect.poll(() => page.locator('#allowance-corner-1').inputValue()).toBe('folded_next');
		await page.selectOption('#allowance-corner-1', 'folded_prev');
		await page.click('button:has-text("Apply")');
		await expect.poll(() => page.locator('[data-testid="recipe"] li').count()).toBe(3);
		const marked = (await page.evaluate((k) => window.dartelierEditor!.geometry(k), key)) as Piece;
		expect(marked.seamAllowance?.corners).toEqual({ 1: 'folded_prev' });
		const checks = await page.locator('[data-testid="verify-checks"] li').allTextContents();
		expect(checks.every((c) => c.startsWith('✓'))).toBe(true);
		await pageScreenshot(page, 'editor-marks');
		await page.fill('#save-message', 'Notch, grainline and allowance');
		await page.click('button:has-text("Save version")');
		await page.waitForSelector('[data-testid="save-report"]:has-text("version 2 saved")');
		await f.context.close();
	});
});
