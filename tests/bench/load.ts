// Load benchmark (not a test): the built app as its own process against a database of its own, the demo
// studio seeded, signed in as its owner; then, with autocannon over loopback:
//   (a) the style page's API read   GET /api/studios/{studioId}/styles/{styleId}     50 connections, 20 s
//   (b) a piece's version list      GET /api/studios/{studioId}/pieces/{pieceId}/versions   50 connections, 20 s
//   (c) version saves               POST …/pieces/{pieceId}/versions, each from the head last seen (a
//       grainline placed again: the same geometry every time), 8 connections, 20 s; a save whose base
//       another connection moved first is refused with 409 stale base: expected, counted apart.
// Prints p50/p99 latency, requests per second and errors (answers other than 2xx, and the expected 409s
// of the saves; socket errors and time-outs), with the load average before and after each phase.
// Run: npx vite build && npm run bench:load   (DURATION=20 READ_CONNECTIONS=50 SAVE_CONNECTIONS=8)
import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import { grain } from '../../src/lib/pattern/panels';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { loadAppStart } from './load-app';

const DURATION_S = Number(process.env.DURATION ?? 20);
const READ_CONNECTIONS = Number(process.env.READ_CONNECTIONS ?? 50);
const SAVE_CONNECTIONS = Number(process.env.SAVE_CONNECTIONS ?? 8);
/** which phases to run (e.g. PHASES=a while profiling the style read) */
const PHASES = process.env.PHASES ?? 'abc';

interface Figures {
	what: string;
	connections: number;
	p50: number;
	p99: number;
	rps: number;
	total: number;
	ok: number;
	expected409: number;
	errors: number;
	load: string;
	appCpuS: number;
	/** CPU seconds autocannon (this process) used in the phase */
	benchCpuS: number;
	/** CPU seconds the whole machine used in the phase (every process and the kernel) */
	machineCpuS: number;
}

const loadavg = () => readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');

/** CPU seconds (user + system) the app process has used so far. */
function cpuSeconds(pid: number): number {
	const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
	return (Number(fields[11]) + Number(fields[12])) / 100;
}

/** CPU seconds the whole machine has used so far (user, nice, system, irq, softirq of every core). */
function machineCpuSeconds(): number {
	const [, user, nice, system, , , irq, softirq] = readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).map(Number);
	return (user + nice + system + irq + softirq) / 100;
}

async function phase(what: string, pid: number, opts: autocannon.Options, conflictsExpected = false): Promise<Figures> {
	const before = loadavg();
	const cpu0 = cpuSeconds(pid);
	const machine0 = machineCpuSeconds();
	const bench0 = process.cpuUsage();
	const r = await autocannon({ duration: DURATION_S, ...opts });
	const cpu = cpuSeconds(pid) - cpu0;
	const machineCpuS = machineCpuSeconds() - machine0;
	const bench = process.cpuUsage(bench0);
	const codes = (r as unknown as { statusCodeStats?: Record<string, { count: number }> }).statusCodeStats ?? {};
	const count = (pred: (code: number) => boolean) => Object.entries(codes).reduce((t, [c, v]) => t + (pred(Number(c)) ? v.count : 0), 0);
	const ok = count((c) => c >= 200 && c < 300);
	const expected409 = conflictsExpected ? count((c) => c === 409) : 0;
	const unexpected = count((c) => c < 200 || c >= 300) - expected409;
	return {
		what,
		connections: opts.connections ?? 10,
		p50: r.latency.p50,
		p99: r.latency.p99,
		rps: r.requests.average,
		total: r.requests.total,
		ok,
		expected409,
		errors: unexpected + r.errors + r.timeouts,
		load: `${before} → ${loadavg()}`,
		appCpuS: cpu,
		benchCpuS: (bench.user + bench.system) / 1e6,
		machineCpuS
	};
}

const app = await loadAppStart();
const headers = { cookie: app.cookie, accept: 'application/json' };
try {
	const overview = await (await fetch(`${app.base}/api/studios/${app.studioId}/styles/${app.styleId}`, { headers })).json();
	const pieces = overview.pieces as { id: string; name: string; headVersionId: string; shown: { id: string; number: number; geometry: Piece } }[];
	// the piece with the most versions: its list is the longest to read
	const piece = pieces.reduce((a, b) => (b.shown.number > a.shown.number ? b : a));
	const bodyBytes = JSON.stringify(overview).length;
	console.log(`style "${overview.style.name}": ${pieces.length} pieces, the read is ${(bodyBytes / 1024).toFixed(0)} kB; version list of "${piece.name}" (${piece.shown.number} versions)`);

	const results: Figures[] = [];
	if (PHASES.includes('a')) results.push(await phase('(a) style read', app.pid, { url: `${app.base}/api/studios/${app.studioId}/styles/${app.styleId}`, connections: READ_CONNECTIONS, headers }));
	if (PHASES.includes('b')) results.push(await phase('(b) version list', app.pid, { url: `${app.base}/api/studios/${app.studioId}/pieces/${piece.id}/versions`, connections: READ_CONNECTIONS, headers }));

	// (c) the grainline placed again along its own line: the server replays the step on whichever head
	// the save names and gets this same geometry, so every save from the current head is accepted
	const g = piece.shown.geometry;
	const line = g.grainline ?? { from: { x: 0, y: 0 }, to: { x: 0, y: 100 } };
	const params = {
		through: { x: (line.from.x + line.to.x) / 2, y: (line.from.y + line.to.y) / 2 },
		lengthMm: Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y),
		centreLine: { from: line.from, to: line.to }
	};
	const placed = grain(g, params);
	if (!placed.ok) throw new Error(`the grainline step is refused on ${piece.name}: ${placed.error.message}`);
	let head = piece.shown.id;
	let saved = 0;
	if (PHASES.includes('c')) results.push(
		await phase(
			'(c) version save',
			app.pid,
			{
				url: `${app.base}/api/studios/${app.studioId}/pieces/${piece.id}/versions`,
				connections: SAVE_CONNECTIONS,
				method: 'POST',
				headers: { ...headers, 'content-type': 'application/json', origin: app.base },
				requests: [
					{
						setupRequest: (req) => ({ ...req, body: JSON.stringify({ baseVersionId: head, message: `Grainline placed again (${saved})`, geometry: placed.piece, recipe: [{ op: 'grain', params }] }) }),
						onResponse: (status, body) => {
							if (status === 201) {
								head = JSON.parse(body).version.id;
								saved++;
							}
						}
					}
				]
			},
			true
		)
	);

	const ms = (v: number) => `${v.toFixed(1)} ms`;
	console.log(`\nnode ${process.version}, ${DURATION_S} s a phase; CPU per request: the app process, this process (autocannon), the whole machine (the rest is PostgreSQL and the kernel)`);
	console.table(
		results.map((f) => ({
			what: f.what,
			connections: f.connections,
			'p50': ms(f.p50),
			'p99': ms(f.p99),
			'req/s': f.rps.toFixed(0),
			requests: f.total,
			'2xx': f.ok,
			'409 (expected)': f.expected409,
			errors: f.errors,
			'app CPU ms/req': ((1000 * f.appCpuS) / f.total).toFixed(2),
			'bench CPU ms/req': ((1000 * f.benchCpuS) / f.total).toFixed(2),
			'machine CPU ms/req': ((1000 * f.machineCpuS) / f.total).toFixed(2),
			'load average (1, 5, 15 min)': f.load
		}))
	);
	const reads = results.filter((f) => !f.what.includes('save'));
	const saves = results.filter((f) => f.what.includes('save'));
	if (reads.length) console.log(`reads ≥ 500 req/s, p99 ≤ 100 ms, 0 errors: ${reads.every((f) => f.rps >= 500 && f.p99 <= 100 && f.errors === 0) ? 'met' : 'NOT met'}`);
	if (saves.length) console.log(`saves with no errors but the expected 409s: ${saves.every((f) => f.errors === 0 && f.ok > 0) ? 'met' : 'NOT met'}`);
} finally {
	await app.close();
}
process.exit(0);
