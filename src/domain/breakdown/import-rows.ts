import type {
  BreakdownField,
  BreakdownImportOptions,
  BreakdownImportResult,
  BreakdownLine,
  ImportedLine,
  ImportProblem,
} from '../contracts/breakdown.ts';
import type { MassSource } from '../contracts/mass.ts';
import { toKg, toMm } from '../units.ts';
import { FIELD_INFO } from './fields.ts';
import { parseNumber, readCell, unguardText } from './cells.ts';

/** A material the import may name, by code or name (case-insensitive). */
export interface KnownMaterial {
  code: string;
  name?: string;
  /** kg/m³; when given, a row with a volume and no mass gets a CAD mass. */
  densityKgPerM3?: number;
}

export interface ImportContext {
  /** Materials of the production. */
  materials: readonly KnownMaterial[];
  /** Assembly numbers that already exist in the machine. */
  assemblyNumbers: readonly string[];
  /** The file's header row (papaparse meta.fields); default: the keys of the first row. */
  headers?: readonly string[];
  /** Row number of rows[0] in the file; default 2 (row 1 is the header). */
  firstRowNumber?: number;
  /** Row number of each row, when blank rows were dropped before (overrides firstRowNumber). */
  rowNumbers?: readonly number[];
}

const MASS_SOURCE_WORDS: Record<string, MassSource> = {
  weighed: 'weighed',
  weighted: 'weighed',
  scale: 'weighed',
  catalogue: 'catalogue',
  catalog: 'catalogue',
  datasheet: 'catalogue',
  cad: 'cad',
  estimated: 'estimated',
  estimate: 'estimated',
  est: 'estimated',
};
const PROCUREMENT_WORDS: Record<string, 'bought' | 'made'> = {
  bought: 'bought',
  buy: 'bought',
  purchased: 'bought',
  b: 'bought',
  made: 'made',
  make: 'made',
  manufactured: 'made',
  m: 'made',
};

/** A unit mass above this is almost surely a unit mix-up (g read as kg): a warning, not an error. */
const SUSPICIOUS_UNIT_MASS_KG = 50_000;

/**
 * Validates and normalises the rows of a parts list (records keyed by column header, as papaparse with
 * `header: true` or an exceljs sheet walk gives them). Every problem names its row (as numbered in the
 * file, the header being row 1), the column header and the field. Nothing is guessed: a cell that cannot be
 * read is an error; a missing mass is a warning (the line becomes a gap in every total until it has one).
 * Errors: missing part number or quantity, non-numeric or negative numbers, bad quantity, unknown material,
 * mass source or bought/made word, duplicate line (same part number in the same assembly), unknown parent
 * assembly, an incomplete CoG or box, more serial numbers than units, a mapped column missing from the file.
 * `ok` is true only when there is no error: the caller writes nothing otherwise.
 */
export function importBreakdownRows(rows: readonly Record<string, unknown>[], options: BreakdownImportOptions, context: ImportContext): BreakdownImportResult {
  const problems: ImportProblem[] = [];
  const lines: ImportedLine[] = [];
  const units = options.units;
  const dec = options.decimalSeparator ?? '.';
  const mapping = options.mapping;
  const headerList = context.headers ?? (rows.length > 0 ? Object.keys(rows[0]) : []);

  // --- Resolve mapped headers against the file's: exact first, then ignoring case and spaces.
  const norm = (h: string): string => h.toLowerCase().replace(/\s+/g, ' ').trim();
  const column: Partial<Record<BreakdownField, string>> = {};
  const usedBy = new Map<string, BreakdownField>();
  for (const [f, wanted] of Object.entries(mapping) as [BreakdownField, string][]) {
    if (wanted === undefined) continue;
    let found = headerList.find((h) => h === wanted);
    if (found === undefined) {
      const matches = headerList.filter((h) => norm(h) === norm(wanted));
      if (matches.length === 1) found = matches[0];
    }
    if (found === undefined) {
      problems.push({ rowNumber: 1, column: wanted, field: f, severity: 'error', message: `Column "${wanted}" (mapped to ${f}) is not in the file's header row.` });
      continue;
    }
    const other = usedBy.get(found);
    if (other) {
      problems.push({ rowNumber: 1, column: found, field: f, severity: 'error', message: `Column "${found}" is mapped to both ${other} and ${f}.` });
      continue;
    }
    usedBy.set(found, f);
    column[f] = found;
  }
  for (const req of ['partNumber', 'quantity'] as const) {
    if (mapping[req] === undefined) problems.push({ rowNumber: 1, column: null, field: req, severity: 'error', message: `No column is mapped to ${req}; it is required.` });
  }
  const has = (f: BreakdownField): boolean => column[f] !== undefined;
  const triple = (fs: [BreakdownField, BreakdownField, BreakdownField]): boolean => fs.some(has);

  const importedFields = new Set<keyof BreakdownLine>(['partNumber', 'quantity']);
  for (const f of Object.keys(column) as BreakdownField[]) importedFields.add(FIELD_INFO[f].lineField);
  // Volume and material give a CAD mass (and source) where the mass cell is empty or unmapped.
  const computesCadMass = has('volume') && has('material');
  if (computesCadMass) {
    importedFields.add('unitMassKg');
    importedFields.add('massSource');
  }
  if (has('unitMass') && !has('massSource')) {
    problems.push({ rowNumber: 1, column: null, field: 'massSource', severity: 'warning', message: 'No column is mapped to mass source: masses without one count as estimated.' });
  }

  if (!has('unitMass') && !computesCadMass && mapping.unitMass === undefined) {
    problems.push({ rowNumber: 1, column: null, field: 'unitMass', severity: 'warning', message: 'No column is mapped to unit mass (nor volume and material): every line will be a gap in the totals until it has a mass.' });
  }

  const materialIndex = new Map<string, KnownMaterial>();
  for (const m of context.materials) {
    materialIndex.set(m.code.trim().toLowerCase(), m);
    if (m.name) {
      const k = m.name.trim().toLowerCase();
      if (!materialIndex.has(k)) materialIndex.set(k, m);
    }
  }
  const knownAssemblies = new Set(context.assemblyNumbers);
  const newAssemblies = new Set<string>();
  const firstRow = new Map<string, number>(); // duplicate-line key → first row number
  const lengthToMm = toMm(1, units.length);
  const massToKg = toKg(1, units.mass);
  let skipped = 0;

  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    const rowNumber = context.rowNumbers?.[i] ?? (context.firstRowNumber ?? 2) + i;
    // Blank rows (every mapped cell empty) are skipped, as spreadsheets often end with some.
    let blank = true;
    for (const h of Object.values(column)) {
      if (readCell(row[h as string]).kind !== 'empty') {
        blank = false;
        break;
      }
    }
    if (blank) {
      skipped++;
      continue;
    }
    let rowOk = true;
    const problem = (f: BreakdownField | null, message: string, severity: 'error' | 'warning' = 'error'): void => {
      if (severity === 'error') rowOk = false;
      problems.push({ rowNumber, column: f ? (column[f] ?? null) : null, field: f, severity, message });
    };

    /** Text of a mapped cell (formula guard removed), or null when unmapped or empty. */
    const text = (f: BreakdownField): string | null => {
      const h = column[f];
      if (h === undefined) return null;
      const c = readCell(row[h]);
      if (c.kind === 'empty') return null;
      if (c.kind === 'text') return unguardText(c.value);
      if (c.kind === 'number') return String(c.value);
      if (c.kind === 'date') return c.value.toISOString().slice(0, 10);
      problem(f, `${column[f]}: ${c.why}.`);
      return null;
    };
    /** Number of a mapped cell in file units, null when unmapped or empty; undefined after a problem. */
    const num = (f: BreakdownField): number | null | undefined => {
      const h = column[f];
      if (h === undefined) return null;
      const c = readCell(row[h]);
      if (c.kind === 'empty') return null;
      if (c.kind === 'number') return c.value;
      if (c.kind === 'text') {
        const v = parseNumber(c.value, dec);
        if (v !== null) return v;
        problem(f, `${h}: "${c.value}" is not a number${dec === ',' ? " (decimal comma expected)" : ''}.`);
        return undefined;
      }
      problem(f, `${h}: ${c.kind === 'date' ? 'the cell holds a date, not a number' : c.why}.`);
      return undefined;
    };

    // Part number, name, assembly.
    const partNumber = text('partNumber');
    if (partNumber === null) problem('partNumber', `${column.partNumber ?? 'Part number'}: missing part number.`);
    else if (partNumber.length > 100) problem('partNumber', `${column.partNumber}: part number is longer than 100 characters.`);
    const name = text('name') ?? '';
    if (name.length > 200) problem('name', `${column.name}: name is longer than 200 characters.`);
    const assemblyNumber = text('assemblyNumber');
    if (assemblyNumber !== null && !knownAssemblies.has(assemblyNumber)) {
      if (options.allowNewAssemblies) {
        if (!newAssemblies.has(assemblyNumber)) problem('assemblyNumber', `${column.assemblyNumber}: assembly "${assemblyNumber}" is new and will be created.`, 'warning');
        newAssemblies.add(assemblyNumber);
      } else {
        problem('assemblyNumber', `${column.assemblyNumber}: unknown parent assembly "${assemblyNumber}".`);
      }
    }

    // Quantity.
    const qRaw = num('quantity');
    let quantity = 0;
    if (qRaw === null) problem('quantity', `${column.quantity ?? 'Quantity'}: missing quantity.`);
    else if (qRaw !== undefined) {
      if (!(qRaw > 0)) problem('quantity', `${column.quantity}: quantity must be above zero (got ${qRaw}).`);
      else {
        quantity = qRaw;
        if (!Number.isInteger(qRaw)) problem('quantity', `${column.quantity}: quantity ${qRaw} is not a whole number (fine for lengths sold by the metre).`, 'warning');
      }
    }

    // Material and volume (volume in the file's length unit cubed).
    const materialText = text('material');
    let material: KnownMaterial | undefined;
    if (materialText !== null) {
      material = materialIndex.get(materialText.toLowerCase());
      if (!material) {
        const known = context.materials.slice(0, 8).map((m) => m.code).join(', ');
        problem('material', `${column.material}: unknown material "${materialText}" (known: ${known}${context.materials.length > 8 ? ', …' : ''}).`);
      }
    }
    const vRaw = num('volume');
    let volumeMm3: number | null = null;
    if (vRaw !== null && vRaw !== undefined) {
      if (!(vRaw > 0)) problem('volume', `${column.volume}: volume must be above zero (got ${vRaw}).`);
      else volumeMm3 = vRaw * lengthToMm ** 3;
    }

    // Mass and its source.
    const mRaw = num('unitMass');
    let unitMassKg: number | null = null;
    if (mRaw !== null && mRaw !== undefined) {
      if (mRaw < 0) problem('unitMass', `${column.unitMass}: mass must not be negative (got ${mRaw}).`);
      else {
        unitMassKg = mRaw * massToKg;
        if (unitMassKg > SUSPICIOUS_UNIT_MASS_KG) problem('unitMass', `${column.unitMass}: ${unitMassKg.toFixed(0)} kg for one unit: check the mass unit (${units.mass}).`, 'warning');
      }
    }
    const sText = text('massSource');
    let massSource: MassSource | null = null;
    if (sText !== null) {
      const s = MASS_SOURCE_WORDS[sText.toLowerCase()];
      if (!s) problem('massSource', `${column.massSource}: unknown mass source "${sText}" (use weighed, catalogue, cad or estimated).`);
      else massSource = s;
    }
    if (unitMassKg === null && mRaw === null && volumeMm3 !== null) {
      if (material?.densityKgPerM3 && material.densityKgPerM3 > 0) {
        unitMassKg = volumeMm3 * 1e-9 * material.densityKgPerM3;
        if (massSource !== null && massSource !== 'cad') problem('massSource', `${column.massSource}: mass computed from volume × density is a CAD mass, not ${massSource}.`, 'warning');
        massSource = 'cad';
      } else if (material) {
        problem('volume', `${column.volume}: material "${material.code}" has no density, so the volume gives no mass.`, 'warning');
      } else if (materialText === null) {
        problem('volume', `${column.volume}: a volume without a material gives no mass.`, 'warning');
      }
    }
    if (unitMassKg === null && mRaw === null && rowOk && has('unitMass')) {
      problem('unitMass', `${column.unitMass}: no mass; the line will be listed as a gap until it has one.`, 'warning');
    }
    if (unitMassKg !== null && massSource === null && sText === null && has('massSource')) {
      problem('massSource', `${column.massSource}: no mass source given; counted as estimated.`, 'warning');
      massSource = 'estimated';
    }

    // Customs.
    const pText = text('procurement');
    let procurement: 'bought' | 'made' | null = null;
    if (pText !== null) {
      procurement = PROCUREMENT_WORDS[pText.toLowerCase()] ?? null;
      if (!procurement) problem('procurement', `${column.procurement}: "${pText}" is neither bought nor made.`);
    }
    const uv = num('unitValue');
    let unitValue: number | null = null;
    if (uv !== null && uv !== undefined) {
      if (uv < 0) problem('unitValue', `${column.unitValue}: value must not be negative (got ${uv}).`);
      else unitValue = uv;
    }
    const cText = text('currency');
    let currency: string | null = null;
    if (cText !== null) {
      if (!/^[A-Za-z]{3}$/.test(cText)) problem('currency', `${column.currency}: "${cText}" is not a three-letter ISO 4217 currency code (e.g. EUR).`);
      else currency = cText.toUpperCase();
    }
    const coText = text('countryOfOrigin');
    let countryOfOrigin: string | null = null;
    if (coText !== null) {
      if (!/^[A-Za-z]{2}$/.test(coText)) problem('countryOfOrigin', `${column.countryOfOrigin}: "${coText}" is not a two-letter ISO 3166-1 country code (e.g. DE).`);
      else countryOfOrigin = coText.toUpperCase();
    }
    const snText = text('serialNumbers');
    const serialNumbers = snText === null ? [] : snText.split(/[;,\n]/).map((x) => x.trim()).filter((x) => x !== '');
    if (new Set(serialNumbers).size !== serialNumbers.length) problem('serialNumbers', `${column.serialNumbers}: a serial number appears twice.`);
    if (quantity > 0 && serialNumbers.length > quantity) {
      problem('serialNumbers', `${column.serialNumbers}: ${serialNumbers.length} serial numbers for a quantity of ${quantity}.`);
    }

    // CoG and box: all of a group or none.
    const group = (fs: BreakdownField[], what: string): number[] | null => {
      const vals = fs.map((f) => num(f));
      if (vals.some((v) => v === undefined)) return null;
      const given = vals.filter((v) => v !== null).length;
      if (given === 0) return null;
      if (given < fs.length) {
        const missing = fs.filter((_, k) => vals[k] === null).map((f) => column[f] ?? f);
        problem(fs[vals.findIndex((v) => v === null)], `${what} is incomplete: ${missing.join(', ')} ${missing.length === 1 ? 'is' : 'are'} empty.`);
        return null;
      }
      return (vals as number[]).map((v) => v * lengthToMm);
    };
    const cog = triple(['cogX', 'cogY', 'cogZ']) ? group(['cogX', 'cogY', 'cogZ'], 'CoG') : null;
    const bmin = group(['bboxMinX', 'bboxMinY', 'bboxMinZ', 'bboxMaxX', 'bboxMaxY', 'bboxMaxZ'], 'Bounding box');
    const size = group(['sizeX', 'sizeY', 'sizeZ'], 'Size');
    let bboxMm: BreakdownLine['bboxMm'] = null;
    if (bmin) {
      const bad = [0, 1, 2].filter((k) => bmin[k] > bmin[k + 3]);
      if (bad.length > 0) problem((['bboxMinX', 'bboxMinY', 'bboxMinZ'] as const)[bad[0]], `Bounding box: minimum above maximum on ${bad.map((k) => 'xyz'[k]).join(', ')}.`);
      else bboxMm = { minMm: [bmin[0], bmin[1], bmin[2]], maxMm: [bmin[3], bmin[4], bmin[5]] };
      if (size) problem('sizeX', 'Both a box (min/max) and a size are given; the min/max box is used.', 'warning');
    } else if (size) {
      if (size.some((v) => v < 0)) problem('sizeX', `Size must not be negative.`);
      else if (!cog) problem('sizeX', 'A size without a CoG cannot be placed (the box is centred on the CoG).');
      else bboxMm = { minMm: [cog[0] - size[0] / 2, cog[1] - size[1] / 2, cog[2] - size[2] / 2], maxMm: [cog[0] + size[0] / 2, cog[1] + size[1] / 2, cog[2] + size[2] / 2] };
    }
    const notes = text('notes');

    // Duplicate line: same part number in the same assembly.
    if (partNumber !== null) {
      const key = `${assemblyNumber ?? ''}\u0000${partNumber}`;
      const first = firstRow.get(key);
      if (first !== undefined) {
        problem(null, `Duplicate line: part number "${partNumber}" in ${assemblyNumber ? `assembly "${assemblyNumber}"` : 'the machine (no assembly)'} is already on row ${first}; give one line with the total quantity.`);
      } else firstRow.set(key, rowNumber);
    }

    if (!rowOk) continue;
    lines.push({
      rowNumber,
      partNumber: partNumber as string,
      name,
      assemblyNumber,
      quantity,
      unitMassKg,
      massSource,
      materialCode: material?.code ?? null,
      volumeMm3,
      procurement,
      unitValue,
      currency,
      countryOfOrigin,
      serialNumbers,
      cogMm: cog ? [cog[0], cog[1], cog[2]] : null,
      bboxMm,
      notes,
    });
  }

  return {
    ok: !problems.some((p) => p.severity === 'error'),
    lines,
    problems,
    rowCount: rows.length - skipped,
    skippedBlankRows: skipped,
    importedFields: [...importedFields],
    newAssemblyNumbers: [...newAssemblies],
  };
}
