import { z } from 'zod';
import { breakdownField, importProblem, importUnits, type BreakdownImportOptions, type ImportProblem, type ImportUnits } from '@domain/contracts/breakdown.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { machinePath } from './keys.ts';
import { uploadFile, type UploadProgress } from '../../../lib/upload.ts';

/** What the server answers to an upload: the staged file and the mapping it suggests (remembered per machine). */
export const stagedImport = z.object({
  import: z.object({ id: z.string(), fileName: z.string(), headers: z.array(z.string()), rowCount: z.number(), sample: z.array(z.array(z.string())) }),
  suggested: z.object({
    mapping: z.partialRecord(breakdownField, z.string()),
    units: importUnits,
    decimalSeparator: z.enum(['.', ',']),
    allowNewAssemblies: z.boolean(),
  }),
});
export type StagedImport = z.infer<typeof stagedImport>;

const lineSummary = z.object({ partNumber: z.string(), assemblyNumber: z.string().nullable(), name: z.string(), quantity: z.number(), unitMassKg: z.number().nullable() });
export const importPreview = z.object({
  ok: z.boolean(),
  rowCount: z.number(),
  skippedBlankRows: z.number(),
  errorCount: z.number(),
  warningCount: z.number(),
  problems: z.array(importProblem),
  diffProblem: z.string().nullable(),
  importedFields: z.array(z.string()),
  newAssemblyNumbers: z.array(z.string()),
  diff: z
    .object({
      addedCount: z.number(),
      changedCount: z.number(),
      removedCount: z.number(),
      unchangedCount: z.number(),
      added: z.array(lineSummary),
      changed: z.array(z.object({ partNumber: z.string(), assemblyNumber: z.string().nullable(), fields: z.array(z.string()), before: z.record(z.string(), z.unknown()), after: z.record(z.string(), z.unknown()) })),
      removed: z.array(lineSummary),
      /** Lines placed as instances whose placements the import drops (quantity changed, or line removed). */
      placementsDropped: z.array(z.object({ partNumber: z.string(), assemblyNumber: z.string().nullable(), why: z.enum(['quantity changes', 'line removed']) })).default([]),
      placementsDroppedCount: z.number().default(0),
    })
    .nullable(),
});
export type ImportPreview = z.infer<typeof importPreview>;
export type { ImportProblem, ImportUnits, BreakdownImportOptions };

export const importStatus = z.object({
  id: z.string(),
  fileName: z.string(),
  status: z.enum(['uploaded', 'previewed', 'committing', 'committed', 'failed']),
  progressDone: z.number(),
  progressTotal: z.number(),
  error: z.string().nullable(),
});
export type ImportStatus = z.infer<typeof importStatus>;

/** `POST …/machine/imports` (multipart) → the staged file and a suggested mapping. Reports upload progress. */
export async function uploadPartsList(productionId: string, file: File, onProgress?: (p: UploadProgress) => void): Promise<StagedImport> {
  return parseResponse(stagedImport, await uploadFile(machinePath(productionId, '/imports'), file, file.name, {}, onProgress), 'the uploaded parts list');
}

/** `POST …/imports/:id/preview` → every problem by row and column, and the diff; nothing is written. */
export async function previewImport(productionId: string, importId: string, options: BreakdownImportOptions): Promise<ImportPreview> {
  const res = await api.post<{ preview: unknown }>(machinePath(productionId, `/imports/${encodeURIComponent(importId)}/preview`), options);
  return parseResponse(importPreview, res?.preview, 'the import preview');
}

/** `POST …/imports/:id/commit` → applies the whole diff in one transaction, or nothing. */
export async function commitImport(productionId: string, importId: string, options: BreakdownImportOptions): Promise<ImportPreview> {
  const res = await api.post<{ result: unknown }>(machinePath(productionId, `/imports/${encodeURIComponent(importId)}/commit`), options);
  return parseResponse(importPreview, res?.result, 'the import result');
}

/** `GET …/imports/:id` → status and progress, polled while a commit runs. */
export async function getImportStatus(productionId: string, importId: string): Promise<ImportStatus> {
  const res = await api.get<{ import: unknown }>(machinePath(productionId, `/imports/${encodeURIComponent(importId)}`));
  return parseResponse(importStatus, res?.import, 'the import status');
}

/** Address of the breakdown export (a download; the browser sends the session cookie). */
export function exportUrl(productionId: string, format: 'csv' | 'xlsx', units: ImportUnits): string {
  return `/api${machinePath(productionId, `/export?format=${format}&length=${units.length}&mass=${units.mass}`)}`;
}
