/**
 * Benchmark: import of a 10,000-line parts list (CSV) through the API into PostgreSQL: upload (parsed and
 * staged), preview (validated by the breakdown core, diffed against the current breakdown) and commit (validated
 * again and written in one transaction). Target: under 5 s in all. Then a re-import of the same list with 10 %
 * of the masses changed (the diff path), and an export.
 *
 * Uses DATABASE_URL when set; otherwise starts a throwaway PostgreSQL cluster and removes it afterwards.
 * Run: npx tsx scripts/bench/import.ts
 */
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import supertest from 'supertest';
import { pino } from 'pino';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { loadConfig } from '../../server/config/env.ts';
import { openDeps } from '../../server/deps.ts';
import { createApp } from '../../server/app.ts';
import { seed, DEMO_USERS } from '../../seeds/01_demo.ts';

const LINES = 10_000;
const TARGET_MS = 5_000;

/** A deterministic parts list: 40 assemblies, mixed materials and sources, positions in a 4 m disc. */
function partsCsv(lines: number, massFactor = (_i: number) => 1): string {
  const materials = ['steel', 'aluminium', 'brass', 'plywood-birch', 'acetal'];
  const sources = ['weighed', 'catalogue', 'cad', 'estimated'];
  const out = ['Part number,Name,Assembly,Quantity,Unit mass (kg),Mass source,Material,Bought or made,CoG x (mm),CoG y (mm),CoG z (mm),Notes'];
  let s = 12345;
  const rnd = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
  for (let i = 0; i < lines; i++) {
    const a = rnd() * Math.PI * 2;
    const r = rnd() * 2000;
    out.push(
      [
        `B-${String(i + 1).padStart(5, '0')}`,
        `Part ${i + 1}`,
        `ASM-${(i % 40) + 1}`,
        1 + (i % 7),
        ((0.01 + rnd() * 5) * massFactor(i)).toFixed(4),
        sources[i % 4],
        materials[i % 5],
        i % 3 === 0 ? 'bought' : 'made',
        (r * Math.cos(a)).toFixed(1),
        (r * Math.sin(a)).toFixed(1),
        (rnd() * 3400).toFixed(1),
        i % 50 === 0 ? '=not a formula' : '',
      ].join(','),
    );
  }
  return out.join('\n');
}

const MAPPING = {
  partNumber: 'Part number',
  name: 'Name',
  assemblyNumber: 'Assembly',
  quantity: 'Quantity',
  unitMass: 'Unit mass (kg)',
  massSource: 'Mass source',
  material: 'Material',
  procurement: 'Bought or made',
  cogX: 'CoG x (mm)',
  cogY: 'CoG y (mm)',
  cogZ: 'CoG z (mm)',
  notes: 'Notes',
};

async function main(): Promise<void> {
  let stop: (() => void) | undefined;
  let url = process.env.DATABASE_URL;
  if (!url) {
    // @ts-expect-error plain JS module without types
    const { startCluster } = await import('../lib/postgres.mjs');
    const cluster = await startCluster({ persistent: false, log: () => undefined });
    url = cluster.url as string;
    stop = () => cluster.stop({ remove: true });
  }
  const setupDb = createDb(url, 2);
  await migrateLatest(setupDb);
  await seed(setupDb);
  await setupDb.destroy();

  const deps = await openDeps(loadConfig({ ...process.env, DATABASE_URL: url, NODE_ENV: 'test', LOG_LEVEL: 'silent' }), pino({ level: 'silent' }));
  try {
    const app = createApp(deps);
    const planner = DEMO_USERS.find((u) => u.role === 'planner')!;
    const [production] = await deps.db('productions').insert({ name: `Import benchmark ${randomUUID()}` }).returning('id');
    const user = await deps.db('users').where({ email: planner.email }).first('id');
    await deps.db('memberships').insert({ production_id: production.id, user_id: user.id, role: 'planner' });
    const agent = supertest.agent(app);
    let csrf = (await agent.get('/api/auth/csrf')).body.csrfToken as string;
    csrf = (await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: planner.email, password: planner.password })).body.csrfToken;
    const base = `/api/productions/${production.id}/machine`;
    const options = { mapping: MAPPING, units: { length: 'mm', mass: 'kg' }, allowNewAssemblies: true };

    const run = async (label: string, csv: string) => {
      const t0 = performance.now();
      const up = await agent.post(`${base}/imports`).set('x-csrf-token', csrf).attach('file', Buffer.from(csv), 'parts.csv');
      if (up.status !== 201) throw new Error(`upload: ${up.status} ${JSON.stringify(up.body)}`);
      const t1 = performance.now();
      const pv = await agent.post(`${base}/imports/${up.body.import.id}/preview`).set('x-csrf-token', csrf).send(options);
      if (pv.status !== 200 || !pv.body.preview.ok) throw new Error(`preview: ${pv.status} ${JSON.stringify(pv.body).slice(0, 500)}`);
      const t2 = performance.now();
      const cm = await agent.post(`${base}/imports/${up.body.import.id}/commit`).set('x-csrf-token', csrf).send(options);
      if (cm.status !== 200) throw new Error(`commit: ${cm.status} ${JSON.stringify(cm.body).slice(0, 500)}`);
      const t3 = performance.now();
      const d = cm.body.result.diff;
      const total = t3 - t0;
      console.log(
        `${label}: upload+stage ${(t1 - t0).toFixed(0)} ms, preview ${(t2 - t1).toFixed(0)} ms, commit ${(t3 - t2).toFixed(0)} ms, ` +
          `total ${total.toFixed(0)} ms (added ${d.addedCount}, changed ${d.changedCount}, removed ${d.removedCount}) ` +
          `${total < TARGET_MS ? 'PASS' : 'FAIL'} < ${TARGET_MS} ms`,
      );
      return total;
    };

    console.log(`Parts-list import through the API, ${LINES.toLocaleString('en-GB')} lines (CSV, ${(partsCsv(LINES).length / 1024 / 1024).toFixed(2)} MB)`);
    const first = await run('first import ', partsCsv(LINES));
    const second = await run('re-import, 10 % of masses changed', partsCsv(LINES, (i) => (i % 10 === 0 ? 1.1 : 1)));
    const count = await deps.db('machine_part_lines').where({ production_id: production.id }).count<{ count: string }[]>('* as count');
    const t0 = performance.now();
    const mp = await agent.get(`${base}/mass-properties`);
    const t1 = performance.now();
    const ex = await agent.get(`${base}/export?format=xlsx`).buffer(true);
    const t2 = performance.now();
    console.log(`lines in the database: ${count[0].count}; mass properties ${(t1 - t0).toFixed(0)} ms (${mp.body.massProperties.machine.massKg.toFixed(1)} kg); XLSX export ${(t2 - t1).toFixed(0)} ms (HTTP ${ex.status})`);
    if (first >= TARGET_MS || second >= TARGET_MS) process.exitCode = 1;
  } finally {
    await deps.close();
    stop?.();
  }
}

await main();
