import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { machineTestProduction } from './machine-helpers.ts';

const t: TestApp = await createTestApp();
let planner: Agent;
let rigger: Agent;
let pid: string;
const base = () => `/api/productions/${pid}/machine`;

const MAPPING = { partNumber: 'Part number', name: 'Name', assemblyNumber: 'Assembly', quantity: 'Quantity', unitMass: 'Unit mass (kg)', massSource: 'Mass source', material: 'Material', cogX: 'CoG x (mm)', cogY: 'CoG y (mm)', cogZ: 'CoG z (mm)' };
const OPTIONS = { mapping: MAPPING, units: { length: 'mm', mass: 'kg' } };
const HEADER = 'Part number,Name,Assembly,Quantity,Unit mass (kg),Mass source,Material,CoG x (mm),CoG y (mm),CoG z (mm)';

beforeAll(async () => {
  pid = await machineTestProduction(t.db, 'Machine import');
  planner = await t.signIn('planner');
  rigger = await t.signIn('rigger');
  for (const number of ['A1', 'A2']) {
    await planner.post(`${base()}/assemblies`).set('x-csrf-token', planner.csrf).send({ number }).expect(201);
  }
});
afterAll(async () => t.close());

function upload(a: Agent, content: Buffer | string, name: string) {
  return a.post(`${base()}/imports`).set('x-csrf-token', a.csrf).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), name);
}
function preview(importId: string, options: object = OPTIONS) {
  return planner.post(`${base()}/imports/${importId}/preview`).set('x-csrf-token', planner.csrf).send(options);
}
function commit(importId: string, options: object = OPTIONS) {
  return planner.post(`${base()}/imports/${importId}/commit`).set('x-csrf-token', planner.csrf).send(options);
}
const lineCount = async () => Number((await t.db('machine_part_lines').where({ production_id: pid }).count<{ count: string }[]>('* as count'))[0].count);

describe('parts-list import', () => {
  it('names every problem by row and column, and a bad file writes nothing', async () => {
    const csv = [
      HEADER,
      'P-1,Frame,A1,1,12.5,weighed,steel,0,0,100',
      ',No part number,A1,1,1,cad,steel,0,0,0',
      'P-3,Negative,A1,1,-4,cad,steel,0,0,0',
      'P-4,Words,A1,1,heavy,cad,steel,0,0,0',
      'P-5,Unobtainium,A1,1,1,cad,unobtainium,0,0,0',
      'P-1,Duplicate,A1,2,1,cad,steel,0,0,0',
      'P-7,Orphan,Z9,1,1,cad,steel,0,0,0',
    ].join('\n');
    const up = await upload(planner, csv, 'parts.csv').expect(201);
    expect(up.body.import.rowCount).toBe(7);
    const pv = (await preview(up.body.import.id).expect(200)).body.preview;
    expect(pv.ok).toBe(false);
    const at = (row: number) => pv.problems.filter((p: { rowNumber: number; severity: string }) => p.rowNumber === row && p.severity === 'error');
    expect(at(3)[0].column).toBe('Part number');
    expect(at(4)[0].column).toBe('Unit mass (kg)');
    expect(at(5)[0].column).toBe('Unit mass (kg)');
    expect(at(5)[0].message).toMatch(/heavy/);
    expect(at(6)[0].column).toBe('Material');
    expect(at(7)[0].message).toMatch(/row 2|twice|duplicate/i);
    expect(at(8)[0].column).toBe('Assembly');
    expect(at(2)).toHaveLength(0);

    const res = await commit(up.body.import.id).expect(400);
    expect(res.body.error.code).toBe('import_invalid');
    expect(res.body.error.issues.some((i: { path: string }) => i.path === 'row 6, column "Material"')).toBe(true);
    expect(await lineCount()).toBe(0);
    const status = (await planner.get(`${base()}/imports/${up.body.import.id}`).expect(200)).body.import;
    expect(status.status).toBe('failed');
  });

  it('commits a valid list in one go, remembers the mapping, and reports progress', async () => {
    const csv = [HEADER, 'P-1,Frame,A1,1,12.5,weighed,steel,0,0,100', 'P-2,Plate,A1,4,2.5,cad,aluminium,1000,0,100', 'P-3,Bolt,A2,10,0.1,catalogue,,500,500,0'].join('\r\n');
    const up = await upload(planner, csv, 'parts.csv').expect(201);
    const pv = (await preview(up.body.import.id).expect(200)).body.preview;
    expect(pv.ok).toBe(true);
    expect(pv.diff).toMatchObject({ addedCount: 3, changedCount: 0, removedCount: 0 });
    const done = (await commit(up.body.import.id).expect(200)).body.result;
    expect(done.diff.addedCount).toBe(3);
    expect(await lineCount()).toBe(3);
    const status = (await planner.get(`${base()}/imports/${up.body.import.id}`).expect(200)).body.import;
    expect(status).toMatchObject({ status: 'committed', progressDone: 3, progressTotal: 3 });
    // The same import cannot be applied twice.
    await commit(up.body.import.id).expect(409);
    // 12.5 + 4 × 2.5 + 10 × 0.1 = 23.5 kg (hand sum).
    const mp = (await planner.get(`${base()}/mass-properties`).expect(200)).body.massProperties;
    expect(mp.machine.massKg).toBeCloseTo(23.5, 9);
    // The next upload suggests the mapping used last time, even for headers with other names.
    const again = await upload(planner, csv.replace('Part number', 'Part number'), 'again.csv').expect(201);
    expect(again.body.suggested.mapping).toMatchObject(MAPPING);
  });

  it('shows a re-import as a diff and applies it all or nothing', async () => {
    const csv = [HEADER, 'P-1,Frame,A1,1,13.0,weighed,steel,0,0,100', 'P-2,Plate,A1,4,2.5,cad,aluminium,1000,0,100', 'P-4,Cover,A2,1,3,estimated,abs,0,0,200'].join('\n');
    const up = await upload(planner, csv, 'parts-v2.csv').expect(201);
    const pv = (await preview(up.body.import.id).expect(200)).body.preview;
    expect(pv.diff).toMatchObject({ addedCount: 1, changedCount: 1, removedCount: 1, unchangedCount: 1 });
    expect(pv.diff.changed[0]).toMatchObject({ partNumber: 'P-1', fields: ['unitMassKg'], before: { unitMassKg: 12.5 }, after: { unitMassKg: 13 } });
    expect(pv.diff.removed[0].partNumber).toBe('P-3');
    const before = await t.db('machine_part_lines').where({ production_id: pid, part_number: 'P-1' }).first();
    await commit(up.body.import.id).expect(200);
    const after = await t.db('machine_part_lines').where({ production_id: pid }).orderBy('part_number');
    expect(after.map((l) => l.part_number)).toEqual(['P-1', 'P-2', 'P-4']);
    expect(after[0].unit_mass_kg).toBe(13);
    expect(after[0].version).toBe(before.version + 1);
  });

  it('warns before a re-import drops the placements of a placed line whose quantity changes', async () => {
    const p2 = await t.db('machine_part_lines').where({ production_id: pid, part_number: 'P-2' }).first();
    await t.db('machine_part_instances').insert([0, 1, 2, 3].map((seq) => ({ production_id: pid, part_line_id: p2.id, seq, x_mm: seq * 100, y_mm: 0, z_mm: 0 })));
    const csv = [HEADER, 'P-1,Frame,A1,1,13.0,weighed,steel,0,0,100', 'P-2,Plate,A1,3,2.5,cad,aluminium,1000,0,100', 'P-4,Cover,A2,1,3,estimated,abs,0,0,200'].join('\n');
    const up = await upload(planner, csv, 'parts-v3.csv').expect(201);
    const pv = (await preview(up.body.import.id).expect(200)).body.preview;
    expect(pv.diff.placementsDroppedCount).toBe(1);
    expect(pv.diff.placementsDropped).toEqual([{ partNumber: 'P-2', assemblyNumber: 'A1', why: 'quantity changes' }]);
    // Previewing wrote nothing: the placements are still there until the import is applied.
    expect(await t.db('machine_part_instances').where({ part_line_id: p2.id }).count<{ count: number }[]>('* as count')).toEqual([{ count: 4 }]);
    await commit(up.body.import.id).expect(200);
    expect(await t.db('machine_part_instances').where({ part_line_id: p2.id }).count<{ count: number }[]>('* as count')).toEqual([{ count: 0 }]);
  });

  it('round-trips: import → export (CSV and XLSX) → import gives the same breakdown', async () => {
    // A line with formula-like text and negative coordinates, set through the API.
    await planner
      .post(`${base()}/lines`)
      .set('x-csrf-token', planner.csrf)
      .send({ partNumber: '+44-100', name: '=HYPERLINK("http://x","click")', quantity: 2, unitMassKg: 0.25, massSource: 'catalogue', cogMm: [-120.5, -3, 0], bboxMm: { minMm: [-130, -10, -5], maxMm: [-110, 4, 5] }, notes: '@risk' })
      .expect(201);
    const csv = await planner.get(`${base()}/export?format=csv`).buffer(true).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const text = csv.text.replace(/^\uFEFF/, '');
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
    const row = parsed.data.find((r) => r['Part number'].includes('+44-100'))!;
    // Text that a spreadsheet would run as a formula is neutralised; numbers (negative too) stay bare numbers.
    expect(row['Part number']).toBe("'+44-100");
    expect(row.Name).toBe(`'=HYPERLINK("http://x","click")`);
    expect(row.Notes).toBe("'@risk");
    expect(row['CoG x (mm)']).toBe('-120.5');
    expect(text).toMatch(/,-120\.5,/);

    const exportMapping = { mapping: { partNumber: 'Part number', name: 'Name', assemblyNumber: 'Assembly', quantity: 'Quantity', unitMass: 'Unit mass (kg)', massSource: 'Mass source', material: 'Material', volume: 'Volume (mm³)', procurement: 'Bought or made', unitValue: 'Unit value', currency: 'Currency', countryOfOrigin: 'Country of origin', serialNumbers: 'Serial numbers', cogX: 'CoG x (mm)', cogY: 'CoG y (mm)', cogZ: 'CoG z (mm)', bboxMinX: 'Box min x (mm)', bboxMinY: 'Box min y (mm)', bboxMinZ: 'Box min z (mm)', bboxMaxX: 'Box max x (mm)', bboxMaxY: 'Box max y (mm)', bboxMaxZ: 'Box max z (mm)', notes: 'Notes' }, units: { length: 'mm', mass: 'kg' } };
    const up = await upload(planner, Buffer.from(csv.text), 'export.csv').expect(201);
    const pv = (await preview(up.body.import.id, exportMapping).expect(200)).body.preview;
    expect(pv.errorCount).toBe(0);
    expect(pv.diff).toMatchObject({ addedCount: 0, changedCount: 0, removedCount: 0, unchangedCount: 4 });

    const xlsx = await planner.get(`${base()}/export?format=xlsx`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(xlsx.body as ArrayBuffer);
    const sheet = wb.worksheets[0];
    const headers = (sheet.getRow(1).values as unknown[]).slice(1).map(String);
    let r = 2;
    while (!String(sheet.getRow(r).getCell(1).value).includes('+44-100')) r++;
    expect(sheet.getRow(r).getCell(headers.indexOf('CoG x (mm)') + 1).type).toBe(ExcelJS.ValueType.Number);
    expect(sheet.getRow(r).getCell(headers.indexOf('Name') + 1).type).toBe(ExcelJS.ValueType.String);
    expect(sheet.getRow(r).getCell(headers.indexOf('Name') + 1).value).toBe(`'=HYPERLINK("http://x","click")`);
    const upX = await upload(planner, xlsx.body as Buffer, 'export.xlsx').expect(201);
    const pvX = (await preview(upX.body.import.id, exportMapping).expect(200)).body.preview;
    expect(pvX.errorCount).toBe(0);
    expect(pvX.diff).toMatchObject({ addedCount: 0, changedCount: 0, removedCount: 0, unchangedCount: 4 });
  });

  it('refuses wrong types, files over the limit and readers, naming the limit', async () => {
    const wrong = await upload(planner, 'hello', 'parts.pdf').expect(415);
    expect(wrong.body.error.message).toMatch(/\.csv, \.xlsx/);
    const fake = await upload(planner, Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 0]), 'parts.xlsx').expect(415);
    expect(fake.body.error.message).toMatch(/XLSX/);
    const big = await upload(planner, Buffer.alloc(20 * 1024 * 1024 + 1, 65), 'big.csv');
    expect(big.status).toBe(413);
    expect(big.body.error.message).toMatch(/20 MB/);
    await upload(rigger, `${HEADER}\nP-9,x,A1,1,1,cad,steel,0,0,0`, 'parts.csv').expect(403);
    await preview('00000000-0000-4000-8000-000000000000').expect(404);
  });
});
