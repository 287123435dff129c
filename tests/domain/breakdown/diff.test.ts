import { describe, expect, it } from 'vitest';
import { diffBreakdown, type BreakdownLine } from '../../../src/domain/breakdown/index.ts';
import { breakdownDiff } from '../../../src/domain/contracts/breakdown.ts';

function line(partNumber: string, over: Partial<BreakdownLine> = {}): BreakdownLine {
  return {
    partNumber,
    name: partNumber,
    assemblyNumber: 'DC-100',
    quantity: 1,
    unitMassKg: 1,
    massSource: 'catalogue',
    materialCode: null,
    volumeMm3: null,
    procurement: null,
    unitValue: null,
    currency: null,
    countryOfOrigin: null,
    serialNumbers: [],
    cogMm: [0, 0, 0],
    bboxMm: null,
    notes: null,
    ...over,
  };
}

describe('diffBreakdown', () => {
  const existing = [
    { ...line('A'), id: 'uuid-a' },
    { ...line('B', { quantity: 2 }), id: 'uuid-b' },
    { ...line('C'), id: 'uuid-c' },
    { ...line('A', { assemblyNumber: 'AC-200' }), id: 'uuid-a2' },
  ];
  const incoming = [
    line('A'),
    line('B', { quantity: 3, unitMassKg: 1.5, cogMm: [10, 0, 0] }),
    line('D'),
    line('A', { assemblyNumber: 'AC-200', unitMassKg: 1 + 1e-12 }), // float noise from unit conversion: unchanged
  ];

  it('finds added, changed (with the fields) and removed lines by assembly and part number', () => {
    const d = diffBreakdown(existing, incoming);
    expect(d.added.map((l) => l.partNumber)).toEqual(['D']);
    expect(d.removed.map((l) => l.id)).toEqual(['uuid-c']);
    expect(d.changed).toHaveLength(1);
    expect(d.changed[0].key).toEqual({ assemblyNumber: 'DC-100', partNumber: 'B' });
    expect(d.changed[0].before.id).toBe('uuid-b');
    expect(d.changed[0].fields).toEqual(['quantity', 'unitMassKg', 'cogMm']);
    expect(d.unchangedCount).toBe(2);
    expect(() => breakdownDiff.parse(d)).not.toThrow();
  });

  it('compares only the fields the file carries, so data entered on screen is kept', () => {
    const d = diffBreakdown(existing, incoming, { fields: ['partNumber', 'quantity', 'unitMassKg'] });
    expect(d.changed[0].fields).toEqual(['quantity', 'unitMassKg']);
  });

  it('sees a cleared value and a changed serial list', () => {
    const d = diffBreakdown([line('S', { serialNumbers: ['1', '2'], notes: 'x' })], [line('S', { serialNumbers: ['2', '1'], notes: null })]);
    expect(d.changed[0].fields).toEqual(['serialNumbers', 'notes']);
  });

  it('refuses a list with the same line twice, naming it', () => {
    expect(() => diffBreakdown([], [line('A'), line('A')])).toThrow(/The incoming list has part number "A" twice in assembly "DC-100"/);
  });
});
