import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { demoCopy } from './split-helpers.ts';

/**
 * Two people save the same record at the same moment, both from the same version. The database decides:
 * exactly one save wins, the other is answered 409 with the record as the winner left it, and the loser's
 * values are nowhere in the database. Each race is run several times, on separate sessions (two devices),
 * with both requests in flight together.
 */
let t: TestApp;
let a: Agent;
let b: Agent;
let base: string;

beforeAll(async () => {
  t = await createTestApp();
  const { productionId } = await demoCopy(t.db, 'Concurrent edits');
  base = `/api/productions/${productionId}`;
  [a, b] = [await t.signIn('planner'), await t.signIn('planner')];
});
afterAll(() => t.close());

const ROUNDS = 5;

interface Race {
  path: string;
  /** The body one side sends, for the version both started from. */
  body: (side: 'A' | 'B', round: number, version: number) => object;
  /** The record (and its version) as the API returns it after a save or in a 409. */
  record: (body: { [k: string]: unknown }) => { version: number } & Record<string, unknown>;
  /** Reads the stored value the sides fight over. */
  stored: () => Promise<unknown>;
  /** What each side wrote, as stored. */
  value: (side: 'A' | 'B', round: number) => unknown;
}

async function race(r: Race, startVersion: number) {
  let version = startVersion;
  for (let round = 0; round < ROUNDS; round++) {
    const [ra, rb] = await Promise.all([
      a.patch(r.path).set('x-csrf-token', a.csrf).send(r.body('A', round, version)),
      b.patch(r.path).set('x-csrf-token', b.csrf).send(r.body('B', round, version)),
    ]);
    const statuses = [ra.status, rb.status].sort();
    expect(statuses, `round ${round}: ${JSON.stringify([ra.body, rb.body]).slice(0, 400)}`).toEqual([200, 409]);
    const [win, lose, winner, loser] = ra.status === 200 ? [ra, rb, 'A', 'B'] as const : [rb, ra, 'B', 'A'] as const;
    const saved = r.record(win.body);
    expect(saved.version).toBe(version + 1);
    expect(lose.body.error.code).toBe('conflict');
    // The 409 carries the record as the winner left it, so the client can offer reload or keep mine.
    const current = r.record({ ...lose.body.error.current, __conflict: true });
    expect(current.version).toBe(saved.version);
    expect(await r.stored()).toEqual(r.value(winner, round));
    expect(await r.stored()).not.toEqual(r.value(loser, round));
    version = saved.version;
  }
}

describe('two saves of the same record race: one wins, the other gets 409 with the current record', () => {
  it('a part line', async () => {
    const line = await t.db('machine_part_lines').where({ production_id: base.split('/')[3] }).orderBy('part_number').first();
    await race(
      {
        path: `${base}/machine/lines/${line.id}`,
        body: (side, round, version) => ({ version, name: `${line.name} ${side}${round}` }),
        record: (body) => (body.__conflict ? body : (body.line as never)) as never,
        stored: async () => (await t.db('machine_part_lines').where({ id: line.id }).first('name')).name,
        value: (side, round) => `${line.name} ${side}${round}`,
      },
      line.version,
    );
  });

  it('a section', async () => {
    const section = await t.db('machine_sections').where({ production_id: base.split('/')[3] }).orderBy('code').first();
    await race(
      {
        path: `${base}/machine/sections/${section.id}`,
        body: (side, round, version) => ({ version, marginPercent: side === 'A' ? 10 + round : 30 + round }),
        record: (body) => (body.__conflict ? body : (body.section as never)) as never,
        stored: async () => Number((await t.db('machine_sections').where({ id: section.id }).first('margin_percent')).margin_percent),
        value: (side, round) => (side === 'A' ? 10 + round : 30 + round),
      },
      section.version,
    );
  });

  it('a crate', async () => {
    const crate = await t.db('crates').where({ production_id: base.split('/')[3] }).orderBy('code').first();
    await race(
      {
        path: `${base}/crates/${crate.id}`,
        body: (side, round, version) => ({ version, notes: `Packed by ${side}, round ${round}` }),
        record: (body) => (body.__conflict ? body : (body.crate as never)) as never,
        stored: async () => (await t.db('crates').where({ id: crate.id }).first('notes')).notes,
        value: (side, round) => `Packed by ${side}, round ${round}`,
      },
      crate.version,
    );
  });

  it('a lift plan', async () => {
    const plan = await t.db('lift_plans').where({ production_id: base.split('/')[3] }).orderBy('created_at').first();
    const inputs = typeof plan.inputs === 'string' ? JSON.parse(plan.inputs) : plan.inputs;
    await race(
      {
        path: `${base}/lifting/plans/${plan.id}`,
        body: (side, round, version) => ({ version, inputs: { ...inputs, method: `Method of ${side}, round ${round}` } }),
        record: (body) => (body.__conflict ? body : (body.plan as never)) as never,
        stored: async () => {
          const row = await t.db('lift_plans').where({ id: plan.id }).first('inputs');
          return (typeof row.inputs === 'string' ? JSON.parse(row.inputs) : row.inputs).method;
        },
        value: (side, round) => `Method of ${side}, round ${round}`,
      },
      plan.version,
    );
  });
});
