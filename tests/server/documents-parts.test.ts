import { describe, expect, it } from 'vitest';
import { massProperties } from '../../src/domain/mass/index.ts';
import type { CrateView } from '../../src/domain/contracts/crate-loads.ts';
import { PdfWriter } from '../../server/pdf/document.ts';
import { drawHandlingMark, marksGrid, markSizeToFit, mmToPt, type HandlingMarkKind } from '../../server/pdf/handling-marks.ts';
import { handlingMarksFor } from '../../server/modules/documents/crate-marks.ts';
import { customsRows, customsTable, type AssemblyLite, type PartLineLite } from '../../server/modules/documents/customs-list.ts';
import { renderGray } from './documents-helpers.ts';

/**
 * The pure parts of the documents: symbol sizes, which marks apply, the customs rows. No database.
 */

/** A small seeded generator (mulberry32), so property checks are repeatable. */
function rng(seed: number) {
  return () => {
    seed |= 0;
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('handling mark sizes', () => {
  it('100 mm where there is room, as ISO 780:2015 gives (normal heights 100, 150, 200 mm; REFERENCES §4.3 [S])', () => {
    // PDF user space: 72 units per inch (ISO 32000-1 §8.3.2.3 [PUB]); 1 in = 25.4 mm exactly.
    expect(mmToPt(100)).toBeCloseTo((100 / 25.4) * 72, 9);
    expect(markSizeToFit(2000, 3)).toBeCloseTo((100 / 25.4) * 72, 9);
  });

  it('scaled down proportionally when a row does not fit, never above the preferred size (property check)', () => {
    const r = rng(780);
    for (let i = 0; i < 500; i++) {
      const width = 50 + r() * 900;
      const count = 1 + Math.floor(r() * 9);
      const size = markSizeToFit(width, count);
      expect(size).toBeLessThanOrEqual(mmToPt(100) + 1e-9);
      expect(count * size + (count - 1) * 0.12 * size).toBeLessThanOrEqual(width + 1e-6);
      const grid = marksGrid(count, width, 50 + r() * 700, mmToPt(50));
      const rows = Math.ceil(count / grid.perRow);
      expect(grid.perRow * grid.sizePt + (grid.perRow - 1) * grid.gapPt).toBeLessThanOrEqual(width + 1e-6);
      expect(grid.sizePt).toBeLessThanOrEqual(mmToPt(50) + 1e-9);
      expect(rows).toBeGreaterThanOrEqual(1);
    }
  });

  it('each symbol drawn at 100 mm prints 100 mm wide on the page (pdftoppm at 72 dpi: 1 px = 1 pt)', async () => {
    const kinds: HandlingMarkKind[] = ['this-way-up', 'fragile', 'keep-dry', 'centre-of-gravity', 'no-hooks', 'sling-here', 'stacking-limit', 'do-not-stack'];
    const w = new PdfWriter({ paperSize: 'A4', title: 'Marks' });
    kinds.forEach((kind, i) => {
      if (i > 0) w.doc.addPage();
      drawHandlingMark(w.doc, { kind, caption: kind, reason: '', figure: '60 kg' }, 100, 150, mmToPt(100));
    });
    const pdf = await w.finish();
    for (let page = 1; page <= kinds.length; page++) {
      const img = renderGray(pdf, page, 72);
      // Ink extent of the symbol's square (the page header sits above y = 100 pt, the footer below 700).
      let minX = Infinity;
      let maxX = -Infinity;
      let dark = 0;
      for (let y = 140; y < 700; y++) {
        for (let x = 0; x < img.width; x++) {
          if (img.data[y * img.width + x] < 128) {
            dark++;
            minX = Math.min(minX, x);
            maxX = Math.max(maxX, x);
          }
        }
      }
      expect(dark, kinds[page - 1]).toBeGreaterThan(2000);
      expect(maxX - minX + 1, kinds[page - 1]).toBeGreaterThan(mmToPt(100) * 0.96);
      expect(maxX - minX + 1, kinds[page - 1]).toBeLessThan(mmToPt(100) * 1.02);
    }
  });
});

function crate(over: Partial<CrateView> = {}, figures: Partial<CrateView['figures']> = {}): CrateView {
  return {
    id: 'c',
    code: 'C1',
    name: 'Case',
    kind: 'stock',
    sectionId: null,
    innerMm: null,
    outerMm: [1000, 800, 600],
    tareKg: 20,
    maxGrossKg: null,
    stackable: true,
    maxLoadOnTopKg: null,
    thisWayUp: false,
    fragile: false,
    mayTilt: true,
    ispm15Required: false,
    design: {},
    notes: '',
    version: 1,
    updatedAt: '',
    contents: [],
    ...over,
    figures: {
      tareKg: 20,
      netKg: 10,
      grossKg: 30,
      massComplete: true,
      cogMm: [500, 400, 300],
      tareCogMm: [500, 400, 300],
      tipping: null,
      tippingUnknownReason: null,
      handling: { verdict: 'one person', teamSize: 1, capacityKg: 25, method: 'test', reasons: [], cautions: [] },
      warnings: [],
      packingListNotes: [],
      ...figures,
    },
  };
}

describe('which marks a crate carries (ISO 780: only where they apply)', () => {
  const kinds = (c: CrateView) => handlingMarksFor(c).map((m) => m.kind);

  it('a plain light case with no flags carries none', () => {
    expect(kinds(crate())).toEqual([]);
  });

  it('flags give their marks; machine parts inside ask to keep dry', () => {
    const c = crate({ thisWayUp: true, fragile: true, maxLoadOnTopKg: 60, contents: [{ id: 'x', crateId: 'c', partLineId: 'p', sectionId: null, description: '', quantity: 1, massKg: 10, cogMm: null, version: 1 }] });
    expect(kinds(c)).toEqual(['this-way-up', 'fragile', 'keep-dry', 'no-hooks', 'stacking-limit']);
    expect(handlingMarksFor(c).find((m) => m.kind === 'stacking-limit')?.figure).toBe('60 kg');
    expect(kinds(crate({ stackable: false }))).toEqual(['do-not-stack']);
  });

  it('the CoG mark from 1,000 kg gross (insurers’ packaging handbook, REFERENCES §4.3 [S]) or when well off the middle', () => {
    expect(kinds(crate({}, { grossKg: 999 }))).not.toContain('centre-of-gravity');
    expect(kinds(crate({}, { grossKg: 1000 }))).toContain('centre-of-gravity');
    // 150 mm off the middle of a 1,000 mm length is 15 % [PRACTICE threshold 10 %].
    expect(kinds(crate({}, { cogMm: [650, 400, 300] }))).toContain('centre-of-gravity');
    expect(kinds(crate({}, { cogMm: [550, 400, 300] }))).not.toContain('centre-of-gravity');
    expect(kinds(crate({}, { cogMm: null, grossKg: 5000 }))).not.toContain('centre-of-gravity');
  });

  it('sling positions only on a heavy crate that needs mechanical aid', () => {
    const aid = { verdict: 'mechanical aid required' as const, teamSize: null, capacityKg: null, method: 'test', reasons: [], cautions: [] };
    expect(kinds(crate({}, { handling: aid, grossKg: 60 }))).not.toContain('sling-here');
    expect(kinds(crate({}, { handling: aid, grossKg: 1200 }))).toContain('sling-here');
  });
});

describe('customs rows', () => {
  const line = (o: Partial<PartLineLite> & { id: string }): PartLineLite => ({
    assembly_id: null,
    section_id: null,
    part_number: o.id.toUpperCase(),
    name: `Part ${o.id}`,
    quantity: 1,
    unit_mass_kg: 1,
    value: null,
    currency: null,
    country_of_origin: null,
    serial_numbers: [],
    sort_order: 0,
    ...o,
  });

  it('a section content line expands to the section’s parts, found as the mass core finds them; weights add up to its mass', () => {
    const r = rng(15);
    for (let trial = 0; trial < 30; trial++) {
      // A random assembly tree; some assemblies name a section, some lines name one directly.
      const assemblies: AssemblyLite[] = [];
      for (let i = 0; i < 12; i++) assemblies.push({ id: `a${i}`, parent_id: i > 0 && r() < 0.8 ? `a${Math.floor(r() * i)}` : null, section_id: r() < 0.3 ? (r() < 0.5 ? 'S1' : 'S2') : null });
      const lines: PartLineLite[] = [];
      for (let i = 0; i < 40; i++) {
        lines.push(line({ id: `l${i}`, assembly_id: r() < 0.9 ? `a${Math.floor(r() * 12)}` : null, section_id: r() < 0.15 ? 'S2' : null, quantity: 1 + Math.floor(r() * 4), unit_mass_kg: Math.round(r() * 500) / 10, sort_order: i }));
      }
      const rows = customsRows([{ crate: { code: 'K1' }, contents: [{ part_line_id: null, section_id: 'S1', description: 'S1', quantity: 1, mass_kg: null }] }], lines, assemblies);
      const mp = massProperties({
        sections: [{ id: 'S1' }, { id: 'S2' }],
        assemblies: assemblies.map((a) => ({ id: a.id, parentId: a.parent_id, sectionId: a.section_id })),
        lines: lines.map((l) => ({ id: l.id, assemblyId: l.assembly_id, sectionId: l.section_id, quantity: l.quantity, unitMassKg: l.unit_mass_kg, massSource: 'weighed', cogMm: [0, 0, 0] })),
      });
      const expected = mp.sections.S1.massKg;
      const sum = rows.filter((x) => x.weightKg !== null).reduce((s, x) => s + (x.weightKg ?? 0), 0);
      if (expected === 0) expect(rows.every((x) => x.missing.includes('not linked to a part line') || x.weightKg === 0)).toBe(true);
      else expect(sum).toBeCloseTo(expected, 6);
    }
  });

  it('value = unit value × pieces; missing facts named, never filled in; item numbers run through the crates', () => {
    const lines = [line({ id: 'g', value: 1500.5, currency: 'EUR', country_of_origin: 'NL', quantity: 2, section_id: 'S', serial_numbers: ['SN-1', 'SN-2'] }), line({ id: 'p', value: 10, country_of_origin: 'DE' })];
    const rows = customsRows(
      [
        { crate: { code: 'A' }, contents: [{ part_line_id: 'p', section_id: null, description: '', quantity: 3, mass_kg: 3 }] },
        { crate: { code: 'B' }, contents: [{ part_line_id: null, section_id: 'S', description: '', quantity: 1, mass_kg: 2 }, { part_line_id: null, section_id: null, description: '@loose', quantity: 1, mass_kg: null }] },
      ],
      lines,
      [],
    );
    expect(rows.map((x) => [x.itemNo, x.crateCode, x.pieces, x.value])).toEqual([
      [1, 'A', 3, 30],
      [2, 'B', 2, 3001],
      [3, 'B', 1, null],
    ]);
    expect(rows[0].missing).toEqual(['currency']);
    expect(rows[1].description).toContain('serial no. SN-1, SN-2');
    expect(rows[2].missing).toContain('value');
    const table = customsTable(rows);
    expect(table.rows[2][2]).toBe("'@loose; marks: crate B");
    expect(typeof table.rows[1][5]).toBe('number');
  });
});
