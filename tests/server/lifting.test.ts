import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LIFTING_CAUTIONS } from '../../src/domain/lifting/index.ts';
import type { LiftPlanFieldsInput } from '../../src/domain/contracts/lifting-api.ts';
import { createTestApp, demoProductionId, type Agent, type TestApp } from './helpers.ts';
import { pageOneInkShare, pdfText } from './lifting-helpers.ts';

const t: TestApp = await createTestApp();
let productionId: string;
let planner: Agent;
let rigger: Agent;
let venue: Agent;
let secondRigger: Agent;
let base: string;
const gear = new Map<string, { id: string; version: number; [k: string]: unknown }>();
let dc: { sectionId: string; cogMm: [number, number, number]; boundsMm: { maxMm: number[] } };

beforeAll(async () => {
  productionId = await demoProductionId(t.db);
  base = `/api/productions/${productionId}/lifting`;
  planner = await t.signIn('planner');
  rigger = await t.signIn('rigger');
  venue = await t.signIn('venue');
  // A second rigger on the tour, to author plans the demo rigger then reviews.
  const { hashPassword } = await import('../../server/security/passwords.ts');
  const [u] = await t.db('users')
    .insert({ email: 'rigger2@ballast.example', name: 'Second Rigger', password_hash: await hashPassword('second-rigger-2027') })
    .onConflict(t.db.raw('(lower(email))'))
    .ignore()
    .returning('id');
  const userId = u?.id ?? (await t.db('users').where({ email: 'rigger2@ballast.example' }).first('id')).id;
  await t.db('memberships').insert({ production_id: productionId, user_id: userId, role: 'rigger' }).onConflict(['production_id', 'user_id']).ignore();
  secondRigger = await t.signIn({ email: 'rigger2@ballast.example', password: 'second-rigger-2027' });
  const res = await rigger.get(`${base}/gear`).expect(200);
  for (const g of res.body.gear) gear.set(g.identifier, g);
  const loads = await rigger.get(`${base}/loads`).expect(200);
  dc = loads.body.loads.find((l: { code: string }) => l.code === 'DC');
});
afterAll(async () => t.close());

const send = (agent: Agent, method: 'post' | 'patch' | 'put' | 'delete', url: string, body?: unknown) => agent[method](url).set('x-csrf-token', agent.csrf).send(body ?? {});

function planInputs(over: Partial<LiftPlanFieldsInput> = {}): LiftPlanFieldsInput {
  const z = dc.boundsMm.maxMm[2] - 100;
  const [cx, cy] = dc.cogMm;
  return {
    title: 'Test lift of the drive core',
    sectionId: dc.sectionId,
    liftDate: '2027-02-10',
    pickPoints: [
      { id: 'A', positionMm: [cx - 250, cy, z], slingGearId: gear.get('RS-2T-2.0-A')!.id, shackleGearIds: [gear.get('SH-2T-01')!.id] },
      { id: 'B', positionMm: [cx + 250, cy, z], slingGearId: gear.get('RS-2T-2.0-B')!.id, shackleGearIds: [gear.get('SH-1T-01')!.id] },
    ],
    suspension: { kind: 'single-hook', hoistGearId: gear.get('CH-1000-01')!.id, hangingPoint: { label: 'Test beam', ratingKg: 2000, source: 'typed' } },
    peopleBelow: false,
    ...over,
  };
}

async function createPlan(agent: Agent, over: Partial<LiftPlanFieldsInput> = {}) {
  const res = await send(agent, 'post', `${base}/plans`, { inputs: planInputs(over) });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.plan;
}

async function submitted(agent: Agent, over: Partial<LiftPlanFieldsInput> = {}) {
  const plan = await createPlan(agent, over);
  const res = await send(agent, 'post', `${base}/plans/${plan.id}/submit`, { version: plan.version });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  expect(res.body.plan.status).toBe('submitted');
  return res.body.plan;
}

describe('gear inventory', () => {
  it('a rigger adds, edits and removes gear; a planner reads but may not edit', async () => {
    const item = { kind: 'shackle', identifier: 'SH-TEST-1', ratingKg: 500, massKg: 0.2, nextInspectionDate: '2027-12-31' };
    const created = await send(rigger, 'post', `${base}/gear`, { item });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.gear).toMatchObject({ kind: 'shackle', identifier: 'SH-TEST-1', ratingKg: 500, version: 1 });
    expect((await send(planner, 'post', `${base}/gear`, { item: { ...item, identifier: 'SH-TEST-2' } })).status).toBe(403);
    const list = await planner.get(`${base}/gear`).expect(200);
    expect(list.body.gear.map((g: { identifier: string }) => g.identifier)).toContain('SH-TEST-1');

    const id = created.body.gear.id;
    const edited = await send(rigger, 'patch', `${base}/gear/${id}`, { version: 1, item: { ...item, ratingKg: 750 } });
    expect(edited.status).toBe(200);
    expect(edited.body.gear.ratingKg).toBe(750);
    // A stale save: 409 with the current record.
    const stale = await send(rigger, 'patch', `${base}/gear/${id}`, { version: 1, item: { ...item, ratingKg: 900 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ ratingKg: 750, version: 2 });

    expect((await send(rigger, 'delete', `${base}/gear/${id}`)).status).toBe(204);
  });

  it('refuses a duplicate identifier and a nonsense rating, naming the field', async () => {
    const dup = await send(rigger, 'post', `${base}/gear`, { item: { kind: 'shackle', identifier: 'SH-1T-01', ratingKg: 500, massKg: 0.2, nextInspectionDate: '2027-12-31' } });
    expect(dup.status).toBe(409);
    expect(dup.body.error.issues[0].path).toBe('item.identifier');
    const bad = await send(rigger, 'post', `${base}/gear`, { item: { kind: 'sling', identifier: 'X', slingType: 'roundsling', verticalRatingKg: -5, lengthMm: 1000, massKg: 1, nextInspectionDate: '2027-12-31' } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toContain('item.verticalRatingKg');
  });

  it('gear used by a plan cannot be deleted', async () => {
    await createPlan(planner);
    const res = await send(rigger, 'delete', `${base}/gear/${gear.get('RS-2T-2.0-A')!.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/used by/);
  });
});

describe('lift plans', () => {
  it('are evaluated by the server with the core and carry the cautions', async () => {
    const plan = await createPlan(planner);
    expect(plan.status).toBe('draft');
    expect(plan.result.verdict).toBe('ok');
    expect(plan.result.problems).toEqual([]);
    for (const c of LIFTING_CAUTIONS) expect(plan.result.cautions).toContain(c);
    expect(plan.result.legs).toHaveLength(2);
    expect(plan.result.loads.dynamicHookLoadKg).toBeGreaterThan(plan.result.loads.staticHookLoadKg);
    // The load is the section's current figures with its contingency (10 % on the drive core).
    expect(plan.evaluatedInput.load.massKg).toBeCloseTo(plan.load.massKg, 6);
    expect(plan.evaluatedInput.contingency).toBeCloseTo(plan.load.marginPercent / 100, 9);
    expect(plan.events.map((e: { kind: string }) => e.kind)).toEqual(['created']);
  });

  it('a stale save answers 409 with the current plan', async () => {
    const plan = await createPlan(planner);
    const ok = await send(planner, 'patch', `${base}/plans/${plan.id}`, { version: plan.version, inputs: planInputs({ title: 'Renamed' }) });
    expect(ok.status).toBe(200);
    const stale = await send(rigger, 'patch', `${base}/plans/${plan.id}`, { version: plan.version, inputs: planInputs({ title: 'Mine' }) });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current.title).toBe('Renamed');
  });

  it('names bad geometry: a sling shorter than the span it must bridge', async () => {
    const p = planInputs();
    const plan = await createPlan(planner, { pickPoints: p.pickPoints.map((x, i) => ({ ...x, positionMm: [dc.cogMm[0] + (i ? 1200 : -1200), dc.cogMm[1], x.positionMm[2]] as [number, number, number], legLengthMm: 1000 })) });
    expect(plan.result.verdict).toBe('no verdict');
    expect(plan.result.problems.join(' ')).toMatch(/shorter than/);
  });

  it('refuses gear past its inspection date, naming it', async () => {
    const p = planInputs();
    const plan = await createPlan(planner, { pickPoints: [p.pickPoints[0], { ...p.pickPoints[1], shackleGearIds: [gear.get('SH-1T-03')!.id] }] });
    expect(plan.result.verdict).toBe('no verdict');
    expect(plan.result.problems.join(' ')).toMatch(/SH-1T-03.*inspection was due 2026-11-30/);
  });
});

describe('sign-off', () => {
  it('the demo plan was submitted by the planner; a planner cannot approve, a rigger can', async () => {
    const list = await rigger.get(`${base}/plans`).expect(200);
    const demo = list.body.plans.find((p: { title: string }) => p.title.startsWith('Drive core:'));
    expect(demo).toMatchObject({ status: 'submitted', verdict: 'ok', problemCount: 0, authorName: 'Tobiah Renn' });
    expect((await send(planner, 'post', `${base}/plans/${demo.id}/approve`, { version: demo.version })).status).toBe(403);
    const res = await send(rigger, 'post', `${base}/plans/${demo.id}/approve`, { version: demo.version, comment: 'Checked on drawings.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.plan).toMatchObject({ status: 'approved', reviewerName: 'Saskia Oduya', reviewComment: 'Checked on drawings.' });
    expect(res.body.plan.events.map((e: { kind: string }) => e.kind)).toEqual(['created', 'submitted', 'approved']);
  });

  it('a rigger cannot approve their own plan', async () => {
    const plan = await submitted(rigger);
    const res = await send(rigger, 'post', `${base}/plans/${plan.id}/approve`, { version: plan.version });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/not its author/);
    // Another rigger may.
    expect((await send(secondRigger, 'post', `${base}/plans/${plan.id}/approve`, { version: plan.version })).status).toBe(200);
  });

  it('a plan with an unresolved problem cannot be approved', async () => {
    const plan = await submitted(planner, { peopleBelow: true });
    expect(plan.result.problems.join(' ')).toMatch(/over people/);
    const res = await send(rigger, 'post', `${base}/plans/${plan.id}/approve`, { version: plan.version });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('plan_has_problems');
    const after = await rigger.get(`${base}/plans/${plan.id}`).expect(200);
    expect(after.body.plan.status).toBe('submitted');
    // It can be rejected, with a reason.
    expect((await send(rigger, 'post', `${base}/plans/${plan.id}/reject`, { version: plan.version })).status).toBe(400);
    const rej = await send(rigger, 'post', `${base}/plans/${plan.id}/reject`, { version: plan.version, comment: 'Nobody may be under the load.' });
    expect(rej.status).toBe(200);
    expect(rej.body.plan.status).toBe('rejected');
  });

  it('a venue user cannot read a plan of another venue', async () => {
    const plan = await createPlan(planner);
    expect((await venue.get(`${base}/plans/${plan.id}`)).status).toBe(403);
    const list = await venue.get(`${base}/plans`).expect(200);
    expect(list.body.plans.find((p: { id: string }) => p.id === plan.id)).toBeUndefined();
  });

  async function approvedPlan() {
    const plan = await submitted(planner);
    const res = await send(rigger, 'post', `${base}/plans/${plan.id}/approve`, { version: plan.version });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body.plan;
  }

  it('editing the plan withdraws the approval, with history', async () => {
    const plan = await approvedPlan();
    const res = await send(planner, 'patch', `${base}/plans/${plan.id}`, { version: plan.version, inputs: planInputs({ title: 'Changed after approval' }) });
    expect(res.status).toBe(200);
    expect(res.body.plan.status).toBe('draft');
    expect(res.body.plan.events.map((e: { kind: string }) => e.kind)).toEqual(['created', 'submitted', 'approved', 'approval-withdrawn', 'edited']);
  });

  it('changing the gear withdraws the approval', async () => {
    const plan = await approvedPlan();
    const sling = gear.get('RS-2T-2.0-B')!;
    const current = (await rigger.get(`${base}/gear`).expect(200)).body.gear.find((g: { id: string }) => g.id === sling.id);
    const { id: _id, version, updatedAt: _u, ...item } = current;
    const res = await send(rigger, 'patch', `${base}/gear/${sling.id}`, { version, item: { ...item, description: 'Re-tagged' } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const after = await planner.get(`${base}/plans/${plan.id}`).expect(200);
    expect(after.body.plan.status).toBe('draft');
    const last = after.body.plan.events.at(-1);
    expect(last.kind).toBe('approval-withdrawn');
    expect(last.comment).toMatch(/RS-2T-2.0-B/);
  });

  it("a change to the section's mass withdraws the approval when the plan is next read", async () => {
    const plan = await approvedPlan();
    // The drive core is weighed again (a later weighing governs): 8 kg more than before.
    const [w] = await t.db('machine_weighings')
      .insert({
        production_id: productionId, section_id: dc.sectionId, weighed_on: '2099-01-01', weighed_by: 'Test', readings: JSON.stringify([{ positionMm: [0, 0], readingKg: plan.load.massKg + 8 }]),
        mass_kg: plan.load.massKg + 8, cog_plan_mm: JSON.stringify([0, 0]),
      })
      .returning('id');
    try {
      const after = await rigger.get(`${base}/plans/${plan.id}`).expect(200);
      expect(after.body.plan.status).toBe('draft');
      expect(after.body.plan.events.at(-1).comment).toMatch(/mass, CoG or bounds changed/);
    } finally {
      await t.db('machine_weighings').where({ id: w.id }).delete();
    }
  });

  it('an approval is given only to the figures the reviewer saw', async () => {
    const plan = await submitted(planner);
    const sh = (await rigger.get(`${base}/gear`).expect(200)).body.gear.find((g: { identifier: string }) => g.identifier === 'SH-2T-01');
    const { id, version, updatedAt: _u, ...item } = sh;
    await send(rigger, 'patch', `${base}/gear/${id}`, { version, item: { ...item, massKg: 0.65 } }).expect(200);
    const res = await send(rigger, 'post', `${base}/plans/${plan.id}/approve`, { version: plan.version });
    expect(res.status).toBe(409);
  });
});

describe('hanging points', () => {
  it("a plan on a venue's point takes the venue's current rating; venue staff see only their own venue's points", async () => {
    const venues = await t.db('venues').where({ production_id: productionId }).select('id', 'name');
    const kelder = venues.find((v) => v.name === 'Kelderwerf Hall')!;
    const created = await send(planner, 'post', `${base}/hanging-points`, { venueId: kelder.id, label: 'Truss pickup T1', ratingKg: 2000 });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    // The Loomworks venue user may not add points to another venue.
    expect((await send(venue, 'post', `${base}/hanging-points`, { venueId: kelder.id, label: 'X', ratingKg: 100 })).status).toBe(403);
    const theirs = (await venue.get(`${base}/hanging-points`).expect(200)).body.hangingPoints;
    expect(theirs.length).toBeGreaterThan(0);
    expect(theirs.every((p: { venueName: string }) => p.venueName === 'Loomworks Hall')).toBe(true);

    const plan = await createPlan(planner, { venueId: kelder.id, suspension: { kind: 'single-hook', hoistGearId: gear.get('CH-1000-01')!.id, hangingPoint: { label: 'Truss pickup T1', ratingKg: null, source: 'venue' } } });
    expect(plan.result.components.find((c: { kind: string }) => c.kind === 'hanging-point').capacityKg).toBe(2000);
    const lowered = await send(planner, 'patch', `${base}/hanging-points/${created.body.hangingPoint.id}`, { version: 1, ratingKg: 300 });
    expect(lowered.status).toBe(200);
    const after = (await planner.get(`${base}/plans/${plan.id}`).expect(200)).body.plan;
    expect(after.result.verdict).toBe('over capacity');
    expect(after.result.problems.join(' ')).toMatch(/hanging point Truss pickup T1/);
  });
});

describe('manual handling', () => {
  it('lists sections above the threshold with a verdict, the method and the NIOSH multipliers', async () => {
    const res = await rigger.get(`${base}/handling`).expect(200);
    expect(res.body.settings.handlingMethod).toBe('niosh');
    const dcItem = res.body.items.find((i: { code: string; kind: string }) => i.kind === 'section' && i.code === 'DC');
    expect(dcItem.assessment.verdict.verdict).toBe('mechanical aid required');
    expect(dcItem.assessment.verdict.method).toMatch(/NIOSH/);
    const r = dcItem.assessment.nioshResult.origin;
    for (const k of ['hm', 'vm', 'dm', 'am', 'fm', 'cm']) expect(typeof r[k]).toBe('number');
    expect(dcItem.assessment.estimated).toContain('niosh.origin.hCm');
    for (const c of LIFTING_CAUTIONS) expect(dcItem.assessment.verdict.cautions).toContain(c);
  });

  it('saves the crew\'s task inputs per item, with 409 on a stale save; a venue user is refused', async () => {
    const list = (await planner.get(`${base}/handling`).expect(200)).body.items;
    const item = list.find((i: { kind: string }) => i.kind === 'section');
    const body = { itemKind: item.kind, version: item.version, task: { niosh: { origin: { hCm: 30, vCm: 40 } } } };
    const saved = await send(planner, 'put', `${base}/handling/${item.id}`, body);
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect((await send(planner, 'put', `${base}/handling/${item.id}`, body)).status).toBe(409);
    const again = (await planner.get(`${base}/handling`).expect(200)).body.items.find((i: { id: string }) => i.id === item.id);
    expect(again.assessment.estimated).not.toContain('niosh.origin.hCm');
    expect(again.assessment.niosh.origin.hCm).toBe(30);
    expect((await venue.get(`${base}/handling`)).status).toBe(403);
  });
});

describe('lift plan PDF', () => {
  it('prints the figures, method, signatures and cautions, and page 1 is not blank', async () => {
    const plan = await createPlan(planner, { method: 'Lift slowly; tag lines both sides.' });
    const res = await rigger.get(`${base}/plans/${plan.id}/pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = pdfText(pdf).replace(/\s+/g, ' ');
    expect(text).toContain('Lift plan: Test lift of the drive core');
    expect(text).toContain('DRAFT — not approved');
    expect(text).toContain('Never stand or pass under a suspended load.');
    expect(text).toContain('Masses and centres of gravity are estimates until the item has been weighed.');
    expect(text).toContain('Rigging and lifting gear must be inspected before use and used by a competent person.');
    expect(text).toContain('Local codes, regulations and licensed practice prevail over these figures.');
    expect(text).toContain('Dynamic hook load');
    expect(text).toContain('Lift slowly; tag lines both sides.');
    expect(text).toContain('NAVEDTRA');
    expect(text).toContain('Tobiah Renn');
    expect(text).toMatch(/Reviewing rigger \(competent person\): signature and date/);
    expect(text).toContain('RS-2T-2.0-A');
    const ink = pageOneInkShare(pdf);
    // A4 at 40 dpi is about 331 × 468 pixels; a page with text and a drawing inks a few per cent of it.
    expect(ink.width).toBeGreaterThan(300);
    expect(ink.share).toBeGreaterThan(0.02);
  });
});
