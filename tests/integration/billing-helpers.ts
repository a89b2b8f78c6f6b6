// Billing test set-up: a studio with its owner, and an upgrade through the local payments fake's own
// checkout page (as a person would: the test card on the form), then its webhooks delivered.
import type { Role } from '../../src/lib/server/db/schema';
import type { RunningApp } from './app-server';
import { memberAdd, sessionClient, studioMake, userMake, type Client, type TestUser } from './helpers';

export interface OwnedStudio {
	studioId: string;
	owner: TestUser;
	client: Client;
}

/** A new studio (on Sketch: no billing yet) with an owner signed in, and members with these roles. */
export async function ownedStudio(app: RunningApp, members: Role[] = []): Promise<OwnedStudio> {
	const studio = await studioMake('Billing');
	const owner = await userMake('owner');
	await memberAdd(studio.id, owner.id, 'owner');
	for (const role of members) await memberAdd(studio.id, (await userMake(role)).id, role);
	return { studioId: studio.id, owner, client: await sessionClient(app.baseUrl, owner.id) };
}

/** Pays on the fake's checkout page with a card; returns the page's answer (303 to the app on success). */
export async function checkoutPay(checkoutUrl: string, card = '4242 4242 4242 4242'): Promise<Response> {
	const page = await fetch(checkoutUrl);
	if (page.status !== 200) throw new Error(`checkout page ${checkoutUrl}: ${page.status}`);
	return fetch(`${checkoutUrl}/pay`, {
		method: 'POST',
		headers: { 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams({ card, expiry: '12 / 34', cvc: '123', holder: 'Test Owner' }).toString(),
		redirect: 'manual'
	});
}

/** Starts a checkout for the studio through the app, pays it on the fake's page, waits for the webhooks. */
export async function upgrade(app: RunningApp, s: OwnedStudio, seats: number, interval: 'month' | 'year' = 'month'): Promise<Response> {
	const r = await s.client.api('POST', `/api/studios/${s.studioId}/billing/checkout`, { seats, interval });
	if (r.status !== 201) throw new Error(`checkout: ${r.status} ${await r.text()}`);
	const paid = await checkoutPay((await r.json()).checkout.url);
	await app.payments.idle();
	return paid;
}

export async function billingOf(s: OwnedStudio) {
	const r = await s.client.api('GET', `/api/studios/${s.studioId}/billing`);
	if (r.status !== 200) throw new Error(`billing: ${r.status} ${await r.text()}`);
	return r.json();
}
