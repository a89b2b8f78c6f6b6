// Debian's Chromium through playwright-core (never a downloaded browser).
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

export async function browserLaunch(): Promise<Browser> {
	return chromium.launch({
		executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
		args: [
			'--headless',
			'--no-sandbox',
			'--disable-gpu',
			'--disable-quic',
			'--no-first-run',
			'--disable-background-networking',
			'--disable-component-update',
			'--disable-sync'
		]
		// playwright gives every launch a fresh, empty profile folder of its own.
	});
}

/** Saves a screenshot under test-results/screenshots for a person to look at. */
export async function pageScreenshot(page: Page, name: string): Promise<string> {
	const dir = path.resolve('test-results/screenshots');
	mkdirSync(dir, { recursive: true });
	const file = path.join(dir, `${name}.png`);
	await page.screenshot({ path: file, fullPage: true });
	return file;
}
