import { describe, expect, it } from 'vitest';
import { booleans, measurements, primitives } from '@jscad/modeling';
import { carryOrientations, checkCrateAccess } from '../../../src/domain/access/index.ts';
import { driveCoreCrate, salaVentolina } from './scenario-fixtures.ts';

/** Small seeded generator (mulberry32) so the property tests are repeatable. */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('door check, scenario: Sala Ventolina corridor door 1,100 mm', () => {
  // [COMP] geometry: upright the crate presents min(L, W) × H = 1,150 × 1,000; 1,150 > 1,100 clear width.
  it('fails upright (this way up): 50 mm over the door width', () => {
    const r = checkCrateAccess(driveCoreCrate, salaVentolina);
    expect(r.verdict).toBe('fail');
    const corridor = r.findings.find((f) => f.where === 'corridor door');
    expect(corridor?.verdict).toBe('fail');
    expect(corridor?.margin).toBe(-50);
    expect(corridor?.reason).toMatch(/door width/);
    // the wide scene dock door passes upright
    expect(r.findings.find((f) => f.where === 'scene dock door')?.verdict).toBe('pass');
  });
  // [COMP] tilted: the two smallest sizes 1,000 × 1,150 present 1,000 across (100 mm spare) and
  // 1,150 vertical (950 mm spare under 2,100): margin 100 mm.
  it('passes tilted on its side when tilting is allowed', () => {
    const r = checkCrateAccess({ ...driveCoreCrate, mayTilt: true }, salaVentolina);
    const corridor = r.findings.find((f) => f.where === 'corridor door');
    expect(corridor?.verdict).toBe('pass');
    expect(corridor?.orientation).toBe('tilted');
    expect(corridor?.margin).toBe(100);
    // the wide door still passes upright: tilting is only used where needed
    expect(r.findings.find((f) => f.where === 'scene dock door')?.orientation).toBe('upright');
    expect(r.verdict).toBe('pass');
  });
});

describe('door check: unknown data never passes', () => {
  it('reports "not checked: door width unknown"', () => {
    const r = checkCrateAccess(driveCoreCrate, { doors: [{ widthMm: null, heightMm: 2100 }], floorRatingKnPerM2: 5 });
    expect(r.verdict).toBe('unknown');
    expect(r.findings[0].reason).toContain('not checked: door width unknown');
  });
  it('a venue with no doors recorded is unknown, not a pass', () => {
    const r = checkCrateAccess(driveCoreCrate, { doors: [] });
    expect(r.verdict).toBe('unknown');
    expect(r.findings.map((f) => f.verdict)).not.toContain('pass');
  });
  it('a known width that stops every orientation fails even with the height unknown', () => {
    const r = checkCrateAccess({ ...driveCoreCrate, mayTilt: true }, { doors: [{ widthMm: 900, heightMm: undefined }] });
    expect(r.findings[0].verdict).toBe('fail');
  });
  it('NaN and zero count as unknown', () => {
    for (const w of [Number.NaN, 0, -5]) {
      expect(checkCrateAccess(driveCoreCrate, { doors: [{ widthMm: w, heightMm: 2100 }] }).findings[0].verdict).toBe('unknown');
    }
  });
  it('a crate with a bad size is not checked, and the message names the field', () => {
    const r = checkCrateAccess({ ...driveCoreCrate, widthMm: -3 }, salaVentolina);
    expect(r.verdict).toBe('unknown');
    expect(r.findings[0].reason).toMatch(/widthMm/);
  });
});

describe('door rule: enumeration agrees with the sorted rule (property test)', () => {
  // [COMP] For an axis-aligned box carried straight, the best face is the two smallest dimensions; if
  // any face (a, b) fits an opening, the sorted two smallest fit too. Upright: min(L, W) across, H up.
  it('agrees on 2,000 random crates and doors', () => {
    const r = rng(42);
    for (let i = 0; i < 2000; i++) {
      const [L, W, H] = [200 + r() * 2800, 200 + r() * 2800, 200 + r() * 2800].map(Math.round);
      const dw = Math.round(300 + r() * 2500);
      const dh = Math.round(300 + r() * 2500);
      const mayTilt = r() < 0.5;
      const got = checkCrateAccess({ lengthMm: L, widthMm: W, heightMm: H, grossKg: 100, mayTilt }, { doors: [{ widthMm: dw, heightMm: dh }] }).findings[0];
      const uprightFits = Math.min(L, W) <= dw && H <= dh;
      const [s1, s2] = [L, W, H].sort((a, b) => a - b);
      const tiltFits = (s1 <= dw && s2 <= dh) || (s2 <= dw && s1 <= dh);
      const expected = uprightFits || (mayTilt && tiltFits);
      expect(got.verdict).toBe(expected ? 'pass' : 'fail');
      if (uprightFits) expect(got.orientation).toBe('upright');
    }
  });
  it('offers six orientations when tilting is allowed and two upright ones when not', () => {
    expect(carryOrientations(3, 2, 1, true)).toHaveLength(6);
    expect(carryOrientations(3, 2, 1, false).every((o) => o.verticalMm === 1)).toBe(true);
  });
});

describe('door rule against an independent solid modeller (@jscad/modeling)', () => {
  // Independent check: a wall 100 mm thick with the door cut out (CSG subtract), and the crate placed
  // across the wall in the orientation our check chose; the intersection volume is zero exactly when
  // the box passes the opening. Library: @jscad/modeling 2.13 booleans + measureVolume.
  const { cuboid } = primitives;
  const { subtract, intersect } = booleans;
  function collides(door: { w: number; h: number }, across: number, vertical: number, along: number): boolean {
    const wall = subtract(cuboid({ size: [100, 8000, 8000], center: [0, 0, 4000] }), cuboid({ size: [200, door.w, door.h], center: [0, 0, door.h / 2] }));
    // The box sits on the floor, centred across the opening (the best it can do).
    const box = cuboid({ size: [along, across, vertical], center: [0, 0, vertical / 2] });
    return measurements.measureVolume(intersect(wall, box)) > 1e-6;
  }
  const cases: [number, number, number, boolean, number, number][] = [
    [1600, 1150, 1000, false, 1100, 2100],
    [1600, 1150, 1000, true, 1100, 2100],
    [2000, 900, 1800, false, 1000, 2000],
    [2000, 900, 2100, false, 1000, 2000],
    [2000, 900, 2100, true, 1000, 2000],
    [1200, 800, 900, true, 850, 950],
    [1200, 1200, 1200, true, 1190, 2500],
  ];
  it.each(cases)('crate %i × %i × %i (tilt %s) through %i × %i', (L, W, H, mayTilt, dw, dh) => {
    const f = checkCrateAccess({ lengthMm: L, widthMm: W, heightMm: H, grossKg: 100, mayTilt }, { doors: [{ widthMm: dw, heightMm: dh }] }).findings[0];
    const o = carryOrientations(L, W, H, mayTilt);
    // If we say pass, the chosen orientation must not collide; if we say fail, every allowed
    // orientation must collide in the modeller.
    if (f.verdict === 'pass') {
      const chosen = o.filter((x) => x.kind === f.orientation).find((x) => x.acrossMm <= dw && x.verticalMm <= dh);
      expect(chosen).toBeDefined();
      expect(collides({ w: dw, h: dh }, chosen!.acrossMm, chosen!.verticalMm, chosen!.alongMm)).toBe(false);
    } else {
      for (const x of o) expect(collides({ w: dw, h: dh }, x.acrossMm, x.verticalMm, x.alongMm)).toBe(true);
    }
  });
});
