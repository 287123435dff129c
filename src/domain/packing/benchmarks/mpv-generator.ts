import type { MpvInstance } from './mpv-format.ts';

/**
 * The Martello–Pisinger–Vigo (2000) 3D bin-packing instance generator (classes 1–8), re-written from the
 * generator's rules (shared data README §3.1): a portable lrand48 clone with 32-bit halves, seed v + n.
 */
export class Lrand48 {
  private h: number;
  private l: number;
  constructor(seed: number) {
    this.h = seed >>> 0;
    this.l = 0x330e;
  }
  /** h = h·0xDEECE66D + l·0x5DEEC; l = l·0xE66D + 0xB; h += l >> 16; l &= 0xFFFF; returns h >> 1 (all mod 2³²). */
  next(): number {
    const h = (Math.imul(this.h, 0xdeece66d) + Math.imul(this.l, 0x5deec)) >>> 0;
    const l = (Math.imul(this.l, 0xe66d) + 0xb) >>> 0;
    this.h = (h + (l >>> 16)) >>> 0;
    this.l = l & 0xffff;
    return this.h >>> 1;
  }
  /** Uniform integer in [a, b]. */
  rint(a: number, b: number): number {
    return (this.next() % (b - a + 1)) + a;
  }
}

/** Bin side per class: 100, except 10 for class 6 and 40 for class 7. */
export const mpvBinSide = (cls: number): number => (cls === 6 ? 10 : cls === 7 ? 40 : 100);

/** Generates instance v (1…10) of class `cls` (1…8) with n items. */
export function generateMpv(cls: number, n: number, v: number): MpvInstance {
  if (!(cls >= 1 && cls <= 8)) throw new Error(`3D-BPP class must be 1…8 (got ${cls})`);
  const S = mpvBinSide(cls);
  const [W, H, D] = [S, S, S];
  const r = new Lrand48(v + n);
  const items: [number, number, number][] = [];
  const half = (x: number) => Math.floor(x / 2);
  const twoThirds = (x: number) => Math.floor((2 * x) / 3);
  for (let i = 0; i < n; i++) {
    if (cls >= 6) {
      const m = cls === 6 ? 10 : cls === 7 ? 35 : 100;
      const w = r.rint(1, m);
      const h = r.rint(1, m);
      const d = r.rint(1, m);
      items.push([w, h, d]);
      continue;
    }
    const t0 = r.rint(1, 10);
    const t = t0 <= 5 ? t0 : cls;
    let w: number;
    let h: number;
    let d: number;
    switch (t) {
      case 1:
        w = r.rint(1, half(W));
        h = r.rint(twoThirds(H), H);
        d = r.rint(twoThirds(D), D);
        break;
      case 2:
        w = r.rint(twoThirds(W), W);
        h = r.rint(1, half(H));
        d = r.rint(twoThirds(D), D);
        break;
      case 3:
        w = r.rint(twoThirds(W), W);
        h = r.rint(twoThirds(H), H);
        d = r.rint(1, half(D));
        break;
      case 4:
        w = r.rint(half(W), H); // the generator's code uses H here (equal to W in every class)
        h = r.rint(half(H), H);
        d = r.rint(half(D), D);
        break;
      default:
        w = r.rint(1, half(W));
        h = r.rint(1, half(H));
        d = r.rint(1, half(D));
    }
    items.push([w, h, d]);
  }
  return { bin: [W, H, D], items };
}
