// The editor's calibrate dialog is a dialog of the keyboard too: focus starts in it and Escape closes it.
import { describe, expect, inject, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { editorBrowserUse, editorOpen, editorSetUp } from './editor-helpers';

describe('calibrate dialog', () => {
	const { browser } = editorBrowserUse();

	it('Escape closes the calibrate dialog without changing the calibration', async () => {
		const f = await editorSetUp(browser(), inject('baseUrl'), [{ name: 'Front bodice', geometry: frontBodiceBlock() }]);
		const { page } = f;
		await editorOpen(page, f.editorUrl);
		await page.getByRole('button', { name: 'Calibrate' }).click();
		const dialog = page.getByRole('dialog', { name: 'Check true size on this screen' });
		await dialog.waitFor();
		const before = await dialog.getByText(/px per mm/).textContent();
		// focus starts on the dialog's field
		expect(await page.evaluate(() => document.activeElement?.closest('[role="dialog"]') !== null)).toBe(true);
		await page.keyboard.type('95');
		await page.keyboard.press('Escape');
		await expect.poll(() => dialog.count()).toBe(0);

		// opened again: nothing was applied
		await page.getByRole('button', { name: 'Calibrate' }).click();
		await dialog.waitFor();
		expect(await dialog.getByText(/px per mm/).textContent()).toBe(before);
		// Escape also closes it when focus has left the field
		await dialog.getByRole('heading').click();
		await page.keyboard.press('Escape');
		await expect.poll(() => dialog.count()).toBe(0);
		await f.context.close();
	});
});
