// `npm test`: Chromium (Debian's, installed when missing and we are root), typecheck, the import
// rules (dependency-cruiser) and Biome, Vitest, a production build, then Playwright against the built
// app. Ends with one line "tests: N passed, N failed" summing Vitest and Playwright, where each failed
// check (typecheck, import rules, Biome, build) counts as one failure more.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
process.chdir(root);
const only = process.argv[2]; // optional: unit | e2e
const out = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-test-run-'));

function run(label, cmd, args, extraEnv = {}) {
  console.log(`\n=== ${label}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, ...extraEnv } });
  return r.status === 0;
}

function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return true;
  if (process.getuid?.() !== 0) {
    console.error('Chromium is missing. Install it with: sudo apt-get update && sudo apt-get install -y chromium');
    return false;
  }
  console.log("Installing Debian's chromium (needed by the browser tests) …");
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update'], { stdio: 'inherit', env });
  const r = spawnSync('apt-get', ['install', '-y', '--no-install-recommends', 'chromium', 'fonts-dejavu-core'], { stdio: 'inherit', env });
  return r.status === 0 && fs.existsSync('/usr/bin/chromium');
}

const counts = { passed: 0, failed: 0, skipped: 0 };
let ok = true;
const node = process.execPath;
const failedChecks = [];

/** A check that passes or fails as a whole: a failure is counted once and named at the end. */
function check(label, args) {
  if (run(label, node, args)) return;
  ok = false;
  counts.failed += 1;
  failedChecks.push(label);
}

if (only !== 'e2e') {
  check('typecheck (tsc --noEmit)', ['node_modules/typescript/bin/tsc', '--noEmit', '-p', '.']);
  check('import rules (dependency-cruiser)', [
    'node_modules/dependency-cruiser/bin/dependency-cruise.mjs',
    '--config',
    '.dependency-cruiser.cjs',
    '--output-type',
    'err',
    'src',
    'server',
    'shared',
    'tests',
    'e2e',
    'fakes',
    'bench',
    'scripts',
  ]);
  check('formatting and lint (Biome)', ['node_modules/@biomejs/biome/bin/biome', 'check', '.']);
  const vitestJson = path.join(out, 'vitest.json');
  ok = run('unit and API tests (Vitest)', node, ['node_modules/vitest/vitest.mjs', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${vitestJson}`]) && ok;
  if (fs.existsSync(vitestJson)) {
    const v = JSON.parse(fs.readFileSync(vitestJson, 'utf8'));
    counts.passed += v.numPassedTests ?? 0;
    counts.failed += (v.numFailedTests ?? 0) + (v.numTotalTestSuites && !v.success && !v.numFailedTests ? 1 : 0);
    counts.skipped += (v.numPendingTests ?? 0) + (v.numTodoTests ?? 0);
  } else {
    counts.failed += 1;
  }
}

if (only !== 'unit') {
  if (!ensureChromium()) {
    ok = false;
    counts.failed += 1;
  } else {
    check('production build (vite build)', ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn']);
    const e2eJson = path.join(out, 'e2e.json');
    ok = run('browser tests (Playwright, Chromium)', node, ['node_modules/@playwright/test/cli.js', 'test', '--config', 'e2e/playwright.config.ts'], { PLAYWRIGHT_JSON_OUTPUT_NAME: e2eJson }) && ok;
    if (fs.existsSync(e2eJson)) {
      const s = JSON.parse(fs.readFileSync(e2eJson, 'utf8')).stats ?? {};
      counts.passed += (s.expected ?? 0) + (s.flaky ?? 0);
      counts.failed += s.unexpected ?? 0;
      counts.skipped += s.skipped ?? 0;
    } else {
      counts.failed += 1;
    }
  }
}

fs.rmSync(out, { recursive: true, force: true });
if (!ok && counts.failed === 0) counts.failed = 1;
if (failedChecks.length) console.log(`\nfailed checks: ${failedChecks.join(', ')}`);
console.log(`\ntests: ${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ''}`);
process.exit(ok && counts.failed === 0 ? 0 : 1);
