import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = new URL('.', import.meta.url).pathname;

function kernelSources(dir: string): string[] {
	const out: string[] = [];
	for (const name of readdirSync(dir)) {
		const full = join(dir, name);
		if (statSync(full).isDirectory()) {
			if (name !== 'test-support') out.push(...kernelSources(full));
		} else if (name.endsWith('.ts') && !name.endsWith('.test.ts') && !name.endsWith('.bench.ts')) out.push(full);
	}
	return out;
}

const FORBIDDEN_IMPORTS = ['svelte', 'konva', 'svelte-konva', '$app', '$lib/server', 'pg', 'kysely'];

describe('geometry kernel stays pure', () => {
	const files = kernelSources(root);

	it('finds the kernel sources', () => {
		expect(files.length).toBeGreaterThan(5);
		expect(files.some((f) => f.endsWith('index.ts'))).toBe(true);
	});

	it.each(files.map((f) => [f.slice(root.length), f]))('%s imports no UI, server or database module', (_name, file) => {
		const src = readFileSync(file, 'utf8');
		const specs = [...src.matchAll(/(?:import|export)[^'"`;]*?from\s*['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|import\s+['"]([^'"]+)['"]/g)].map(
			(m) => m[1] ?? m[2] ?? m[3]
		);
		const bad = specs.filter((s) => FORBIDDEN_IMPORTS.some((f) => s === f || s.startsWith(f + '/')));
		expect(bad).toEqual([]);
	});

	it.each(files.map((f) => [f.slice(root.length), f]))('%s uses no clock, randomness, document or window', (_name, file) => {
		const src = readFileSync(file, 'utf8')
			.replace(/\/\*[\s\S]*?\*\//g, '')
			.replace(/\/\/.*$/gm, '');
		expect(src).not.toMatch(/\bDate\b/);
		expect(src).not.toMatch(/Math\.random/);
		expect(src).not.toMatch(/\bdocument\b/);
		expect(src).not.toMatch(/\bwindow\b/);
	});
});
