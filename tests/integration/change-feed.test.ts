// What an app process keeps in memory (src/lib/server/cache) follows the database's change notices
// (migration 2026-12-04-0090, PostgreSQL LISTEN/NOTIFY): a value is kept until a change that concerns it
// commits, from any connection; a value read while such a change came in is not kept; after
// changeFeedSync() (what every write request waits for) the notices of changes committed before have
// been heard. Checked with a kept read of our own and with the sessions lucia reads.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lucia } from '../../src/lib/server/auth/lucia';
import { changeFeedReady, changeFeedSync } from '../../src/lib/server/cache/change-feed';
import { keptReads } from '../../src/lib/server/cache/kept';
import { membershipsRoleSet } from '../../src/lib/server/repositories/memberships';
import { sessionsDelete } from '../../src/lib/server/repositories/sessions';
import { stylesCreate, stylesUpdate } from '../../src/lib/server/repositories/styles';
import { sha256Hex } from '../../src/lib/server/auth/tokens';
import { memberAdd, studioMake, testDb, testDbClose, userMake } from './helpers';

beforeAll(async () => {
	// the first call starts listening; ready once the connection is made
	for (let waitedMs = 0; !changeFeedReady(); waitedMs += 50) {
		if (waitedMs > 10_000) throw new Error('the change feed did not connect within 10 s');
		await new Promise((r) => setTimeout(r, 50));
	}
});

afterAll(async () => {
	await testDbClose();
});

async function styleMade() {
	const user = await userMake('feed');
	const studio = await studioMake('Feed');
	return stylesCreate(testDb(), { studioId: studio.id, name: 'Kept', createdBy: user.id });
}

describe('kept reads and the change notices', () => {
	it('keep a value until a change to its style commits on another connection', async () => {
		const style = await styleMade();
		const other = await styleMade();
		const kept = keptReads<{ id: string; name: string }>({ max: 10, ttlMs: 60_000, kinds: ['style'], names: (v, _k, id) => v.id === id });
		let reads = 0;
		const read = async () => {
			reads++;
			const row = await testDb().selectFrom('styles').select(['id', 'name']).where('id', '=', style.id).executeTakeFirstOrThrow();
			return { ...row };
		};
		expect((await kept.get('s', read))?.name).toBe('Kept');
		expect((await kept.get('s', read))?.name).toBe('Kept');
		expect(reads).toBe(1);
		// a change to another style leaves it kept
		await stylesUpdate(testDb(), other.id, { name: 'Other, renamed' });
		await changeFeedSync();
		await kept.get('s', read);
		expect(reads).toBe(1);
		// a change to this one, committed through the test's own pool (another connection): read again
		await stylesUpdate(testDb(), style.id, { name: 'Renamed' });
		await changeFeedSync();
		expect((await kept.get('s', read))?.name).toBe('Renamed');
		expect(reads).toBe(2);
		// a change that rolls back says nothing
		await testDb()
			.transaction()
			.execute(async (tx) => {
				await stylesUpdate(tx, style.id, { name: 'Never' });
				throw new Error('rolled back');
			})
			.catch(() => undefined);
		await changeFeedSync();
		expect((await kept.get('s', read))?.name).toBe('Renamed');
		expect(reads).toBe(2);
	});

	it('do not keep a value read while a change came in (it may be the one read before the change)', async () => {
		const style = await styleMade();
		const kept = keptReads<{ name: string }>({ max: 10, ttlMs: 60_000, kinds: ['style'], names: () => true });
		let reads = 0;
		const racing = async () => {
			reads++;
			const before = await testDb().selectFrom('styles').select('name').where('id', '=', style.id).executeTakeFirstOrThrow();
			await stylesUpdate(testDb(), style.id, { name: 'Changed during the read' });
			await changeFeedSync();
			return { ...before };
		};
		expect((await kept.get('r', racing))?.name).toBe('Kept');
		const plain = async () => {
			reads++;
			return { ...(await testDb().selectFrom('styles').select('name').where('id', '=', style.id).executeTakeFirstOrThrow()) };
		};
		expect((await kept.get('r', plain))?.name).toBe('Changed during the read');
		expect(reads).toBe(2);
		expect(kept.size).toBe(1);
	});

	it('end a kept session the moment it is deleted elsewhere, and give a new role at once', async () => {
		const user = await userMake('feed-session');
		const studio = await studioMake('Feed roles');
		await memberAdd(studio.id, user.id, 'designer');
		const session = await lucia.createSession(user.id, {});
		const first = await lucia.validateSession(session.id);
		expect(first.user?.roles[studio.id]).toBe('designer');
		// the role changed by another connection: the next check says so
		await membershipsRoleSet(testDb(), studio.id, user.id, 'patterncutter');
		await changeFeedSync();
		expect((await lucia.validateSession(session.id)).user?.roles[studio.id]).toBe('patterncutter');
		// the session deleted by another connection (a sign-out on another app process): gone
		await sessionsDelete(testDb(), sha256Hex(session.id));
		await changeFeedSync();
		expect((await lucia.validateSession(session.id)).session).toBeNull();
	});

	it('keep and use nothing while the listening connection is lost, and listen again by itself', async () => {
		const style = await styleMade();
		await changeFeedSync(); // the new style's own notices heard, so they do not cross the first read
		const kept = keptReads<{ name: string }>({ max: 10, ttlMs: 60_000, kinds: ['style'], names: () => true });
		let reads = 0;
		const read = async () => {
			reads++;
			return { ...(await testDb().selectFrom('styles').select('name').where('id', '=', style.id).executeTakeFirstOrThrow()) };
		};
		await kept.get('l', read);
		await kept.get('l', read);
		expect(reads).toBe(1);
		// the server ends the listening connection (as a restart or a dropped link would)
		await sql`select pg_terminate_backend(pid) from pg_stat_activity where application_name = 'dartelier-change-feed'`.execute(testDb());
		await expect.poll(() => changeFeedReady(), { timeout: 5000, interval: 5 }).toBe(false);
		expect(kept.size).toBe(0);
		// meanwhile every read asks the database and nothing is kept
		await kept.get('l', read);
		await kept.get('l', read);
		expect(reads).toBe(3);
		expect(kept.size).toBe(0);
		// it listens again within a few seconds, and keeps again
		await expect.poll(() => changeFeedReady(), { timeout: 10_000, interval: 50 }).toBe(true);
		await kept.get('l', read);
		await kept.get('l', read);
		expect(reads).toBe(4);
	});
});
