import { describe, expect, it } from 'vitest';
import { proposeSplits, rng, type SplitAssembly, type SplitInput, type SplitPart, type SplitResult } from '../../../src/domain/split/index.ts';

type V3 = [number, number, number];

/** A random small machine: a tree of `n` assemblies with 0–3 parts each. */
function randomMachine(seed: number, n: number): { assemblies: SplitAssembly[]; parts: SplitPart[] } {
  const r = rng(seed);
  const assemblies: SplitAssembly[] = [];
  const parts: SplitPart[] = [];
  for (let i = 0; i < n; i++) {
    const parentId = i === 0 ? null : `A${Math.floor(r() * i)}`;
    assemblies.push({ id: `A${i}`, parentId, keepTogether: r() < 0.25 });
    const count = i === 0 ? Math.floor(r() * 2) : 1 + Math.floor(r() * 2);
    for (let k = 0; k < count; k++) {
      const min: V3 = [r() * 2000, r() * 1500, r() * 1000];
      const size: V3 = [100 + r() * 900, 100 + r() * 700, 100 + r() * 600];
      const max: V3 = [min[0] + size[0], min[1] + size[1], min[2] + size[2]];
      parts.push({ assemblyId: `A${i}`, massKg: 5 + Math.round(r() * 120), cogMm: [min[0] + r() * size[0], min[1] + r() * size[1], min[2] + r() * size[2]], bboxMinMm: min, bboxMaxMm: max });
    }
  }
  return { assemblies, parts };
}

/**
 * Independent brute-force oracle (written apart from the advisor): every combination of "divided"
 * flags over the dividable assemblies gives a frontier; every set partition of its units is tried;
 * the best by the written objective (sections, heaviest mass, Σ CoG-to-footprint-centre offset) wins.
 */
function oracle(input: SplitInput): { sections: number; heaviestKg: number; offsetSum: number } | undefined {
  const { assemblies, parts, limits } = input;
  const kids = new Map<string, string[]>();
  for (const a of assemblies) if (a.parentId) kids.set(a.parentId, [...(kids.get(a.parentId) ?? []), a.id]);
  const partsOf = (id: string) => parts.filter((p) => p.assemblyId === id);
  const subtreeParts = (id: string): SplitPart[] => [...partsOf(id), ...(kids.get(id) ?? []).flatMap(subtreeParts)];
  const dividable = assemblies.filter((a) => !a.keepTogether && (kids.get(a.id)?.length ?? 0) > 0).map((a) => a.id);
  const seen = new Set<string>();
  let best: { sections: number; heaviestKg: number; offsetSum: number } | undefined;
  const better = (a: typeof best, b: typeof best) =>
    !b || (a && (a.sections < b.sections || (a.sections === b.sections && (a.heaviestKg < b.heaviestKg - 1e-9 || (Math.abs(a.heaviestKg - b.heaviestKg) <= 1e-9 && a.offsetSum < b.offsetSum - 1e-9)))));
  for (let mask = 0; mask < 1 << dividable.length; mask++) {
    const divided = new Set(dividable.filter((_, i) => mask & (1 << i)));
    const units: SplitPart[][] = [];
    const walk = (id: string) => {
      if (!divided.has(id)) {
        const ps = subtreeParts(id);
        if (ps.length) units.push(ps);
        return;
      }
      if (partsOf(id).length) units.push(partsOf(id));
      for (const c of kids.get(id) ?? []) walk(c);
    };
    for (const a of assemblies) if (a.parentId === null) walk(a.id);
    const key = units.map((u) => u.map((p) => parts.indexOf(p)).join(',')).sort().join('|');
    if (seen.has(key)) continue;
    seen.add(key);
    // all set partitions of units
    const blocks: SplitPart[][] = [];
    const rec = (i: number) => {
      if (i === units.length) {
        let heaviest = 0;
        let offsets = 0;
        for (const b of blocks) {
          const m = b.reduce((s, p) => s + p.massKg, 0);
          const min = [0, 1, 2].map((k) => Math.min(...b.map((p) => p.bboxMinMm[k])));
          const max = [0, 1, 2].map((k) => Math.max(...b.map((p) => p.bboxMaxMm[k])));
          const size = [0, 1, 2].map((k) => max[k] - min[k]).sort((x, y) => x - y);
          const lim = limits.maxSectionSizeMm ? [...limits.maxSectionSizeMm].sort((x, y) => x - y) : undefined;
          if (m > limits.maxSectionMassKg * (1 + 1e-9)) return;
          if (lim && size.some((s, k) => s > lim[k])) return;
          const cx = b.reduce((s, p) => s + p.massKg * p.cogMm[0], 0) / m;
          const cy = b.reduce((s, p) => s + p.massKg * p.cogMm[1], 0) / m;
          heaviest = Math.max(heaviest, m);
          offsets += Math.hypot(cx - (min[0] + max[0]) / 2, cy - (min[1] + max[1]) / 2);
        }
        const cand = { sections: blocks.length, heaviestKg: heaviest, offsetSum: offsets };
        if (better(cand, best)) best = cand;
        return;
      }
      for (const b of blocks) {
        b.push(...units[i]);
        rec(i + 1);
        b.splice(b.length - units[i].length, units[i].length);
      }
      blocks.push([...units[i]]);
      rec(i + 1);
      blocks.pop();
    };
    rec(0);
  }
  return best;
}

/** Every part lands in exactly one section (checked through the sections' units). */
function checkCoverage(input: SplitInput, res: SplitResult) {
  const parentOf = new Map(input.assemblies.map((a) => [a.id, a.parentId]));
  for (const prop of res.proposals) {
    let total = 0;
    input.parts.forEach((p) => {
      let hits = 0;
      for (const s of prop.sections) {
        for (const u of s.units ?? []) {
          if (u.scope === 'own-parts' && u.assemblyId === p.assemblyId) hits++;
          if (u.scope === 'whole') {
            for (let a: string | null | undefined = p.assemblyId; a; a = parentOf.get(a)) if (a === u.assemblyId) hits++;
          }
        }
      }
      expect(hits).toBe(1);
      total += p.massKg;
    });
    expect(prop.sections.reduce((s, x) => s + x.massKg, 0)).toBeCloseTo(total, 6);
    for (const s of prop.sections) expect(s.massKg).toBeLessThanOrEqual(input.limits.maxSectionMassKg * (1 + 1e-9));
  }
}

describe('split advisor on small trees: proven best against exhaustive search', () => {
  it('matches the brute-force oracle on 150 random machines (exact mode)', () => {
    let compared = 0;
    for (let seed = 1; seed <= 150; seed++) {
      const m = randomMachine(seed, 3 + (seed % 4));
      const total = m.parts.reduce((s, p) => s + p.massKg, 0);
      const r = rng(seed * 7);
      const input: SplitInput = {
        ...m,
        limits: { maxSectionMassKg: Math.max(20, total * (0.25 + 0.6 * r())), maxSectionSizeMm: r() < 0.5 ? [2600, 1900, 1600] : undefined },
        options: { maxProposals: 3 },
      };
      const res = proposeSplits(input);
      const best = oracle(input);
      if (!best) {
        expect(res.proposals).toHaveLength(0);
        expect(res.infeasible.length).toBeGreaterThan(0);
        continue;
      }
      if (res.method !== 'exact') continue;
      compared++;
      const s = res.proposals[0].score!;
      expect(s.sections).toBe(best.sections);
      expect(s.heaviestKg).toBeCloseTo(best.heaviestKg, 6);
      expect(s.cogOffsetSumMm).toBeCloseTo(best.offsetSum, 6);
      checkCoverage(input, res);
      // proposals come best first
      for (let i = 1; i < res.proposals.length; i++) {
        const a = res.proposals[i - 1].score!, b = res.proposals[i].score!;
        expect(a.sections < b.sections || (a.sections === b.sections && a.heaviestKg <= b.heaviestKg + 1e-9)).toBe(true);
      }
    }
    expect(compared).toBeGreaterThan(60);
  });

  it('the heuristic finds the optimal section count on most small machines and is always valid', () => {
    let same = 0;
    let n = 0;
    for (let seed = 1; seed <= 80; seed++) {
      const m = randomMachine(seed, 4 + (seed % 3));
      const total = m.parts.reduce((s, p) => s + p.massKg, 0);
      const input: SplitInput = { ...m, limits: { maxSectionMassKg: Math.max(20, total * 0.4) }, options: { method: 'heuristic', maxIterations: 60, timeLimitMs: 10_000, seed } };
      const best = oracle(input);
      const res = proposeSplits(input);
      if (!best) continue;
      n++;
      expect(res.proposals[0].score!.sections).toBeGreaterThanOrEqual(best.sections);
      if (res.proposals[0].score!.sections === best.sections) same++;
      checkCoverage(input, res);
    }
    expect(same / n).toBeGreaterThan(0.9);
  });
});

describe('split advisor: rules', () => {
  const box = (x: number, l: number): Pick<SplitPart, 'bboxMinMm' | 'bboxMaxMm' | 'cogMm'> => ({ bboxMinMm: [x, 0, 0], bboxMaxMm: [x + l, 400, 400], cogMm: [x + l / 2, 200, 200] });
  it('names the keep-together assembly that makes it impossible, and by how much', () => {
    const res = proposeSplits({
      assemblies: [
        { id: 'machine', parentId: null, keepTogether: false },
        { id: 'DC', parentId: 'machine', keepTogether: true },
        { id: 'AC', parentId: 'machine', keepTogether: false },
      ],
      parts: [
        { assemblyId: 'DC', massKg: 420, ...box(0, 800) },
        { assemblyId: 'AC', massKg: 180, ...box(1000, 800) },
      ],
      limits: { maxSectionMassKg: 400 },
    });
    expect(res.proposals).toHaveLength(0);
    expect(res.infeasible).toHaveLength(1);
    expect(res.infeasible[0].assemblyId).toBe('DC');
    expect(res.infeasible[0].reason).toMatch(/20\.0 kg over the 400 kg/);
  });
  it('a long section fits the size limit turned on its side (any orientation)', () => {
    const res = proposeSplits({
      assemblies: [{ id: 'beam', parentId: null, keepTogether: true }],
      parts: [{ assemblyId: 'beam', massKg: 50, bboxMinMm: [0, 0, 0], bboxMaxMm: [2000, 500, 500], cogMm: [1000, 250, 250] }],
      limits: { maxSectionMassKg: 100, maxSectionSizeMm: [600, 2100, 600] },
    });
    expect(res.proposals[0].sections).toHaveLength(1);
    expect(res.proposals[0].sections[0].margins?.sizeMm).toEqual([100, 100, 100]);
  });
  it('adjacent-only assemblies share a section only with neighbours', () => {
    const base = {
      assemblies: [
        { id: 'm', parentId: null, keepTogether: false },
        { id: 'a', parentId: 'm', keepTogether: true },
        { id: 'b', parentId: 'm', keepTogether: true },
        { id: 'c', parentId: 'm', keepTogether: true },
      ],
      parts: [
        { assemblyId: 'a', massKg: 40, ...box(0, 300) },
        { assemblyId: 'b', massKg: 60, ...box(400, 300) },
        { assemblyId: 'c', massKg: 50, ...box(800, 300) },
      ],
      limits: { maxSectionMassKg: 100 },
    };
    // Without adjacency rules a + b (100 kg) and c: 2 sections, heaviest 100; or a + c (90) and b (60):
    // the objective picks heaviest 90. With a adjacent only to b, a may not join c.
    const free = proposeSplits(base);
    expect(free.proposals[0].sections.map((s) => s.assemblyIds.join('+'))).toEqual(['a+c', 'b']);
    const assemblies = base.assemblies.map((a) => (a.id === 'a' ? { ...a, adjacentOnly: true } : a));
    const adj = proposeSplits({ ...base, assemblies, options: { adjacency: [['a', 'b']] } });
    expect(adj.proposals[0].sections.map((s) => s.assemblyIds.join('+'))).toEqual(['a+b', 'c']);
  });
  it('is deterministic for a seed and iteration count (heuristic on a larger machine)', () => {
    const raw = randomMachine(99, 40);
    const m = { ...raw, assemblies: raw.assemblies.map((a) => ({ ...a, keepTogether: false })) };
    const input: SplitInput = { ...m, limits: { maxSectionMassKg: 300 }, options: { seed: 5, maxIterations: 50, timeLimitMs: 60_000 } };
    const a = proposeSplits(input);
    const b = proposeSplits(input);
    expect(a.method).toBe('heuristic');
    expect(a.proposals.length).toBeGreaterThan(0);
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
    checkCoverage(input, a);
  });
  it('bad input names the row', () => {
    const res = proposeSplits({ assemblies: [{ id: 'x', parentId: 'ghost', keepTogether: false }], parts: [], limits: { maxSectionMassKg: 10 } });
    expect(res.infeasible[0].reason).toMatch(/parent ghost/);
    expect(proposeSplits({ assemblies: [], parts: [], limits: { maxSectionMassKg: 0 } }).infeasible[0].reason).toMatch(/maxSectionMassKg/);
  });
});
