import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { importBreakdownRows, type BreakdownImportOptions, type KnownMaterial } from '../../../src/domain/breakdown/index.ts';
import { breakdownImportResult } from '../../../src/domain/contracts/breakdown.ts';
import { DEFAULT_MATERIALS } from '../../../src/domain/mass/index.ts';
import { KG_PER_POUND, MM_PER_INCH } from '../../../src/domain/units.ts';

/** Rows as papaparse gives them (an independent CSV reader from npm), with the file's header. */
function csvRows(text: string): { rows: Record<string, unknown>[]; headers: string[] } {
  const r = Papa.parse<Record<string, unknown>>(text, { header: true, skipEmptyLines: false });
  return { rows: r.data, headers: r.meta.fields ?? [] };
}

const materials: KnownMaterial[] = DEFAULT_MATERIALS.map((m) => ({ code: m.code, name: m.name, densityKgPerM3: m.densityKgPerM3 }));
const mapping = {
  partNumber: 'Part No',
  name: 'Description',
  assemblyNumber: 'Parent',
  quantity: 'Qty',
  unitMass: 'Mass',
  massSource: 'Source',
  material: 'Material',
  cogX: 'X',
  cogY: 'Y',
  cogZ: 'Z',
};
const opts: BreakdownImportOptions = { mapping, units: { length: 'mm', mass: 'kg' } };
const ctx = { materials, assemblyNumbers: ['DC-100', 'DC-110', 'AC-200'] };

describe('importBreakdownRows: every problem named by row (header = row 1) and column', () => {
  const csv = [
    'Part No,Description,Parent,Qty,Mass,Source,Material,X,Y,Z',
    'DC-101,Motor,DC-100,1,62.5,catalogue,,0,0,450', // row 2: fine
    ',Bracket,DC-100,2,1.2,cad,steel,10,0,0', // row 3: missing part number
    'DC-103,Plate,DC-100,1,-4,cad,steel,0,0,0', // row 4: negative mass
    'DC-104,Shaft,DC-100,1,abc,cad,steel,0,0,0', // row 5: non-numeric mass
    'DC-105,Gear,DC-100,1,2.0,cad,unobtainium,0,0,0', // row 6: unknown material
    'DC-101,Motor again,DC-100,1,62.5,catalogue,,0,0,450', // row 7: duplicate of row 2
    'DC-107,Cover,XX-999,1,3,estimated,,0,0,0', // row 8: unknown parent assembly
    'DC-108,Bolt,DC-100,0,0.01,catalogue,steel,0,0,0', // row 9: bad quantity (zero)
    'DC-109,Nut,DC-100,two,0.01,catalogue,steel,0,0,0', // row 10: bad quantity (text)
    'DC-110,Arm,AC-200,1,5,weighed,aluminium,100,,50', // row 11: incomplete CoG
    ',,,,,,,,,', // row 12: blank, skipped
    'DC-112,Washer,DC-100,3,0.005,,steel,-12.5,-300,0', // row 13: no source → warning, counted estimated
    'DC-113,Gasket,DC-100,1,,,,,,', // row 14: no mass → warning (a gap later)
    'DC-101,Motor,DC-110,1,62.5,catalogue,,0,0,450', // row 15: same part number, other assembly: fine
    'DC-116,Cable,DC-100,2.5,0.2,guess,,0,0,0', // row 16: fractional qty warning + unknown mass source
  ].join('\n');
  const { rows, headers } = csvRows(csv);
  const r = importBreakdownRows(rows, opts, { ...ctx, headers });
  const at = (row: number) => r.problems.filter((p) => p.rowNumber === row);

  it('refuses the file while any error remains, and keeps only the clean rows', () => {
    expect(r.ok).toBe(false);
    expect(r.lines.map((l) => l.rowNumber)).toEqual([2, 13, 14, 15]);
    expect(r.rowCount).toBe(14);
    expect(r.skippedBlankRows).toBe(1);
    expect(() => breakdownImportResult.parse(r)).not.toThrow();
  });

  it('names each problem', () => {
    expect(at(2)).toEqual([]);
    expect(at(3)).toEqual([{ rowNumber: 3, column: 'Part No', field: 'partNumber', severity: 'error', message: 'Part No: missing part number.' }]);
    expect(at(4)[0]).toMatchObject({ column: 'Mass', severity: 'error', message: 'Mass: mass must not be negative (got -4).' });
    expect(at(5)[0]).toMatchObject({ column: 'Mass', message: 'Mass: "abc" is not a number.' });
    expect(at(6)[0]).toMatchObject({ column: 'Material', message: expect.stringMatching(/^Material: unknown material "unobtainium" \(known: steel, /) });
    expect(at(7)[0]).toMatchObject({ column: null, severity: 'error', message: expect.stringMatching(/Duplicate line: part number "DC-101" in assembly "DC-100" is already on row 2/) });
    expect(at(8)[0]).toMatchObject({ column: 'Parent', message: 'Parent: unknown parent assembly "XX-999".' });
    expect(at(9)[0]).toMatchObject({ column: 'Qty', message: 'Qty: quantity must be above zero (got 0).' });
    expect(at(10)[0]).toMatchObject({ column: 'Qty', message: 'Qty: "two" is not a number.' });
    expect(at(11)[0]).toMatchObject({ column: 'Y', field: 'cogY', message: 'CoG is incomplete: Y is empty.' });
    expect(at(12)).toEqual([]);
    expect(at(13)).toEqual([expect.objectContaining({ column: 'Source', severity: 'warning', message: 'Source: no mass source given; counted as estimated.' })]);
    expect(at(14)).toEqual([expect.objectContaining({ column: 'Mass', severity: 'warning', message: expect.stringMatching(/no mass; the line will be listed as a gap/) })]);
    expect(at(15)).toEqual([]);
    expect(at(16).map((p) => [p.severity, p.column])).toEqual([
      ['warning', 'Qty'],
      ['error', 'Source'],
    ]);
  });

  it('normalises the clean lines (negative coordinates are numbers; source defaulted to estimated)', () => {
    const washer = r.lines.find((l) => l.partNumber === 'DC-112')!;
    expect(washer).toMatchObject({ quantity: 3, unitMassKg: 0.005, massSource: 'estimated', materialCode: 'steel', cogMm: [-12.5, -300, 0], assemblyNumber: 'DC-100' });
    const gasket = r.lines.find((l) => l.partNumber === 'DC-113')!;
    expect(gasket).toMatchObject({ unitMassKg: null, massSource: null, cogMm: null, materialCode: null });
  });
});

describe('importBreakdownRows: units, number formats, spreadsheet cells', () => {
  it('converts inches and pounds exactly [PUB: 1 in = 25.4 mm, 1 lb = 0.45359237 kg, 1959 agreement]', () => {
    const { rows, headers } = csvRows('Part No,Qty,Mass,X,Y,Z,Vol,Material\nP1,1,10,1,-2,0.5,,\nP2,1,,0,0,0,2,steel\n');
    const r = importBreakdownRows(
      rows,
      { mapping: { partNumber: 'Part No', quantity: 'Qty', unitMass: 'Mass', cogX: 'X', cogY: 'Y', cogZ: 'Z', volume: 'Vol', material: 'Material' }, units: { length: 'in', mass: 'lb' } },
      { materials, assemblyNumbers: [], headers },
    );
    expect(r.ok).toBe(true);
    expect(r.lines[0].unitMassKg).toBeCloseTo(10 * KG_PER_POUND, 12);
    expect(r.lines[0].cogMm).toEqual([MM_PER_INCH, -2 * MM_PER_INCH, 0.5 * MM_PER_INCH]);
    // 2 in³ of steel: 2 × 16,387.064 mm³ × 7,850 kg/m³ (a CAD mass, so the source is cad).
    expect(r.lines[1].volumeMm3).toBeCloseTo(2 * MM_PER_INCH ** 3, 9);
    expect(r.lines[1].unitMassKg).toBeCloseTo(2 * MM_PER_INCH ** 3 * 1e-9 * 7850, 12);
    expect(r.lines[1].massSource).toBe('cad');
    expect(r.importedFields).toEqual(expect.arrayContaining(['unitMassKg', 'massSource', 'volumeMm3', 'cogMm']));
    expect(r.lines[0].massSource).toBeNull(); // no source column: left unset (counted as estimated later), warned once
    expect(r.problems.map((p) => p.rowNumber)).toEqual([1]);
  });

  it('reads thousands separators and the decimal comma only when asked, and refuses ambiguous text', () => {
    const rows = [{ P: 'A', Q: '1', M: '1,234.5' }, { P: 'B', Q: '1', M: '1,5' }];
    const dot = importBreakdownRows(rows, { mapping: { partNumber: 'P', quantity: 'Q', unitMass: 'M' }, units: { length: 'mm', mass: 'g' } }, { materials, assemblyNumbers: [] });
    expect(dot.lines[0].unitMassKg).toBeCloseTo(1.2345, 12);
    expect(dot.problems.find((p) => p.rowNumber === 3)?.message).toBe('M: "1,5" is not a number.');
    const comma = importBreakdownRows([{ P: 'A', Q: '1', M: '1.234,5' }, { P: 'B', Q: '1', M: '−0,5' }], { mapping: { partNumber: 'P', quantity: 'Q', unitMass: 'M' }, units: { length: 'mm', mass: 'kg' }, decimalSeparator: ',' }, { materials, assemblyNumbers: [] });
    expect(comma.lines[0].unitMassKg).toBe(1234.5);
    expect(comma.problems.find((p) => p.rowNumber === 3)?.message).toBe('M: mass must not be negative (got -0.5).');
  });

  it('reads exceljs cell shapes: formula results, rich text, hyperlinks; refuses error cells and dates in number columns', () => {
    const rows = [
      { P: { richText: [{ text: 'RT-' }, { text: '1' }] }, Q: { formula: 'A1*2', result: 4 }, M: 2.5, N: { text: 'see sheet', hyperlink: 'https://example.invalid' } },
      { P: 'E-1', Q: 1, M: { error: '#DIV/0!' }, N: null },
      { P: 'D-1', Q: 1, M: new Date('2024-01-02'), N: null },
      { P: 'F-1', Q: { formula: 'B2', sharedFormula: 'B2' }, M: 1, N: null },
    ];
    const r = importBreakdownRows(rows, { mapping: { partNumber: 'P', quantity: 'Q', unitMass: 'M', notes: 'N' }, units: { length: 'mm', mass: 'kg' } }, { materials, assemblyNumbers: [] });
    expect(r.lines[0]).toMatchObject({ partNumber: 'RT-1', quantity: 4, unitMassKg: 2.5, notes: 'see sheet' });
    expect(r.problems.map((p) => [p.rowNumber, p.message])).toEqual([
      [1, 'No column is mapped to mass source: masses without one count as estimated.'],
      [3, 'M: the cell shows the error #DIV/0!.'],
      [4, 'M: the cell holds a date, not a number.'],
      [5, 'Q: a formula with no saved result (save the file in a spreadsheet program first).'],
    ]);
  });

  it('checks the mapping against the header row, and the customs fields', () => {
    const rows = [{ 'part no ': 'A', QTY: 1, Origin: 'Germany', Cur: 'eur', Serials: 'S1; S2; S3', Make: 'bought' }];
    const r = importBreakdownRows(
      rows,
      {
        mapping: { partNumber: 'Part No', quantity: 'Qty', countryOfOrigin: 'Origin', currency: 'Cur', serialNumbers: 'Serials', procurement: 'Make', notes: 'Remarks' },
        units: { length: 'mm', mass: 'kg' },
      },
      { materials, assemblyNumbers: [] },
    );
    expect(r.problems.filter((p) => p.rowNumber === 1).map((p) => p.message)).toEqual([
      'Column "Remarks" (mapped to notes) is not in the file\'s header row.',
      'No column is mapped to unit mass (nor volume and material): every line will be a gap in the totals until it has a mass.',
    ]);
    expect(r.problems.filter((p) => p.rowNumber === 2).map((p) => p.message)).toEqual([
      'Origin: "Germany" is not a two-letter ISO 3166-1 country code (e.g. DE).',
      'Serials: 3 serial numbers for a quantity of 1.',
    ]);
    const ok = importBreakdownRows([{ P: 'A', Q: 2, O: 'de', C: 'eur', S: 'S1, S2' }], { mapping: { partNumber: 'P', quantity: 'Q', countryOfOrigin: 'O', currency: 'C', serialNumbers: 'S' }, units: { length: 'mm', mass: 'kg' } }, { materials, assemblyNumbers: [] });
    expect(ok.lines[0]).toMatchObject({ countryOfOrigin: 'DE', currency: 'EUR', serialNumbers: ['S1', 'S2'] });
  });

  it('collects new assembly numbers only when allowed, and places a size box on the CoG', () => {
    const rows = [{ P: 'A', Q: 1, A: 'NEW-1', X: 0, Y: 0, Z: 100, L: 200, W: 100, H: 50 }];
    const base = { mapping: { partNumber: 'P', quantity: 'Q', assemblyNumber: 'A', cogX: 'X', cogY: 'Y', cogZ: 'Z', sizeX: 'L', sizeY: 'W', sizeZ: 'H' }, units: { length: 'mm', mass: 'kg' } } as const;
    expect(importBreakdownRows(rows, base, { materials, assemblyNumbers: [] }).ok).toBe(false);
    const r = importBreakdownRows(rows, { ...base, allowNewAssemblies: true }, { materials, assemblyNumbers: [] });
    expect(r.ok).toBe(true);
    expect(r.newAssemblyNumbers).toEqual(['NEW-1']);
    expect(r.lines[0].bboxMm).toEqual({ minMm: [-100, -50, 75], maxMm: [100, 50, 125] });
  });
});
