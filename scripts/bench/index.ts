// `npm run bench`: every speed benchmark of the project, one after another, each in its own
// process so one's memory does not skew the next. Figures are printed; targets are stated beside them.
// `npm run bench -- --only mass,import` runs a subset; the packing benchmark has its own script
// (`npm run bench:packing`) because its default sample takes minutes.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const all = ['mass', 'import', 'split', 'load'];
const onlyArg = process.argv.indexOf('--only');
const chosen = onlyArg > 0 ? process.argv[onlyArg + 1].split(',') : all;

let failed = 0;
for (const name of chosen) {
  const file = join(here, `${name}.ts`);
  if (!existsSync(file)) {
    console.log(`\n== ${name}: no benchmark yet (${file})`);
    continue;
  }
  console.log(`\n== ${name}`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', '--expose-gc', file], { stdio: 'inherit' });
  if (r.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);
