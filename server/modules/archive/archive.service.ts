import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { Transform, type Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGzip, createGunzip } from 'node:zlib';
import tar from 'tar-stream';
import type { Knex } from 'knex';
import { ZodError } from 'zod';
import { ARCHIVE_FORMAT, ARCHIVE_FORMAT_VERSION, archiveManifest, type ArchiveFile, type ArchiveManifest, type ArchiveRestoreResult, type ArchiveTable } from '../../../src/domain/contracts/archive.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import { ARCHIVE_LIMITS, MANIFEST_ENTRY, classifyEntry, fileEntry, showName, tableEntry, tooLarge, type EntryKind } from './archive-format.ts';
import { quoteIdent, readCatalogue, readFile, readRows, readUsers, schemaVersion, setTextForms, type ArchivedTable, type Catalogue, type TextRow } from './archive.repository.ts';

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

export interface ExportFigures {
  tables: number;
  rows: number;
  files: number;
  /** Uncompressed bytes of all entries. */
  bytes: number;
}

/** The production's name and a file name for its archive, or 404. */
export async function archiveName(db: Knex, productionId: string, now = new Date()): Promise<{ name: string; fileName: string }> {
  const production = await db('productions').where({ id: productionId }).first('name');
  if (!production) throw notFound('The production');
  const slug =
    String(production.name)
      .normalize('NFKD')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'production';
  const stamp = now.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
  return { name: production.name, fileName: `ballast-${slug}-${stamp}.tar.gz` };
}

/**
 * Writes the production's archive into `sink` (an HTTP response): rows read in one repeatable-read, read-only
 * transaction, so the archive is one consistent moment of the production even while people keep working.
 * Each entry waits for the one before it to be taken by the sink, so memory holds one table or one file.
 */
export async function writeArchive(db: Knex, productionId: string, sink: Writable): Promise<ExportFigures> {
  const catalogue = await readCatalogue(db);
  const figures: ExportFigures = { tables: 0, rows: 0, files: 0, bytes: 0 };
  await db.transaction(async (trx) => {
    await trx.raw('set transaction isolation level repeatable read, read only');
    await setTextForms(trx);
    const production = await trx('productions').where({ id: productionId }).first('id', 'name');
    if (!production) throw notFound('The production');
    const exportedAt = new Date();
    const manifest: ArchiveManifest = {
      format: ARCHIVE_FORMAT,
      formatVersion: ARCHIVE_FORMAT_VERSION,
      schemaVersion: await schemaVersion(trx),
      exportedAt: exportedAt.toISOString(),
      production: { id: production.id, name: production.name },
      tables: [],
      files: [],
    };

    const pack = tar.pack();
    const done = pipeline(pack, createGzip({ level: 6 }), sink);
    // A sink that fails (the client went away) ends the export at the next entry.
    const failed = done.then(() => new Promise<never>(() => undefined));
    failed.catch(() => undefined);
    const add = async (name: string, body: Buffer) => {
      const written = new Promise<void>((resolve, reject) => {
        const entry = pack.entry({ name, size: body.length, mtime: exportedAt, mode: 0o644, type: 'file' }, body, (err) => (err ? reject(err) : resolve()));
        // An entry cut off by a failed sink reports through the callback; its own 'error' event would go unheard.
        entry.on('error', () => undefined);
      });
      // Seen by the race below; marked handled so that a late refusal after a failed sink is not left unhandled.
      written.catch(() => undefined);
      await Promise.race([written, failed]);
      figures.bytes += body.length;
    };
    const addTable = async (name: string, columns: { name: string; type: string }[], rows: TextRow[]) => {
      const body = Buffer.from(rows.map((r) => `${JSON.stringify(r)}\n`).join(''), 'utf8');
      await add(tableEntry(name), body);
      manifest.tables.push({ name, entry: tableEntry(name), columns, rows: rows.length, bytes: body.length, sha256: sha256(body) });
      figures.tables++;
      figures.rows += rows.length;
    };

    try {
      await addTable('users', catalogue.users.columns, await readUsers(trx, catalogue, productionId));
      const files: { table: string; column: string; id: string }[] = [];
      for (const t of catalogue.tables) {
        const rows = await readRows(trx, t, catalogue, productionId);
        if (t.fileColumns.length) {
          const idAt = t.columns.findIndex((c) => c.name === t.primaryKey[0]);
          for (const row of rows) {
            for (const column of t.fileColumns) {
              const at = t.columns.findIndex((c) => c.name === column);
              if (row[at] === true) {
                const id = String(row[idAt]);
                row[at] = fileEntry(t.name, column, id);
                files.push({ table: t.name, column, id });
              } else row[at] = null;
            }
          }
        }
        await addTable(t.name, t.columns, rows);
      }
      for (const f of files) {
        const body = await readFile(trx, f.table, f.column, f.id);
        const entry = fileEntry(f.table, f.column, f.id);
        await add(entry, body);
        manifest.files.push({ entry, table: f.table, column: f.column, rowId: f.id, bytes: body.length, sha256: sha256(body) });
        figures.files++;
      }
      await add(MANIFEST_ENTRY, Buffer.from(JSON.stringify(manifest, null, 1), 'utf8'));
      pack.finalize();
      await done;
    } catch (err) {
      // Ends the pipeline (and the response) rather than leaving it waiting for entries that will not come.
      pack.destroy(err as Error);
      throw err;
    }
  });
  return figures;
}

interface SeenEntry {
  name: string;
  kind: EntryKind;
  bytes: number;
  sha256: string;
}

/**
 * Reads the archive's entries one by one, within the limits: the uncompressed total (a gzip bomb), the number
 * of entries, the size of each, and only the names classifyEntry accepts. `visit` gets each entry's bytes.
 */
async function readEntries(path: string, visit: (e: SeenEntry, body: Buffer) => Promise<void>): Promise<void> {
  let total = 0;
  const counter = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      total += chunk.length;
      if (total > ARCHIVE_LIMITS.uncompressedBytes) cb(tooLarge('The archive unpacks to more than allowed; it', ARCHIVE_LIMITS.uncompressedBytes));
      else cb(null, chunk);
    },
  });
  const extract = tar.extract();
  const feeding = pipeline(createReadStream(path), createGunzip(), counter, extract);
  feeding.catch(() => undefined);
  let count = 0;
  try {
    for await (const entry of extract) {
      const name = entry.header.name;
      count++;
      if (count > ARCHIVE_LIMITS.entries) throw new AppError('too_large', `The archive holds more than ${ARCHIVE_LIMITS.entries} entries; ${showName(name)} is one too many.`, { code: 'archive_too_large' });
      const kind = classifyEntry(name, entry.header.type);
      const size = entry.header.size ?? 0;
      const limit = kind.kind === 'manifest' ? ARCHIVE_LIMITS.manifestBytes : ARCHIVE_LIMITS.entryBytes;
      if (size > limit) throw tooLarge(`Entry ${showName(name)}`, limit);
      const chunks: Buffer[] = [];
      for await (const chunk of entry) chunks.push(chunk as Buffer);
      const body = Buffer.concat(chunks);
      await visit({ name, kind, bytes: body.length, sha256: sha256(body) }, body);
    }
    await feeding;
  } catch (err) {
    extract.destroy();
    throw readError(err);
  }
}

function readError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  const e = err as { code?: string; message?: string };
  if (typeof e?.code === 'string' && e.code.startsWith('Z_')) {
    return invalid(`The file is not a complete gzip'd Ballast archive (${e.message}). Upload the .tar.gz file exactly as it was downloaded.`, undefined, 'archive_unreadable');
  }
  return invalid(`The archive could not be read as a tar file: ${e?.message ?? String(err)}.`, undefined, 'archive_unreadable');
}

/** The manifest, read and checked against every entry seen (checksums, sizes, nothing missing, nothing extra). */
function checkManifest(raw: Buffer | undefined, seen: Map<string, SeenEntry>): ArchiveManifest {
  if (!raw) throw invalid(`The archive has no ${MANIFEST_ENTRY}: it is not a Ballast production archive, or it was cut short.`, undefined, 'archive_no_manifest');
  let manifest: ArchiveManifest;
  try {
    manifest = archiveManifest.parse(JSON.parse(raw.toString('utf8')));
  } catch (err) {
    const detail = err instanceof ZodError ? err.issues.map((i) => `${i.path.join('.') || '(top)'}: ${i.message}`).join('; ') : (err as Error).message;
    throw invalid(`Entry ${MANIFEST_ENTRY} is not a valid manifest: ${detail}`.slice(0, 1000), [{ path: MANIFEST_ENTRY, message: 'not a valid manifest' }], 'archive_bad_manifest');
  }
  if (manifest.formatVersion !== ARCHIVE_FORMAT_VERSION) {
    throw invalid(`The archive is in format version ${manifest.formatVersion}; this Ballast reads version ${ARCHIVE_FORMAT_VERSION}.`, undefined, 'archive_format_version');
  }
  const listed = new Map<string, { bytes: number; sha256: string }>();
  for (const t of manifest.tables) {
    if (t.entry !== tableEntry(t.name)) throw invalid(`The manifest names entry ${showName(t.entry)} for table ${t.name}; expected ${tableEntry(t.name)}.`, undefined, 'archive_bad_manifest');
    listed.set(t.entry, t);
  }
  for (const f of manifest.files) {
    if (f.entry !== fileEntry(f.table, f.column, f.rowId)) throw invalid(`The manifest names entry ${showName(f.entry)} for a file of ${f.table}.${f.column}; expected ${fileEntry(f.table, f.column, f.rowId)}.`, undefined, 'archive_bad_manifest');
    listed.set(f.entry, f);
  }
  for (const [entry, want] of listed) {
    const got = seen.get(entry);
    if (!got) throw invalid(`Entry ${showName(entry)} is listed in the manifest but missing from the archive.`, [{ path: entry, message: 'missing' }], 'archive_entry_missing');
    if (got.sha256 !== want.sha256 || got.bytes !== want.bytes) {
      throw invalid(`Entry ${showName(entry)} does not match its SHA-256 in the manifest: the archive was changed or damaged after it was made. Nothing was restored.`, [{ path: entry, message: 'checksum mismatch' }], 'archive_checksum');
    }
  }
  for (const entry of seen.keys()) {
    if (entry !== MANIFEST_ENTRY && !listed.has(entry)) throw invalid(`Entry ${showName(entry)} is not listed in the manifest.`, [{ path: entry, message: 'not in the manifest' }], 'archive_entry_refused');
  }
  return manifest;
}

/** The archive's tables against this database's: the same tables, the same columns in the same order. */
function checkTables(manifest: ArchiveManifest, catalogue: Catalogue): void {
  const want = ['users', ...catalogue.tables.map((t) => t.name)];
  const got = manifest.tables.map((t) => t.name);
  const missing = want.filter((n) => !got.includes(n));
  const extra = got.filter((n) => !want.includes(n));
  if (missing.length || extra.length || new Set(got).size !== got.length) {
    throw invalid(
      `The archive's tables do not fit this database${missing.length ? `; missing: ${missing.join(', ')}` : ''}${extra.length ? `; unknown here: ${extra.join(', ')}` : ''}${new Set(got).size !== got.length ? '; a table is listed twice' : ''}.`,
      undefined,
      'archive_tables',
    );
  }
  for (const t of manifest.tables) {
    const here = t.name === 'users' ? catalogue.users.columns : catalogue.tables.find((x) => x.name === t.name)!.columns;
    const a = t.columns.map((c) => `${c.name}:${c.type}`).join(',');
    const b = here.map((c) => `${c.name}:${c.type}`).join(',');
    if (a !== b) throw invalid(`Table ${t.name} in the archive has the columns (${a}); this database has (${b}).`, [{ path: t.entry, message: 'columns differ' }], 'archive_tables');
  }
}

/** Parses a table entry's JSON lines into rows of text values, each of the table's width. */
function parseRows(entry: string, body: Buffer, width: number): (string | null)[][] {
  const text = body.toString('utf8');
  const lines = text.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  return lines.map((line, i) => {
    let row: unknown;
    try {
      row = JSON.parse(line);
    } catch {
      throw invalid(`Entry ${showName(entry)}, line ${i + 1}: not valid JSON.`, [{ path: `${entry}:${i + 1}`, message: 'not JSON' }], 'archive_bad_row');
    }
    if (!Array.isArray(row) || row.length !== width || !row.every((v) => v === null || typeof v === 'string')) {
      throw invalid(`Entry ${showName(entry)}, line ${i + 1}: expected ${width} values, each text or null.`, [{ path: `${entry}:${i + 1}`, message: 'wrong shape' }], 'archive_bad_row');
    }
    return row as (string | null)[];
  });
}

/** Rows with parents before children where a table points at itself (an assembly's parent assembly). */
function parentsFirst(t: ArchivedTable, entry: string, rows: (string | null)[][]): (string | null)[][] {
  if (!t.selfReferences.length) return rows;
  const keyAt = new Map(t.foreignKeys.filter((f) => f.refTable === t.name).map((f) => [f.column, t.columns.findIndex((c) => c.name === f.refColumn)]));
  const byKey = new Map<string, Map<string, number>>();
  for (const [col, at] of keyAt) byKey.set(col, new Map(rows.map((r, i) => [String(r[at]), i])));
  const out: (string | null)[][] = [];
  const state = new Uint8Array(rows.length);
  const visit = (i: number) => {
    if (state[i] === 2) return;
    if (state[i] === 1) throw invalid(`Entry ${showName(entry)}: rows point at each other in a cycle.`, [{ path: entry, message: 'cycle' }], 'archive_bad_row');
    state[i] = 1;
    for (const col of t.selfReferences) {
      const v = rows[i][t.columns.findIndex((c) => c.name === col)];
      const parent = v === null ? undefined : byKey.get(col)!.get(v);
      if (parent !== undefined) visit(parent);
    }
    state[i] = 2;
    out.push(rows[i]);
  };
  rows.forEach((_, i) => visit(i));
  return out;
}

function dbRefusal(entry: string, err: unknown): AppError {
  const e = err as { code?: string; message?: string; constraint?: string };
  if (e?.code === '23505' && e.constraint === 'productions_pkey') return new AppError('conflict', 'A production with this archive\u2019s id already exists here. Nothing was restored.', { code: 'archive_production_exists' });
  if (typeof e?.code === 'string' && /^(22|23)/.test(e.code)) {
    return invalid(`Entry ${showName(entry)} could not be restored: ${e.message}${e.constraint ? ` (rule ${e.constraint})` : ''}. Nothing was restored.`, [{ path: entry, message: e.message ?? 'refused' }], 'archive_row_refused');
  }
  return err as AppError;
}

/**
 * Restores an archive file into this database: two reads of the file. The first checks everything without
 * writing (names, limits, checksums against the manifest, format and schema versions, tables and columns, the
 * production not already here); the second inserts every row and file in one transaction, keeping every id,
 * so that any refusal leaves the database exactly as it was.
 */
export async function restoreArchive(db: Knex, path: string): Promise<ArchiveRestoreResult> {
  // First read: check, write nothing.
  const seen = new Map<string, SeenEntry>();
  const order: string[] = [];
  let manifestRaw: Buffer | undefined;
  await readEntries(path, async (e, body) => {
    if (seen.has(e.name)) throw invalid(`Entry ${showName(e.name)} appears twice in the archive.`, [{ path: e.name, message: 'duplicate' }], 'archive_entry_refused');
    seen.set(e.name, e);
    order.push(e.name);
    if (e.kind.kind === 'manifest') manifestRaw = body;
  });
  const manifest = checkManifest(manifestRaw, seen);
  const here = await schemaVersion(db);
  if (manifest.schemaVersion !== here) {
    throw invalid(
      `The archive was made by a Ballast whose newest migration is ${manifest.schemaVersion}; this one's is ${here}. Restore it into an installation at the same version.`,
      undefined,
      'archive_schema_version',
    );
  }
  const catalogue = await readCatalogue(db);
  checkTables(manifest, catalogue);
  // Entries in the order the restore needs: users, then tables parents first, then files after their table.
  const tableAt = (name: string) => order.indexOf(tableEntry(name));
  const expected = ['users', ...catalogue.tables.map((t) => t.name)];
  for (let i = 1; i < expected.length; i++) {
    if (tableAt(expected[i]) < tableAt(expected[i - 1])) throw invalid(`Entry ${showName(tableEntry(expected[i]))} comes before ${showName(tableEntry(expected[i - 1]))}; parents must come first.`, undefined, 'archive_order');
  }
  for (const f of manifest.files) {
    if (order.indexOf(f.entry) < tableAt(f.table)) throw invalid(`Entry ${showName(f.entry)} comes before the rows of ${f.table}.`, undefined, 'archive_order');
  }
  const productionId = manifest.production.id;
  if (await db('productions').where({ id: productionId }).first('id')) {
    throw new AppError('conflict', `A production with this archive\u2019s id (${productionId}, "${manifest.production.name}") already exists here. Nothing was restored.`, { code: 'archive_production_exists' });
  }

  // Second read: write everything in one transaction.
  const tablesByEntry = new Map<string, ArchiveTable>(manifest.tables.map((t) => [t.entry, t]));
  const filesByEntry = new Map<string, ArchiveFile>(manifest.files.map((f) => [f.entry, f]));
  return db.transaction(async (trx) => {
    await setTextForms(trx);
    const userMap = new Map<string, string>();
    const users = { added: 0, existing: 0, matchedByEmail: 0 };
    /** Values of every column some foreign key points at, per table, among the rows restored. */
    const keys = new Map<string, Map<string, Set<string>>>();
    const pendingFiles = new Set<string>();
    const counts: { name: string; rows: number }[] = [];
    let files = 0;

    await readEntries(path, async (e, body) => {
      const first = seen.get(e.name);
      if (!first || first.sha256 !== e.sha256) throw invalid(`Entry ${showName(e.name)} changed between the two reads of the upload.`, undefined, 'archive_checksum');
      if (e.kind.kind === 'manifest') return;
      if (e.kind.kind === 'table') {
        const listed = tablesByEntry.get(e.name)!;
        const rows = parseRows(e.name, body, listed.columns.length);
        if (rows.length !== listed.rows) throw invalid(`Entry ${showName(e.name)} holds ${rows.length} rows; the manifest says ${listed.rows}.`, undefined, 'archive_bad_row');
        if (e.kind.table === 'users') await restoreUsers(trx, listed, rows, userMap, users);
        else {
          const t = catalogue.tables.find((x) => x.name === listed.name)!;
          await restoreTable(trx, t, e.name, rows, { productionId, userMap, keys, catalogue, pendingFiles });
        }
        counts.push({ name: listed.name, rows: rows.length });
        return;
      }
      const f = filesByEntry.get(e.name)!;
      if (!pendingFiles.delete(e.name)) throw invalid(`Entry ${showName(e.name)} is a file that no row of ${f.table} refers to.`, [{ path: e.name, message: 'not referred to' }], 'archive_bad_row');
      const updated = await trx(f.table)
        .where({ id: f.rowId })
        .update({ [f.column]: body });
      if (updated !== 1) throw invalid(`Entry ${showName(e.name)}: no row ${f.rowId} in ${f.table}.`, undefined, 'archive_bad_row');
      files++;
    });
    if (pendingFiles.size) {
      const [missing] = pendingFiles;
      throw invalid(`Entry ${showName(missing)} is referred to by a row but is not in the archive.`, [{ path: missing, message: 'missing' }], 'archive_entry_missing');
    }
    for (const t of catalogue.tables) {
      for (const column of t.sequenced) {
        await trx.raw(`select setval(pg_get_serial_sequence(?, ?), m) from (select max(${quoteIdent(column)}) as m from ${quoteIdent(t.name)}) x where m is not null`, [t.name, column]);
      }
    }
    return { production: manifest.production, tables: counts.filter((c) => c.name !== 'users'), files, users };
  });
}

async function restoreUsers(trx: Knex.Transaction, listed: ArchiveTable, rows: (string | null)[][], userMap: Map<string, string>, figures: ArchiveRestoreResult['users']): Promise<void> {
  const at = (name: string) => listed.columns.findIndex((c) => c.name === name);
  const idAt = at('id');
  const emailAt = at('email');
  for (const [i, row] of rows.entries()) {
    const id = row[idAt];
    const email = row[emailAt];
    if (!id || !email) throw invalid(`Entry ${showName(listed.entry)}, line ${i + 1}: a person needs an id and an e-mail.`, undefined, 'archive_bad_row');
    const sameId = await trx('users').where({ id }).first('id');
    if (sameId) {
      userMap.set(id, id);
      figures.existing++;
      continue;
    }
    const sameEmail = await trx('users').whereRaw('lower(email) = lower(?)', [email]).first('id');
    if (sameEmail) {
      userMap.set(id, sameEmail.id);
      figures.matchedByEmail++;
      continue;
    }
    // No password (they set one through "forgot password") and no admin rights, whatever the source said.
    const cols = listed.columns.map((c) => quoteIdent(c.name));
    try {
      await trx.raw(`insert into users (${cols.join(', ')}, password_hash, is_admin) values (${cols.map(() => '?').join(', ')}, null, false)`, row);
    } catch (err) {
      throw dbRefusal(listed.entry, err);
    }
    userMap.set(id, id);
    figures.added++;
  }
}

async function restoreTable(
  trx: Knex.Transaction,
  t: ArchivedTable,
  entry: string,
  input: (string | null)[][],
  ctx: { productionId: string; userMap: Map<string, string>; keys: Map<string, Map<string, Set<string>>>; catalogue: Catalogue; pendingFiles: Set<string> },
): Promise<void> {
  const col = (name: string) => t.columns.findIndex((c) => c.name === name);
  const rows = parentsFirst(t, entry, input);
  const lineOf = (row: (string | null)[]) => input.indexOf(row) + 1;
  const own = (name: string) => {
    let m = ctx.keys.get(t.name);
    if (!m) ctx.keys.set(t.name, (m = new Map()));
    let s = m.get(name);
    if (!s) m.set(name, (s = new Set()));
    return s;
  };
  const refused = (row: (string | null)[], message: string) => invalid(`Entry ${showName(entry)}, line ${lineOf(row)}: ${message}`, [{ path: `${entry}:${lineOf(row)}`, message }], 'archive_bad_row');

  // Every row belongs to the archive's production, and points only at rows and people of the archive.
  const scopeAt = t.scope.kind === 'production' ? col('id') : t.scope.kind === 'production-id' ? col('production_id') : -1;
  if (t.scope.kind === 'production' && rows.length !== 1) throw invalid(`Entry ${showName(entry)} must hold exactly the one production.`, undefined, 'archive_bad_row');
  const selfKeys = new Map(t.selfReferences.map((c) => [c, new Set(rows.map((r) => r[col(t.foreignKeys.find((f) => f.column === c)!.refColumn)]).filter((v): v is string => v !== null))]));
  for (const row of rows) {
    if (scopeAt >= 0 && row[scopeAt] !== ctx.productionId) throw refused(row, `the row belongs to another production (${row[scopeAt]}), not ${ctx.productionId}.`);
    for (const fk of t.foreignKeys) {
      const at = col(fk.column);
      const v = row[at];
      if (v === null) continue;
      if (fk.refTable === 'users') {
        const mapped = ctx.userMap.get(v);
        if (!mapped) throw refused(row, `${fk.column} names a person (${v}) who is not in the archive.`);
        row[at] = mapped;
      } else if (fk.refTable === t.name) {
        if (!selfKeys.get(fk.column)!.has(v)) throw refused(row, `${fk.column} points at ${v}, which is not a row of ${t.name} in the archive.`);
      } else if (ctx.catalogue.tables.some((x) => x.name === fk.refTable)) {
        if (!ctx.keys.get(fk.refTable)?.get(fk.refColumn)?.has(v)) throw refused(row, `${fk.column} points at ${fk.refTable} ${v}, which is not in the archive.`);
      }
    }
    for (const c of t.fileColumns) {
      const at = col(c);
      const v = row[at];
      if (v === null) continue;
      const id = row[col(t.primaryKey[0])]!;
      if (v !== fileEntry(t.name, c, id)) throw refused(row, `${c} should name the entry ${fileEntry(t.name, c, id)}.`);
      ctx.pendingFiles.add(v);
      // Written empty now; the file entry that follows fills it in.
      row[at] = '\\x';
    }
  }
  // Keys other tables point at, for their checks.
  const pointedAt = new Set(ctx.catalogue.tables.flatMap((x) => x.foreignKeys.filter((f) => f.refTable === t.name).map((f) => f.refColumn)));
  for (const name of pointedAt) {
    const s = own(name);
    for (const row of rows) if (row[col(name)] !== null) s.add(row[col(name)]!);
  }

  const cols = t.columns.map((c) => quoteIdent(c.name)).join(', ');
  const perBatch = Math.max(1, Math.min(500, Math.floor(30_000 / t.columns.length)));
  const placeholders = `(${t.columns.map(() => '?').join(', ')})`;
  for (let i = 0; i < rows.length; i += perBatch) {
    const batch = rows.slice(i, i + perBatch);
    try {
      await trx.raw(`insert into ${quoteIdent(t.name)} (${cols}) values ${batch.map(() => placeholders).join(', ')}`, batch.flat());
    } catch (err) {
      throw dbRefusal(entry, err);
    }
  }
}
