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
const step = (name, args) => {
  log(`${name}…`);
  const t = Date.now();
  const r = spawnSync(node, args, { cwd: root, env, stdio: 'inherit' });
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
const report = join(outDir, 'report.json');
const projects = built ? [] : ['--project', 'domain', '--project', 'server', '--project', 'client'];
const before = stepFailures;
const testsOk = step('tests', [bin('vitest/vitest.mjs'), 'run', ...projects, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...extra]);
// The test step's own failure is counted test by test from its report below, not twice.
if (existsSync(report)) stepFailures = before;

let passed = 0;
let failed = 0;
if (existsSync(report)) {
  const r = JSON.parse(readFileSync(report, 'utf8'));
  passed = r.numPassedTests;
  failed = r.numFailedTests;
  // A file that fails to load has no tests but is still a failure.
  failed += r.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
  // The runner failed for another reason (an unhandled error, a teardown that threw): count it.
  if (!testsOk && failed === 0) {
    log('the test runner exited with an error although every test passed (see "Unhandled" above)');
    failed++;
  }
} else {
  failed++;
}
rmSync(outDir, { recursive: true, force: true });
failed += stepFailures;
cleanup();
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
