import type { Knex } from 'knex';

/**
 * Caching of computed views (mass properties, the breakdown's order and pages, venue manifests), safe with
 * several app servers sharing one database.
 *
 * Each cached value is stored with the fingerprint of the data it was computed from: the production's row
 * of that scope in production_revisions, whose revision PostgreSQL raises when any transaction that wrote a
 * row of the scope's tables commits (migration create-production-revisions: deferred triggers, so whoever
 * wrote it, whichever server, and also a write straight into the database). The fingerprint also holds the
 * row version's xmin (the id of the transaction that wrote it), so a revision row deleted and made again
 * never repeats an old fingerprint. The fingerprint is read before the rows and a commit raises the
 * revision atomically with its rows, so a value may be newer than its fingerprint, never older. Reading it
 * is one primary-key lookup; computing a view reads every row it needs and runs the core.
 */

export type RevisionScope = 'machine' | 'tour';

/** One short string that changes whenever any row of the production's data of this scope changes. */
export async function revisionFingerprint(db: Knex, productionId: string, scope: RevisionScope): Promise<string> {
  const row = (await db('production_revisions').where({ production_id: productionId, scope }).first(db.raw('revision::text as revision'), db.raw('xmin::text as xmin'))) as
    | { revision: string; xmin: string }
    | undefined;
  // No row: nothing of this scope was ever written for this production (or the production is gone).
  return row ? `${row.revision}@${row.xmin}` : 'none';
}

/** The fingerprint of a production's machine breakdown. */
export const machineFingerprint = (db: Knex, productionId: string): Promise<string> => revisionFingerprint(db, productionId, 'machine');

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
