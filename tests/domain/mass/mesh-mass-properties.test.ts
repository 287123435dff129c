import { describe, expect, it } from 'vitest';
import { meshMassProperties, rotationFromEulerZyxDeg, rotateTensor, shiftFromCog } from '../../../src/domain/mass/index.ts';
import { cuboid, flatten, prism, reverseWinding, tetrahedron, transform, uvSphere, type V3 } from './mesh-builders.ts';

const close = (a: number, b: number, rel: number, abs = 0): void => {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(Math.max(abs, rel * Math.abs(b)));
};

/**
 * Independent oracle: split the solid into tetrahedra from the origin and add their covariance matrices,
 * C = det/120 · (Σ vᵢvᵢᵀ + s sᵀ) with s = Σ vᵢ (J. Blow and A. Binstock, "How to find the inertia tensor
 * (or other mass properties) of a 3D solid body represented by a triangle mesh", 2004; the canonical
 * tetrahedron's covariance is the Dirichlet simplex integral ∫xᵃyᵇzᶜ = a!b!c!/(a+b+c+3)!) [COMP].
 * A different formula from the one under test (Eberly's per-axis subexpressions); density 1 kg/mm³ ≙ 1e9 kg/m³.
 */
function oracle(t: ArrayLike<number>): { volume: number; cog: V3; inertia: number[][] } {
  let vol = 0;
  const mc = [0, 0, 0];
  const C = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  for (let k = 0; k < t.length; k += 9) {
    const v = [0, 1, 2].map((c) => [t[k + 3 * c], t[k + 3 * c + 1], t[k + 3 * c + 2]]);
    const det =
      v[0][0] * (v[1][1] * v[2][2] - v[1][2] * v[2][1]) - v[0][1] * (v[1][0] * v[2][2] - v[1][2] * v[2][0]) + v[0][2] * (v[1][0] * v[2][1] - v[1][1] * v[2][0]);
    const s = [0, 1, 2].map((i) => v[0][i] + v[1][i] + v[2][i]);
    vol += det / 6;
    for (let i = 0; i < 3; i++) mc[i] += (det / 24) * s[i];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) C[i][j] += (det / 120) * (v[0][i] * v[0][j] + v[1][i] * v[1][j] + v[2][i] * v[2][j] + s[i] * s[j]);
  }
  const cog = mc.map((x) => x / vol) as V3;
  // Covariance about the CoG, then I = tr(C) E − C.
  const Cc = C.map((row, i) => row.map((x, j) => x - vol * cog[i] * cog[j]));
  const tr = Cc[0][0] + Cc[1][1] + Cc[2][2];
  const inertia = Cc.map((row, i) => row.map((x, j) => (i === j ? tr - x : -x)));
  return { volume: vol, cog, inertia };
}

const RHO_UNIT = 1e9; // kg/m³, i.e. 1 kg/mm³, so that massKg = volumeMm3 and inertia is the pure geometric integral

describe('meshMassProperties: analytic primitives (any statics handbook)', () => {
  it('cuboid a×b×c: V = abc, CoG at the centre, I = m(b²+c²)/12 … [PUB-2 handbook formula]', () => {
    const [a, b, c] = [400, 250, 120];
    const at: V3 = [1200, -300, 50];
    const r = meshMassProperties(cuboid(a, b, c, at), 7850);
    const m = a * b * c * 1e-9 * 7850; // 94.2 kg
    close(r.volumeMm3, a * b * c, 1e-12);
    close(r.massKg, m, 1e-12);
    r.cogMm.forEach((v, i) => close(v, at[i] + [a, b, c][i] / 2, 1e-12));
    close(r.inertiaKgMm2[0][0], (m * (b * b + c * c)) / 12, 1e-10);
    close(r.inertiaKgMm2[1][1], (m * (a * a + c * c)) / 12, 1e-10);
    close(r.inertiaKgMm2[2][2], (m * (a * a + b * b)) / 12, 1e-10);
    for (const [i, j] of [[0, 1], [1, 2], [0, 2]]) expect(Math.abs(r.inertiaKgMm2[i][j])).toBeLessThan(1e-6);
    expect(r.flipped).toBe(false);
    expect(r.bboxMm).toEqual({ minMm: at, maxMm: [at[0] + a, at[1] + b, at[2] + c] });
    close(r.surfaceAreaMm2 as number, 2 * (a * b + b * c + a * c), 1e-12);
  });

  it('keeps its precision for a small part far from the origin (inertia is taken about the box centre)', () => {
    const near = meshMassProperties(cuboid(10, 20, 30), 1000);
    const far = meshMassProperties(cuboid(10, 20, 30, [5e6, -7e6, 3e6]), 1000);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(far.inertiaKgMm2[i][j] - near.inertiaKgMm2[i][j])).toBeLessThan(1e-9 * near.inertiaKgMm2[0][0]);
  });

  it('unit tetrahedron: V = 1/6, CoG (¼, ¼, ¼), Ixx = 1/80, Ixy = +1/480 about the CoG [COMP: Dirichlet ∫x² = 2!/5!, ∫xy = 1/5!]', () => {
    const r = meshMassProperties(tetrahedron([0, 0, 0], [1, 0, 0], [0, 1, 0], [0, 0, 1]), RHO_UNIT);
    close(r.volumeMm3, 1 / 6, 1e-13);
    r.cogMm.forEach((v) => close(v, 0.25, 1e-13));
    // ∫(y²+z²) = 2/60 about the origin; minus V·(2/16) to the CoG = 1/30 − 1/48 = 1/80.
    for (let i = 0; i < 3; i++) close(r.inertiaKgMm2[i][i], 1 / 80, 1e-12);
    // Off-diagonal = −(∫xy − V x̄ȳ) = −(1/120 − 1/96) = +1/480.
    close(r.inertiaKgMm2[0][1], 1 / 480, 1e-12);
    close(r.inertiaKgMm2[1][2], 1 / 480, 1e-12);
    close(r.inertiaKgMm2[0][2], 1 / 480, 1e-12);
  });

  it("Tonon's numerical example tetrahedron [PUB-2: F. Tonon, 'Explicit Exact Formulas for the 3-D Tetrahedron Inertia Tensor in Terms of its Vertex Coordinates', J. Math. Stat. 1(1):8–11, 2004, values as reproduced in several open test suites]", () => {
    const t = tetrahedron([8.3322, -11.86875, 0.93355], [0.75523, 5, 16.37072], [52.61236, 5, -5.3858], [2, 5, 3]);
    const r = meshMassProperties(t, RHO_UNIT);
    close(r.cogMm[0], 15.92492, 0, 5e-5); // the paper prints 5 decimals; its last x digit is off by 3e-5, as the reproductions note
    close(r.cogMm[1], 0.78281, 0, 5e-5);
    close(r.cogMm[2], 3.72962, 0, 5e-5);
    // a, b, c: moments about the x, y, z axes through the CoG. The printed values agree with exact arithmetic
    // to about 2e-8 relative (the paper's own rounding), hence the tolerance.
    close(r.inertiaKgMm2[0][0], 43520.33257, 1e-7);
    close(r.inertiaKgMm2[1][1], 194711.28938, 1e-7);
    close(r.inertiaKgMm2[2][2], 191168.76173, 1e-7);
    // Products a′ = ∫yz, b′ = ∫xz, c′ = ∫xy (the paper's definitions; its matrix E_Q places b′ and c′ the other
    // way round, which the reproductions point out). The tensor holds the negated products.
    close(-r.inertiaKgMm2[1][2], 4417.6615, 1e-7);
    close(-r.inertiaKgMm2[0][2], -46343.16662, 1e-7);
    close(-r.inertiaKgMm2[0][1], 11996.20119, 1e-7);
  });

  it('regular n-gon prism: exact V = (n/2) r² sin(2π/n) h and Iz = m r²(2 + cos α)/6 [COMP], tending to πr²h and m r²/2 [PUB-2 handbook]', () => {
    const [r0, h] = [150, 600];
    for (const n of [6, 24, 360]) {
      const a = (2 * Math.PI) / n;
      const res = meshMassProperties(prism(r0, h, n), 2700);
      const vExact = (n / 2) * r0 * r0 * Math.sin(a) * h;
      close(res.volumeMm3, vExact, 1e-12);
      close(res.inertiaKgMm2[2][2], (res.massKg * r0 * r0 * (2 + Math.cos(a))) / 6, 1e-11);
      res.cogMm.forEach((v) => expect(Math.abs(v)).toBeLessThan(1e-9));
    }
    // Convergence to the cylinder: error falls like 1/n².
    const fine = meshMassProperties(prism(r0, h, 2048), 2700);
    const m = fine.massKg;
    close(fine.volumeMm3, Math.PI * r0 * r0 * h, 2e-6);
    close(fine.inertiaKgMm2[2][2], (m * r0 * r0) / 2, 2e-5);
    close(fine.inertiaKgMm2[0][0], (m * (3 * r0 * r0 + h * h)) / 12, 2e-5);
    close(fine.inertiaKgMm2[1][1], (m * (3 * r0 * r0 + h * h)) / 12, 2e-5);
  });

  it('sphere approximation tends to V = 4/3 πr³ and I = 2/5 m r² [PUB-2 handbook]', () => {
    const r0 = 80;
    const coarse = meshMassProperties(uvSphere(r0, 24, 48), 8450);
    const fine = meshMassProperties(uvSphere(r0, 192, 384), 8450);
    const vSphere = (4 / 3) * Math.PI * r0 ** 3;
    const errCoarse = Math.abs(coarse.volumeMm3 - vSphere) / vSphere;
    const errFine = Math.abs(fine.volumeMm3 - vSphere) / vSphere;
    expect(errFine).toBeLessThan(2e-4);
    expect(errFine).toBeLessThan(errCoarse / 30); // ~1/n²: 8× finer, ~64× smaller
    for (let i = 0; i < 3; i++) close(fine.inertiaKgMm2[i][i], 0.4 * fine.massKg * r0 * r0, 4e-4);
    expect(Math.abs(fine.inertiaKgMm2[0][1])).toBeLessThan(1e-9 * fine.inertiaKgMm2[0][0]);
    fine.cogMm.forEach((v) => expect(Math.abs(v)).toBeLessThan(1e-9));
  });
});

describe('meshMassProperties: invariants and an independent formula', () => {
  // Deterministic pseudo-random numbers (mulberry32), so a failure can be replayed.
  function rng(seed: number): () => number {
    let a = seed >>> 0;
    return () => {
      a = (a + 0x6d2b79f5) >>> 0;
      let t = a;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
  }

  it('agrees with the tetrahedron-covariance oracle on random rotated and moved solids', () => {
    const rand = rng(42);
    for (let trial = 0; trial < 30; trial++) {
      const rot = rotationFromEulerZyxDeg([rand() * 360 - 180, rand() * 180 - 90, rand() * 360 - 180]);
      const shift: V3 = [rand() * 4000 - 2000, rand() * 4000 - 2000, rand() * 2000];
      const base = trial % 3 === 0 ? cuboid(100 + rand() * 900, 50 + rand() * 300, 10 + rand() * 500) : trial % 3 === 1 ? prism(20 + rand() * 200, 50 + rand() * 800, 7 + Math.floor(rand() * 40)) : uvSphere(10 + rand() * 300, 9, 14);
      // Two bodies apart: a multi-shell mesh, as a welded frame exported as one STL would be.
      const t = [...transform(base, rot, shift), ...transform(cuboid(30, 40, 50), rot, [shift[0] + 5000, shift[1], shift[2]])];
      const r = meshMassProperties(t, RHO_UNIT);
      const o = oracle(t);
      close(r.volumeMm3, o.volume, 1e-10);
      r.cogMm.forEach((v, i) => close(v, o.cog[i], 1e-9, 1e-7));
      const scaleI = Math.max(o.inertia[0][0], o.inertia[1][1], o.inertia[2][2]);
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(r.inertiaKgMm2[i][j] - o.inertia[i][j])).toBeLessThan(1e-8 * scaleI);
    }
  });

  it('rotating a solid turns its tensor: I′ = R I Rᵀ; moving it does not change I about the CoG', () => {
    const base = meshMassProperties(cuboid(600, 200, 100, [-300, -100, -50]), 7850);
    const R = rotationFromEulerZyxDeg([30, -20, 65]);
    const turned = meshMassProperties(transform(cuboid(600, 200, 100, [-300, -100, -50]), R, [1000, 2000, 3000]), 7850);
    const expected = rotateTensor(R, base.inertiaKgMm2);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(turned.inertiaKgMm2[i][j] - expected[i][j])).toBeLessThan(1e-8 * base.inertiaKgMm2[0][0]);
    close(turned.massKg, base.massKg, 1e-12);
    close(turned.cogMm[0], 1000, 1e-12);
  });

  it('parallel-axis theorem: two separate cuboids equal the sum of their own inertias moved to the joint CoG [PUB-2: I = I_cg + m d²]', () => {
    const a = meshMassProperties(cuboid(100, 100, 100), 7850);
    const b = meshMassProperties(cuboid(200, 50, 50, [1000, 0, 0]), 7850);
    const both = meshMassProperties([...cuboid(100, 100, 100), ...cuboid(200, 50, 50, [1000, 0, 0])], 7850);
    const m = a.massKg + b.massKg;
    const cog = [0, 1, 2].map((i) => (a.massKg * a.cogMm[i] + b.massKg * b.cogMm[i]) / m) as V3;
    const ia = shiftFromCog(a.inertiaKgMm2, a.massKg, [a.cogMm[0] - cog[0], a.cogMm[1] - cog[1], a.cogMm[2] - cog[2]]);
    const ib = shiftFromCog(b.inertiaKgMm2, b.massKg, [b.cogMm[0] - cog[0], b.cogMm[1] - cog[1], b.cogMm[2] - cog[2]]);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(both.inertiaKgMm2[i][j] - (ia[i][j] + ib[i][j]))).toBeLessThan(1e-6);
    // By hand for Iyy: own moments plus m(dx² + dz²) for each (a's centre at 50, 50, 50; b's at 1,100, 25, 25).
    const d2 = (c: V3): number => (c[0] - cog[0]) ** 2 + (c[2] - cog[2]) ** 2;
    close(both.inertiaKgMm2[1][1], a.inertiaKgMm2[1][1] + b.inertiaKgMm2[1][1] + a.massKg * d2([50, 50, 50]) + b.massKg * d2([1100, 25, 25]), 1e-12);
  });

  it('accepts a consistently inside-out mesh, flips it and says so', () => {
    const good = meshMassProperties(prism(100, 300, 32), 1000);
    const inside = meshMassProperties(reverseWinding(prism(100, 300, 32)), 1000);
    expect(inside.flipped).toBe(true);
    close(inside.volumeMm3, good.volumeMm3, 1e-14);
    close(inside.inertiaKgMm2[0][0], good.inertiaKgMm2[0][0], 1e-12);
    expect(inside.volumeMm3).toBeGreaterThan(0);
  });

  it('welds corners that differ by rounding noise, also where the noise straddles a grid boundary', () => {
    // A cube centred on the origin: 0 is exactly halfway across its extent, a worst case for rounding to a
    // grid. Nudge every other copy of each corner by ±1e-13 mm, as trigonometric seams do.
    const t = cuboid(100, 100, 100, [-50, -50, -50]).map((v, i) => (i % 2 ? v + 1e-13 : v - 1e-13));
    // The same cube built as two halves without the inner faces: the corners at x = 0 sit exactly on a grid
    // boundary (halfway across), and the right half writes them as −1e-14.
    const left = cuboid(50, 100, 100, [-50, -50, -50]).slice(0, 9 * 10); // without its +x face
    const rightFull = cuboid(50, 100, 100, [0, -50, -50]);
    const right = [...rightFull.slice(0, 9 * 8), ...rightFull.slice(9 * 10)].map((v, i) => (i % 3 === 0 && v === 0 ? -1e-14 : v)); // without its −x face
    const mid = [...left, ...right];
    expect(meshMassProperties(t, 1000).volumeMm3).toBeCloseTo(1e6, 6);
    expect(meshMassProperties(mid, 1000).volumeMm3).toBeCloseTo(1e6, 6);
  });

  it('welds corners a caller-given tolerance apart, and only then', () => {
    // One copy of the corner (10, 20, 30) written as (10.001, 20, 30): an open crack of 1 µm by default.
    const t = cuboid(10, 20, 30);
    let moved = false;
    const cracked = t.map((v, i) => {
      if (!moved && i % 3 === 0 && v === 10 && t[i + 1] === 20 && t[i + 2] === 30) {
        moved = true;
        return 10.001;
      }
      return v;
    });
    expect(() => meshMassProperties(cracked, 1000)).toThrow(/open edges/);
    expect(meshMassProperties(cracked, 1000, { weldToleranceMm: 0.01 }).volumeMm3).toBeCloseTo(6000, 1);
  });

  it('takes Float32Array and number[] alike', () => {
    const t = cuboid(10, 20, 30, [1, 2, 3]);
    expect(meshMassProperties(Float32Array.from(t), 1000).volumeMm3).toBeCloseTo(6000, 6);
  });

  it('ignores zero-area triangles with two equal corners (as at the poles of a lat–long sphere)', () => {
    const t = cuboid(10, 10, 10);
    const withSliver = [...t, 0, 0, 0, 0, 0, 0, 10, 0, 0];
    const r = meshMassProperties(withSliver, 1000);
    expect(r.degenerateTriangleCount).toBe(1);
    close(r.volumeMm3, 1000, 1e-12);
  });
});

describe('meshMassProperties: refusals name the problem', () => {
  it('refuses a mesh with a hole, counting the open edges and naming the first', () => {
    const t = cuboid(10, 20, 30).slice(9); // drop the first triangle
    expect(() => meshMassProperties(t, 1000, { itemName: 'bracket.stl' })).toThrow(/Mesh "bracket\.stl" is not closed: 3 open edges.*First offending edge \(open\): triangle \d+/);
  });

  it('refuses a face turned over (two triangles run the same way along an edge)', () => {
    const t = cuboid(10, 20, 30);
    const turned = [...t.slice(0, 9 * 5), ...reverseWinding(t.slice(9 * 5, 9 * 6)), ...t.slice(9 * 6)];
    expect(() => meshMassProperties(turned, 1000)).toThrow(/3 edges where two triangles run the same way/);
  });

  it('refuses an edge shared by more than two triangles', () => {
    const t = cuboid(10, 20, 30);
    const twice = [...t, ...t.slice(0, 9), ...reverseWinding(t.slice(0, 9))];
    expect(() => meshMassProperties(twice, 1000)).toThrow(/shared by more than two triangles/);
  });

  it('refuses non-finite coordinates, bad lengths, no triangles and zero or bad density, naming the item', () => {
    const t = cuboid(10, 20, 30);
    t[9 * 4 + 4] = NaN;
    expect(() => meshMassProperties(t, 1000, { itemName: 'P-100' })).toThrow(/Mesh "P-100": triangle 5 \(counting from 1\), corner 2 has a non-finite y coordinate/);
    expect(() => meshMassProperties([0, 0, 0, 1, 0, 0, 0, 1], 1000)).toThrow(/not a multiple of 9/);
    expect(() => meshMassProperties([], 1000)).toThrow(/no triangles/);
    expect(() => meshMassProperties(cuboid(1, 1, 1), 0)).toThrow(/density .* above zero/);
    expect(() => meshMassProperties(cuboid(1, 1, 1), Infinity)).toThrow(/density/);
  });

  it('refuses a closed mesh with no volume (a flat double-sided triangle)', () => {
    const v: V3[] = [[0, 0, 0], [10, 0, 0], [10, 10, 0]];
    const sheet = flatten(v, [[0, 1, 2], [0, 2, 1]]);
    expect(() => meshMassProperties(sheet, 1000)).toThrow(/volume is zero/);
  });
});
