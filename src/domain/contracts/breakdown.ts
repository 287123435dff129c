import { z } from 'zod';
import { box3Mm, massSource, vec3Mm } from './mass.ts';

/**
 * Shapes of the parts-list import, diff and export, shared by the client (column mapping form, preview),
 * the server (validation of the upload options, the transaction that applies a diff) and the core
 * (src/domain/breakdown). Internal units: mm, kg.
 */

/** The fields a parts-list column can be mapped to. */
export const breakdownField = z.enum([
  'partNumber',
  'name',
  'assemblyNumber',
  'quantity',
  'unitMass',
  'massSource',
  'material',
  'volume',
  'procurement',
  'unitValue',
  'currency',
  'countryOfOrigin',
  'serialNumbers',
  'cogX',
  'cogY',
  'cogZ',
  'bboxMinX',
  'bboxMinY',
  'bboxMinZ',
  'bboxMaxX',
  'bboxMaxY',
  'bboxMaxZ',
  'sizeX',
  'sizeY',
  'sizeZ',
  'notes',
]);
export type BreakdownField = z.infer<typeof breakdownField>;
export const BREAKDOWN_FIELDS = breakdownField.options;

/** Field → column header in the file. partNumber and quantity are required; the rest optional. */
export const columnMapping = z
  .partialRecord(breakdownField, z.string().trim().min(1).max(200))
  .refine((m) => m.partNumber !== undefined && m.quantity !== undefined, { message: 'map at least the part number and quantity columns' });
export type ColumnMapping = z.infer<typeof columnMapping>;

export const importLengthUnit = z.enum(['mm', 'cm', 'm', 'in']);
export const importMassUnit = z.enum(['kg', 'g', 'lb']);
/** Units of the file's numbers (STL-like: a parts list rarely says). Volumes are in the length unit cubed. */
export const importUnits = z.object({ length: importLengthUnit, mass: importMassUnit });
export type ImportUnits = z.infer<typeof importUnits>;

/** How to read a parts list: what the planner picks before the preview (remembered per machine). */
export const breakdownImportOptions = z.object({
  mapping: columnMapping,
  units: importUnits,
  /** '.' reads 1,234.5; ',' reads 1.234,5. */
  decimalSeparator: z.enum(['.', ',']).default('.'),
  /** When true, unknown assembly numbers are collected as new assemblies (a warning) instead of an error. */
  allowNewAssemblies: z.boolean().default(false),
});
export type BreakdownImportOptions = z.input<typeof breakdownImportOptions>;

export const procurement = z.enum(['bought', 'made']);

/** A part line of the breakdown as imported and exported (mm, kg). */
export const breakdownLine = z.object({
  partNumber: z.string().min(1).max(100),
  name: z.string().max(200),
  /** Number of the assembly it belongs to; null = directly under the machine. */
  assemblyNumber: z.string().max(100).nullable(),
  quantity: z.number().positive(),
  /** Null: no mass yet (a gap in every total until given). */
  unitMassKg: z.number().nonnegative().nullable(),
  massSource: massSource.nullable(),
  /** Code of a known material. */
  materialCode: z.string().nullable(),
  /** Volume of one unit, mm³ (CAD). */
  volumeMm3: z.number().positive().nullable(),
  procurement: procurement.nullable(),
  /** Customs value of one unit, in `currency`. */
  unitValue: z.number().nonnegative().nullable(),
  /** ISO 4217 code, upper case. */
  currency: z.string().regex(/^[A-Z]{3}$/).nullable(),
  /** ISO 3166-1 alpha-2, upper case. */
  countryOfOrigin: z.string().regex(/^[A-Z]{2}$/).nullable(),
  serialNumbers: z.array(z.string().min(1)),
  cogMm: vec3Mm.nullable(),
  bboxMm: box3Mm.nullable(),
  notes: z.string().nullable(),
});
export type BreakdownLine = z.infer<typeof breakdownLine>;

/** A line as read from a file: with its row number (header = row 1). */
export const importedLine = breakdownLine.extend({ rowNumber: z.number().int().positive() });
export type ImportedLine = z.infer<typeof importedLine>;

/** One problem found in a file, naming the row (1-based as in the file; 1 = header) and column header. */
export const importProblem = z.object({
  rowNumber: z.number().int().positive(),
  /** The column header in the file; null when the problem is not one cell's (e.g. a duplicate line). */
  column: z.string().nullable(),
  field: breakdownField.nullable(),
  severity: z.enum(['error', 'warning']),
  message: z.string(),
});
export type ImportProblem = z.infer<typeof importProblem>;

export const breakdownImportResult = z.object({
  /** True when no problem is an error: the lines may be written. */
  ok: z.boolean(),
  lines: z.array(importedLine),
  problems: z.array(importProblem),
  /** Data rows read (blank rows excluded) and blank rows skipped. */
  rowCount: z.number().int().nonnegative(),
  skippedBlankRows: z.number().int().nonnegative(),
  /** Line fields the mapping fills: a re-import compares only these, so unmapped data is kept. */
  importedFields: z.array(z.string()),
  /** Assembly numbers not yet known (only with allowNewAssemblies). */
  newAssemblyNumbers: z.array(z.string()),
});
export type BreakdownImportResult = z.infer<typeof breakdownImportResult>;

/** The fields of BreakdownLine a diff compares (everything but the key). */
export const diffableField = z.enum([
  'name',
  'quantity',
  'unitMassKg',
  'massSource',
  'materialCode',
  'volumeMm3',
  'procurement',
  'unitValue',
  'currency',
  'countryOfOrigin',
  'serialNumbers',
  'cogMm',
  'bboxMm',
  'notes',
]);
export type DiffableField = z.infer<typeof diffableField>;

export const lineKey = z.object({ assemblyNumber: z.string().nullable(), partNumber: z.string() });

export const breakdownDiff = z.object({
  added: z.array(breakdownLine),
  changed: z.array(z.object({ key: lineKey, before: breakdownLine, after: breakdownLine, fields: z.array(diffableField) })),
  removed: z.array(breakdownLine),
  unchangedCount: z.number().int().nonnegative(),
});
export type BreakdownDiff = z.infer<typeof breakdownDiff>;
