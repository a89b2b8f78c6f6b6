// Shared set-up of the fitting tests: a studio with one person per role (and an outsider in another
// studio), a style with the front bodice block signed off as version 1, and multipart uploads.
import { expect, inject } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import type { Role } from '../../src/lib/server/db/schema';
import { Client, memberAdd, SESSION_COOKIE, sessionClient, studioMake, studioOnStudioPlan, userMake } from './helpers';

export interface FittingWorld {
	studioId: string;
	otherStudioId: string;
	styleId: string;
	pieceId: string;
	v1: string;
	users: Record<Role | 'outsider', { id: string; email: string; name: string }>;
	as: Record<Role | 'outsider', Client>;
}

/** The storage module reads its settings from the environment: point it at the tests' fake. */
export function storageEnvUse(): void {
	process.env.S3_ENDPOINT = inject('s3Endpoint');
	process.env.S3_BUCKET = 'dartelier-photos';
}

export async function fittingWorld(baseUrl: string, label: string): Promise<FittingWorld> {
	const studio = await studioMake(label);
	const other = await studioMake(`${label} elsewhere`);
	// four members: more than the free plan's seats
	await studioOnStudioPlan(studio.id);
	const users = {} as FittingWorld['users'];
	const as = {} as FittingWorld['as'];
	for (const role of ['owner', 'patterncutter', 'designer', 'sampleroom'] as const) {
		const u = await userMake(role);
		await memberAdd(studio.id, u.id, role);
		users[role] = u;
		as[role] = await sessionClient(baseUrl, u.id);
	}
	const outsider = await userMake('outsider');
	await memberAdd(other.id, outsider.id, 'owner');
	users.outsider = outsider;
	as.outsider = await sessionClient(baseUrl, outsider.id);
	const c = as.patterncutter;
	const s = await c.api('POST', `/api/studios/${studio.id}/styles`, { name: 'Juniper bodice', code: 'LR-301' });
	const styleId = (await s.json()).style.id as string;
	const p = await c.api('POST', `/api/studios/${studio.id}/styles/${styleId}/pieces`, {
		name: 'Midriff band',
		geometry: frontBodiceBlock(),
		origin: { op: 'draft', params: { note: 'demo block' } }
	});
	expect(p.status).toBe(201);
	const body = await p.json();
	const pieceId = body.piece.id as string;
	const v1 = body.version.id as string;
	const state = `/api/studios/${studio.id}/pieces/${pieceId}/versions/${v1}/state`;
	expect((await c.api('POST', state, { action: 'propose' })).status).toBe(200);
	expect((await as.designer.api('POST', state, { action: 'sign_off' })).status).toBe(200);
	return { studioId: studio.id, otherStudioId: other.id, styleId, pieceId, v1, users, as };
}

/** POSTs one file as multipart (field "file"), as a browser's form would. */
export async function upload(client: Client, path: string, bytes: Uint8Array, name: string, type = 'application/octet-stream'): Promise<Response> {
	const form = new FormData();
	form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
	return client.request('POST', path, { body: form, headers: { accept: 'application/json' } });
}

/** Headers that sign a raw fetch in as the client (for bodies Client.request cannot send). */
export function sessionHeaders(client: Client): Record<string, string> {
	return { cookie: `${SESSION_COOKIE}=${client.session}`, origin: client.base, accept: 'application/json' };
}
