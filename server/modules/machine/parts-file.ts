import Papa from 'papaparse';
import ExcelJS from 'exceljs';
import { AppError } from '../../http/errors.ts';

/**
 * Reads an uploaded parts list (CSV with papaparse, XLSX with exceljs) into its header row and data rows as
 * cell values, untouched: the breakdown core (importBreakdownRows) reads every cell and names each problem by
 * row and column. Rows keep their numbers as in the file (header = row 1).
 */
export interface PartsFile {
  headers: string[];
  /** Cells in header order; values as the reader gave them (strings, numbers, exceljs cell objects, Dates). */
  rows: unknown[][];
  rowNumbers: number[];
}

export const PARTS_LIST_MAX_ROWS = 100_000;

export async function readPartsFile(buffer: Buffer, fileName: string): Promise<PartsFile> {
  const lower = fileName.toLowerCase();
  const file = lower.endsWith('.xlsx') ? await readXlsx(buffer, fileName) : readCsv(buffer, fileName);
  if (file.headers.length === 0) throw new AppError('invalid', `${fileName}: the first row is empty; it must hold the column headers.`, { issues: [{ path: 'file', message: 'row 1: no column headers' }] });
  const seen = new Map<string, number>();
  file.headers.forEach((h, i) => {
    if (h === '') return;
    if (seen.has(h)) {
      throw new AppError('invalid', `${fileName}: row 1 names column "${h}" twice (columns ${seen.get(h)! + 1} and ${i + 1}); give each column its own header.`, {
        issues: [{ path: 'file', message: `row 1, column "${h}": header appears twice` }],
      });
    }
    seen.set(h, i);
  });
  if (file.rows.length > PARTS_LIST_MAX_ROWS) {
    throw new AppError('too_large', `${fileName} has ${file.rows.length} rows; the limit is ${PARTS_LIST_MAX_ROWS.toLocaleString('en-GB')} lines per import.`);
  }
  return file;
}

function readCsv(buffer: Buffer, fileName: string): PartsFile {
  let text = buffer.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.includes('\u0000')) throw new AppError('unsupported_type', `${fileName} is not a text CSV file (it holds binary data); save it as CSV (UTF-8) or XLSX.`);
  // No header mode: papaparse would silently rename duplicate headers; the reader checks them itself.
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false, delimiter: '' });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) {
    const row = (fatal.row ?? 0) + 1;
    throw new AppError('invalid', `${fileName}, row ${row}: ${fatal.message}.`, { issues: [{ path: 'file', message: `row ${row}: ${fatal.message}` }] });
  }
  const [head = [], ...data] = parsed.data;
  const headers = head.map((h) => String(h ?? '').trim());
  const rows: unknown[][] = [];
  const rowNumbers: number[] = [];
  data.forEach((r, i) => {
    // papaparse gives a trailing newline as one empty row: drop rows that are wholly empty at the end.
    rows.push(r);
    rowNumbers.push(i + 2);
  });
  while (rows.length && rows[rows.length - 1].every((c) => c === '' || c === undefined)) {
    rows.pop();
    rowNumbers.pop();
  }
  return { headers, rows, rowNumbers };
}

async function readXlsx(buffer: Buffer, fileName: string): Promise<PartsFile> {
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(buffer as unknown as ArrayBuffer);
  } catch (e) {
    throw new AppError('unsupported_type', `${fileName} could not be read as an XLSX workbook (${(e as Error).message}); save it as .xlsx or CSV.`);
  }
  const sheet = wb.worksheets[0];
  if (!sheet) throw new AppError('invalid', `${fileName} has no worksheet.`);
  const width = sheet.columnCount;
  const headerRow = sheet.getRow(1);
  const headers: string[] = [];
  for (let c = 1; c <= width; c++) {
    const v = headerRow.getCell(c).value;
    headers.push(v === null || v === undefined ? '' : typeof v === 'object' && 'richText' in v ? v.richText.map((t) => t.text).join('').trim() : String(typeof v === 'object' && 'result' in v ? v.result : v).trim());
  }
  const rows: unknown[][] = [];
  const rowNumbers: number[] = [];
  const last = sheet.actualRowCount > 0 ? sheet.rowCount : 0;
  for (let r = 2; r <= last; r++) {
    const row = sheet.getRow(r);
    const cells: unknown[] = [];
    for (let c = 1; c <= width; c++) cells.push(row.getCell(c).value ?? null);
    rows.push(cells);
    rowNumbers.push(r);
  }
  while (rows.length && rows[rows.length - 1].every((c) => c === null || c === '')) {
    rows.pop();
    rowNumbers.pop();
  }
  return { headers, rows, rowNumbers };
}

/** Rows as records keyed by header, for the core. */
export function toRecords(file: PartsFile): Record<string, unknown>[] {
  return file.rows.map((cells) => {
    const rec: Record<string, unknown> = {};
    file.headers.forEach((h, i) => {
      if (h !== '') rec[h] = cells[i] ?? null;
    });
    return rec;
  });
}

/** JSON-safe form for the staged import (Dates survive as tagged strings). */
export function encodeCells(rows: unknown[][]): unknown[][] {
  return rows.map((r) => r.map((c) => (c instanceof Date ? { $date: c.toISOString() } : c)));
}
export function decodeCells(rows: unknown[][]): unknown[][] {
  return rows.map((r) => r.map((c) => (c && typeof c === 'object' && '$date' in c ? new Date(String((c as { $date: string }).$date)) : c)));
}
