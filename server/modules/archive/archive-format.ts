import { AppError } from '../../http/errors.ts';
import { formatBytes } from '../machine/upload.ts';

/**
 * Names and limits of the entries of a production archive (a gzip'd tar made with tar-stream):
 *
 *   tables/users.jsonl, tables/<table>.jsonl   one JSON array of column text per line, parents before children
 *   files/<table>/<column>/<row id>            the bytes of one bytea value (an STL, a photo)
 *   manifest.json                              last: versions, tables, row counts, SHA-256 of every entry
 *
 * A restore reads only entries of these shapes; anything else, a link, an absolute path or a `..` is refused
 * with the entry's name, and the archive is bounded in size, in uncompressed size and in entries.
 */

export const MANIFEST_ENTRY = 'manifest.json';

export const ARCHIVE_LIMITS = {
  /** The uploaded (compressed) file. */
  uploadBytes: 128 * 1024 * 1024,
  /** Everything the archive unpacks to, headers included: a gzip bomb stops here. */
  uncompressedBytes: 1024 * 1024 * 1024,
  /** One entry (a table's rows, or one file): held in memory while it is checked and written. */
  entryBytes: 128 * 1024 * 1024,
  entries: 100_000,
  manifestBytes: 32 * 1024 * 1024,
} as const;

export const tableEntry = (table: string) => `tables/${table}.jsonl`;
export const fileEntry = (table: string, column: string, id: string) => `files/${table}/${column}/${id}`;

const TABLE_ENTRY = /^tables\/([a-z_][a-z0-9_]{0,62})\.jsonl$/;
const FILE_ENTRY = /^files\/([a-z_][a-z0-9_]{0,62})\/([a-z_][a-z0-9_]{0,62})\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})$/;

export type EntryKind = { kind: 'manifest' } | { kind: 'table'; table: string } | { kind: 'file'; table: string; column: string; id: string };

/** Shows an entry name in a message: control characters escaped, long names cut. */
export function showName(name: string): string {
  const clean = JSON.stringify(name.length > 200 ? `${name.slice(0, 200)}…` : name);
  return clean;
}

/**
 * What an entry is, from its name and tar type; a refusal naming it for anything outside the archive's shapes
 * (absolute paths, `..`, backslashes, links, devices, unknown names).
 */
export function classifyEntry(name: string, type: string | null | undefined): EntryKind {
  const shown = showName(name);
  if (type !== 'file') {
    throw new AppError('invalid', `Entry ${shown} is a ${type ?? 'special entry'}; a Ballast archive holds plain files only.`, { code: 'archive_entry_refused', issues: [{ path: name, message: 'not a plain file' }] });
  }
  if (name.startsWith('/') || /^[a-zA-Z]:/.test(name) || name.includes('\\') || name.split('/').some((part) => part === '..' || part === '.' || part === '') || name.includes('\0')) {
    throw new AppError('invalid', `Entry ${shown} is refused: its path leaves the archive or is not a plain relative path (absolute, "..", "." or a backslash).`, {
      code: 'archive_path_refused',
      issues: [{ path: name, message: 'path trick' }],
    });
  }
  if (name === MANIFEST_ENTRY) return { kind: 'manifest' };
  const t = TABLE_ENTRY.exec(name);
  if (t) return { kind: 'table', table: t[1] };
  const f = FILE_ENTRY.exec(name);
  if (f) return { kind: 'file', table: f[1], column: f[2], id: f[3] };
  throw new AppError('invalid', `Entry ${shown} is not part of a Ballast production archive (expected ${MANIFEST_ENTRY}, tables/<table>.jsonl or files/<table>/<column>/<id>).`, {
    code: 'archive_entry_refused',
    issues: [{ path: name, message: 'unknown entry' }],
  });
}

export function tooLarge(what: string, limit: number): AppError {
  return new AppError('too_large', `${what} is over the limit of ${formatBytes(limit)} for a production archive.`, { code: 'archive_too_large' });
}
