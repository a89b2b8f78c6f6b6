import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// Drafting and measurement code is pure: no Svelte, DOM, database, clock or randomness outside tests.
describe('purity of measurements and drafting', () => {
	const dirs = [join(__dirname), join(__dirname, '../measurements')];
	const files = dirs.flatMap((d) => readdirSync(d).filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts')).map((f) => join(d, f)));
	it.each(files)('%s', (file) => {
		const text = readFileSync(file, 'utf8');
		expect(text).not.toMatch(/from ['"](svelte|\$app|kysely|pg)/);
		expect(text).not.toMatch(/\bDate\b|Math\.random|document\.|window\./);
	});
});
