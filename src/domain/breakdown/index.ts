/** Public entry point of the breakdown core: parts-list import (validation), diff and export. */
export { importBreakdownRows, type ImportContext, type KnownMaterial } from './import-rows.ts';
export { diffBreakdown, lineKeyOf, DIFFABLE_FIELDS, type TypedBreakdownDiff } from './diff.ts';
export { breakdownToTable, tableToCsv, type ExportTable, type ExportOptions } from './export.ts';
export { neutraliseCell, guardText, unguardText, parseNumber, readCell, type CellRead } from './cells.ts';
export { FIELD_INFO, EXPORT_FIELDS, defaultHeader, defaultColumnMapping, type FieldInfo, type FieldKind } from './fields.ts';
export type {
  BreakdownField,
  BreakdownLine,
  BreakdownImportOptions,
  BreakdownImportResult,
  BreakdownDiff,
  ColumnMapping,
  ImportedLine,
  ImportProblem,
  ImportUnits,
  DiffableField,
} from '../contracts/breakdown.ts';
