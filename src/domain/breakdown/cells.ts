/**
 * Reading spreadsheet cells as papaparse (strings) and exceljs (numbers, dates, rich text, formula results,
 * hyperlinks, errors) hand them over, and the formula guard used on export.
 */

export type CellRead =
  | { kind: 'empty' }
  | { kind: 'number'; value: number }
  | { kind: 'text'; value: string }
  | { kind: 'date'; value: Date }
  | { kind: 'bad'; why: string };

/** Normalises one cell value. Text is trimmed; an empty string is empty. */
export function readCell(v: unknown): CellRead {
  if (v === null || v === undefined) return { kind: 'empty' };
  if (typeof v === 'number') return Number.isFinite(v) ? { kind: 'number', value: v } : { kind: 'bad', why: `${String(v)} is not a finite number` };
  if (typeof v === 'string') {
    const t = v.trim();
    return t === '' ? { kind: 'empty' } : { kind: 'text', value: t };
  }
  if (typeof v === 'boolean') return { kind: 'text', value: v ? 'TRUE' : 'FALSE' };
  if (v instanceof Date) return Number.isNaN(v.getTime()) ? { kind: 'bad', why: 'an invalid date' } : { kind: 'date', value: v };
  if (typeof v === 'object') {
    const o = v as Record<string, unknown>;
    // exceljs shapes: formula {formula, result}, shared formula {sharedFormula, result}, rich text
    // {richText: [{text}]}, hyperlink {text, hyperlink}, error {error: '#N/A'}.
    if ('error' in o) return { kind: 'bad', why: `the cell shows the error ${String(o.error)}` };
    if ('formula' in o || 'sharedFormula' in o) {
      return 'result' in o ? readCell(o.result) : { kind: 'bad', why: 'a formula with no saved result (save the file in a spreadsheet program first)' };
    }
    if (Array.isArray(o.richText)) return readCell(o.richText.map((r) => (r && typeof r === 'object' && 'text' in r ? String((r as { text: unknown }).text) : '')).join(''));
    if ('text' in o) return readCell(o.text);
  }
  return { kind: 'bad', why: 'a value of a kind that cannot be read' };
}

const SPACES = /[\s\u00a0\u2009\u202f]/g;

/**
 * Reads a number written as text. With '.' as decimal separator, commas may only group thousands
 * (1,234.5); with ',' the reverse (1.234,5). A Unicode minus is accepted. Returns null when it is not a
 * plain number (so "12 kg", "1,5" with '.', or "abc" are refused, not guessed).
 */
export function parseNumber(text: string, decimalSeparator: '.' | ',' = '.'): number | null {
  let s = unguardText(text).replace(SPACES, '').replace(/\u2212/g, '-');
  if (decimalSeparator === '.') {
    if (s.includes(',')) {
      if (!/^[+-]?\d{1,3}(,\d{3})+(\.\d*)?$/.test(s)) return null;
      s = s.replace(/,/g, '');
    }
  } else {
    if (s.includes('.')) {
      if (!/^[+-]?\d{1,3}(\.\d{3})+(,\d*)?$/.test(s)) return null;
      s = s.replace(/\./g, '');
    }
    s = s.replace(',', '.');
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

/** A text a spreadsheet would run as a formula: it starts with = + - @ (after spaces), or with a tab or CR. */
function isFormulaLike(s: string): boolean {
  return /^[\t\r]/.test(s) || /^\s*[=+\-@]/.test(s);
}

/**
 * Formula-injection guard for exported TEXT cells: a leading apostrophe, which spreadsheets show as text and
 * do not evaluate. Applied when the text, after any apostrophes it already begins with, looks like a formula
 * (so that a text that itself starts with an apostrophe survives the round trip). Numbers are not touched:
 * pass numbers as numbers (negative coordinates stay numbers).
 */
export function guardText(s: string): string {
  return isFormulaLike(s.replace(/^'+/, '')) ? `'${s}` : s;
}

/** The inverse of guardText, applied to text cells on import. */
export function unguardText(s: string): string {
  return s.startsWith("'") && isFormulaLike(s.replace(/^'+/, '')) ? s.slice(1) : s;
}

/** A cell for export: numbers (finite) unchanged, text guarded, null/undefined/NaN empty. */
export function neutraliseCell(v: string | number | null | undefined): string | number | null {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number') return Number.isFinite(v) ? v : null;
  return guardText(v);
}
