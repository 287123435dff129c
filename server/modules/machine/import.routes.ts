import ExcelJS from 'exceljs';
import { z } from 'zod';
import { breakdownToTable, tableToCsv } from '../../../src/domain/breakdown/index.ts';
import { breakdownImportOptions, importUnits, type BreakdownImportOptions, type ImportUnits } from '../../../src/domain/contracts/breakdown.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { notFound } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';
import { ensureMachine, json } from './machine.repository.ts';
import { analyseImport, commitImport, currentLines, guessMapping, presentAnalysis, rememberMapping, stagedFile, type ImportRow } from './import.service.ts';
import { encodeCells, readPartsFile } from './parts-file.ts';
import { requireFile, singleUpload, type UploadRule } from './upload.ts';

/** 10,000 lines of 25 columns are about 2 MB of CSV; XLSX a little less. */
export const PARTS_LIST_MAX_BYTES = 20 * 1024 * 1024;
export const PARTS_LIST_UPLOAD: UploadRule = { field: 'file', maxBytes: PARTS_LIST_MAX_BYTES, extensions: ['.csv', '.xlsx'], label: 'a parts list (.csv or .xlsx)' };

const exportQuery = z.object({
  format: z.enum(['csv', 'xlsx']).default('csv'),
  length: importUnits.shape.length.default('mm'),
  mass: importUnits.shape.mass.default('kg'),
});

/**
 * Parts-list import (upload → preview with problems and diff → commit in one transaction, with progress)
 * and export (CSV, XLSX) of the breakdown, under …/machine.
 */
export function importRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const loadImport = async (productionId: string, importId: string): Promise<ImportRow> => {
    const row = (await db('machine_imports').where({ id: importId, production_id: productionId }).first()) as ImportRow | undefined;
    if (!row) throw notFound('The import');
    return row;
  };
  return [
    route({
      method: 'post',
      path: '/imports',
      access: can('machine.edit'),
      before: [singleUpload(PARTS_LIST_UPLOAD)],
      async handler(req, res) {
        const productionId = uuidParam(req, 'productionId');
        const file = requireFile(req.file, PARTS_LIST_UPLOAD);
        const machine = await ensureMachine(db, productionId);
        const parsed = await readPartsFile(file.buffer, file.originalname);
        const remembered = (machine.import_mapping ?? {}) as Partial<BreakdownImportOptions>;
        const units: ImportUnits = importUnits.safeParse(remembered.units).success ? (remembered.units as ImportUnits) : { length: 'mm', mass: 'kg' };
        const mapping = guessMapping(parsed.headers.filter((h) => h !== ''), remembered.mapping, units);
        const [row] = await db('machine_imports')
          .insert({
            production_id: productionId,
            machine_id: machine.id,
            file_name: file.originalname,
            headers: json(parsed.headers),
            rows: json({ cells: encodeCells(parsed.rows), rowNumbers: parsed.rowNumbers }),
            progress_total: parsed.rows.length,
            created_by: req.actor!.userId,
          })
          .returning(['id', 'file_name', 'created_at']);
        res.status(201).json({
          import: {
            id: row.id,
            fileName: row.file_name,
            headers: parsed.headers.filter((h) => h !== ''),
            rowCount: parsed.rows.length,
            sample: parsed.rows.slice(0, 5).map((r) => r.map((c) => (c === null || c === undefined ? '' : typeof c === 'object' ? JSON.stringify(c) : String(c)))),
          },
          suggested: {
            mapping,
            units,
            decimalSeparator: remembered.decimalSeparator ?? '.',
            allowNewAssemblies: remembered.allowNewAssemblies ?? false,
          },
        });
      },
    }),
    route({
      method: 'get',
      path: '/imports/:importId',
      access: can('machine.read'),
      async handler(req) {
        const row = (await db('machine_imports')
          .where({ id: uuidParam(req, 'importId'), production_id: uuidParam(req, 'productionId') })
          .first('id', 'file_name', 'status', 'progress_done', 'progress_total', 'error', 'summary')) as
          | { id: string; file_name: string; status: string; progress_done: number; progress_total: number; error: string | null; summary: unknown }
          | undefined;
        if (!row) throw notFound('The import');
        return { import: { id: row.id, fileName: row.file_name, status: row.status, progressDone: row.progress_done, progressTotal: row.progress_total, error: row.error, summary: row.summary } };
      },
    }),
    route({
      method: 'post',
      path: '/imports/:importId/preview',
      access: can('machine.edit'),
      body: breakdownImportOptions,
      async handler(req) {
        const productionId = uuidParam(req, 'productionId');
        const row = await loadImport(productionId, uuidParam(req, 'importId'));
        const options = req.body as BreakdownImportOptions;
        const machine = await ensureMachine(db, productionId);
        const analysis = await analyseImport(db, productionId, stagedFile(row), options);
        await rememberMapping(db, machine, options);
        const preview = presentAnalysis(analysis);
        if (row.status === 'uploaded' || row.status === 'previewed') {
          await db('machine_imports').where({ id: row.id }).update({ status: 'previewed', mapping: json(options), summary: json({ ...preview, problems: undefined }), updated_at: db.fn.now() });
        }
        return { preview };
      },
    }),
    route({
      method: 'post',
      path: '/imports/:importId/commit',
      access: can('machine.edit'),
      body: breakdownImportOptions,
      async handler(req) {
        const productionId = uuidParam(req, 'productionId');
        const row = await loadImport(productionId, uuidParam(req, 'importId'));
        const result = await commitImport(db, req.log ?? deps.log, row, req.body as BreakdownImportOptions);
        return { result };
      },
    }),
    route({
      method: 'get',
      path: '/export',
      access: can('machine.read'),
      query: exportQuery,
      async handler(req, res) {
        const productionId = uuidParam(req, 'productionId');
        const q = req.query as unknown as z.infer<typeof exportQuery>;
        const machine = await ensureMachine(db, productionId);
        const table = breakdownToTable(await currentLines(db, productionId), { units: { length: q.length, mass: q.mass } });
        const base = `${(machine.name || 'machine').replace(/[^\w-]+/g, '-').toLowerCase()}-breakdown`;
        if (q.format === 'csv') {
          res.setHeader('Content-Type', 'text/csv; charset=utf-8');
          res.setHeader('Content-Disposition', `attachment; filename="${base}.csv"`);
          // A byte-order mark so spreadsheet programs read UTF-8 (names with accents) correctly.
          res.send(`\uFEFF${tableToCsv(table)}`);
          return;
        }
        res.setHeader('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        res.setHeader('Content-Disposition', `attachment; filename="${base}.xlsx"`);
        // Streamed row by row: a 10,000-line workbook never sits whole in memory.
        const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: res, useSharedStrings: false, useStyles: true });
        const sheet = wb.addWorksheet('Breakdown', { views: [{ state: 'frozen', ySplit: 1 }] });
        const head = sheet.addRow(table.header);
        head.font = { bold: true };
        head.commit();
        // Cells go in as typed values: numbers stay numbers; guarded text stays text (never a formula).
        for (const r of table.rows) sheet.addRow(r).commit();
        sheet.commit();
        await wb.commit();
      },
    }),
  ];
}
