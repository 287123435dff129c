import type { BreakdownField, BreakdownLine, ImportUnits } from '../contracts/breakdown.ts';
import { fromKg, fromMm } from '../units.ts';
import { neutraliseCell } from './cells.ts';
import { EXPORT_FIELDS, defaultHeader } from './fields.ts';

/** A table ready for a CSV writer or an XLSX sheet: numbers as numbers, text guarded against formulas. */
export interface ExportTable {
  header: string[];
  rows: (string | number | null)[][];
}

export interface ExportOptions {
  /** Units of the written numbers; default mm and kg. */
  units?: ImportUnits;
  /** Columns to write, in order; default EXPORT_FIELDS (the box as min/max). */
  fields?: readonly BreakdownField[];
  /** Header text per field; default "Part number", "Unit mass (kg)", … (what defaultColumnMapping reads back). */
  headers?: Partial<Record<BreakdownField, string>>;
}

/** Repeating decimals from unit conversion (0.1 in → 2.54 mm → back) are cut at 12 significant digits. */
function tidy(v: number): number {
  const r = Number(v.toPrecision(12));
  return Object.is(r, -0) ? 0 : r;
}

/**
 * The breakdown as a table for CSV or XLSX: one row per line, numbers converted to the chosen units and kept
 * as numbers (negative coordinates stay numbers), text cells that a spreadsheet would run as a formula
 * (= + - @, tab, CR) given a leading apostrophe. Serial numbers are joined with "; ".
 */
export function breakdownToTable(lines: readonly BreakdownLine[], options: ExportOptions = {}): ExportTable {
  const units = options.units ?? { length: 'mm', mass: 'kg' };
  const fields = options.fields ?? EXPORT_FIELDS;
  const header = fields.map((f) => options.headers?.[f] ?? defaultHeader(f, units));
  const len = (v: number): number => tidy(fromMm(v, units.length));
  const rows = lines.map((l) =>
    fields.map((f): string | number | null => {
      const c = l.cogMm;
      const b = l.bboxMm;
      switch (f) {
        case 'partNumber':
          return neutraliseCell(l.partNumber);
        case 'name':
          return neutraliseCell(l.name === '' ? null : l.name);
        case 'assemblyNumber':
          return neutraliseCell(l.assemblyNumber);
        case 'quantity':
          return l.quantity;
        case 'unitMass':
          return l.unitMassKg === null ? null : tidy(fromKg(l.unitMassKg, units.mass));
        case 'massSource':
          return l.massSource;
        case 'material':
          return neutraliseCell(l.materialCode);
        case 'volume':
          return l.volumeMm3 === null ? null : tidy(l.volumeMm3 * fromMm(1, units.length) ** 3);
        case 'procurement':
          return l.procurement;
        case 'unitValue':
          return l.unitValue;
        case 'currency':
          return l.currency;
        case 'countryOfOrigin':
          return l.countryOfOrigin;
        case 'serialNumbers':
          return l.serialNumbers.length === 0 ? null : neutraliseCell(l.serialNumbers.join('; '));
        case 'cogX':
          return c ? len(c[0]) : null;
        case 'cogY':
          return c ? len(c[1]) : null;
        case 'cogZ':
          return c ? len(c[2]) : null;
        case 'bboxMinX':
          return b ? len(b.minMm[0]) : null;
        case 'bboxMinY':
          return b ? len(b.minMm[1]) : null;
        case 'bboxMinZ':
          return b ? len(b.minMm[2]) : null;
        case 'bboxMaxX':
          return b ? len(b.maxMm[0]) : null;
        case 'bboxMaxY':
          return b ? len(b.maxMm[1]) : null;
        case 'bboxMaxZ':
          return b ? len(b.maxMm[2]) : null;
        case 'sizeX':
          return b ? len(b.maxMm[0] - b.minMm[0]) : null;
        case 'sizeY':
          return b ? len(b.maxMm[1] - b.minMm[1]) : null;
        case 'sizeZ':
          return b ? len(b.maxMm[2] - b.minMm[2]) : null;
        case 'notes':
          return neutraliseCell(l.notes);
      }
    }),
  );
  return { header, rows };
}

/**
 * RFC 4180 CSV text of a table: fields with the delimiter, a quote, CR or LF, or edge spaces are quoted and
 * quotes doubled; numbers are written as JavaScript prints them (a dot as decimal point); empty cells empty.
 */
export function tableToCsv(table: ExportTable, options: { delimiter?: ',' | ';' | '\t'; eol?: '\r\n' | '\n' } = {}): string {
  const d = options.delimiter ?? ',';
  const eol = options.eol ?? '\r\n';
  const cell = (v: string | number | null): string => {
    if (v === null) return '';
    const s = typeof v === 'number' ? String(v) : v;
    return s.includes(d) || s.includes('"') || s.includes('\n') || s.includes('\r') || s !== s.trim() ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return [table.header, ...table.rows].map((r) => r.map(cell).join(d)).join(eol) + eol;
}
