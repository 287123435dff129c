import type { Knex } from 'knex';

/**
 * Caching of figures computed from a production's machine breakdown (mass properties, the breakdown's
 * order), safe with several app servers sharing one database.
 *
 * Each cached value is stored with a fingerprint of the rows it was computed from: per table, the row
 * count and the sum of the rows' `xmin` (the id of the transaction that wrote each row version).
 * Any committed insert, update or delete changes it: an insert raises the count, a delete lowers the count
 * or (with inserts in the same transaction) replaces old xmins by the newer transaction's, and an update
 * replaces a row version's xmin by a newer one. So a value is served only while its rows are exactly as
 * they were, whichever server wrote them. The fingerprint is read before the rows, so a value may be newer
 * than its fingerprint, never older. (VACUUM FREEZE shows frozen rows' xmin as 2: that only makes a
 * fingerprint change without a write, a recomputation.) Reading the fingerprint costs one query over the
 * production's rows that returns one short string; computing the figures reads every row and runs the core.
 *
 * Why not a revision counter bumped by triggers, or NOTIFY: both make every write in a production (or, for
 * NOTIFY, in the database) wait for the previous writer's commit to reach the disk, which the load benchmark
 * would feel in every save.
 */

/** The tables a machine breakdown is read from, each with a `production_id` column. */
export const MACHINE_TABLES = ['machines', 'machine_sections', 'machine_assemblies', 'machine_part_lines', 'machine_part_instances', 'machine_section_add_ons', 'machine_weighings'] as const;
export type MachineTable = (typeof MACHINE_TABLES)[number];

/** One short string that changes whenever any row of these tables in this production changes. */
export async function machineFingerprint(db: Knex, productionId: string, tables: readonly MachineTable[] = MACHINE_TABLES): Promise<string> {
  const parts = tables.map((t) => `(select count(*) || ':' || coalesce(sum(xmin::text::bigint), 0) from ${t} where production_id = :p)`);
  const { rows } = (await db.raw(`select concat_ws('/', ${parts.join(', ')}) as fp`, { p: productionId })) as { rows: { fp: string }[] };
  return rows[0].fp;
}

/**
 * A small per-process cache of values by key, each valid for one fingerprint. Concurrent requests for the
 * same key and fingerprint share one computation. At most `maxEntries` keys are kept (least recently used
 * go first). Values are deep-frozen: a caller that tried to change a shared value would fail loudly.
 */
export class FingerprintCache<T> {
  private readonly entries = new Map<string, { fingerprint: string; value: Promise<T> }>();

  constructor(private readonly maxEntries: number) {}

  async get(key: string, fingerprint: string, compute: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(key);
    if (hit && hit.fingerprint === fingerprint) {
      // Most recently used last.
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit.value;
    }
    const value = compute().then(deepFreeze);
    const entry = { fingerprint, value };
    this.entries.delete(key);
    this.entries.set(key, entry);
    while (this.entries.size > this.maxEntries) this.entries.delete(this.entries.keys().next().value!);
    // A failed computation is not kept.
    value.catch(() => {
      if (this.entries.get(key) === entry) this.entries.delete(key);
    });
    return value;
  }

  clear(): void {
    this.entries.clear();
  }
}

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    if (value instanceof Map) for (const v of value.values()) deepFreeze(v);
    else for (const v of Object.values(value)) deepFreeze(v);
  }
  return value;
}

/** One cache per database handle (one per app), so apps in one process (tests) never share values. */
export function cacheFor<T>(registry: WeakMap<Knex, FingerprintCache<T>>, db: Knex, maxEntries: number): FingerprintCache<T> {
  let c = registry.get(db);
  if (!c) {
    c = new FingerprintCache<T>(maxEntries);
    registry.set(db, c);
  }
  return c;
}
