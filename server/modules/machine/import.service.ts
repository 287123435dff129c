import { allQueries } from '../../db/parallel.ts';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import {
  DIFFABLE_FIELDS,
  FIELD_INFO,
  defaultHeader,
  diffBreakdown,
  importBreakdownRows,
  type BreakdownField,
  type BreakdownImportResult,
  type BreakdownLine,
  type ColumnMapping,
  type ImportUnits,
  type TypedBreakdownDiff,
} from '../../../src/domain/breakdown/index.ts';
import { BREAKDOWN_FIELDS, type BreakdownImportOptions } from '../../../src/domain/contracts/breakdown.ts';
import { AppError, invalid } from '../../http/errors.ts';
import { ensureMachine, json, type MachineRow, type PartLineRow } from './machine.repository.ts';
import { decodeCells, toRecords, type PartsFile } from './parts-file.ts';

/**
 * Parts-list import: staged upload → preview (every problem by row and column, and the diff against the
 * current breakdown) → commit, which re-validates and applies the whole diff in ONE transaction: a single
 * bad row writes nothing. Column mapping and units are remembered per machine.
 */

/** A line of the current breakdown in the core's import/export shape, with its database identity. */
export type ExistingLine = BreakdownLine & { id: string; hasInstances: boolean };

export interface ImportRow {
  id: string;
  production_id: string;
  machine_id: string;
  file_name: string;
  status: 'uploaded' | 'previewed' | 'committing' | 'committed' | 'failed';
  headers: string[];
  rows: unknown[][];
  row_numbers?: number[];
  mapping: unknown;
  summary: unknown;
  progress_done: number;
  progress_total: number;
  error: string | null;
}

export function rowToBreakdownLine(r: PartLineRow & { volume_mm3?: number | null }, assemblyNumber: string | null): BreakdownLine {
  return {
    partNumber: r.part_number,
    name: r.name,
    assemblyNumber,
    quantity: Number(r.quantity),
    unitMassKg: r.unit_mass_kg,
    massSource: r.mass_source,
    materialCode: r.material,
    volumeMm3: r.volume_mm3 ?? null,
    procurement: r.make_or_buy,
    unitValue: r.value,
    currency: r.currency,
    countryOfOrigin: r.country_of_origin,
    serialNumbers: r.serial_numbers ?? [],
    cogMm: r.cog_mm,
    bboxMm: r.bbox_mm,
    notes: r.notes === '' ? null : r.notes,
  };
}

/** Columns of a line from the core's shape (assembly resolved by the caller). */
function lineColumns(l: BreakdownLine): Record<string, unknown> {
  return {
    part_number: l.partNumber,
    name: l.name,
    quantity: l.quantity,
    unit_mass_kg: l.unitMassKg,
    mass_source: l.massSource,
    material: l.materialCode,
    volume_mm3: l.volumeMm3,
    make_or_buy: l.procurement,
    value: l.unitValue,
    currency: l.currency,
    country_of_origin: l.countryOfOrigin,
    serial_numbers: l.serialNumbers,
    cog_mm: json(l.cogMm),
    bbox_mm: json(l.bboxMm),
    notes: l.notes ?? '',
  };
}

/** The whole current breakdown as the core's lines, in tree order. */
export async function currentLines(db: Knex, productionId: string): Promise<ExistingLine[]> {
  const rows = (await db('machine_part_lines as l')
    .leftJoin('machine_assemblies as a', 'a.id', 'l.assembly_id')
    .where('l.production_id', productionId)
    .orderBy([{ column: 'l.sort_order' }, { column: 'l.part_number' }])
    .select('l.*', 'a.number as assembly_number', db.raw('exists (select 1 from machine_part_instances i where i.part_line_id = l.id) as has_instances'))) as (PartLineRow & {
    volume_mm3: number | null;
    assembly_number: string | null;
    has_instances: boolean;
  })[];
  return rows.map((r) => ({ ...rowToBreakdownLine(r, r.assembly_number), id: r.id, hasInstances: r.has_instances }));
}

const norm = (h: string) =>
  h
    .toLowerCase()
    .replace(/\(.*?\)/g, '')
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();

/** Other words people put in parts-list headers, by field (matched after normalising case and punctuation). */
const SYNONYMS: Partial<Record<BreakdownField, string[]>> = {
  partNumber: ['part no', 'part', 'pn', 'p n', 'item number', 'item no', 'part number'],
  name: ['description', 'desc', 'part name', 'title'],
  assemblyNumber: ['assembly number', 'assembly no', 'parent', 'parent assembly'],
  quantity: ['qty', 'count', 'quantity'],
  unitMass: ['mass', 'weight', 'unit weight', 'unit mass'],
  massSource: ['source', 'mass source', 'weight source'],
  material: ['material', 'material code'],
  procurement: ['make buy', 'make or buy', 'bought or made', 'procurement'],
  unitValue: ['value', 'unit price', 'price', 'unit value'],
  countryOfOrigin: ['country', 'origin', 'coo', 'country of origin'],
  serialNumbers: ['serials', 'serial', 'serial numbers'],
};

/**
 * A first mapping for a file: what this machine used last time (where the file has those headers), then
 * Ballast's own export headers, then common synonyms. The planner checks and changes it before the preview.
 */
export function guessMapping(headers: string[], remembered: Partial<Record<BreakdownField, string>> | undefined, units: ImportUnits): Partial<Record<BreakdownField, string>> {
  const out: Partial<Record<BreakdownField, string>> = {};
  const taken = new Set<string>();
  const present = new Set(headers);
  for (const [f, h] of Object.entries(remembered ?? {}) as [BreakdownField, string][]) {
    if (h && present.has(h) && !taken.has(h)) {
      out[f] = h;
      taken.add(h);
    }
  }
  for (const f of BREAKDOWN_FIELDS) {
    if (out[f]) continue;
    const candidates = [norm(defaultHeader(f, units)), norm(FIELD_INFO[f].header), ...(SYNONYMS[f] ?? [])];
    const h = headers.find((x) => !taken.has(x) && candidates.includes(norm(x)));
    if (h) {
      out[f] = h;
      taken.add(h);
    }
  }
  return out;
}

export interface ImportAnalysis {
  result: BreakdownImportResult;
  diff: TypedBreakdownDiff<ExistingLine, BreakdownImportResult['lines'][number]> | null;
  /** A problem that stops the diff (e.g. the current breakdown holds a duplicate). */
  diffProblem: string | null;
}

/** Validates the staged file with the core and, when it is valid, diffs it against the current breakdown. */
export async function analyseImport(db: Knex, productionId: string, file: PartsFile, options: BreakdownImportOptions): Promise<ImportAnalysis> {
  const [materials, assemblies, existing] = await allQueries(db, [
    () => db('machine_materials').where({ production_id: productionId }).select('code', 'name', 'density_kg_per_m3'),
    () => db('machine_assemblies').where({ production_id: productionId }).pluck('number'),
    () => currentLines(db, productionId),
  ]);
  const result = importBreakdownRows(toRecords(file), options, {
    materials: materials.map((m: { code: string; name: string; density_kg_per_m3: number }) => ({ code: m.code, name: m.name, densityKgPerM3: m.density_kg_per_m3 })),
    assemblyNumbers: assemblies as string[],
    headers: file.headers.filter((h) => h !== ''),
    rowNumbers: file.rowNumbers,
  });
  if (!result.ok) return { result, diff: null, diffProblem: null };
  try {
    return { result, diff: diffBreakdown(existing, result.lines, { fields: result.importedFields }), diffProblem: null };
  } catch (e) {
    return { result, diff: null, diffProblem: (e as Error).message };
  }
}

const SHOWN = 200;

/** What the preview screen shows: problems by row and column, the diff in counts and its first lines. */
export function presentAnalysis(a: ImportAnalysis) {
  const { result, diff } = a;
  const errors = result.problems.filter((p) => p.severity === 'error');
  const pick = (l: BreakdownLine) => ({ partNumber: l.partNumber, assemblyNumber: l.assemblyNumber, name: l.name, quantity: l.quantity, unitMassKg: l.unitMassKg });
  // Lines placed as instances lose their placements when their quantity changes or they go: say so before.
  const placementsDropped = diff
    ? [
        ...diff.changed.filter((c) => c.before.hasInstances && c.fields.includes('quantity')).map((c) => ({ partNumber: c.key.partNumber, assemblyNumber: c.key.assemblyNumber, why: 'quantity changes' as const })),
        ...diff.removed.filter((l) => l.hasInstances).map((l) => ({ partNumber: l.partNumber, assemblyNumber: l.assemblyNumber, why: 'line removed' as const })),
      ]
    : [];
  return {
    ok: result.ok && !a.diffProblem,
    rowCount: result.rowCount,
    skippedBlankRows: result.skippedBlankRows,
    errorCount: errors.length,
    warningCount: result.problems.length - errors.length,
    // Errors first: they block the import.
    problems: [...errors, ...result.problems.filter((p) => p.severity === 'warning')].slice(0, 2000),
    diffProblem: a.diffProblem,
    importedFields: result.importedFields,
    newAssemblyNumbers: result.newAssemblyNumbers,
    diff: diff && {
      addedCount: diff.added.length,
      changedCount: diff.changed.length,
      removedCount: diff.removed.length,
      unchangedCount: diff.unchangedCount,
      added: diff.added.slice(0, SHOWN).map(pick),
      changed: diff.changed.slice(0, SHOWN).map((c) => ({
        partNumber: c.key.partNumber,
        assemblyNumber: c.key.assemblyNumber,
        fields: c.fields,
        before: Object.fromEntries(c.fields.map((f) => [f, c.before[f]])),
        after: Object.fromEntries(c.fields.map((f) => [f, c.after[f]])),
      })),
      removed: diff.removed.slice(0, SHOWN).map(pick),
      placementsDropped: placementsDropped.slice(0, SHOWN),
      placementsDroppedCount: placementsDropped.length,
    },
  };
}

export function problemsAsIssues(result: BreakdownImportResult) {
  return result.problems
    .filter((p) => p.severity === 'error')
    .slice(0, 500)
    .map((p) => ({ path: `row ${p.rowNumber}${p.column ? `, column "${p.column}"` : ''}`, message: p.message }));
}

export function stagedFile(row: ImportRow): PartsFile {
  const stored = row.rows as unknown as { cells: unknown[][]; rowNumbers: number[] };
  return { headers: row.headers, rows: decodeCells(stored.cells), rowNumbers: stored.rowNumbers };
}

/** Remembers the mapping and units for this machine's next import. */
export async function rememberMapping(db: Knex, machine: MachineRow, options: BreakdownImportOptions): Promise<void> {
  await db('machines')
    .where({ id: machine.id })
    .update({ import_mapping: json({ mapping: options.mapping, units: options.units, decimalSeparator: options.decimalSeparator ?? '.', allowNewAssemblies: options.allowNewAssemblies ?? false }) });
}

const CHUNK = 2500;

/**
 * Applies a validated import in one transaction: new assemblies, added lines, changed lines (only the
 * fields the file carries), removed lines. Progress is written outside the transaction (a separate
 * connection) so other requests can poll it while the transaction runs.
 */
export async function commitImport(db: Knex, log: Logger, importRow: ImportRow, options: BreakdownImportOptions): Promise<ReturnType<typeof presentAnalysis>> {
  const productionId = importRow.production_id;
  const machine = await ensureMachine(db, productionId);
  const claimed = await db('machine_imports')
    .where({ id: importRow.id })
    .whereIn('status', ['uploaded', 'previewed', 'failed'])
    .update({ status: 'committing', progress_done: 0, error: null, updated_at: db.fn.now() });
  if (!claimed) throw new AppError('conflict', `This import is already ${importRow.status === 'committed' ? 'applied' : 'being applied'}; upload the file again to import it once more.`);
  const progress = (done: number, total: number) =>
    db('machine_imports')
      .where({ id: importRow.id })
      .update({ progress_done: done, progress_total: total, updated_at: db.fn.now() })
      .catch((err: unknown) => log.warn({ err }, 'import progress not written'));
  try {
    const summary = await db.transaction(async (trx) => {
      // One import at a time per machine: the diff is taken and applied under this lock.
      await trx.raw('select pg_advisory_xact_lock(hashtext(?))', [`machine-import:${productionId}`]);
      const analysis = await analyseImport(trx, productionId, stagedFile(importRow), options);
      if (!analysis.result.ok) throw invalid(`The file has ${analysis.result.problems.filter((p) => p.severity === 'error').length} problems; nothing was imported.`, problemsAsIssues(analysis.result), 'import_invalid');
      if (!analysis.diff) throw invalid(`The import cannot be compared with the current breakdown: ${analysis.diffProblem}`);
      const diff = analysis.diff;
      const total = diff.added.length + diff.changed.length + diff.removed.length;
      let done = 0;
      await progress(0, total);

      const assemblyId = new Map<string, string>(
        ((await trx('machine_assemblies').where({ production_id: productionId }).select('id', 'number')) as { id: string; number: string }[]).map((a) => [a.number, a.id]),
      );
      for (const number of analysis.result.newAssemblyNumbers) {
        if (assemblyId.has(number)) continue;
        const [a] = await trx('machine_assemblies').insert({ production_id: productionId, machine_id: machine.id, number, name: '' }).returning('id');
        assemblyId.set(number, a.id);
      }
      const asm = (n: string | null) => (n === null ? null : (assemblyId.get(n) ?? null));

      const [{ max }] = (await trx('machine_part_lines').where({ production_id: productionId }).max('sort_order as max')) as { max: number | null }[];
      let sort = max ?? 0;
      for (let i = 0; i < diff.added.length; i += CHUNK) {
        // One JSON parameter per chunk rather than 17 bindings per row: far less work on both sides.
        const chunk = diff.added.slice(i, i + CHUNK).map((l) => ({ ...lineColumns(l), cog_mm: l.cogMm, bbox_mm: l.bboxMm, assembly_id: asm(l.assemblyNumber), sort_order: ++sort }));
        await trx.raw(
          `insert into machine_part_lines (production_id, machine_id, assembly_id, part_number, name, quantity, unit_mass_kg, mass_source, material,
             volume_mm3, make_or_buy, value, currency, country_of_origin, serial_numbers, cog_mm, bbox_mm, notes, sort_order)
           select ?, ?, v.assembly_id, v.part_number, v.name, v.quantity, v.unit_mass_kg, v.mass_source, v.material,
             v.volume_mm3, v.make_or_buy, v.value, v.currency, v.country_of_origin, v.serial_numbers, v.cog_mm, v.bbox_mm, v.notes, v.sort_order
           from jsonb_to_recordset(?::jsonb) as v(assembly_id uuid, part_number text, name text, quantity numeric, unit_mass_kg float8, mass_source text,
             material text, volume_mm3 float8, make_or_buy text, value numeric, currency text, country_of_origin text, serial_numbers text[],
             cog_mm jsonb, bbox_mm jsonb, notes text, sort_order int)`,
          [productionId, machine.id, JSON.stringify(chunk)],
        );
        done += chunk.length;
        await progress(done, total);
      }

      const imported = new Set(analysis.result.importedFields);
      for (let i = 0; i < diff.changed.length; i += CHUNK) {
        const chunk = diff.changed.slice(i, i + CHUNK);
        const values = chunk.map((c) => {
          // Fields the file does not carry keep what Ballast holds.
          const merged: BreakdownLine = { ...c.before };
          for (const f of DIFFABLE_FIELDS) if (imported.has(f)) (merged as Record<string, unknown>)[f] = c.after[f];
          const cols = lineColumns(merged);
          return { id: c.before.id, ...cols, cog_mm: merged.cogMm, bbox_mm: merged.bboxMm };
        });
        await trx.raw(
          `update machine_part_lines l set
             name = v.name, quantity = v.quantity, unit_mass_kg = v.unit_mass_kg, mass_source = v.mass_source, material = v.material,
             volume_mm3 = v.volume_mm3, make_or_buy = v.make_or_buy, value = v.value, currency = v.currency,
             country_of_origin = v.country_of_origin, serial_numbers = v.serial_numbers, cog_mm = v.cog_mm, bbox_mm = v.bbox_mm,
             notes = v.notes, version = l.version + 1, updated_at = now()
           from jsonb_to_recordset(?::jsonb) as v(id uuid, name text, quantity numeric, unit_mass_kg float8, mass_source text, material text,
             volume_mm3 float8, make_or_buy text, value numeric, currency text, country_of_origin text, serial_numbers text[],
             cog_mm jsonb, bbox_mm jsonb, notes text)
           where l.id = v.id and l.production_id = ?`,
          [JSON.stringify(values), productionId],
        );
        // Placed instances no longer match a changed quantity: the line falls back to one CoG (flagged approximate).
        const requantified = chunk.filter((c) => c.before.hasInstances && c.fields.includes('quantity')).map((c) => c.before.id);
        if (requantified.length) await trx('machine_part_instances').whereIn('part_line_id', requantified).andWhere({ production_id: productionId }).delete();
        done += chunk.length;
        await progress(done, total);
      }

      for (let i = 0; i < diff.removed.length; i += CHUNK) {
        const ids = diff.removed.slice(i, i + CHUNK).map((l) => l.id);
        await trx('machine_part_lines').whereIn('id', ids).andWhere({ production_id: productionId }).delete();
        done += ids.length;
        await progress(done, total);
      }
      return presentAnalysis(analysis);
    });
    await db('machine_imports')
      .where({ id: importRow.id })
      .update({ status: 'committed', summary: json(summary), rows: json({ cells: [], rowNumbers: [] }), updated_at: db.fn.now() });
    return summary;
  } catch (e) {
    await db('machine_imports')
      .where({ id: importRow.id })
      .update({ status: 'failed', error: (e as Error).message, progress_done: 0, updated_at: db.fn.now() })
      .catch(() => undefined);
    throw e;
  }
}

export type { ColumnMapping };
