// `npm test`: the same install steps as `npm start`, a throwaway PostgreSQL on a free port in a
// temporary folder, then type-check, lint, build and every test project. It ends with one line
// "N passed, N failed" and leaves no process or cluster behind.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureChromium, ensureNodeModules, ensurePoppler } from './lib/setup.mjs';
import { startCluster } from './lib/postgres.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const log = (m) => console.log(`[test] ${m}`);
const extra = process.argv.slice(2);

ensureNodeModules(root, log);
ensureChromium(log);
ensurePoppler(log);

const cluster = await startCluster({ persistent: false, log });
let cleaned = false;
const cleanup = () => {
  if (cleaned) return;
  cleaned = true;
  cluster.stop({ remove: true });
};
process.on('exit', cleanup);
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => process.exit(130));

const env = { ...process.env, DATABASE_URL: cluster.url, NODE_ENV: 'test', BALLAST_TEST_PG: JSON.stringify({ pgdata: cluster.pgdata, bin: cluster.bin, ids: cluster.ids, opts: cluster.opts, dataDir: cluster.dataDir }) };
const node = process.execPath;
const bin = (p) => join(root, 'node_modules', p);

let stepFailures = 0;
const step = (name, args, stepEnv = env) => {
  log(`${name}…`);
  const t = Date.now();
  const r = spawnSync(node, args, { cwd: root, env: stepEnv, stdio: 'inherit' });
  const ok = r.status === 0;
  log(`${name}: ${ok ? 'ok' : 'FAILED'} (${((Date.now() - t) / 1000).toFixed(1)} s)`);
  if (!ok) stepFailures++;
  return ok;
};

step('typecheck', [bin('typescript/bin/tsc'), '--noEmit', '-p', 'tsconfig.json']);
step('lint', [bin('eslint/bin/eslint.js'), '.', '--max-warnings=0']);
const built = step('build', [bin('vite/bin/vite.js'), 'build', '--logLevel', 'warn']);
step('migrate and seed', ['--import', 'tsx', 'scripts/migrate-and-seed.ts', '--seed']);

const outDir = mkdtempSync(join(tmpdir(), 'ballast-vitest-'));
let passed = 0;
let failed = 0;

/**
 * Runs one vitest pass and adds its counts. The browser tests run in a second pass, after the
 * others, so that they never race the API tests over the same demo rows.
 */
function testPass(name, projects, passEnv = env) {
  const report = join(outDir, `${name}.json`);
  const ok = step(name, [bin('vitest/vitest.mjs'), 'run', ...projects.flatMap((p) => ['--project', p]), '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...extra], passEnv);
  if (!existsSync(report)) {
    failed++;
    return;
  }
  // The step's own failure is counted test by test from its report, not twice.
  if (!ok) stepFailures--;
  const r = JSON.parse(readFileSync(report, 'utf8'));
  let f = r.numFailedTests;
  // A file that fails to load has no tests but is still a failure.
  f += r.testResults.filter((t) => t.status === 'failed' && t.assertionResults.length === 0).length;
  // The runner failed for another reason (an unhandled error, a teardown that threw): count it.
  if (!ok && f === 0) {
    log(`${name}: the test runner exited with an error although every test passed (see "Unhandled" above)`);
    f++;
  }
  passed += r.numPassedTests;
  failed += f;
}

testPass('tests', ['domain', 'server', 'client']);
// The browser tests get a database of their own with the pristine demo, untouched by the API tests.
if (built) testPass('browser tests', ['e2e'], { ...env, DATABASE_URL: cluster.createDatabase('ballast_browser') });
else log('browser tests skipped: the client did not build (counted as a failure above)');
rmSync(outDir, { recursive: true, force: true });
failed += stepFailures;
cleanup();
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
