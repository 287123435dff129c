import type { Knex } from 'knex';
import { conflict, notFound } from './errors.ts';

/**
 * Optimistic concurrency for every editable record: the update applies only if the row still has
 * the version the client started from; otherwise 409 with the current record. Never a silent
 * overwrite.
 */
export async function updateVersioned<Row extends { version: number }>(
  db: Knex,
  table: string,
  where: Record<string, unknown>,
  expectedVersion: number,
  changes: Record<string, unknown>,
  what: string,
  present: (row: Row) => unknown = (r) => r,
): Promise<Row> {
  const [row] = (await db(table)
    .where({ ...where, version: expectedVersion })
    .update({ ...changes, version: db.raw('version + 1'), updated_at: db.fn.now() })
    .returning('*')) as Row[];
  if (row) return row;
  const current = (await db(table).where(where).first()) as Row | undefined;
  if (!current) throw notFound(what);
  throw conflict(present(current));
}
