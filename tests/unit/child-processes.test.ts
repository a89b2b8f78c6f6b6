// The test set-ups' children (tests/child-processes.ts) are stopped for certain: one that ignores
// SIGTERM is killed after the grace period, and a process group goes whole, its leader and the rest.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { childStop, childTrack } from '../child-processes';

/** Running (not ended, nor an ended process nobody has reaped yet: state Z in /proc). */
const alive = (pid: number) => {
	try {
		return !/^\d+ \(.*\) Z/.test(readFileSync(`/proc/${pid}/stat`, 'utf8'));
	} catch {
		return false;
	}
};

describe('stopping the children a test set-up started', () => {
	it('kills a child that ignores SIGTERM once the grace period is over, and waits until it has ended', async () => {
		const child = childTrack(spawn(process.execPath, ['-e', "process.on('SIGTERM', () => {}); console.log('up'); setInterval(() => {}, 1000)"], { stdio: ['ignore', 'pipe', 'ignore'] }));
		await new Promise((r) => child.stdout!.once('data', r));
		await childStop(child, 300);
		expect(child.signalCode).toBe('SIGKILL');
	});

	it('ends every process of a detached group, not only its leader', async () => {
		const child = childTrack(spawn('bash', ['-c', 'sleep 60 & echo $!; wait'], { stdio: ['ignore', 'pipe', 'ignore'], detached: true }), true);
		const grandchild = Number(await new Promise<string>((r) => child.stdout!.once('data', (d) => r(String(d)))));
		expect(alive(grandchild)).toBe(true);
		await childStop(child, 2000);
		expect(child.exitCode !== null || child.signalCode !== null).toBe(true);
		await expect.poll(() => alive(grandchild), { timeout: 5000 }).toBe(false);
	});
});
