import type { Knex } from 'knex';
import ExcelJS from 'exceljs';
import { neutraliseCell, tableToCsv, type ExportTable } from '../../../src/domain/breakdown/index.ts';
import { loadCrates, type ContentRow, type CrateRow } from '../crates/crates.repository.ts';
import type { PartLineRow } from '../machine/machine.repository.ts';

/**
 * The list customs forms for temporary import ask for (the general list of a carnet: item no., trade
 * description with marks and serial numbers, number of pieces, weight, value, country of origin;
 * REFERENCES §4.5 [S]), grouped per crate, from the part lines' values, origins and serial numbers.
 *
 * A crate's content line names a part line (one item), a whole section (every part line of the section,
 * a line's section being its own, else its nearest assembly's, as in the mass core), or is described in
 * words (one item with what is known). Nothing missing is filled in: an unknown value, origin or weight
 * leaves the cell empty and says so in the last column.
 */

export interface CustomsRow {
  itemNo: number;
  crateCode: string;
  description: string;
  pieces: number;
  weightKg: number | null;
  value: number | null;
  currency: string | null;
  countryOfOrigin: string | null;
  missing: string[];
}

/** The columns of a part line the customs list reads. */
export type PartLineLite = Pick<
  PartLineRow,
  'id' | 'assembly_id' | 'section_id' | 'part_number' | 'name' | 'quantity' | 'unit_mass_kg' | 'value' | 'currency' | 'country_of_origin' | 'serial_numbers' | 'sort_order'
>;

export interface AssemblyLite {
  id: string;
  parent_id: string | null;
  section_id: string | null;
}

/** Each part line's effective section: its own, else its nearest assembly's (walking up the parents). */
export function effectiveSections(lines: readonly PartLineLite[], assemblies: readonly AssemblyLite[]): Map<string, string | null> {
  const byId = new Map(assemblies.map((a) => [a.id, a]));
  const memo = new Map<string, string | null>();
  const ofAssembly = (id: string | null): string | null => {
    const seen = new Set<string>();
    let cur = id;
    while (cur && !seen.has(cur)) {
      if (memo.has(cur)) return memo.get(cur)!;
      seen.add(cur);
      const a = byId.get(cur);
      if (!a) return null;
      if (a.section_id) {
        for (const s of seen) memo.set(s, a.section_id);
        return a.section_id;
      }
      cur = a.parent_id;
    }
    for (const s of seen) memo.set(s, null);
    return null;
  };
  return new Map(lines.map((l) => [l.id, l.section_id ?? ofAssembly(l.assembly_id)]));
}

const num = (v: unknown): number | null => (v === null || v === undefined || !Number.isFinite(Number(v)) ? null : Number(v));

/** The trade description: name and part number, the crate it travels in (the marks) and the serial numbers. */
function describe(line: PartLineLite, crateCode: string): string {
  const name = line.name.trim() || line.part_number;
  const serials = (line.serial_numbers ?? []).filter((s) => s.trim() !== '');
  return `${name}, part no. ${line.part_number}; marks: crate ${crateCode}${serials.length ? `; serial no. ${serials.join(', ')}` : ''}`;
}

function partRow(line: PartLineLite, crateCode: string, pieces: number, weightKg: number | null): Omit<CustomsRow, 'itemNo'> {
  const unitValue = num(line.value);
  const value = unitValue === null ? null : Math.round(unitValue * pieces * 100) / 100;
  const missing: string[] = [];
  if (value === null) missing.push('value');
  else if (!line.currency) missing.push('currency');
  if (!line.country_of_origin) missing.push('country of origin');
  if (weightKg === null) missing.push('weight');
  return { crateCode, description: describe(line, crateCode), pieces, weightKg, value, currency: line.currency, countryOfOrigin: line.country_of_origin, missing };
}

/**
 * The rows, crate by crate (crates in code order, their contents in their order). Pure: the callers pass
 * the rows read from the database.
 */
export function customsRows(
  crates: readonly { crate: Pick<CrateRow, 'code'>; contents: readonly Pick<ContentRow, 'part_line_id' | 'section_id' | 'description' | 'quantity' | 'mass_kg'>[] }[],
  lines: readonly PartLineLite[],
  assemblies: readonly AssemblyLite[],
): CustomsRow[] {
  const lineById = new Map(lines.map((l) => [l.id, l]));
  const sectionOf = effectiveSections(lines, assemblies);
  const linesOfSection = new Map<string, PartLineLite[]>();
  for (const l of [...lines].sort((a, b) => a.sort_order - b.sort_order || a.part_number.localeCompare(b.part_number))) {
    const s = sectionOf.get(l.id);
    if (s) linesOfSection.set(s, [...(linesOfSection.get(s) ?? []), l]);
  }
  const out: Omit<CustomsRow, 'itemNo'>[] = [];
  for (const { crate, contents } of crates) {
    for (const c of contents) {
      const qty = Number(c.quantity);
      const line = c.part_line_id ? lineById.get(c.part_line_id) : undefined;
      if (line) {
        const unit = num(line.unit_mass_kg);
        out.push(partRow(line, crate.code, qty, num(c.mass_kg) ?? (unit === null ? null : unit * qty)));
        continue;
      }
      const sectionLines = c.section_id ? (linesOfSection.get(c.section_id) ?? []) : [];
      if (sectionLines.length) {
        for (const l of sectionLines) {
          const unit = num(l.unit_mass_kg);
          const pieces = Number(l.quantity) * qty;
          out.push(partRow(l, crate.code, pieces, unit === null ? null : unit * pieces));
        }
        continue;
      }
      out.push({
        crateCode: crate.code,
        description: `${c.description.trim() || 'Content line with no description'}; marks: crate ${crate.code}`,
        pieces: qty,
        weightKg: num(c.mass_kg),
        value: null,
        currency: null,
        countryOfOrigin: null,
        missing: ['value', 'country of origin', ...(num(c.mass_kg) === null ? ['weight'] : []), 'not linked to a part line'],
      });
    }
  }
  return out.map((r, i) => ({ itemNo: i + 1, ...r }));
}

export async function loadCustomsRows(db: Knex, productionId: string): Promise<CustomsRow[]> {
  const [crates, lines, assemblies] = await Promise.all([
    loadCrates(db, productionId),
    db('machine_part_lines')
      .where({ production_id: productionId })
      .select('id', 'assembly_id', 'section_id', 'part_number', 'name', 'quantity', 'unit_mass_kg', 'value', 'currency', 'country_of_origin', 'serial_numbers', 'sort_order') as Promise<PartLineLite[]>,
    db('machine_assemblies').where({ production_id: productionId }).select('id', 'parent_id', 'section_id') as Promise<AssemblyLite[]>,
  ]);
  return customsRows(crates, lines, assemblies);
}

export const CUSTOMS_HEADER = ['Item no.', 'Crate', 'Trade description, marks and serial numbers', 'Number of pieces', 'Weight (kg)', 'Value', 'Currency', 'Country of origin', 'Missing'];

/** Numbers stay numbers; every text cell goes through the breakdown core's formula guard. */
export function customsTable(rows: readonly CustomsRow[]): ExportTable {
  return {
    header: CUSTOMS_HEADER.map((h) => neutraliseCell(h) as string),
    rows: rows.map((r) => [
      r.itemNo,
      neutraliseCell(r.crateCode),
      neutraliseCell(r.description),
      r.pieces,
      r.weightKg === null ? null : Math.round(r.weightKg * 1000) / 1000,
      r.value,
      neutraliseCell(r.currency),
      neutraliseCell(r.countryOfOrigin),
      neutraliseCell(r.missing.join('; ') || null),
    ]),
  };
}

export function customsCsv(rows: readonly CustomsRow[]): string {
  return tableToCsv(customsTable(rows));
}

export async function customsXlsx(rows: readonly CustomsRow[], title: string): Promise<Buffer> {
  const table = customsTable(rows);
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Ballast';
  const ws = wb.addWorksheet('General list');
  ws.addRow(table.header).font = { bold: true };
  for (const r of table.rows) ws.addRow(r);
  ws.columns.forEach((col, i) => {
    col.width = [8, 10, 60, 10, 12, 12, 9, 10, 30][i] ?? 12;
  });
  ws.getColumn(5).numFmt = '0.0##';
  ws.getColumn(6).numFmt = '#,##0.00';
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  wb.title = title;
  return Buffer.from(await wb.xlsx.writeBuffer());
}
