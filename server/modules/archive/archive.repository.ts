import type { Knex } from 'knex';

/**
 * What a production archive holds, read from the database's own catalogue rather than from a list kept by
 * hand, so that a table added by a later migration is carried without anyone remembering it:
 *
 * - every table with a `production_id` column (and `productions` itself, by `id`);
 * - every table without one whose rows hang from such a table by a foreign key (e.g. `leg_crates` → `tour_legs`);
 * - `users`, for the people those rows name (members, authors, reviewers, scanners), without password hashes;
 * - not: sessions, sign-in limits, caught mail, password resets, the migration tables, and `invitations`
 *   (their token hashes are credentials; see docs/decisions/0003-production-archives.md).
 *
 * Values travel as PostgreSQL's own text form of each column (`col::text`), and go back in as text that the
 * database parses for the column's type: numerics, doubles, timestamps, arrays and JSON come back exactly as
 * they were, whatever node-pg would have made of them. bytea columns travel as separate files.
 */

/** Tables with production rows that are deliberately not archived, with the reason. */
export const NOT_ARCHIVED: Record<string, string> = {
  invitations: 'pending invitations carry token hashes (credentials); invite people again after a restore',
  production_revisions: 'revision numbers for caches, raised by the database itself as the restored rows go in',
};

/** Columns of `users` that travel; the password hash and the admin flag do not. */
export const USER_COLUMNS = ['id', 'email', 'name', 'active', 'units', 'version', 'created_at', 'updated_at'] as const;

export interface ColumnInfo {
  name: string;
  /** PostgreSQL's type name (udt_name), e.g. uuid, jsonb, _text, bytea. */
  type: string;
}

export interface ForeignKey {
  column: string;
  refTable: string;
  refColumn: string;
}

export interface ArchivedTable {
  name: string;
  columns: ColumnInfo[];
  primaryKey: string[];
  foreignKeys: ForeignKey[];
  /** How its rows are chosen: by production_id, by id (productions), or through a parent table's rows. */
  scope: { kind: 'production-id' } | { kind: 'production' } | { kind: 'parent'; column: string; parent: string };
  /** bytea columns, written as files (the table then needs a single uuid primary key). */
  fileColumns: string[];
  /** Columns that point at rows of the same table (e.g. an assembly's parent). */
  selfReferences: string[];
  /** Columns with a sequence behind them (serial or identity), to be moved past restored values. */
  sequenced: string[];
}

export interface Catalogue {
  /** Production tables in an order that satisfies every foreign key between them (parents first). */
  tables: ArchivedTable[];
  users: { columns: ColumnInfo[] };
  /** Columns of archived tables that point at users.id. */
  userReferences: { table: string; column: string }[];
}

export const quoteIdent = (name: string): string => {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`Unexpected identifier ${name}`);
  return `"${name}"`;
};

const SKIP_ALWAYS = new Set(['knex_migrations', 'knex_migrations_lock', 'users']);

/** Reads the catalogue of the database behind `db` (one query per kind of fact). */
export async function readCatalogue(db: Knex): Promise<Catalogue> {
  const columnRows: { table_name: string; column_name: string; udt_name: string; column_default: string | null; is_identity: string; is_generated: string; is_nullable: string }[] = await db('information_schema.columns as c')
    .join('information_schema.tables as t', function joinTables() {
      this.on('t.table_name', 'c.table_name').andOn('t.table_schema', 'c.table_schema');
    })
    .where({ 'c.table_schema': 'public', 't.table_type': 'BASE TABLE' })
    .orderBy([{ column: 'c.table_name' }, { column: 'c.ordinal_position' }])
    .select('c.table_name', 'c.column_name', 'c.udt_name', 'c.column_default', 'c.is_identity', 'c.is_generated', 'c.is_nullable');
  const fkRows: { table_name: string; column_name: string; ref_table: string; ref_column: string }[] = (
    await db.raw(`
      select src.relname as table_name, a.attname as column_name, dst.relname as ref_table, af.attname as ref_column
      from pg_constraint c
      join pg_class src on src.oid = c.conrelid
      join pg_class dst on dst.oid = c.confrelid
      join lateral unnest(c.conkey, c.confkey) as k(attnum, fattnum) on true
      join pg_attribute a on a.attrelid = c.conrelid and a.attnum = k.attnum
      join pg_attribute af on af.attrelid = c.confrelid and af.attnum = k.fattnum
      where c.contype = 'f' and c.connamespace = 'public'::regnamespace and array_length(c.conkey, 1) = 1
      order by src.relname, a.attname`)
  ).rows;
  const pkRows: { table_name: string; column_name: string }[] = (
    await db.raw(`
      select cl.relname as table_name, a.attname as column_name
      from pg_index i
      join pg_class cl on cl.oid = i.indrelid
      join pg_namespace n on n.oid = cl.relnamespace
      join lateral unnest(i.indkey) with ordinality as k(attnum, ord) on true
      join pg_attribute a on a.attrelid = i.indrelid and a.attnum = k.attnum
      where i.indisprimary and n.nspname = 'public'
      order by cl.relname, k.ord`)
  ).rows;

  const byTable = new Map<string, typeof columnRows>();
  for (const c of columnRows) byTable.set(c.table_name, [...(byTable.get(c.table_name) ?? []), c]);
  const fks = new Map<string, ForeignKey[]>();
  for (const f of fkRows) fks.set(f.table_name, [...(fks.get(f.table_name) ?? []), { column: f.column_name, refTable: f.ref_table, refColumn: f.ref_column }]);
  const pks = new Map<string, string[]>();
  for (const p of pkRows) pks.set(p.table_name, [...(pks.get(p.table_name) ?? []), p.column_name]);

  const make = (name: string, scope: ArchivedTable['scope']): ArchivedTable => {
    const cols = (byTable.get(name) ?? []).filter((c) => c.is_generated !== 'ALWAYS');
    const foreignKeys = fks.get(name) ?? [];
    const primaryKey = pks.get(name) ?? [];
    if (!primaryKey.length) throw new Error(`Table ${name} has no primary key; an archive needs one to order and compare its rows.`);
    const fileColumns = cols.filter((c) => c.udt_name === 'bytea').map((c) => c.column_name);
    if (fileColumns.length && !(primaryKey.length === 1 && cols.find((c) => c.column_name === primaryKey[0])?.udt_name === 'uuid')) {
      throw new Error(`Table ${name} keeps files but has no single uuid primary key to name them by.`);
    }
    return {
      name,
      columns: cols.map((c) => ({ name: c.column_name, type: c.udt_name })),
      primaryKey,
      foreignKeys,
      scope,
      fileColumns,
      selfReferences: foreignKeys.filter((f) => f.refTable === name).map((f) => f.column),
      sequenced: cols.filter((c) => c.is_identity === 'YES' || (c.column_default ?? '').startsWith('nextval(')).map((c) => c.column_name),
    };
  };

  const chosen = new Map<string, ArchivedTable>();
  chosen.set('productions', make('productions', { kind: 'production' }));
  for (const [name, cols] of byTable) {
    if (SKIP_ALWAYS.has(name) || name in NOT_ARCHIVED || chosen.has(name)) continue;
    if (cols.some((c) => c.column_name === 'production_id')) chosen.set(name, make(name, { kind: 'production-id' }));
  }
  // Tables that hang from archived tables by a not-null foreign key, until no more are found.
  for (let grew = true; grew; ) {
    grew = false;
    for (const [name, cols] of byTable) {
      if (SKIP_ALWAYS.has(name) || name in NOT_ARCHIVED || chosen.has(name)) continue;
      // Only a parent key that is never null says whose every row is (a nullable one would leave rows out).
      const parent = (fks.get(name) ?? []).find((f) => chosen.has(f.refTable) && f.refTable !== name && cols.find((c) => c.column_name === f.column)?.is_nullable === 'NO');
      if (!parent) continue;
      chosen.set(name, make(name, { kind: 'parent', column: parent.column, parent: parent.refTable }));
      grew = true;
    }
  }

  const tables = topologicalOrder([...chosen.values()]);
  const userReferences = tables.flatMap((t) => t.foreignKeys.filter((f) => f.refTable === 'users').map((f) => ({ table: t.name, column: f.column })));
  const userCols = (byTable.get('users') ?? []).filter((c) => (USER_COLUMNS as readonly string[]).includes(c.column_name));
  return { tables, users: { columns: userCols.map((c) => ({ name: c.column_name, type: c.udt_name })) }, userReferences };
}

/** Parents before children by the foreign keys between archived tables (self references aside). */
function topologicalOrder(tables: ArchivedTable[]): ArchivedTable[] {
  const names = new Set(tables.map((t) => t.name));
  const out: ArchivedTable[] = [];
  const done = new Set<string>();
  const visiting = new Set<string>();
  const visit = (t: ArchivedTable) => {
    if (done.has(t.name)) return;
    if (visiting.has(t.name)) throw new Error(`The foreign keys between ${[...visiting].join(', ')} form a cycle; an archive cannot order them.`);
    visiting.add(t.name);
    for (const f of t.foreignKeys) {
      if (f.refTable !== t.name && names.has(f.refTable)) visit(tables.find((x) => x.name === f.refTable)!);
    }
    visiting.delete(t.name);
    done.add(t.name);
    out.push(t);
  };
  for (const t of [...tables].sort((a, b) => a.name.localeCompare(b.name))) visit(t);
  return out;
}

/** The SQL condition choosing a table's rows of one production (binding: the production id). */
export function scopeSql(t: ArchivedTable, catalogue: Catalogue): string {
  if (t.scope.kind === 'production') return 'id = ?';
  if (t.scope.kind === 'production-id') return 'production_id = ?';
  const scope = t.scope;
  const parent = catalogue.tables.find((x) => x.name === scope.parent)!;
  const ref = t.foreignKeys.find((f) => f.column === scope.column)!;
  return `${quoteIdent(scope.column)} in (select ${quoteIdent(ref.refColumn)} from ${quoteIdent(parent.name)} where ${scopeSql(parent, catalogue)})`;
}

/** Each column as PostgreSQL's text of it; bytea columns as the mark of whether a file is there. */
function selectList(columns: ColumnInfo[], fileColumns: string[]): string {
  return columns
    .map((c) => (fileColumns.includes(c.name) ? `(${quoteIdent(c.name)} is not null) as ${quoteIdent(c.name)}` : `${quoteIdent(c.name)}::text as ${quoteIdent(c.name)}`))
    .join(', ');
}

/** Fixed text forms for the export's session: dates as ISO, times in UTC, doubles to their shortest exact digits. */
export async function setTextForms(trx: Knex.Transaction): Promise<void> {
  await trx.raw(`set local datestyle = 'ISO, YMD'`);
  await trx.raw(`set local timezone = 'UTC'`);
  await trx.raw(`set local intervalstyle = 'postgres'`);
  await trx.raw('set local extra_float_digits = 1');
}

export type TextRow = (string | boolean | null)[];

/** A table's rows of one production, ordered by primary key, as arrays of column text. */
export async function readRows(trx: Knex.Transaction, t: ArchivedTable, catalogue: Catalogue, productionId: string): Promise<TextRow[]> {
  const sql = `select ${selectList(t.columns, t.fileColumns)} from ${quoteIdent(t.name)} where ${scopeSql(t, catalogue)} order by ${t.primaryKey.map(quoteIdent).join(', ')}`;
  // Every scope has exactly one placeholder, at its innermost level.
  const res = await trx.raw(sql, [productionId]);
  return res.rows.map((r: Record<string, string | boolean | null>) => t.columns.map((c) => r[c.name]));
}

/** One stored file. */
export async function readFile(trx: Knex.Transaction, table: string, column: string, id: string): Promise<Buffer> {
  const row = await trx(table).where({ id }).first(column);
  return row[column] as Buffer;
}

/** The people the production's rows name, ordered by id. */
export async function readUsers(trx: Knex.Transaction, catalogue: Catalogue, productionId: string): Promise<TextRow[]> {
  const parts = catalogue.userReferences.map(({ table, column }) => {
    const t = catalogue.tables.find((x) => x.name === table)!;
    return `select ${quoteIdent(column)} as id from ${quoteIdent(table)} where ${scopeSql(t, catalogue)}`;
  });
  if (!parts.length) return [];
  const sql = `select ${selectList(catalogue.users.columns, [])} from users where id in (${parts.join(' union ')}) order by id`;
  const res = await trx.raw(sql, parts.map(() => productionId));
  return res.rows.map((r: Record<string, string | null>) => catalogue.users.columns.map((c) => r[c.name]));
}

/** The newest migration applied to this database: the archive's schema version. */
export async function schemaVersion(db: Knex): Promise<string> {
  const row = await db('knex_migrations').max<{ name: string }[]>('name as name').first();
  if (!row?.name) throw new Error('The database has no migrations applied.');
  return row.name;
}
