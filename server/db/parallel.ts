import type { Knex } from 'knex';

/**
 * Runs independent reads together on the pool (each takes a connection of its own) and one after another
 * on a transaction, whose single connection takes one query at a time: node-postgres queues a second query
 * on a busy connection today, with a deprecation warning, and will refuse it from version 9. Each task is
 * a function so that nothing starts before its turn.
 */
export async function allQueries<T extends readonly unknown[] | []>(db: Knex, tasks: { [K in keyof T]: () => PromiseLike<T[K]> }): Promise<{ -readonly [K in keyof T]: Awaited<T[K]> }> {
  const list = tasks as unknown as (() => PromiseLike<unknown>)[];
  if (!(db as Knex.Transaction).isTransaction) return (await Promise.all(list.map((t) => t()))) as { -readonly [K in keyof T]: Awaited<T[K]> };
  const out: unknown[] = [];
  for (const t of list) out.push(await t());
  return out as { -readonly [K in keyof T]: Awaited<T[K]> };
}
