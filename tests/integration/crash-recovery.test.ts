// Nothing lost, nothing half-written: the BUILT app (`node build`, its own process) and a PostgreSQL
// cluster of the test's own (the scratch cluster: scratch-cluster.ts) take 50 saves at once, 40 versions
// of 20 pieces and 10 style changes (concurrent-saves.ts), and crash mid-way: first the app is killed
// with SIGKILL and started again, then PostgreSQL is stopped in immediate mode and started again. After
// each: every piece's head is a stored version, every stored version verifies and replays, no version or
// change is half-stored, and every save answered 201 is there (stored-saves-check.ts).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { appProcessStart, type AppProcess } from './app-process';
import { panelStyle } from './change-fixtures';
import { savesStart, type SaveAnswer, type SaveTargets, type SavesRunning } from './concurrent-saves';
import { Client, PASSWORD, uniq } from './helpers';
import { scratchCluster, scratchDatabaseCreate, type ScratchDatabase } from './scratch-cluster';
import { storedSavesProblems } from './stored-saves-check';

const PIECES = 20;
const VERSION_LOOPS = 40;
const CHANGE_LOOPS = 10;
/** A carry across two panels makes three pieces: the band and the two upper panels (change-fixtures.ts). */
const PIECES_PER_CARRY = 3;
/** Saves answered 201 before the crash comes: it comes mid-way, with 50 saves in flight. */
const BEFORE_CRASH = 25;
/** The machine may be loaded: waits are long, and a wait that runs out fails the test. */
const WAIT_MS = 240_000;

let database: ScratchDatabase;
let app: AppProcess;
let c: Client;
let targets: SaveTargets;
const answers: SaveAnswer[] = [];

beforeAll(async () => {
	database = await scratchDatabaseCreate('dartelier_crash');
	app = await appProcessStart(database.url);
	c = new Client(app.baseUrl);
	const signUp = await c.post('/signup', { name: 'Crash Cutter', email: `crash-${uniq()}@example.test`, password: PASSWORD, studioName: 'Crash Workroom' });
	expect(signUp.status).toBe(303);
	const studioId = signUp.headers.get('location')!.split('/')[2];
	const s = await c.api('POST', `/api/studios/${studioId}/styles`, { name: 'Crash bodice', code: 'CR-17', season: 'AW27' });
	expect(s.status).toBe(201);
	const styleId = (await s.json()).style.id as string;
	const pieceIds: string[] = [];
	for (let i = 0; i < PIECES; i++) {
		const p = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, {
			name: `Front ${i + 1}`,
			geometry: frontBodiceBlock(),
			origin: { op: 'draft', params: { note: 'block' } }
		});
		expect(p.status).toBe(201);
		pieceIds.push((await p.json()).piece.id);
	}
	targets = { studioId, pieceIds, panelStyles: [await panelStyle(c, studioId), await panelStyle(c, studioId)] };
}, WAIT_MS);

afterAll(async () => {
	await app?.stop();
	await database?.close();
	await scratchCluster('stop');
}, WAIT_MS);

/** Waits until `n` saves in all were answered 201; fails at once if the app process ended meanwhile. */
async function acknowledgedReach(saves: SavesRunning, n: number): Promise<void> {
	const until = Date.now() + WAIT_MS;
	while (saves.acknowledged() < n) {
		if (app.exited()) throw new Error(`the app process ended (${JSON.stringify(app.exited())}):\n${app.output()}`);
		if (Date.now() > until) throw new Error(`${saves.acknowledged()} saves were answered 201 within ${WAIT_MS / 1000} s, not ${n}`);
		await new Promise((r) => setTimeout(r, 100));
	}
}

/** Statuses that are not 201, 409 (a base moved by the other loop) or one of `allowed`. */
const odd = (list: SaveAnswer[], allowed: SaveAnswer['status'][]) => list.filter((a) => ![201, 409, ...allowed].includes(a.status)).map((a) => `${a.kind} ${a.status}`);

describe('a crash in the middle of 50 saves', () => {
	it('loses no save answered 201 and stores nothing half-written when the app is killed with SIGKILL and started again', async () => {
		const saves = savesStart(c, targets, VERSION_LOOPS, CHANGE_LOOPS);
		try {
			await acknowledgedReach(saves, BEFORE_CRASH);
			const gone = new Promise((r) => app.child.once('exit', r));
			app.child.kill('SIGKILL');
			await gone;
		} finally {
			await saves.stop();
		}
		answers.push(...saves.answers);
		expect(saves.answers.filter((a) => a.status === 'failed').length, 'saves cut off by the crash').toBeGreaterThan(0);
		expect(odd(saves.answers, ['failed'])).toEqual([]);

		app = await appProcessStart(database.url);
		const session = c.session;
		c = new Client(app.baseUrl);
		c.session = session; // sessions are rows in the database: still signed in
		expect(await storedSavesProblems(database.db, targets.studioId, answers, PIECES_PER_CARRY)).toEqual([]);
	}, WAIT_MS * 2);

	it('loses no save answered 201 and stores nothing half-written when PostgreSQL is stopped in immediate mode and started again', async () => {
		const saves = savesStart(c, targets, VERSION_LOOPS, CHANGE_LOOPS);
		let stoppedAt = 0;
		try {
			await acknowledgedReach(saves, BEFORE_CRASH);
			await scratchCluster('stop', 'immediate');
			stoppedAt = saves.answers.length;
			await new Promise((r) => setTimeout(r, 2000)); // saves keep coming while it is down
			await scratchCluster('start');
			// the app, never restarted, stores saves again
			await acknowledgedReach(saves, saves.acknowledged() + 10);
		} finally {
			await saves.stop();
		}
		answers.push(...saves.answers);
		expect(app.exited(), `the app process exited:\n${app.output()}`).toBeNull();
		expect(saves.answers.slice(stoppedAt).some((a) => a.status === 503), 'the outage was seen').toBe(true);
		expect(odd(saves.answers, [503])).toEqual([]);
		expect(await storedSavesProblems(database.db, targets.studioId, answers, PIECES_PER_CARRY)).toEqual([]);
	}, WAIT_MS * 2);
});
