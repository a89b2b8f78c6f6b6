// The processes test set-ups start (`node build`, the fake mail server, `npm start`): each is stopped
// with SIGTERM, then SIGKILL after a grace period, and waited for; and whatever is still running when
// this process exits (Vitest ends a run that does not close in time with process.exit) is killed then.
// No app server, with its size-run worker, may outlive the run and take the jobs of a later one.
import type { ChildProcess } from 'node:child_process';

interface Tracked {
	child: ChildProcess;
	/** the child leads a process group of its own (spawned `detached`): signals go to the whole group */
	group: boolean;
}

const running = new Set<Tracked>();
let exitHooked = false;

function signal(t: Tracked, sig: NodeJS.Signals): void {
	try {
		if (t.group && t.child.pid) process.kill(-t.child.pid, sig);
		else t.child.kill(sig);
	} catch {
		/* already gone */
	}
}

const ended = (child: ChildProcess) => child.exitCode !== null || child.signalCode !== null;

/** Keeps track of a child until childStop; a child still running when this process exits gets SIGKILL. */
export function childTrack(child: ChildProcess, group = false): ChildProcess {
	running.add({ child, group });
	if (!exitHooked) {
		exitHooked = true;
		process.once('exit', () => {
			for (const t of running) signal(t, 'SIGKILL');
		});
	}
	return child;
}

/** Stops a tracked child: SIGTERM, SIGKILL after `graceMs` if it has not ended, then waits until it has. */
export async function childStop(child: ChildProcess, graceMs = 10_000): Promise<void> {
	const t = [...running].find((r) => r.child === child) ?? { child, group: false };
	const gone = ended(child) ? Promise.resolve() : new Promise<void>((resolve) => child.once('exit', () => resolve()));
	signal(t, 'SIGTERM');
	let timer: ReturnType<typeof setTimeout> | undefined;
	await Promise.race([gone, new Promise<void>((resolve) => (timer = setTimeout(resolve, graceMs)))]);
	clearTimeout(timer);
	// a group's other members (npx, tsx and the server under them) may outlive its leader
	if (!ended(child) || t.group) signal(t, 'SIGKILL');
	await Promise.race([gone, new Promise<void>((resolve) => (timer = setTimeout(resolve, 5000)))]); // one that never started never ends
	clearTimeout(timer);
	running.delete(t);
}
