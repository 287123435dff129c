import type { BreakdownLine, DiffableField } from '../contracts/breakdown.ts';

/** A diff that keeps the caller's line types (e.g. existing lines carry their database id). */
export interface TypedBreakdownDiff<T extends BreakdownLine, U extends BreakdownLine> {
  added: U[];
  changed: { key: { assemblyNumber: string | null; partNumber: string }; before: T; after: U; fields: DiffableField[] }[];
  removed: T[];
  unchangedCount: number;
}

/** All the fields a diff compares by default. */
export const DIFFABLE_FIELDS: readonly DiffableField[] = [
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
];

/** Numbers equal to 1e-9 relative (unit conversions on the way out and back in leave float noise). */
function sameNumber(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (a === null || b === null || a === undefined || b === undefined) return false;
  if (typeof a === 'number' && typeof b === 'number') return sameNumber(a, b);
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => sameValue(x, b[i]));
  if (typeof a === 'object' && typeof b === 'object') {
    const ka = Object.keys(a as object);
    return ka.length === Object.keys(b as object).length && ka.every((k) => sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
  }
  return false;
}

/** The identity of a line: its part number within its assembly. */
export function lineKeyOf(l: { assemblyNumber: string | null; partNumber: string }): string {
  return `${l.assemblyNumber ?? ''}\u0000${l.partNumber}`;
}

/**
 * What re-importing `incoming` over `existing` would do: lines added, changed (naming the fields that differ)
 * and removed, matched by (assembly number, part number). Compare only the fields the import carries
 * (`importedFields` of the import result) so that data entered in Ballast and absent from the file (a CoG set
 * on screen, say) is neither reported as changed nor wiped. The caller applies the whole diff in one
 * transaction, or none of it.
 * @throws when either list holds the same (assembly, part number) twice, naming it.
 */
export function diffBreakdown<T extends BreakdownLine, U extends BreakdownLine>(
  existing: readonly T[],
  incoming: readonly U[],
  options: { fields?: readonly string[] } = {},
): TypedBreakdownDiff<T, U> {
  const fields = options.fields ? DIFFABLE_FIELDS.filter((f) => options.fields!.includes(f)) : DIFFABLE_FIELDS;
  const index = <L extends BreakdownLine>(ls: readonly L[], what: string): Map<string, L> => {
    const m = new Map<string, L>();
    for (const l of ls) {
      const k = lineKeyOf(l);
      if (m.has(k)) throw new Error(`${what} has part number "${l.partNumber}" twice in ${l.assemblyNumber ? `assembly "${l.assemblyNumber}"` : 'the machine (no assembly)'}.`);
      m.set(k, l);
    }
    return m;
  };
  const before = index(existing, 'The existing breakdown');
  const after = index(incoming, 'The incoming list');
  const added: U[] = [];
  const removed: T[] = [];
  const changed: TypedBreakdownDiff<T, U>['changed'] = [];
  let unchangedCount = 0;
  for (const [k, a] of after) {
    const b = before.get(k);
    if (!b) {
      added.push(a);
      continue;
    }
    const diff = fields.filter((f) => !sameValue(b[f], a[f]));
    if (diff.length === 0) unchangedCount++;
    else changed.push({ key: { assemblyNumber: a.assemblyNumber, partNumber: a.partNumber }, before: b, after: a, fields: diff });
  }
  for (const [k, b] of before) if (!after.has(k)) removed.push(b);
  return { added, changed, removed, unchangedCount };
}
