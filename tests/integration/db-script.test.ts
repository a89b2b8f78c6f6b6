// The start scripts' database handling (scripts/lib.sh), on a scratch cluster of its own so that the
// test cluster other tests use is never touched.
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import pg from 'pg';

function db(action: string): string {
	return execFileSync('bash', ['scripts/db.sh', action, 'scratch'], { encoding: 'utf8' });
}
function settings(): { url: string; data: string } {
	const out = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_settings scratch && printf "%s\\n%s" "$DATABASE_URL" "$PG_DATA"'], {
		encoding: 'utf8'
	});
	const [url, data] = out.trim().split('\n');
	return { url, data };
}
async function selectOne(url: string): Promise<number> {
	const client = new pg.Client({ connectionString: url });
	await client.connect();
	try {
		const r = await client.query('select 1 as one');
		return r.rows[0].one as number;
	} finally {
		await client.end();
	}
}

describe('project database start script', () => {
	afterAll(() => {
		db('stop');
	});

	it('starts the cluster on loopback and a second start is a no-op', async () => {
		db('start');
		const { url, data } = settings();
		const pidBefore = readFileSync(`${data}/postmaster.pid`, 'utf8').split('\n')[0];
		const second = db('start');
		expect(second).toContain('already running');
		const pidAfter = readFileSync(`${data}/postmaster.pid`, 'utf8').split('\n')[0];
		expect(pidAfter).toBe(pidBefore);
		expect(url).toContain('@127.0.0.1:');
		expect(await selectOne(url)).toBe(1);
	});

	it('recovers when the server was killed with SIGKILL', async () => {
		db('start');
		const { url, data } = settings();
		const pid = Number(readFileSync(`${data}/postmaster.pid`, 'utf8').split('\n')[0]);
		process.kill(pid, 'SIGKILL');
		await new Promise((r) => setTimeout(r, 300));
		expect(db('status')).toContain('not running');
		expect(db('start')).toContain('started');
		const newPid = Number(readFileSync(`${data}/postmaster.pid`, 'utf8').split('\n')[0]);
		expect(newPid).not.toBe(pid);
		expect(await selectOne(url)).toBe(1);
	});
});
