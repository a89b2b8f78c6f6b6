// Runs the vitest benchmarks (unit project) and prints each one's median, which vitest's own table
// leaves out (it prints mean and p75). Usage: node tests/bench/medians.js [file or folder …]
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const dir = mkdtempSync(join(tmpdir(), 'dartelier-bench-'));
const out = join(dir, 'bench.json');
try {
	execFileSync('npx', ['vitest', 'bench', '--run', '--project', 'unit', '--outputJson', out, ...process.argv.slice(2)], { stdio: ['ignore', 'ignore', 'inherit'] });
	const report = JSON.parse(readFileSync(out, 'utf8'));
	for (const file of report.files) {
		for (const group of file.groups) {
			console.log(`\n${group.fullName}`);
			for (const b of group.benchmarks) {
				const ms = (/** @type {number} */ v) => (v < 0.1 ? `${(v * 1000).toFixed(1)} µs` : `${v.toFixed(2)} ms`);
				console.log(`  ${b.name.padEnd(44)} median ${ms(b.median).padStart(10)}   p75 ${ms(b.p75).padStart(10)}   (${b.sampleCount} samples)`);
			}
			// a group that runs the kernel beside a reference library ("kernel: …", "reference: …") gets the ratio
			const kernel = group.benchmarks.find((/** @type {{ name: string }} */ b) => b.name.startsWith('kernel'));
			const reference = group.benchmarks.find((/** @type {{ name: string }} */ b) => b.name.startsWith('reference'));
			if (kernel && reference) console.log(`  ratio reference ÷ kernel (medians): ${(reference.median / kernel.median).toFixed(2)}`);
		}
	}
} finally {
	rmSync(dir, { recursive: true, force: true });
}
