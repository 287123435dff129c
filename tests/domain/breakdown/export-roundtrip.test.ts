import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import ExcelJS from 'exceljs';
import {
  breakdownToTable,
  defaultColumnMapping,
  guardText,
  importBreakdownRows,
  neutraliseCell,
  tableToCsv,
  unguardText,
  type BreakdownLine,
  type ExportTable,
  type ImportUnits,
} from '../../../src/domain/breakdown/index.ts';
import { DEFAULT_MATERIALS } from '../../../src/domain/mass/index.ts';

const materials = DEFAULT_MATERIALS.map((m) => ({ code: m.code, name: m.name, densityKgPerM3: m.densityKgPerM3 }));

/** A breakdown with the awkward cases: formula-like text, quotes, commas, negative coordinates, gaps. */
const lines: BreakdownLine[] = [
  {
    partNumber: 'DC-101',
    name: 'Motor, 4 kW "IE3"',
    assemblyNumber: 'DC-100',
    quantity: 1,
    unitMassKg: 62.5,
    massSource: 'catalogue',
    materialCode: null,
    volumeMm3: null,
    procurement: 'bought',
    unitValue: 1450,
    currency: 'EUR',
    countryOfOrigin: 'DE',
    serialNumbers: ['M-0001'],
    cogMm: [-120.5, 0, 450],
    bboxMm: { minMm: [-300, -200, 250], maxMm: [60, 200, 650] },
    notes: '=HYPERLINK("http://example.invalid","click")',
  },
  {
    partNumber: '-2+3',
    name: '+44 support',
    assemblyNumber: null,
    quantity: 8,
    unitMassKg: 0.125,
    massSource: 'weighed',
    materialCode: 'steel',
    volumeMm3: 15923.5668789809,
    procurement: 'made',
    unitValue: null,
    currency: null,
    countryOfOrigin: null,
    serialNumbers: [],
    cogMm: [-1e-7, -2500, -0.25],
    bboxMm: null,
    notes: "@SUM(A1:A2) and 'quoted'",
  },
  {
    partNumber: "'=already guarded",
    name: '',
    assemblyNumber: 'AC-200',
    quantity: 2.5,
    unitMassKg: null,
    massSource: null,
    materialCode: null,
    volumeMm3: null,
    procurement: null,
    unitValue: 0,
    currency: null,
    countryOfOrigin: null,
    serialNumbers: [],
    cogMm: null,
    bboxMm: null,
    notes: 'tab\tinside, and a\nnew line',
  },
];
const assemblyNumbers = ['DC-100', 'AC-200'];

function stripRow<T extends { rowNumber?: number }>(l: T): Omit<T, 'rowNumber'> {
  const { rowNumber: _r, ...rest } = l;
  return rest;
}

/** Compares with the float tolerance that unit conversion there and back needs. */
function expectSameLines(a: BreakdownLine[], b: BreakdownLine[]): void {
  expect(a.length).toBe(b.length);
  const round = (v: unknown): unknown =>
    typeof v === 'number' ? Number(v.toPrecision(10)) + 0 : Array.isArray(v) ? v.map(round) : v && typeof v === 'object' ? Object.fromEntries(Object.entries(v).map(([k, x]) => [k, round(x)])) : v;
  expect(round(a)).toEqual(round(b));
}

function csvToRows(csv: string): { rows: Record<string, unknown>[]; headers: string[] } {
  const r = Papa.parse<Record<string, unknown>>(csv, { header: true, skipEmptyLines: true });
  expect(r.errors).toEqual([]);
  return { rows: r.data, headers: r.meta.fields ?? [] };
}

describe('formula neutralisation on export [PRACTICE: spreadsheet formula-injection guard, a leading apostrophe]', () => {
  it('guards text starting with = + - @ tab CR; numbers, negative ones included, stay numbers', () => {
    expect(neutraliseCell('=1+1')).toBe("'=1+1");
    expect(neutraliseCell('+44 20')).toBe("'+44 20");
    expect(neutraliseCell('-cmd|calc')).toBe("'-cmd|calc");
    expect(neutraliseCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(neutraliseCell('\t=1')).toBe("'\t=1");
    expect(neutraliseCell('\rx')).toBe("'\rx");
    expect(neutraliseCell('  =1')).toBe("'  =1");
    expect(neutraliseCell('plain')).toBe('plain');
    expect(neutraliseCell(-12.5)).toBe(-12.5);
    expect(neutraliseCell(-0.001)).toBe(-0.001);
    expect(neutraliseCell(null)).toBeNull();
    expect(neutraliseCell(Number.NaN)).toBeNull();
  });

  it('undoes exactly what it did, including text that already began with an apostrophe', () => {
    for (const s of ['=x', "'=x", "''=x", "'plain", 'plain', '-5', '@', "'"]) expect(unguardText(guardText(s))).toBe(s);
  });

  it('puts numbers in the table as numbers and guarded text as text', () => {
    const t = breakdownToTable(lines);
    const col = (h: string): number => t.header.indexOf(h);
    expect(t.rows[0][col('CoG x (mm)')]).toBe(-120.5);
    expect(typeof t.rows[1][col('CoG y (mm)')]).toBe('number');
    expect(t.rows[1][col('Part number')]).toBe("'-2+3");
    expect(t.rows[0][col('Notes')]).toBe('\'=HYPERLINK("http://example.invalid","click")');
    expect(t.rows[2][col('Part number')]).toBe("''=already guarded");
  });
});

describe('import → export → import gives the same breakdown', () => {
  for (const units of [
    { length: 'mm', mass: 'kg' },
    { length: 'in', mass: 'lb' },
    { length: 'cm', mass: 'g' },
  ] as ImportUnits[]) {
    it(`through CSV (papaparse reads it back), in ${units.length} and ${units.mass}`, () => {
      const csv = tableToCsv(breakdownToTable(lines, { units }));
      const { rows, headers } = csvToRows(csv);
      const first = importBreakdownRows(rows, { mapping: defaultColumnMapping(units), units }, { materials, assemblyNumbers, headers });
      expect(first.problems.filter((p) => p.severity === 'error')).toEqual([]);
      expectSameLines(first.lines.map(stripRow), lines);
      // And once more: the second export reads back to the same lines.
      const again = csvToRows(tableToCsv(breakdownToTable(first.lines, { units })));
      const second = importBreakdownRows(again.rows, { mapping: defaultColumnMapping(units), units }, { materials, assemblyNumbers, headers: again.headers });
      expectSameLines(second.lines.map(stripRow), lines);
    });
  }

  it('through XLSX (exceljs writes and reads it): numeric cells stay numbers, guarded text stays text', async () => {
    const table: ExportTable = breakdownToTable(lines);
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('Breakdown');
    ws.addRow(table.header);
    for (const r of table.rows) ws.addRow(r);
    const buf = await wb.xlsx.writeBuffer();
    const wb2 = new ExcelJS.Workbook();
    await wb2.xlsx.load(buf as ArrayBuffer);
    const sheet = wb2.getWorksheet('Breakdown')!;
    const headers = (sheet.getRow(1).values as unknown[]).slice(1).map(String);
    const rows: Record<string, unknown>[] = [];
    for (let i = 2; i <= sheet.rowCount; i++) {
      const row = sheet.getRow(i);
      const rec: Record<string, unknown> = {};
      headers.forEach((h, k) => (rec[h] = row.getCell(k + 1).value));
      rows.push(rec);
    }
    const cogX = sheet.getRow(2).getCell(headers.indexOf('CoG x (mm)') + 1);
    expect(cogX.type).toBe(ExcelJS.ValueType.Number);
    expect(cogX.value).toBe(-120.5);
    const pn = sheet.getRow(3).getCell(headers.indexOf('Part number') + 1);
    expect(pn.type).toBe(ExcelJS.ValueType.String);
    expect(pn.value).toBe("'-2+3");
    const r = importBreakdownRows(rows, { mapping: defaultColumnMapping({ length: 'mm', mass: 'kg' }), units: { length: 'mm', mass: 'kg' } }, { materials, assemblyNumbers, headers });
    expect(r.problems.filter((p) => p.severity === 'error')).toEqual([]);
    expectSameLines(r.lines.map(stripRow), lines);
  });

  it('writes RFC 4180 CSV: quotes, commas and line breaks inside cells survive', () => {
    const csv = tableToCsv({ header: ['a', 'b'], rows: [['x, "y"', -3], [' lead', null]] });
    expect(csv).toBe('a,b\r\n"x, ""y""",-3\r\n" lead",\r\n');
  });
});
