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

function forbiddenImports(src: string): string[] {
	const specs = [...src.matchAll(/(?:import|export)[^'"`;]*?from\s*['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|import\s+['"]([^'"]+)['"]/g)].map(
		(m) => m[1] ?? m[2] ?? m[3]
	);
	return specs.filter((s) => FORBIDDEN_IMPORTS.some((f) => s === f || s.startsWith(f + '/')));
}

function forbiddenGlobals(source: string): string[] {
	const src = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
	const found: string[] = [];
	if (/\bDate\b/.test(src)) found.push('Date');
	if (/Math\.random/.test(src)) found.push('Math.random');
	if (/\bdocument\b/.test(src)) found.push('document');
	if (/\bwindow\b/.test(src)) found.push('window');
	return found;
}

describe('geometry kernel stays pure', () => {
	const files = kernelSources(root);

	it('finds the kernel sources', () => {
		expect(files.length).toBeGreaterThan(5);
		expect(files.some((f) => f.endsWith('index.ts'))).toBe(true);
	});

	it('the scanner itself catches forbidden imports and globals (control)', () => {
		expect(forbiddenImports(`import Konva from 'konva';\nimport { x } from "$lib/server/db";\nconst k = await import('kysely');`)).toEqual(['konva', '$lib/server/db', 'kysely']);
		expect(forbiddenImports(`import { a } from './vec';\nimport type { Pg } from './pg-like';`)).toEqual([]);
		expect(forbiddenGlobals('const t = Date.now(); const r = Math.random(); window.x = document.body;')).toEqual(['Date', 'Math.random', 'document', 'window']);
		expect(forbiddenGlobals('// Date in a comment\nconst update = 1;')).toEqual([]);
	});

	it.each(files.map((f) => [f.slice(root.length), f]))('%s imports no UI, server or database module', (_name, file) => {
		expect(forbiddenImports(readFileSync(file, 'utf8'))).toEqual([]);
	});

	it.each(files.map((f) => [f.slice(root.length), f]))('%s uses no clock, randomness, document or window', (_name, file) => {
		expect(forbiddenGlobals(readFileSync(file, 'utf8'))).toEqual([]);
	});
});
