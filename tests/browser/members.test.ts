// The members table asks before a change of role or a removal, and a studio always keeps an owner:
// the page does not offer to demote or remove the only owner, and when the server refuses (another
// owner changed things meanwhile) the page says why and shows the stored role again.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { dbCreate, type Db } from '../../src/lib/server/db/index';
import { membershipsCreate } from '../../src/lib/server/repositories/memberships';
import { usersCreate } from '../../src/lib/server/repositories/users';
import { browserLaunch, pageScreenshot } from './chromium';
import { signUp } from './editor-helpers';

describe('members table', () => {
	let browser: Browser;
	let db: Db;
	const baseUrl = () => inject('baseUrl');
	beforeAll(async () => {
		browser = await browserLaunch();
		db = dbCreate(inject('databaseUrl'), 2);
	});
	afterAll(async () => {
		await browser?.close();
		await db?.destroy();
	});

	/** A new owner with a studio and two more members (a pattern cutter and a designer). */
	async function studioWithMembers() {
		const { context, page } = await signUp(browser, baseUrl());
		const me = await (await page.request.get(`${baseUrl()}/api/me`)).json();
		const studioId: string = me.memberships[0].studioId;
		const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6)}`;
		const cutter = await usersCreate(db, { email: `cutter-${stamp}@test.example`, name: 'Bea Cutter', passwordHash: 'not-used' });
		const designer = await usersCreate(db, { email: `designer-${stamp}@test.example`, name: 'Cal Designer', passwordHash: 'not-used' });
		await membershipsCreate(db, { studioId, userId: cutter.id, role: 'patterncutter' });
		await membershipsCreate(db, { studioId, userId: designer.id, role: 'designer' });
		await page.goto(`${baseUrl()}/studios/${studioId}/members`);
		await page.waitForSelector('main table');
		return { context, page, studioId, me: me.user ?? me, cutter, designer };
	}

	async function roleStored(page: Page, studioId: string, userId: string): Promise<string | undefined> {
		const r = await (await page.request.get(`${baseUrl()}/api/studios/${studioId}/members`)).json();
		return r.members.find((m: { userId: string }) => m.userId === userId)?.role;
	}

	it('a change of role waits for confirmation: cancelling keeps the stored role, confirming applies it', async () => {
		const { context, page, studioId, cutter } = await studioWithMembers();
		const select = page.getByLabel('Role of Bea Cutter');
		await select.selectOption('designer');
		const dialog = page.getByRole('dialog', { name: 'Make Bea Cutter designer?' });
		expect(await dialog.isVisible()).toBe(true);
		expect(await dialog.textContent()).toContain('Role now: pattern cutter');
		await pageScreenshot(page, 'members-confirm-role');
		expect(await roleStored(page, studioId, cutter.id)).toBe('patterncutter');

		await dialog.getByRole('button', { name: 'Cancel' }).click();
		await expect.poll(() => dialog.isVisible()).toBe(false);
		expect(await select.inputValue()).toBe('patterncutter');
		expect(await roleStored(page, studioId, cutter.id)).toBe('patterncutter');

		// Escape cancels too
		await select.selectOption('sampleroom');
		await page.getByRole('dialog').waitFor();
		await page.keyboard.press('Escape');
		await expect.poll(() => page.getByRole('dialog').count()).toBe(0);
		expect(await select.inputValue()).toBe('patterncutter');

		await select.selectOption('designer');
		await page.getByRole('dialog').getByRole('button', { name: 'Make designer' }).click();
		await expect.poll(() => roleStored(page, studioId, cutter.id)).toBe('designer');
		expect(await select.inputValue()).toBe('designer');
		await context.close();
	});

	it('a removal waits for confirmation', async () => {
		const { context, page, studioId, designer } = await studioWithMembers();
		const row = page.locator('main tbody tr', { hasText: 'Cal Designer' });
		await row.getByRole('button', { name: 'Remove' }).click();
		const dialog = page.getByRole('dialog', { name: 'Remove Cal Designer from the studio?' });
		expect(await dialog.isVisible()).toBe(true);
		await dialog.getByRole('button', { name: 'Cancel' }).click();
		expect(await roleStored(page, studioId, designer.id)).toBe('designer');
		expect(await row.count()).toBe(1);

		await row.getByRole('button', { name: 'Remove' }).click();
		await page.getByRole('dialog').getByRole('button', { name: 'Remove' }).click();
		await expect.poll(() => row.count()).toBe(0);
		expect(await roleStored(page, studioId, designer.id)).toBeUndefined();
		await context.close();
	});

	it('the only owner is not offered a demotion or a removal, and says why', async () => {
		const { context, page } = await studioWithMembers();
		const mine = page.getByLabel('Role of Edith Cutter');
		expect(await mine.isDisabled()).toBe(true);
		const myRow = page.locator('main tbody tr', { hasText: '(you)' });
		expect(await myRow.getByRole('button', { name: 'Remove' }).isDisabled()).toBe(true);
		expect(await myRow.textContent()).toContain('The only owner');
		await pageScreenshot(page, 'members-only-owner');
		await context.close();
	});

	it('when the server refuses to demote the last owner (409), the page shows its message and the stored role', async () => {
		const { context, page, studioId, cutter, me } = await studioWithMembers();
		// a second owner, so the page offers to demote me
		await page.getByLabel('Role of Bea Cutter').selectOption('owner');
		await page.getByRole('dialog').getByRole('button', { name: 'Make owner' }).click();
		await expect.poll(() => roleStored(page, studioId, cutter.id)).toBe('owner');
		// meanwhile the other owner is demoted elsewhere (as this page does not know)
		await db.updateTable('memberships').set({ role: 'patterncutter' }).where('studio_id', '=', studioId).where('user_id', '=', cutter.id).execute();

		const mine = page.getByLabel('Role of Edith Cutter');
		await mine.selectOption('designer');
		await page.getByRole('dialog').getByRole('button', { name: 'Make designer' }).click();
		const alert = page.getByRole('alert');
		await alert.waitFor();
		expect(await alert.textContent()).toContain("studio's last owner");
		expect(await mine.inputValue()).toBe('owner');
		expect(await roleStored(page, studioId, me.id)).toBe('owner');
		await context.close();
	});
});
