// Server code writes through the one logger (pino, src/lib/server/log.ts), never through console: a
// console line is not JSON, carries no request id and escapes the censoring of secrets.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

function filesUnder(dir: string, keep: (f: string) => boolean): string[] {
	return readdirSync(dir).flatMap((name) => {
		const f = path.join(dir, name);
		if (statSync(f).isDirectory()) return filesUnder(f, keep);
		return keep(f) ? [f] : [];
	});
}

const serverFile = (f: string) => /\.(ts|js)$/.test(f) && !/\.(test|bench)\.ts$/.test(f);
const routeServerFile = (f: string) => /[+](server|page\.server|layout\.server)\.ts$/.test(f);

describe('server logging', () => {
	it('no server module, route handler or page action calls console', () => {
		const files = [...filesUnder('src/lib/server', serverFile), ...filesUnder('src/routes', routeServerFile), 'src/hooks.server.ts'];
		expect(files.length).toBeGreaterThan(50);
		const offenders = files.filter((f) => /\bconsole\.(log|info|warn|error|debug|trace)\s*\(/.test(readFileSync(f, 'utf8')));
		expect(offenders).toEqual([]);
	});
});
