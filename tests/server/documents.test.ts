import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import type { LiftPlanFields } from '../../src/domain/contracts/lifting-api.ts';
import { LIFTING_CAUTIONS } from '../../src/domain/lifting/index.ts';
import type { Actor } from '../../src/domain/policy/index.ts';
import { loadConfig } from '../../server/config/env.ts';
import { createPlan } from '../../server/modules/lifting/lift-plans.service.ts';
import { gearColumns } from '../../server/modules/lifting/lifting.repository.ts';
import { crateQrText, parseCrateQr } from '../../server/modules/tour/crate-qr.ts';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { tourTestProduction } from './tour-helpers.ts';
import { decodeQr, inkShare, pdfPageSizes, renderGray } from './documents-helpers.ts';
import { pdfText } from './lifting-helpers.ts';

/**
 * Documents against a production of their own: packing lists, labels and manifests read back with
 * poppler (pdftotext, pdfinfo, pdftoppm), the label's QR code decoded by ZXing, the customs list parsed
 * by papaparse and exceljs.
 */

const t: TestApp = await createTestApp();
let productionId: string;
let ownVenueId: string;
let ownEngagementId: string;
let otherEngagementId: string;
let planner: Agent;
let rigger: Agent;
let venue: Agent;
let base: string;
const crate: Record<'A' | 'B' | 'C', string> = { A: '', B: '', C: '' };
const PLAN_TITLE = 'Gear lift S1';

/** pounds per kilogram by the 1959 international yard and pound agreement: 1 lb = 0.45359237 kg exactly [PUB]. */
const LB = (kg: number) => kg / 0.45359237;
const fmt = (v: number, d: number) => v.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d });
const flat = (s: string) => s.replace(/\s+/g, ' ');

function binary(agent: Agent, url: string) {
  return agent
    .get(url)
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
}

beforeAll(async () => {
  const db = t.db;
  const p = await tourTestProduction(db, 'Documents');
  productionId = p.productionId;
  ownVenueId = p.ownVenueId;
  base = `/api/productions/${productionId}/documents`;
  planner = await t.signIn('planner');
  rigger = await t.signIn('rigger');
  venue = await t.signIn('venue');

  // The own venue prints imperial paperwork and has one door 700 mm wide on its route.
  await db('venues')
    .where({ id: ownVenueId })
    .update({
      paperwork_units: 'imperial',
      access: JSON.stringify({ doors: [{ name: 'Scene dock door', widthMm: 700, heightMm: 2100 }] }),
      contacts: JSON.stringify([{ name: 'Ada Rowntree', role: 'Production manager', email: 'ada@own-hall.example', phone: '+44 161 000 0000', receivesManifest: true }]),
    });

  // Machine: one section S1 reached through an assembly, a loose bought part with a formula-like name.
  const [machine] = await db('machines').insert({ production_id: productionId, name: 'Test machine' }).returning('id');
  const [section] = await db('machine_sections').insert({ production_id: productionId, machine_id: machine.id, code: 'S1', name: 'Gear section' }).returning('id');
  const [assembly] = await db('machine_assemblies').insert({ production_id: productionId, machine_id: machine.id, number: 'A1', name: 'Gear train assembly', section_id: section.id }).returning('id');
  const box = (s: number) => JSON.stringify({ minMm: [0, 0, 0], maxMm: [s, s, s] });
  await db('machine_part_lines').insert([
    { production_id: productionId, machine_id: machine.id, assembly_id: assembly.id, part_number: 'GT-100', name: 'Gear train', quantity: 2, unit_mass_kg: 40, mass_source: 'weighed', value: 1500.5, currency: 'EUR', country_of_origin: 'NL', serial_numbers: ['SN-001', 'SN-002'], cog_mm: JSON.stringify([300, 300, 300]), bbox_mm: box(600), sort_order: 1 },
    { production_id: productionId, machine_id: machine.id, section_id: section.id, part_number: 'CW-4', name: 'Counterweight plate', quantity: 4, unit_mass_kg: 25, mass_source: 'catalogue', cog_mm: JSON.stringify([300, 300, 100]), bbox_mm: box(600), sort_order: 2 },
  ]);
  const [loose] = await db('machine_part_lines')
    .insert({ production_id: productionId, machine_id: machine.id, part_number: 'PS-1', name: '=HYPERLINK("http://x.example")', quantity: 1, unit_mass_kg: 18, value: 250, currency: 'EUR', country_of_origin: 'DE', serial_numbers: ['+SN-9'] })
    .returning('id');

  const stock = { production_id: productionId, kind: 'stock' };
  const [a] = await db('crates')
    .insert({ ...stock, code: 'DOC-A', name: 'Power supply case', outer_length_mm: 800, outer_width_mm: 600, outer_height_mm: 500, tare_kg: 12, fragile: true, stackable: true, max_load_on_top_kg: 60, this_way_up: true })
    .returning('id');
  const [b] = await db('crates')
    .insert({ ...stock, code: 'DOC-B', name: 'Gear section crate', outer_length_mm: 1200, outer_width_mm: 800, outer_height_mm: 2000, tare_kg: 150, ispm15_required: true, stackable: false, this_way_up: true })
    .returning('id');
  const [c] = await db('crates').insert({ ...stock, code: 'DOC-C', name: 'Spares', outer_length_mm: 600, outer_width_mm: 400, outer_height_mm: 400, tare_kg: 8 }).returning('id');
  crate.A = a.id;
  crate.B = b.id;
  crate.C = c.id;
  await db('crate_contents').insert([
    { production_id: productionId, crate_id: a.id, part_line_id: loose.id, description: 'Power supply', quantity: 1, mass_kg: 18, cog_mm: JSON.stringify([400, 300, 200]) },
    // The tare sits at the middle of the case (z 1,000 mm); the section's CoG 1,500 mm up.
    { production_id: productionId, crate_id: b.id, section_id: section.id, description: 'Section S1 — Gear section', quantity: 1, mass_kg: 1100, cog_mm: JSON.stringify([600, 400, 1500]) },
    { production_id: productionId, crate_id: c.id, description: '=SUM(A1:A3) spare fasteners', quantity: 3, mass_kg: null },
  ]);

  const eng = (venueId: string, d: string) => ({ production_id: productionId, venue_id: venueId, load_in_on: `2099-${d}-01`, show_first_on: `2099-${d}-02`, show_last_on: `2099-${d}-03`, load_out_on: `2099-${d}-04` });
  const [own] = await db('engagements').insert(eng(ownVenueId, '03')).returning('id');
  const [other] = await db('engagements').insert(eng(p.otherVenueId, '04')).returning('id');
  ownEngagementId = own.id;
  otherEngagementId = other.id;
  const [leg] = await db('tour_legs').insert({ production_id: productionId, to_engagement_id: own.id, departs_on: '2099-02-27' }).returning('id');
  // Unloading order: B first, then A.
  await db('leg_crates').insert([
    { leg_id: leg.id, crate_id: b.id, load_order: 1 },
    { leg_id: leg.id, crate_id: a.id, load_order: 2 },
  ]);

  // A lift plan at the own venue, through the lifting module's own service.
  const gear = [
    { kind: 'hoist', identifier: 'H1', ratedLoadKg: 2000, selfWeightKg: 40, chainWeightKg: 20, liftingSpeedMPerMin: 4, hoistClass: 'D8+', hasSecondBrake: true, nextInspectionDate: '2099-09-30' },
    { kind: 'sling', identifier: 'S-A', slingType: 'roundsling', verticalRatingKg: 2000, lengthMm: 2000, massKg: 1.4, nextInspectionDate: '2099-06-30' },
    { kind: 'sling', identifier: 'S-B', slingType: 'roundsling', verticalRatingKg: 2000, lengthMm: 2000, massKg: 1.4, nextInspectionDate: '2099-06-30' },
  ] as const;
  const ids = new Map<string, string>();
  for (const g of gear) {
    const [row] = await db('lifting_gear').insert({ production_id: productionId, ...gearColumns(g as never) }).returning('id');
    ids.set(g.identifier, row.id);
  }
  const fields: LiftPlanFields = {
    title: PLAN_TITLE,
    sectionId: section.id,
    venueId: ownVenueId,
    liftDate: '2099-03-01',
    cogUncertaintyMm: null,
    pickPoints: [
      { id: 'A', positionMm: [100, 300, 600], slingGearId: ids.get('S-A'), hitch: 'vertical', shackleGearIds: [] },
      { id: 'B', positionMm: [500, 300, 600], slingGearId: ids.get('S-B'), hitch: 'vertical', shackleGearIds: [] },
    ],
    suspension: { kind: 'single-hook', hoistGearId: ids.get('H1')!, hangingPoint: { label: 'Beam 1', ratingKg: 2000, source: 'typed' } },
    legRating: 'two-carry',
    peopleBelow: false,
    occupiedAreasMm: [],
    exclusionMarginMm: 1500,
    maxTiltDeg: 5,
    method: '',
  } as LiftPlanFields;
  const plannerRow = await db('users').where({ email: 'planner@ballast.example' }).first('id');
  const actor: Actor = { userId: plannerRow.id, isAdmin: false, memberships: [{ productionId, role: 'planner', venueIds: [] }] };
  await createPlan(db, actor, productionId, fields);
});
afterAll(async () => t.close());

describe('packing list', () => {
  it('reads back the crate, its masses, CoG corner, the verdicts and every caution; A4 page; not blank', async () => {
    const res = await binary(planner, `${base}/crates/${crate.B}/packing-list.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    const text = flat(pdfText(pdf));
    expect(text).toContain('Packing list — crate DOC-B');
    // Gross = tare + contents (150 + 1,100 kg); the next stop prints imperial, so pounds alongside.
    expect(text).toContain(`${fmt(1250, 1)} kg (${fmt(LB(1250), 1)} lb)`);
    expect(text).toContain(`${fmt(1100, 1)} kg`);
    expect(text).toContain('corner A');
    // Statics [C] (REFERENCES §4.4): CoG height (150·1000 + 1100·1500)/1250 = 1,440 mm; across, b = 400 mm
    // to the side edge; b/h = 0.28 < 0.5 g sideways (road, insurers' handbook [S]): the crate tips.
    const h = (150 * 1000 + 1100 * 1500) / 1250;
    expect(400 / h).toBeLessThan(0.5);
    expect(text).toContain('LASH OR BLOCK');
    expect(text).toContain('MECHANICAL AID REQUIRED');
    expect(text).toContain('ISPM 15');
    expect(text).toContain('Do not stack');
    // ≥ 1,000 kg gross: the CoG mark is required (insurers' packaging handbook, REFERENCES §4.3 [S]).
    expect(text).toContain('Centre of gravity');
    for (const caution of LIFTING_CAUTIONS) expect(text).toContain(caution);
    // A4 = 210 × 297 mm = 595.28 × 841.89 pt (ISO 216 [PUB]; 1 pt = 1/72 in).
    for (const s of pdfPageSizes(pdf)) {
      expect(s.widthPt).toBeCloseTo((210 / 25.4) * 72, 1);
      expect(s.heightPt).toBeCloseTo((297 / 25.4) * 72, 1);
    }
    expect(inkShare(renderGray(pdf, 1, 40))).toBeGreaterThan(0.01);
  });

  it('names fragile contents, the stacking limit and an unknown mass; Letter when the production says so', async () => {
    const a = flat(pdfText((await binary(planner, `${base}/crates/${crate.A}/packing-list.pdf`).expect(200)).body));
    expect(a).toContain('DOC-A');
    expect(a).toContain('Fragile');
    expect(a).toContain('Stacking limit 60 kg');
    expect(a).toContain('Use no hooks');
    expect(a).toContain(`${fmt(30, 1)} kg`); // 12 + 18 kg
    await t.db('productions').where({ id: productionId }).update({ paper_size: 'Letter' });
    try {
      const res = await binary(rigger, `${base}/crates/${crate.C}/packing-list.pdf`).expect(200);
      const c = flat(pdfText(res.body));
      expect(c).toContain('UNKNOWN');
      expect(c).toContain('lower bound');
      expect(c).toContain('NO VERDICT');
      // US Letter = 8.5 × 11 in = 612 × 792 pt [PUB: ANSI/ASME Y14.1].
      for (const s of pdfPageSizes(res.body)) expect([s.widthPt, s.heightPt]).toEqual([612, 792]);
    } finally {
      await t.db('productions').where({ id: productionId }).update({ paper_size: 'A4' });
    }
  });

  it('refuses venue staff, an unknown crate and a crate of another production', async () => {
    expect((await planner.get(`${base}/crates/${crate.A}/packing-list.pdf`)).status).toBe(200);
    expect((await venue.get(`${base}/crates/${crate.A}/packing-list.pdf`)).status).toBe(403);
    expect((await planner.get(`${base}/crates/00000000-0000-4000-8000-000000000000/packing-list.pdf`)).status).toBe(404);
    expect((await planner.get(`${base}/crates/not-a-uuid/packing-list.pdf`)).status).toBe(404);
  });
});

describe('crate labels', () => {
  it('one label a page, with a QR code that ZXing reads as the crate address check-in understands', async () => {
    const res = await binary(planner, `${base}/crates/labels.pdf?ids=${crate.B},${crate.A}`).expect(200);
    const pdf = res.body as Buffer;
    expect(pdfPageSizes(pdf)).toHaveLength(2);
    const text = flat(pdfText(pdf));
    for (const code of ['DOC-A', 'DOC-B']) expect(text).toContain(code);
    expect(text).toContain(`GROSS ${fmt(1250, 0)} kg`);
    expect(text).toContain('Own Hall');
    // Labels come in code order: page 1 is DOC-A.
    const expected = crateQrText(loadConfig({ ...process.env, NODE_ENV: 'test' }).APP_URL, productionId, crate.A);
    // A phone reads many frames; the test reads the page at a few resolutions and takes the first
    // that decodes (ZXing's sampling misses some random codes at any single one).
    let decoded = '';
    for (const dpi of [150, 200, 300, 250, 120]) {
      const page = renderGray(pdf, 1, dpi);
      expect(inkShare(page)).toBeGreaterThan(0.02);
      try {
        decoded = decodeQr(page);
        break;
      } catch {
        // try the next resolution
      }
    }
    expect(decoded).toBe(expected);
    expect(parseCrateQr(decoded)).toEqual({ productionId, crateId: crate.A });
  });

  it('two a page on request; every crate when no ids are given; bad ids answer 400', async () => {
    const two = await binary(planner, `${base}/crates/labels.pdf?ids=${crate.A},${crate.B}&perPage=2`).expect(200);
    expect(pdfPageSizes(two.body)).toHaveLength(1);
    const all = await binary(rigger, `${base}/crates/labels.pdf`).expect(200);
    expect(pdfPageSizes(all.body)).toHaveLength(3);
    expect(flat(pdfText(all.body))).toContain('DOC-C');
    const bad = await planner.get(`${base}/crates/labels.pdf?ids=${crate.A},nonsense`);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('nonsense');
    expect((await planner.get(`${base}/crates/labels.pdf?perPage=3`)).status).toBe(400);
  });
});

describe('venue manifest', () => {
  it('lists crates in unloading order with access results, lift plans, contacts and cautions, imperial alongside', async () => {
    const res = await binary(planner, `${base}/engagements/${ownEngagementId}/manifest.pdf`).expect(200);
    const pdf = res.body as Buffer;
    const text = flat(pdfText(pdf));
    expect(text).toContain('Manifest — Own Hall');
    expect(text.indexOf('DOC-B')).toBeGreaterThan(-1);
    expect(text.indexOf('DOC-B')).toBeLessThan(text.indexOf('DOC-A'));
    // DOC-B is 800 mm wide against a 700 mm door: it fails by 100 mm (3.9 in); DOC-A (600 mm) passes.
    expect(text).toContain('FAIL');
    expect(text).toMatch(/−100 mm/);
    expect(text).toContain(`(−${fmt(100 / 25.4, 1)} in)`);
    expect(text).toContain(`${fmt(1280, 0)} kg (${fmt(LB(1280), 0)} lb)`);
    expect(text).toContain(PLAN_TITLE);
    expect(text).toContain('Ada Rowntree');
    for (const caution of LIFTING_CAUTIONS) expect(text).toContain(caution);
    expect(inkShare(renderGray(pdf, 1, 40))).toBeGreaterThan(0.01);
  });

  it('venue staff get their own venue’s manifest and are refused another venue’s', async () => {
    expect((await binary(venue, `${base}/engagements/${ownEngagementId}/manifest.pdf`)).status).toBe(200);
    const refused = await venue.get(`${base}/engagements/${otherEngagementId}/manifest.pdf`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toContain('another venue');
    expect((await planner.get(`${base}/engagements/00000000-0000-4000-8000-000000000000/manifest.pdf`)).status).toBe(404);
  });
});

describe('customs list', () => {
  const header = ['Item no.', 'Crate', 'Trade description, marks and serial numbers', 'Number of pieces', 'Weight (kg)', 'Value', 'Currency', 'Country of origin', 'Missing'];

  it('CSV: one row per item grouped by crate, numbers as numbers, formula-like text neutralised', async () => {
    const res = await planner.get(`${base}/customs-list.csv`).expect(200);
    expect(res.headers['content-type']).toContain('text/csv');
    const parsed = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, ''), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [head, ...rows] = parsed.data;
    expect(head).toEqual(header);
    expect(rows.map((r) => r[1])).toEqual(['DOC-A', 'DOC-B', 'DOC-B', 'DOC-C']);
    expect(rows.map((r) => Number(r[0]))).toEqual([1, 2, 3, 4]);
    const [ps, gears, weights, spares] = rows;
    // The bought part's name starts with "=": written with a leading apostrophe, never as a formula.
    expect(ps[2].startsWith(`'=HYPERLINK`)).toBe(true);
    expect(ps[2]).toContain('+SN-9');
    expect(ps.slice(3, 8)).toEqual(['1', '18', '250', 'EUR', 'DE']);
    // Gear train: 2 pieces at 40 kg and 1,500.50 EUR each.
    expect(gears[2]).toContain('SN-001, SN-002');
    expect(gears[2]).toContain('crate DOC-B');
    expect(Number(gears[3])).toBe(2);
    expect(Number(gears[4])).toBe(2 * 40);
    expect(Number(gears[5])).toBeCloseTo(2 * 1500.5, 2);
    expect(gears[7]).toBe('NL');
    expect(weights[5]).toBe('');
    expect(weights[8]).toContain('value');
    expect(weights[8]).toContain('country of origin');
    expect(spares[2].startsWith(`'=SUM`)).toBe(true);
    expect(spares[4]).toBe('');
    for (const r of rows) for (const cell of r) expect(/^[=+\-@]/.test(cell)).toBe(false);
  });

  it('XLSX holds the same rows, with numbers as number cells and the same guarded text', async () => {
    const csv = Papa.parse<string[]>((await planner.get(`${base}/customs-list.csv`).expect(200)).text.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data;
    const res = await binary(rigger, `${base}/customs-list.xlsx`).expect(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as unknown as ArrayBuffer);
    const ws = wb.worksheets[0];
    const rows: (string | number | null)[][] = [];
    ws.eachRow((row) => rows.push((row.values as (string | number | null | undefined)[]).slice(1, header.length + 1).map((v) => (v === undefined ? null : v))));
    expect(rows[0]).toEqual(header);
    expect(rows).toHaveLength(csv.length);
    rows.slice(1).forEach((r, i) => {
      expect(typeof r[0]).toBe('number');
      expect(typeof r[3]).toBe('number');
      r.forEach((v, j) => expect(v === null ? '' : String(v)).toBe(csv[i + 1][j]));
    });
    expect((await venue.get(`${base}/customs-list.xlsx`)).status).toBe(403);
  });
});
