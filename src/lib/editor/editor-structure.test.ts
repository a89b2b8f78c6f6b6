import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

/** The editor's own rules of shape: no import circle among its files, no file over 300 lines. */

const ROOT = dirname(fileURLToPath(import.meta.url));
const LIB = resolve(ROOT, '..');
const MAX_LINES = 300;

function filesUnder(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const p = join(dir, name);
		return statSync(p).isDirectory() ? filesUnder(p) : /\.(ts|svelte)$/.test(name) ? [p] : [];
	});
}

const files = filesUnder(ROOT);
const sources = files.filter((f) => !f.endsWith('.test.ts'));

/** Every module an editor file imports (type-only imports too), resolved to a file of the editor. */
function importsOf(file: string): string[] {
	const text = readFileSync(file, 'utf8');
	const specs = [...text.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2]);
	const out: string[] = [];
	for (const spec of specs) {
		let base: string;
		if (spec.startsWith('.')) base = resolve(dirname(file), spec);
		else if (spec.startsWith('$lib/')) base = resolve(LIB, spec.slice(5));
		else continue;
		const hit = [base, `${base}.ts`, `${base}.svelte.ts`, join(base, 'index.ts')].find((c) => sources.includes(c));
		if (hit) out.push(hit);
	}
	return out;
}

/** A circle of imports, as the files along it, or null. */
export function importCircle(graph: ReadonlyMap<string, readonly string[]>): string[] | null {
	const state = new Map<string, 'open' | 'done'>();
	const stack: string[] = [];
	const visit = (f: string): string[] | null => {
		state.set(f, 'open');
		stack.push(f);
		for (const g of graph.get(f) ?? []) {
			if (state.get(g) === 'open') return [...stack.slice(stack.indexOf(g)), g];
			if (!state.has(g)) {
				const c = visit(g);
				if (c) return c;
			}
		}
		stack.pop();
		state.set(f, 'done');
		return null;
	};
	for (const f of graph.keys()) {
		if (state.has(f)) continue;
		const c = visit(f);
		if (c) return c;
	}
	return null;
}

describe('the editor module', () => {
	it('finds a circle when there is one (the check itself)', () => {
		const g = new Map([
			['a', ['b']],
			['b', ['c']],
			['c', ['a']],
			['d', ['a']]
		]);
		expect(importCircle(g)).toEqual(['a', 'b', 'c', 'a']);
		expect(importCircle(new Map([['a', ['b']], ['b', []]]))).toBeNull();
	});

	it('has no import circle among its files, type imports included', () => {
		expect(sources.length).toBeGreaterThan(40);
		const graph = new Map(sources.map((f) => [f, importsOf(f)]));
		// the state is imported by many of its files: the graph is not trivially empty
		expect([...graph.values()].flat().length).toBeGreaterThan(100);
		const circle = importCircle(graph);
		expect(circle?.map((f) => relative(ROOT, f)) ?? null).toBeNull();
	});

	it(`has no file over ${MAX_LINES} lines`, () => {
		const long = files.map((f) => ({ file: relative(ROOT, f), lines: readFileSync(f, 'utf8').split('\n').length - 1 })).filter((x) => x.lines > MAX_LINES);
		expect(long).toEqual([]);
	});
});
