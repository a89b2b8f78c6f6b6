// Prints the closing line of `npm test`: every test counted, and the stages that failed.
import { existsSync, readFileSync } from 'node:fs';

const failedStages = process.argv.slice(2);
let passed = 0;
let failed = 0;
for (const file of ['.run/vitest-main.json', '.run/vitest-browser.json']) {
	if (!existsSync(file)) continue;
	const r = JSON.parse(readFileSync(file, 'utf8'));
	passed += r.numPassedTests ?? 0;
	failed += (r.numFailedTests ?? 0) + (r.numFailedTestSuites ?? 0);
}
// svelte-check and the build count as one check each.
for (const stage of ['svelte-check', 'build']) {
	if (failedStages.includes(stage)) failed += 1;
	else passed += 1;
}
if (failedStages.length) console.log(`Failed stages: ${[...new Set(failedStages)].join(', ')}`);
if (failedStages.length && failed === 0) failed = failedStages.length;
console.log(`summary: ${passed} passed, ${failed} failed`);
process.exit(failed > 0 || failedStages.length > 0 ? 1 : 0);
