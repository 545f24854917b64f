#!/usr/bin/env node
/**
 * `npm test`: every check the project has, then one plain closing line,
 * "N passed, N failed, N skipped", counting every test of every suite
 * (model, ui, e2e; the ngspice cross-checks live in the model suite).
 * Type checking and lint run first and count as one test each.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';

const ci = process.env.CI === 'true';
const run = (cmd, args) => spawnSync(cmd, args, { stdio: 'inherit', shell: false }).status ?? 1;
const have = (cmd) => spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;

for (const [name, ok, install] of [
  ['Chromium', existsSync('/usr/bin/chromium'), 'sudo apt-get install -y chromium'],
  ['ngspice', have('ngspice'), 'sudo apt-get install -y ngspice'],
]) {
  if (!ok) {
    console.warn(`\n!!! ${name} is missing: its suite will ${ci ? 'FAIL (CI=true)' : 'be SKIPPED'}. Install it with: ${install}\n`);
  }
}

let passed = 0;
let failed = 0;
let skipped = 0;

for (const [label, cmd, args] of [
  ['type check', 'npx', ['tsc', '-p', 'tsconfig.json', '--noEmit']],
  ['lint', 'npx', ['eslint', '.']],
]) {
  console.log(`\n— ${label} —`);
  if (run(cmd, args) === 0) passed++;
  else {
    failed++;
    console.error(`${label} failed`);
  }
}

mkdirSync('test-results', { recursive: true });
const report = 'test-results/vitest.json';
const status = run('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`]);
if (existsSync(report)) {
  const r = JSON.parse(readFileSync(report, 'utf8'));
  passed += r.numPassedTests;
  failed += r.numFailedTests;
  skipped += r.numPendingTests + r.numTodoTests;
  if (status !== 0 && r.numFailedTests === 0) failed++; // a suite that failed to load counts
} else {
  failed++;
}
console.log(`${passed} passed, ${failed} failed${skipped > 0 ? `, ${skipped} skipped` : ''}`);
process.exit(failed > 0 ? 1 : 0);
