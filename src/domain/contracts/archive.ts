import { z } from 'zod';

/**
 * A production archive (server/modules/archive): one .tar.gz holding every row of one production, the
 * people it names, and every stored file, with a manifest that carries the format and schema versions, the
 * row counts and a SHA-256 of every entry. See docs/decisions/0003-production-archives.md.
 */

export const ARCHIVE_FORMAT = 'ballast-production-archive';
export const ARCHIVE_FORMAT_VERSION = 1;

const sha256 = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in lower-case hex');
const columnName = z.string().regex(/^[a-z_][a-z0-9_]{0,62}$/, 'a column name');
const tableName = z.string().regex(/^[a-z_][a-z0-9_]{0,62}$/, 'a table name');

export const archiveTable = z.object({
  name: tableName,
  /** The entry with the rows: JSON lines, one array of column values (text, or null) per row. */
  entry: z.string(),
  /** Columns in the order of each row's values, with PostgreSQL's type name. */
  columns: z.array(z.object({ name: columnName, type: z.string().max(100) })).min(1),
  rows: z.number().int().min(0),
  bytes: z.number().int().min(0),
  sha256,
});
export type ArchiveTable = z.infer<typeof archiveTable>;

export const archiveFile = z.object({
  entry: z.string(),
  table: tableName,
  column: columnName,
  rowId: z.string().uuid(),
  bytes: z.number().int().min(0),
  sha256,
});
export type ArchiveFile = z.infer<typeof archiveFile>;

export const archiveManifest = z.object({
  format: z.literal(ARCHIVE_FORMAT),
  formatVersion: z.number().int(),
  /** The newest migration of the database it was made from: restored only into the same schema. */
  schemaVersion: z.string().min(1).max(200),
  exportedAt: z.string(),
  production: z.object({ id: z.string().uuid(), name: z.string() }),
  /** In the order they are restored (parents before children). */
  tables: z.array(archiveTable),
  files: z.array(archiveFile),
});
export type ArchiveManifest = z.infer<typeof archiveManifest>;

export interface ArchiveRestoreResult {
  production: { id: string; name: string };
  tables: { name: string; rows: number }[];
  files: number;
  /** People named by the production: added without a password, already here (same id), or matched by e-mail. */
  users: { added: number; existing: number; matchedByEmail: number };
}
