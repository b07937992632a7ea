// Adds up vitest's JSON reports and prints one closing line: "tests: N passed, N failed".
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';

const dir = process.argv[2];
let passed = 0;
let failed = 0;
let skipped = 0;
for (const f of readdirSync(dir).filter((n) => /^vitest-.*\.json$/.test(n))) {
  const r = JSON.parse(readFileSync(path.join(dir, f), 'utf8'));
  passed += r.numPassedTests ?? 0;
  failed += (r.numFailedTests ?? 0) + (r.numRuntimeErrorTestSuites ?? 0);
  skipped += (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
  console.log(`${f.replace(/^vitest-|\.json$/g, '')}: ${r.numPassedTests} passed, ${r.numFailedTests} failed`);
}
console.log(`tests: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
