/**
 * Small seeded pseudo-random generator (mulberry32, public domain): uniform numbers in [0, 1).
 * Used only to diversify the search; the same seed always gives the same sequence.
 */
export function seededRandom(seed: number): () => number {
  let a = (Math.floor(seed) ^ 0x9e3779b9) >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
