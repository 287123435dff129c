import type { PackContainer, PackItem, VerticalAxis } from '../types.ts';

/**
 * Reader for the OR-Library "thpack" text format used by the BR container-loading instances:
 * `P`, then per problem `p seed` (thpack1–7, BR0–15) or `p` (thpack8–9), `L W H`, `n`, and n lines
 * `i l fl w fw h fh q` where each 0/1 flag says whether that dimension may stand vertical.
 */

export interface ThpackBoxType {
  id: number;
  dims: [number, number, number];
  /** Whether each of dims may be vertical. */
  vertical: [boolean, boolean, boolean];
  quantity: number;
}

export interface ThpackInstance {
  problem: number;
  /** Generator seed; absent in files without a seed field. */
  seed?: number;
  container: [number, number, number];
  boxes: ThpackBoxType[];
  /** Lines that could not be read (e.g. a box line with 7 of 8 fields); the rest of the problem is kept. */
  warnings: string[];
}

export function parseThpack(text: string): ThpackInstance[] {
  const lines = text.split(/\r?\n/).map((l) => l.trim()).filter((l) => l.length > 0).map((l) => l.split(/\s+/).map(Number));
  let k = 0;
  const next = (): number[] => {
    if (k >= lines.length) throw new Error(`thpack: unexpected end of file after line ${k}`);
    return lines[k++];
  };
  const count = next()[0];
  const out: ThpackInstance[] = [];
  for (let p = 0; p < count; p++) {
    const head = next();
    const size = next();
    if (size.length !== 3) throw new Error(`thpack problem ${head[0]}: container line must have 3 numbers, got "${size.join(' ')}"`);
    const n = next()[0];
    const boxes: ThpackBoxType[] = [];
    const warnings: string[] = [];
    for (let i = 0; i < n; i++) {
      const f = next();
      if (f.length !== 8 || f.some((v) => !Number.isFinite(v))) {
        warnings.push(`problem ${head[0]}, box line ${i + 1}: expected 8 numbers, got ${f.length} ("${f.join(' ')}")`);
        continue;
      }
      boxes.push({ id: f[0], dims: [f[1], f[3], f[5]], vertical: [f[2] === 1, f[4] === 1, f[6] === 1], quantity: f[7] });
    }
    out.push({ problem: head[0], seed: head.length > 1 ? head[1] : undefined, container: [size[0], size[1], size[2]], boxes, warnings });
  }
  return out;
}

/** The instance as packing-engine input: x = first container size, vertical flags as verticalAxes. */
export function thpackToPackInput(inst: ThpackInstance): { container: PackContainer; items: PackItem[] } {
  const names: VerticalAxis[] = ['length', 'width', 'height'];
  return {
    container: { lengthMm: inst.container[0], widthMm: inst.container[1], heightMm: inst.container[2] },
    items: inst.boxes.map((b) => ({
      id: `${inst.problem}-${b.id}`,
      lengthMm: b.dims[0],
      widthMm: b.dims[1],
      heightMm: b.dims[2],
      quantity: b.quantity,
      orientation: 'any' as const,
      verticalAxes: names.filter((_, j) => b.vertical[j]),
    })),
  };
}
