// A crash while a style change is being saved: the server process is killed (SIGKILL) with the
// change's transaction open, every row written but not committed. The style must be exactly as before.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { piecesOfStyle } from '../../src/lib/server/repositories/pieces';
import { seamPairsOfStyle } from '../../src/lib/server/repositories/seam-pairs';
import { styleChangesOfStyle } from '../../src/lib/server/repositories/style-changes';
import { appProcessStart, type AppProcess } from './app-process';
import { startApp, type RunningApp } from './app-server';
import { carryBody, panelStyle } from './change-fixtures';
import { memberAdd, sessionClient, studioMake, testDb, testDbClose, userMake } from './helpers';

let app: RunningApp;
let child: AppProcess | undefined;

beforeAll(async () => {
	app = await startApp();
}, 60_000);

afterAll(async () => {
	child?.child.kill('SIGKILL');
	await app?.close();
	await testDbClose();
});

/** Starts the built app (`node build`) in its own process, holding each change's transaction open before it commits. */
async function serverProcess(): Promise<AppProcess> {
	process.env.DARTELIER_TEST_CHANGE_STALL_MS = '60000';
	try {
		return await appProcessStart(inject('databaseUrl'));
	} finally {
		delete process.env.DARTELIER_TEST_CHANGE_STALL_MS;
	}
}

/** Backends of the test database holding a transaction open after writing the change's rows. */
async function openChangeTransactions(): Promise<number> {
	const r = await sql<{ n: number }>`select count(*)::int as n from pg_stat_activity where datname = current_database() and state = 'idle in transaction' and (query ilike '%seam_pairs%' or query ilike '%pieces%')`.execute(testDb());
	return r.rows[0].n;
}

async function snapshot(styleId: string) {
	const pieces = await piecesOfStyle(testDb(), styleId);
	const versions = await testDb().selectFrom('piece_versions').select(['id', 'piece_id']).where('piece_id', 'in', pieces.map((p) => p.id)).orderBy('id').execute();
	return {
		pieces: pieces.map((p) => [p.id, p.name, p.headVersionId, p.headNumber]),
		versions: versions.map((v) => v.id),
		changes: (await styleChangesOfStyle(testDb(), styleId)).map((c) => c.id),
		seamPairs: (await seamPairsOfStyle(testDb(), styleId)).map((p) => [p.id, p.aEdge, p.bEdge])
	};
}

describe('a crash while a style change is saved', () => {
	it('leaves the style exactly as before when the server process is killed with the change half-stored', async () => {
		const studioId = (await studioMake('Crash')).id;
		const cutter = await userMake('cutter');
		await memberAdd(studioId, cutter.id, 'patterncutter');
		const st = await panelStyle(await sessionClient(app.baseUrl, cutter.id), studioId);
		const before = await snapshot(st.styleId);
		const openBefore = await openChangeTransactions();

		const server = await serverProcess();
		child = server;
		const c = await sessionClient(server.baseUrl, cutter.id);
		const saving = c.api('POST', `/api/studios/${studioId}/styles/${st.styleId}/changes`, carryBody(st)).catch((e: Error) => e);
		// wait until the change's rows are written and its transaction waits to commit
		await expect.poll(openChangeTransactions, { timeout: 30_000, interval: 100 }).toBeGreaterThan(openBefore);
		server.child.kill('SIGKILL');
		expect(await saving).toBeInstanceOf(Error);
		// PostgreSQL notices the dropped connection and rolls the transaction back
		await expect.poll(openChangeTransactions, { timeout: 30_000, interval: 100 }).toBe(openBefore);
		expect(await snapshot(st.styleId)).toEqual(before);
	}, 90_000);
});
