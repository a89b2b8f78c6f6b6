// The loop back from the fitting, in Chromium against the built app: the sample room records a fitting
// with two photos and pins a note on the midriff band; the pattern cutter sees the pin in the editor,
// makes the change, saves, and marks the note done with that version; the designer receives the e-mail
// asking for review (read in the dev inbox), follows its link and signs the version off.
import { describe, expect, inject, it } from 'vitest';
import { demoPath } from '../../src/lib/pattern/fixtures/demo-path';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { toilePhotoJpeg } from '../../src/lib/server/seed/toile-photo';
import { pageScreenshot } from './chromium';
import { demoBrowserUse, demoSignIn } from './demo-studio';
import { clickOnPiece, editorOpen, saveFromPanel } from './editor-helpers';

const { browser, demo, baseUrl } = demoBrowserUse();

/** A style of its own in the demo studio holding the demo path's midriff band, signed off (the sample room sees it). */
async function bandStyle() {
	const band = demoPath().pieces.find((p) => p.key === 'midriff-band')!.first.geometry as Piece;
	const cutter = await demoSignIn(browser(), baseUrl(), demo(), 'patterncutter');
	const designer = await demoSignIn(browser(), baseUrl(), demo(), 'designer');
	const api = `${baseUrl()}/api/studios/${demo().studioId}`;
	const post = async (page: typeof cutter.page, url: string, data: unknown) => {
		const r = await page.request.post(url, { data });
		if (!r.ok()) throw new Error(`${url}: ${r.status()} ${await r.text()}`);
		return r.json();
	};
	const style = (await post(cutter.page, `${api}/styles`, { name: `Juniper bodice, fitting loop ${Date.now().toString(36)}`, code: 'LR-214-F' })).style;
	const made = await post(cutter.page, `${api}/styles/${style.id}/pieces`, { name: 'Midriff band', geometry: band, origin: { op: 'draft' } });
	const state = `${api}/pieces/${made.piece.id}/versions/${made.version.id}/state`;
	await post(cutter.page, state, { action: 'propose' });
	await post(designer.page, state, { action: 'sign_off' });
	await designer.context.close();
	return { styleId: style.id as string, pieceId: made.piece.id as string, band, cutter };
}

describe('back from the fitting', () => {
	it('sample room → pattern cutter → designer: photos, a pinned note, a new version, the note done, sign-off by e-mail', async () => {
		const { styleId, pieceId, band, cutter } = await bandStyle();
		const studio = `${baseUrl()}/studios/${demo().studioId}`;

		// the sample room records the fitting and uploads two photos
		const room = await demoSignIn(browser(), baseUrl(), demo(), 'sampleroom');
		await room.page.goto(`${studio}/styles/${styleId}`);
		await room.page.click('button:has-text("Record a fitting")');
		await room.page.fill('input[placeholder="First toile fitting"]', 'Toile fitting, band');
		await room.page.fill('input[aria-label="Fit model"]', 'Fit model A (size 10)');
		await room.page.click('button:has-text("Record the fitting")');
		await room.page.waitForURL(/\/fittings\/[0-9a-f-]{36}$/);
		await room.page.setInputFiles('[data-testid="photo-input"]', [
			{ name: 'front.jpg', mimeType: 'image/jpeg', buffer: await toilePhotoJpeg('front', 600, 800) },
			{ name: 'side.jpg', mimeType: 'image/jpeg', buffer: await toilePhotoJpeg('three-quarter', 600, 800) }
		]);
		await expect.poll(() => room.page.locator('[data-testid="photo-thumb"]').count(), { timeout: 20_000 }).toBe(2);
		// large on click, the arrow keys step through, Escape closes and gives focus back
		await room.page.locator('[data-testid="photo-thumb"]').first().click();
		await expect.poll(() => room.page.locator('dialog[open] [aria-live]').textContent()).toBe('1 / 2');
		await room.page.keyboard.press('ArrowRight');
		await expect.poll(() => room.page.locator('dialog[open] [aria-live]').textContent()).toBe('2 / 2');
		// the large photo is drawn once it has loaded (under load that can take a moment after the counter moved)
		await expect.poll(() => room.page.locator('[data-testid="photo-large"]').evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), { timeout: 15_000 }).toBe(600);
		await room.page.keyboard.press('Escape');
		await expect.poll(() => room.page.locator('dialog[open]').count()).toBe(0);

		// a note pinned on the band: a click on its drawing gives the point
		const seg = band.outline.segments.find((s) => s.kind === 'line') ?? band.outline.segments[0];
		const end = seg.kind === 'line' ? seg.p1 : seg.p3;
		const notchAt = { x: Math.round((seg.p0.x + end.x) * 5) / 10, y: Math.round((seg.p0.y + end.y) * 5) / 10 };
		await room.page.locator('[data-testid="pin-canvas"] svg').click();
		await room.page.fill('#note-x', String(notchAt.x));
		await room.page.fill('#note-y', String(notchAt.y));
		await room.page.selectOption('#note-category', 'seam_placement');
		// amounts in inches, chosen on the page: typed as a fraction, shown to the sixteenth
		await room.page.selectOption('[data-testid="amount-unit"]', 'in');
		await room.page.fill('#note-amount', '1/4');
		await room.page.fill('#note-body', 'Mark the seam: add a notch here so the band meets the upper front at the same point.');
		await room.page.selectOption('#note-for', { label: demo().users.find((u) => u.role === 'patterncutter')!.name });
		await room.page.click('button:has-text("Pin the note")');
		await room.page.waitForSelector('[data-testid="fit-note"], form [role="alert"]');
		expect(await room.page.locator('form [role="alert"]').allTextContents()).toEqual([]);
		await expect.poll(() => room.page.locator('[data-testid="fit-note"]').count()).toBe(1);
		expect(await room.page.locator('[data-testid="fit-note-headline"]').textContent()).toBe('seam placement, move out / down 1/4 in');
		await expect.poll(() => room.page.locator('[data-testid="pin-mark"]').count()).toBe(1);
		await pageScreenshot(room.page, 'fitting-page');
		await room.context.close();

		// the pattern cutter sees the pin in the editor, adds the notch there, saves, marks the note done
		const page = cutter.page;
		await editorOpen(page, `${studio}/styles/${styleId}/edit`);
		await expect.poll(() => page.locator('[data-testid="fit-pin"]').count(), { timeout: 15_000 }).toBe(1);
		// the pin gives the amount in the editor's unit once one is chosen
		await page.selectOption('label:has-text("Unit") select', 'in');
		await expect.poll(() => page.locator('[data-testid="fit-pin"]').getAttribute('aria-label')).toContain('seam placement, move out / down 1/4 in');
		await page.keyboard.press('n');
		await clickOnPiece(page, pieceId, notchAt);
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('[data-testid="recipe"]').textContent()).toContain('notch');
		await saveFromPanel(page, 'Notch where the band meets the upper front (fitting note)');
		await page.locator('[data-testid="fit-pin"]').click();
		await page.click('button:has-text("Mark done: resolved by version 2")');
		await expect.poll(() => page.locator('[data-testid="fit-pin"]').count()).toBe(0);
		await pageScreenshot(page, 'editor-fit-note-done');
		// proposes version 2: the signers are asked by e-mail
		// the page must be live before its button is pressed (a click before it hydrates does nothing)
		await page.goto(`${studio}/styles/${styleId}`, { waitUntil: 'networkidle' });
		await page.click('button:has-text("Propose")');
		await page.waitForSelector('[role="status"]:has-text("Proposed")');
		await cutter.context.close();

		// the designer reads the e-mail in the dev inbox, follows its link, and signs off after confirming
		const designer = demo().users.find((u) => u.role === 'designer')!;
		let link = '';
		await expect
			.poll(
				async () => {
					const messages = (await (await fetch(`${inject('inboxUrl')}/messages.json`)).json()) as { to: string[]; subject: string; links: string[] }[];
					const m = messages.find((x) => x.to.includes(designer.email) && x.links.some((l) => l.includes(pieceId)));
					link = m?.links.find((l) => l.includes(pieceId)) ?? '';
					return m?.subject ?? '';
				},
				{ timeout: 15_000 }
			)
			.toMatch(/^Review: Midriff band version 2 of Juniper bodice, fitting loop/);
		expect(link).toMatch(new RegExp(`/studios/${demo().studioId}/styles/${styleId}/pieces/${pieceId}/versions/[0-9a-f-]{36}$`));
		const d = await demoSignIn(browser(), baseUrl(), demo(), 'designer');
		await d.page.goto(link);
		await d.page.click('button:has-text("Review and sign off")');
		await d.page.waitForSelector('dialog[open]:has-text("No seam warnings and no open fit notes")');
		await d.page.fill('dialog[open] textarea', 'Notch matches the upper front; fitting note closed.');
		await d.page.click('dialog[open] button:has-text("Sign off")');
		await d.page.waitForSelector('[data-testid="review-thread"]:has-text("signed it off")');
		await pageScreenshot(d.page, 'version-signed-off-after-fitting');
		const versions = await (await d.page.request.get(`${baseUrl()}/api/studios/${demo().studioId}/pieces/${pieceId}/versions`)).json();
		expect(versions.versions.map((v: { number: number; state: string }) => [v.number, v.state])).toEqual([
			[2, 'signed_off'],
			[1, 'superseded']
		]);
		await d.context.close();
	});
});
