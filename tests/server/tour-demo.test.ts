import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, demoProductionId, type Agent, type TestApp } from './helpers.ts';

/**
 * The demo tour does what SCENARIO.md says each venue is there to show. Read-only: other test files share
 * the demo production.
 */
let t: TestApp;
let planner: Agent;
let productionId: string;
interface Cell {
  rowId: string;
  engagementId: string;
  verdict: string;
  findings: { check: string; verdict: string; reason: string; where?: string }[];
}
let matrix: { rows: { id: string; code: string; kind: string; grossKg: number | null }[]; columns: { engagementId: string; venueName: string }[]; cells: Cell[] };

beforeAll(async () => {
  t = await createTestApp();
  productionId = await demoProductionId(t.db);
  planner = await t.signIn('planner');
  matrix = (await planner.get(`/api/productions/${productionId}/tour/access-matrix`).expect(200)).body.matrix;
});
afterAll(async () => t.close());

const col = (venue: string) => matrix.columns.find((c) => c.venueName === venue)!.engagementId;
const row = (code: string) => matrix.rows.find((r) => r.code === code && r.kind === 'crate')!;
const finding = (code: string, venue: string, check: string) => matrix.cells.find((c) => c.rowId === row(code).id && c.engagementId === col(venue))!.findings.filter((f) => f.check === check);
const heaviest = () => [...matrix.rows].filter((r) => r.kind === 'crate' && r.grossKg !== null).sort((a, b) => b.grossKg! - a.grossKg!)[0];

describe('demo tour', () => {
  it('has eight engagements over ten weeks, in order, each with a leg and the crates on it', async () => {
    const tour = (await planner.get(`/api/productions/${productionId}/tour`).expect(200)).body.tour;
    expect(tour.engagements.map((e: { venueName: string }) => e.venueName)).toEqual([
      'Kelderwerf Hall',
      'Sala Ventolina',
      'Havsljus Scen',
      'Teatr Bursztynowy',
      'Loomworks Hall',
      'Forum Aurelian',
      'Assay House',
      'Verrière Pavilion',
    ]);
    const days = (Date.parse(tour.engagements[7].loadOutOn) - Date.parse(tour.engagements[0].loadInOn)) / 86_400_000;
    expect(days).toBeGreaterThan(63);
    expect(days).toBeLessThanOrEqual(70);
    expect(tour.legs).toHaveLength(8);
    for (const leg of tour.legs) expect(leg.crates.length).toBe(tour.crates.length);
  });

  it('each venue shows its check', () => {
    // Kelderwerf: street level and no tail lift on the semi-trailer: a tail lift or forklift is needed.
    expect(finding('BQ1', 'Kelderwerf Hall', 'dock')[0]).toMatchObject({ verdict: 'fail' });
    expect(finding('BQ1', 'Kelderwerf Hall', 'dock')[0].reason).toMatch(/street level/);
    // Sala Ventolina: the corridor door is the tight point for the drive core.
    const door = finding('DC', 'Sala Ventolina', 'door').find((f) => f.where === 'corridor door B2')!;
    expect(door.reason).toMatch(/1,100 mm|tilted/);
    // Havsljus: the lift's class is unknown, treated as A.
    expect(finding('DC', 'Havsljus Scen', 'lift').map((f) => f.reason).join(' ')).toMatch(/class A/);
    // Havsljus has no stage rating yet: the floor is not checked, never passed.
    expect(finding('BQ1', 'Havsljus Scen', 'floor')[0].verdict).toBe('unknown');
    // Bursztynowy: the heaviest crate on a 5.0 kN/m² stage.
    expect(finding(heaviest().code, 'Teatr Bursztynowy', 'floor')[0].reason).toMatch(/rating of 5(\.00)? kN/);
    // Forum Aurelian: the 9 % ramp is too steep for a hand pallet truck.
    expect(finding('BQ1', 'Forum Aurelian', 'ramp')[0]).toMatchObject({ verdict: 'fail' });
    // Verrière: the container is unloaded at the door by the venue's forklift.
    expect(finding('BQ1', 'Verrière Pavilion', 'dock')[0]).toMatchObject({ verdict: 'pass' });
    expect(finding('BQ1', 'Verrière Pavilion', 'dock')[0].reason).toMatch(/forklift/);
  });

  it('Kelderwerf has its check-in, with a missing crate flagged before the leg to Sala Ventolina', async () => {
    const statuses = (await planner.get(`/api/productions/${productionId}/tour/check-status`).expect(200)).body.statuses;
    const kelderwerf = statuses.find((s: { engagement: { venueName: string } }) => s.engagement.venueName === 'Kelderwerf Hall');
    expect(kelderwerf.summary.in.missing).toBe(1);
    expect(kelderwerf.summary.in.damaged).toBe(1);
    expect(kelderwerf.flags[0].message).toMatch(/marked missing at Kelderwerf Hall and is due on the leg to Sala Ventolina leaving 2027-03-05/);
  });

  it('Assay House prints in imperial units; Loomworks has its contacts', async () => {
    const venues = (await planner.get(`/api/productions/${productionId}/venues`).expect(200)).body.venues;
    expect(venues.find((v: { name: string }) => v.name === 'Assay House').paperworkUnits).toBe('imperial');
    expect(venues.find((v: { name: string }) => v.name === 'Loomworks Hall').contacts.length).toBeGreaterThan(0);
  });
});
