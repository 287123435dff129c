import { describe, expect, it } from 'vitest';
import { pickPointLoadsKg, verticalPickLoadsKg } from '../../../src/domain/lifting/pick-point-loads.ts';
import { hangingEquilibrium } from '../../../src/domain/lifting/hanging-equilibrium.ts';
import { cross, length, sub, type Vec3 } from '../../../src/domain/geometry/vec3.ts';

// A small deterministic random source so property tests are repeatable.
function rng(seed: number) {
  let s = seed;
  return () => (s = (s * 16807) % 2147483647) / 2147483647;
}

// Independent oracle for 3 × 3 systems: Cramer's rule (determinants), not elimination.
function det3(m: number[][]): number {
  return (
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) -
    m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) +
    m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0])
  );
}
function cramer(m: number[][], b: number[]): number[] {
  const d = det3(m);
  return [0, 1, 2].map((k) => det3(m.map((row, i) => row.map((v, j) => (j === k ? b[i] : v)))) / d);
}
// Independent oracle for vertical 3-point shares: barycentric coordinates from signed triangle areas.
function area(a: number[], b: number[], c: number[]): number {
  return ((b[0] - a[0]) * (c[1] - a[1]) - (c[0] - a[0]) * (b[1] - a[1])) / 2;
}

describe('verticalPickLoadsKg', () => {
  it('two-point pick: W 10,000 lb, CoG 2 ft from B and 8 ft from A → B 8,000 lb, A 2,000 lb [PUB-2 sling maker page; statics]', () => {
    const ftMm = 304.8;
    const [a, b] = verticalPickLoadsKg({ loadKg: 10000, cogMm: [8 * ftMm, 0, 0], pickPointsMm: [[0, 0, 0], [10 * ftMm, 0, 0]] });
    expect(a).toBeCloseTo(2000, 6);
    expect(b).toBeCloseTo(8000, 6);
  });

  it('three points: shares equal the barycentric coordinates from triangle areas (independent oracle), random cases', () => {
    const r = rng(11);
    for (let n = 0; n < 200; n++) {
      const p: [number, number, number][] = [0, 1, 2].map(() => [r() * 4000 - 2000, r() * 4000 - 2000, r() * 500]);
      const A = area(p[0], p[1], p[2]);
      if (Math.abs(A) < 1e5) continue;
      const w = [r(), r(), r()];
      const s = w[0] + w[1] + w[2];
      const cog: [number, number, number] = [0, 1, 2].map((k) => (w[0] * p[0][k] + w[1] * p[1][k] + w[2] * p[2][k]) / s) as [number, number, number];
      const W = 100 + r() * 5000;
      const f = verticalPickLoadsKg({ loadKg: W, cogMm: cog, pickPointsMm: p });
      const oracle = [area(cog, p[1], p[2]) / A, area(p[0], cog, p[2]) / A, area(p[0], p[1], cog) / A].map((x) => x * W);
      f.forEach((v, i) => expect(v).toBeCloseTo(oracle[i], 6));
      // Properties: sum equals the load; moments about the CoG vanish.
      expect(f[0] + f[1] + f[2]).toBeCloseTo(W, 6);
      const mx = f.reduce((acc, fi, i) => acc + fi * (p[i][1] - cog[1]), 0);
      const my = f.reduce((acc, fi, i) => acc + fi * (p[i][0] - cog[0]), 0);
      expect(Math.abs(mx) / (W * 1000)).toBeLessThan(1e-9);
      expect(Math.abs(my) / (W * 1000)).toBeLessThan(1e-9);
    }
  });

  it('a CoG outside the pick points in plan is refused, naming the problem', () => {
    expect(() => verticalPickLoadsKg({ loadKg: 100, cogMm: [1200, 0, 0], pickPointsMm: [[0, 0, 0], [1000, 0, 0]] })).toThrow(/do not surround the CoG/);
    expect(() => verticalPickLoadsKg({ loadKg: 100, cogMm: [0, 0, 0], pickPointsMm: [[0, 0, 0], [1, 1, 0], [2, 2, 0]] })).toThrow(/one line/);
    expect(() => verticalPickLoadsKg({ loadKg: 100, cogMm: [0, 0, 0], pickPointsMm: [[0, 0, 0], [1, 0, 0], [0, 1, 0], [1, 1, 0]] })).toThrow(/indeterminate/);
  });
});

describe('pickPointLoadsKg (one hook)', () => {
  it('two symmetric legs at 60° carry W/(2 sin 60°) each: 1000 → 577.35 [PUB-2 NAVEDTRA 14080; COMP]', () => {
    const half = 1000;
    const hookZ = half * Math.tan(Math.PI / 3);
    const t = pickPointLoadsKg({ loadKg: 1000, cogMm: [0, 0, 0], pickPointsMm: [[-half, 0, 0], [half, 0, 0]], hookMm: [0, 0, hookZ] });
    expect(t[0]).toBeCloseTo(577.35, 2);
    expect(t[1]).toBeCloseTo(577.35, 2);
  });

  it('three points: matches Cramer\'s rule on Σ Tᵢuᵢ = Wẑ (independent oracle); property: vertical components sum to W, moments about the CoG balance', () => {
    const r = rng(5);
    let checked = 0;
    for (let n = 0; n < 300; n++) {
      const p: Vec3[] = [0, 1, 2].map(() => [r() * 3000 - 1500, r() * 3000 - 1500, r() * 400] as Vec3);
      if (Math.abs(area(p[0], p[1], p[2])) < 2e5) continue;
      const w = [r() + 0.05, r() + 0.05, r() + 0.05];
      const s = w[0] + w[1] + w[2];
      const cog = [0, 1, 2].map((k) => (w[0] * p[0][k] + w[1] * p[1][k] + w[2] * p[2][k]) / s) as Vec3;
      cog[2] = -200 + r() * 300;
      const hook: Vec3 = [cog[0], cog[1], 600 + r() * 3000];
      const W = 50 + r() * 3000;
      const t = pickPointLoadsKg({ loadKg: W, cogMm: cog, pickPointsMm: p, hookMm: hook });
      const u = p.map((pi) => {
        const d = sub(hook, pi);
        const l = length(d);
        return [d[0] / l, d[1] / l, d[2] / l];
      });
      const oracle = cramer([[u[0][0], u[1][0], u[2][0]], [u[0][1], u[1][1], u[2][1]], [u[0][2], u[1][2], u[2][2]]], [0, 0, W]);
      t.forEach((v, i) => expect(v).toBeCloseTo(oracle[i], 5));
      expect(t.reduce((a, ti, i) => a + ti * u[i][2], 0)).toBeCloseTo(W, 6);
      const m = t.reduce<Vec3>((acc, ti, i) => {
        const f: Vec3 = [ti * u[i][0], ti * u[i][1], ti * u[i][2]];
        const c = cross(sub(p[i], cog), f);
        return [acc[0] + c[0], acc[1] + c[1], acc[2] + c[2]];
      }, [0, 0, 0]);
      expect(length(m) / (W * 1000)).toBeLessThan(1e-9);
      checked++;
    }
    expect(checked).toBeGreaterThan(100);
  });

  it('refuses a hook not plumb above the CoG, a hook below a pick point, and a CoG outside the pick points', () => {
    const pts: [number, number, number][] = [[-1000, 0, 0], [1000, 0, 0]];
    expect(() => pickPointLoadsKg({ loadKg: 100, cogMm: [0, 0, 0], pickPointsMm: pts, hookMm: [50, 0, 2000] })).toThrow(/plumb above the CoG/);
    expect(() => pickPointLoadsKg({ loadKg: 100, cogMm: [0, 0, -500], pickPointsMm: pts, hookMm: [0, 0, -100] })).toThrow(/not above pick point/);
    expect(() => pickPointLoadsKg({ loadKg: 100, cogMm: [1500, 0, 0], pickPointsMm: pts, hookMm: [1500, 0, 2000] })).toThrow(/do not surround/);
    expect(() => pickPointLoadsKg({ loadKg: 100, cogMm: [0, 300, 0], pickPointsMm: pts, hookMm: [0, 300, 2000] })).toThrow(/off the line/);
  });
});

describe('hangingEquilibrium (one hook, slings of given lengths)', () => {
  it('equal slings on a symmetric load: no tilt, hook above the CoG, tensions as the bridle formula', () => {
    const r = hangingEquilibrium({ loadKg: 1000, cogMm: [0, 0, 0], pickPointsMm: [[-1000, 0, 0], [1000, 0, 0]], slingLengthsMm: [2000, 2000] });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.result.tiltDeg).toBeCloseTo(0, 9);
    expect(r.result.hookAboveCogMm).toBeCloseTo(Math.sqrt(3) * 1000, 6);
    r.result.legAnglesFromHorizontalDeg.forEach((a) => expect(a).toBeCloseTo(60, 9));
    r.result.tensionsKg!.forEach((t) => expect(t).toBeCloseTo(577.35, 2));
  });

  it('unequal slings: the tilt matches a hand solution by the law of cosines in the vertical plane [COMP]', () => {
    // Bar with pick points at x = ±1000 mm, CoG midway and 0 mm below. Slings 1800 and 2200 mm.
    const L1 = 1800;
    const L2 = 2200;
    const r = hangingEquilibrium({ loadKg: 500, cogMm: [0, 0, 0], pickPointsMm: [[-1000, 0, 0], [1000, 0, 0]], slingLengthsMm: [L1, L2] });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // Hand solution: the hook is where circles of radii L1, L2 about the pick points meet.
    const x = (L1 * L1 - L2 * L2) / (2 * 2000); // from the midpoint along the bar
    const z = Math.sqrt(L1 * L1 - (x + 1000) ** 2);
    const tilt = (Math.atan2(Math.abs(x), z) * 180) / Math.PI;
    expect(r.result.tiltDeg).toBeCloseTo(tilt, 6);
    expect(r.result.hookInLoadMm[0]).toBeCloseTo(x, 6);
    // Longer sling side hangs lower: pick point B (x = +1000) ends lower in the world than A.
    expect(r.result.world.pickPointsMm[1][2]).toBeLessThan(r.result.world.pickPointsMm[0][2]);
    // Both taut, tensions balance the weight, hook plumb above the CoG in the world.
    expect(r.result.taut).toEqual([true, true]);
    expect(r.result.world.hookMm[0]).toBeCloseTo(0, 9);
  });

  it('a much longer sling goes slack and the load hangs from the other', () => {
    const r = hangingEquilibrium({ loadKg: 300, cogMm: [0, 0, 0], pickPointsMm: [[-1000, 0, 0], [1000, 0, 0]], slingLengthsMm: [1000, 5000] });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.result.taut).toEqual([true, false]);
    expect(r.result.tensionsKg![0]).toBeCloseTo(300, 6);
    expect(r.result.tensionsKg![1]).toBe(0);
  });

  it('slings too short to span their pick points are named', () => {
    const r = hangingEquilibrium({ loadKg: 300, cogMm: [0, 0, 0], pickPointsMm: [[-1000, 0, 0], [1000, 0, 0]], slingLengthsMm: [900, 900] });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0]).toMatch(/Slings 1 and 2.*shorter than the 2000 mm/);
  });

  it('brute force: no point inside every sling\'s reach is farther from the CoG than the hook found; forces and moments balance (random 3-sling cases)', () => {
    const r = rng(3);
    let feasibleSamples = 0;
    for (let n = 0; n < 60; n++) {
      const p: Vec3[] = [0, 1, 2].map(() => [r() * 2000 - 1000, r() * 2000 - 1000, r() * 300] as Vec3);
      const cog: Vec3 = [(p[0][0] + p[1][0] + p[2][0]) / 3 + (r() - 0.5) * 300, (p[0][1] + p[1][1] + p[2][1]) / 3 + (r() - 0.5) * 300, -200];
      const L = p.map((pi) => length(sub(pi, [cog[0], cog[1], 2000])) * (0.9 + 0.2 * r()));
      const out = hangingEquilibrium({ loadKg: 1000, cogMm: cog, pickPointsMm: p, slingLengthsMm: L });
      expect(out.ok).toBe(true);
      if (!out.ok) continue;
      const h = out.result.hookInLoadMm;
      const best = length(sub(h, cog));
      // Sample the feasible set around the solution and at random: none beats it.
      for (let k = 0; k < 400; k++) {
        const q: Vec3 = [h[0] + (r() - 0.5) * 400, h[1] + (r() - 0.5) * 400, h[2] + (r() - 0.5) * 400];
        if (p.every((pi, i) => length(sub(q, pi)) <= L[i])) {
          feasibleSamples++;
          expect(length(sub(q, cog))).toBeLessThanOrEqual(best + 1e-6);
        }
      }
      // Statics at rest (load frame): Σ Tᵢuᵢ = W·up, and moments about the CoG vanish.
      const T = out.result.tensionsKg!;
      const up = out.result.upInLoad;
      const F = [0, 1, 2].map((d) => T.reduce((a, t, i) => a + t * out.result.legDirectionsInLoad[i][d], 0));
      F.forEach((f, d) => expect(f).toBeCloseTo(1000 * up[d], 5));
      const M = T.reduce<Vec3>((acc, t, i) => {
        const u = out.result.legDirectionsInLoad[i];
        const c = cross(sub(p[i], cog), [t * u[0], t * u[1], t * u[2]]);
        return [acc[0] + c[0], acc[1] + c[1], acc[2] + c[2]];
      }, [0, 0, 0]);
      // The weight acts at the CoG, so leg moments about the CoG must vanish by themselves.
      expect(length(M) / (1000 * 1000)).toBeLessThan(1e-7);
      T.forEach((t) => expect(t).toBeGreaterThanOrEqual(0));
    }
    expect(feasibleSamples).toBeGreaterThan(1000);
  });

  it('with three equal-length slings whose lengths fit the hook plumb above the CoG, tensions equal pickPointLoadsKg', () => {
    const p: [number, number, number][] = [[-1000, -600, 0], [1200, -500, 0], [100, 900, 0]];
    const cog: [number, number, number] = [80, -40, -300];
    const hook: [number, number, number] = [cog[0], cog[1], 1800];
    const L = p.map((pi) => length(sub(hook, pi)));
    const out = hangingEquilibrium({ loadKg: 800, cogMm: cog, pickPointsMm: p, slingLengthsMm: L });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.result.tiltDeg).toBeLessThan(1e-6);
    const t = pickPointLoadsKg({ loadKg: 800, cogMm: cog, pickPointsMm: p, hookMm: hook });
    out.result.tensionsKg!.forEach((v, i) => expect(v).toBeCloseTo(t[i], 5));
  });
});
