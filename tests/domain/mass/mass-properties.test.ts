import { describe, expect, it } from 'vitest';
import {
  combineMasses,
  massProperties,
  meshMassProperties,
  partLineFlags,
  rotationFromEulerZyxDeg,
  rotateTensor,
  shiftFromCog,
  type MassAssembly,
  type MassPartLine,
} from '../../../src/domain/mass/index.ts';
import { KG_PER_POUND, MM_PER_INCH } from '../../../src/domain/units.ts';
import { cuboid, transform, type V3 } from './mesh-builders.ts';

const close = (a: number, b: number, rel: number, abs = 0): void => {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(Math.max(abs, rel * Math.abs(b)));
};

function line(id: string, over: Partial<MassPartLine> = {}): MassPartLine {
  return { id, assemblyId: null, quantity: 1, unitMassKg: 1, massSource: 'catalogue', cogMm: [0, 0, 0], ...over };
}

describe('massProperties: published worked examples (REFERENCES §3)', () => {
  it('FAA tabular loading: 1646 lb, moment 21,798.1 lb·in, CG 13.24 in [PUB-2: FAA-H-8083-1 / FAA-H-8083-25 weight-and-balance chapters, flight-training worked example]', () => {
    const items: [number, number][] = [
      [1150, 13.0],
      [190, 12.6],
      [135, 12.6],
      [15, 42.1],
      [156, 13.6],
    ];
    const lines = items.map(([lb, arm], i) => line(`L${i}`, { unitMassKg: lb * KG_PER_POUND, cogMm: [arm * MM_PER_INCH, 0, 0] }));
    const r = massProperties({ lines, assemblies: [] });
    const lb = r.machine.massKg / KG_PER_POUND;
    const cgIn = (r.machine.cogMm as V3)[0] / MM_PER_INCH;
    close(lb, 1646, 1e-12);
    expect(Math.abs(lb * cgIn - 21798.1)).toBeLessThan(0.05);
    expect(cgIn.toFixed(2)).toBe('13.24');
    // The point-mass helper agrees.
    expect(combineMasses(lines.map((l) => ({ massKg: l.unitMassKg as number, cogMm: l.cogMm as V3 }))).cogMm[0] / MM_PER_INCH).toBeCloseTo(cgIn, 12);
  });

  it('composite area: 18 ft² at (14, 9.5) + 160 ft² at (10, 4) → (10.404, 4.556) ft [PUB-2: rigging course slides; COMP]', () => {
    const ft = 304.8;
    const r = massProperties({
      lines: [line('a', { unitMassKg: 18, cogMm: [14 * ft, 9.5 * ft, 0] }), line('b', { unitMassKg: 160, cogMm: [10 * ft, 4 * ft, 0] })],
      assemblies: [],
    });
    const c = r.machine.cogMm as V3;
    expect((c[0] / ft).toFixed(3)).toBe('10.404');
    expect((c[1] / ft).toFixed(3)).toBe('4.556');
  });
});

describe('massProperties: inertia by the parallel-axis theorem, checked against the mesh of the same solids', () => {
  const RHO = 7850; // steel, kg/m³
  const massOf = (s: V3): number => s[0] * s[1] * s[2] * 1e-9 * RHO;

  it('cuboid parts (inertia assumed from their boxes) and rotated instances equal one mesh of all the boxes', () => {
    // An arm (made once, placed four times, turned), a plate and a post; all steel.
    const arm: V3 = [800, 60, 40];
    const plate: V3 = [1000, 1000, 20];
    const post: V3 = [80, 80, 600];
    const placements: { p: V3; e: V3 }[] = [
      { p: [0, 0, 700], e: [0, 0, 0] },
      { p: [0, 0, 700], e: [90, 0, 0] },
      { p: [0, 0, 700], e: [180, 0, 0] },
      { p: [0, 0, 700], e: [270, 15, 0] },
    ];
    const lines: MassPartLine[] = [
      // Arm frame: from the hub at the origin out along +x, centred on y and z.
      {
        id: 'arm',
        assemblyId: 'carousel',
        quantity: 4,
        unitMassKg: massOf(arm),
        massSource: 'cad',
        cogMm: [400 + 100, 0, 0],
        bboxMm: { minMm: [100, -30, -20], maxMm: [900, 30, 20] },
        instances: placements.map(({ p, e }) => ({ positionMm: p, eulerZyxDeg: e })),
      },
      { id: 'plate', assemblyId: 'base', quantity: 1, unitMassKg: massOf(plate), massSource: 'weighed', cogMm: [0, 0, 10], bboxMm: { minMm: [-500, -500, 0], maxMm: [500, 500, 20] } },
      { id: 'post', assemblyId: 'base', quantity: 1, unitMassKg: massOf(post), massSource: 'estimated', cogMm: [0, 0, 320], bboxMm: { minMm: [-40, -40, 20], maxMm: [40, 40, 620] } },
    ];
    const assemblies: MassAssembly[] = [
      { id: 'machine', parentId: null },
      { id: 'base', parentId: 'machine' },
      { id: 'carousel', parentId: 'machine' },
    ];
    const r = massProperties({ lines, assemblies });

    const tris: number[] = [...cuboid(1000, 1000, 20, [-500, -500, 0]), ...cuboid(80, 80, 600, [-40, -40, 20])];
    for (const { p, e } of placements) tris.push(...transform(cuboid(800, 60, 40, [100, -30, -20]), rotationFromEulerZyxDeg(e), p));
    const mesh = meshMassProperties(tris, RHO);

    const top = r.assemblies.machine;
    close(top.massKg, mesh.massKg, 1e-12);
    (top.cogMm as V3).forEach((v, i) => close(v, mesh.cogMm[i], 1e-9, 1e-9));
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) expect(Math.abs((top.inertiaKgMm2 as number[][])[i][j] - mesh.inertiaKgMm2[i][j])).toBeLessThan(1e-9 * mesh.inertiaKgMm2[2][2]);
    }
    // Box of the rotated arms against the mesh's vertex box.
    for (let i = 0; i < 3; i++) {
      close(top.bboxMm!.minMm[i], mesh.bboxMm!.minMm[i], 1e-9, 1e-9);
      close(top.bboxMm!.maxMm[i], mesh.bboxMm!.maxMm[i], 1e-9, 1e-9);
    }
    expect(top.assumedInertiaLineCount).toBe(3);
    expect(lines.map((l) => partLineFlags(l).assumedInertia)).toEqual([true, true, true]);
    expect(top.approximateLineCount).toBe(0);
    expect(top.unitCount).toBe(6);
    // Confidence: cad = arms, weighed = plate, estimated = post.
    close(top.confidence.cadKg, 4 * massOf(arm), 1e-12);
    close(top.confidence.weighedOrCatalogueKg, massOf(plate), 1e-12);
    close(top.confidence.estimatedPercent, (100 * massOf(post)) / top.massKg, 1e-12);
    close(top.confidence.weighedOrCataloguePercent + top.confidence.cadPercent + top.confidence.estimatedPercent, 100, 1e-12);
  });

  it('uses a given own inertia, turned with its instance: R I Rᵀ plus m d²', () => {
    const own = [
      [10, 1, 0],
      [1, 20, 2],
      [0, 2, 30],
    ];
    const R = rotationFromEulerZyxDeg([30, 45, 60]);
    const r = massProperties({
      lines: [line('x', { unitMassKg: 2, cogMm: [0, 0, 0], inertiaKgMm2: own, instances: [{ positionMm: [100, 0, 0], eulerZyxDeg: [30, 45, 60] }] })],
      assemblies: [],
    });
    const expected = rotateTensor(R, own);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) close(r.machine.inertiaKgMm2![i][j], expected[i][j], 1e-12, 1e-12);
    expect(r.machine.cogMm).toEqual([100, 0, 0]);
    expect(r.machine.assumedInertiaLineCount).toBe(0);
  });

  it('random trees: the machine equals a brute-force sum over every unit (combineMasses + explicit shifts)', () => {
    let s = 7;
    const rand = (): number => ((s = (s * 16807) % 2147483647) - 1) / 2147483646;
    for (let trial = 0; trial < 20; trial++) {
      const assemblies: MassAssembly[] = [{ id: 'a0', parentId: null }];
      for (let i = 1; i < 15; i++) assemblies.push({ id: `a${i}`, parentId: `a${Math.floor(rand() * i)}` });
      const lines: MassPartLine[] = [];
      const units: { m: number; c: V3; I: number[][] }[] = [];
      for (let i = 0; i < 60; i++) {
        const size: V3 = [10 + rand() * 500, 10 + rand() * 500, 10 + rand() * 500];
        const m = rand() * 50;
        const c: V3 = [rand() * 4000 - 2000, rand() * 4000 - 2000, rand() * 3000];
        const q = 1 + Math.floor(rand() * 3);
        lines.push(line(`l${i}`, { assemblyId: `a${Math.floor(rand() * 15)}`, quantity: q, unitMassKg: m, cogMm: c, bboxMm: { minMm: [c[0] - size[0] / 2, c[1] - size[1] / 2, c[2] - size[2] / 2], maxMm: [c[0] + size[0] / 2, c[1] + size[1] / 2, c[2] + size[2] / 2] } }));
        const [a, b, cc] = size;
        for (let k = 0; k < q; k++) units.push({ m, c, I: [[(m * (b * b + cc * cc)) / 12, 0, 0], [0, (m * (a * a + cc * cc)) / 12, 0], [0, 0, (m * (a * a + b * b)) / 12]] });
      }
      const r = massProperties({ lines, assemblies });
      const ref = combineMasses(units.map((u) => ({ massKg: u.m, cogMm: u.c })));
      close(r.machine.massKg, ref.massKg, 1e-12);
      (r.machine.cogMm as V3).forEach((v, i) => close(v, ref.cogMm[i], 1e-10, 1e-9));
      const I = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
      for (const u of units) {
        const t = shiftFromCog(u.I, u.m, [u.c[0] - ref.cogMm[0], u.c[1] - ref.cogMm[1], u.c[2] - ref.cogMm[2]]);
        for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) I[i][j] += t[i][j];
      }
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(r.machine.inertiaKgMm2![i][j] - I[i][j])).toBeLessThan(1e-9 * I[0][0]);
      // The root assembly holds every line.
      close(r.assemblies.a0.massKg, ref.massKg, 1e-12);
      // Lines with quantity > 1 and no instances are flagged approximate.
      expect(r.machine.approximateLineCount).toBe(lines.filter((l) => l.quantity > 1).length);
      expect(lines.filter((l) => partLineFlags(l).approximate).length).toBe(r.machine.approximateLineCount);
    }
  });
});

describe('massProperties: sections, add-ons, gaps, margin', () => {
  const assemblies: MassAssembly[] = [
    { id: 'orrery', parentId: null },
    { id: 'drive', parentId: 'orrery', sectionId: 'DC' },
    { id: 'gearbox', parentId: 'drive' }, // inherits DC
    { id: 'desk', parentId: 'orrery', sectionId: 'CD' },
    { id: 'spares', parentId: 'orrery' }, // no section: loose
  ];
  const sections = [{ id: 'DC' }, { id: 'CD' }];
  const lines: MassPartLine[] = [
    line('motor', { assemblyId: 'drive', unitMassKg: 60, massSource: 'catalogue', cogMm: [0, 0, 500] }),
    line('gear', { assemblyId: 'gearbox', unitMassKg: 40, massSource: 'weighed', cogMm: [300, 0, 500] }),
    line('shaft', { assemblyId: 'gearbox', unitMassKg: 25, massSource: 'cad', cogMm: [150, 0, 200], sectionId: 'CD' }), // own override
    line('console', { assemblyId: 'desk', unitMassKg: 70, massSource: null, cogMm: [2000, 0, 400] }),
    line('bolts', { assemblyId: 'spares', quantity: 24, unitMassKg: 0.05, massSource: 'catalogue', cogMm: [0, 1000, 0] }),
    line('cover', { assemblyId: 'gearbox', unitMassKg: null, massSource: null, cogMm: [0, 0, 0], label: 'GB-COVER-01' }),
    line('cable', { assemblyId: 'desk', unitMassKg: 3, massSource: 'estimated', cogMm: null }),
  ];
  const addOns = [{ id: 'frame', sectionId: 'DC', massKg: 35, massSource: 'weighed' as const, cogMm: [0, 0, 50] as V3, bboxMm: { minMm: [-600, -400, 0] as V3, maxMm: [600, 400, 100] as V3 } }];
  const r = massProperties({ lines, assemblies, sections, addOns, marginPercent: 10 });

  it('puts a line in its nearest assigned section, with its own assignment first, and the rest in loose', () => {
    close(r.sections.DC.massKg, 60 + 40 + 35, 1e-12);
    close(r.sections.CD.massKg, 25 + 70, 1e-12);
    close(r.loose.massKg, 24 * 0.05, 1e-12);
    expect(r.sections.DC.addOnCount).toBe(1);
    // Add-ons count in the section and the total, not in the machine or its assemblies.
    close(r.machine.massKg, 60 + 40 + 25 + 70 + 1.2, 1e-12);
    close(r.total.massKg, r.machine.massKg + 35, 1e-12);
    close(r.assemblies.orrery.massKg, r.machine.massKg, 1e-12);
    close(r.assemblies.drive.massKg, 60 + 40 + 25, 1e-12); // the tree is the tree, whatever the sections
    expect(r.sections.DC.bboxMm).toEqual({ minMm: [-600, -400, 0], maxMm: [600, 400, 500] });
    // CoG of DC by hand: (60·(0,0,500) + 40·(300,0,500) + 35·(0,0,50)) / 135.
    const c = r.sections.DC.cogMm as V3;
    close(c[0], (40 * 300) / 135, 1e-12);
    close(c[2], (60 * 500 + 40 * 500 + 35 * 50) / 135, 1e-12);
  });

  it('lists gaps on every node they belong to and never counts them as zero', () => {
    expect(r.gaps.map((g) => [g.lineId, g.reasons])).toEqual([
      ['cover', ['no mass']],
      ['cable', ['no position (CoG)']],
    ]);
    expect(r.gaps[0].label).toBe('GB-COVER-01');
    expect(r.assemblies.gearbox.gaps.map((g) => g.lineId)).toEqual(['cover']);
    expect(r.assemblies.orrery.gaps.map((g) => g.lineId)).toEqual(['cover', 'cable']);
    expect(r.sections.DC.gaps.map((g) => g.lineId)).toEqual(['cover']);
    expect(r.sections.CD.gaps.map((g) => g.lineId)).toEqual(['cable']);
    expect(r.sections.DC.complete).toBe(false);
    expect(r.loose.complete).toBe(true);
    expect(r.assemblies.drive.lineCount).toBe(3);
  });

  it('flags quantity > 1 without instances as approximate, and reports the margin and confidence', () => {
    expect(lines.filter((l) => partLineFlags(l).approximate).map((l) => l.id)).toEqual(['bolts']);
    expect(partLineFlags(lines[5])).toEqual({ gap: true, approximate: false, assumedInertia: false, pointMass: false });
    expect(r.loose.approximateLineCount).toBe(1);
    close(r.loose.approximateMassKg, 1.2, 1e-12);
    close(r.total.massWithMarginKg, r.total.massKg * 1.1, 1e-12);
    expect(r.marginPercent).toBe(10);
    // A mass with no source counts as estimated.
    close(r.sections.CD.confidence.estimatedKg, 70, 1e-12);
    close(r.sections.CD.confidence.cadKg, 25, 1e-12);
    close(r.sections.DC.confidence.weighedOrCataloguePercent, 100, 1e-12);
  });

  it('turns bad per-line data into gaps with every reason, and ignores a malformed box with a warning', () => {
    const rr = massProperties({
      lines: [
        line('neg', { unitMassKg: -3, quantity: Number.NaN }),
        line('inst', { quantity: 3, instances: [{ positionMm: [0, 0, 0] }, { positionMm: [1, Number.POSITIVE_INFINITY, 0] }] }),
        line('box', { bboxMm: { minMm: [10, 0, 0], maxMm: [0, 1, 1] } }),
        line('zero', { quantity: 0 }),
      ],
      assemblies: [],
    });
    expect(rr.gaps.find((g) => g.lineId === 'neg')?.reasons).toEqual(['quantity must be a finite number, 0 or more (got NaN)', 'mass must be a finite number of kg, 0 or more (got -3)']);
    expect(rr.gaps.find((g) => g.lineId === 'inst')?.reasons).toEqual(['quantity is 3 but 2 instances are placed', 'instance 2: position must be three finite numbers in mm']);
    expect(rr.warnings[0].message).toMatch(/Part line "box": bounding box ignored/);
    expect(rr.machine.pointMassLineCount).toBe(2);
    close(rr.machine.massKg, 1, 1e-12); // 'box' counts; 'zero' has no units
    expect(rr.machine.lineCount).toBe(2);
  });

  it('gives no CoG and no inertia for an empty node rather than dividing by zero', () => {
    const rr = massProperties({ lines: [], assemblies: [{ id: 'a', parentId: null }], sections: [{ id: 'S' }] });
    expect(rr.assemblies.a.cogMm).toBeNull();
    expect(rr.sections.S.inertiaKgMm2).toBeNull();
    expect(rr.sections.S.bboxMm).toBeNull();
    expect(rr.machine.confidence.estimatedPercent).toBe(0);
  });

  it('refuses a broken tree, naming the item', () => {
    expect(() => massProperties({ lines: [], assemblies: [{ id: 'a', parentId: 'b' }, { id: 'b', parentId: 'c', label: 'Gearbox' }, { id: 'c', parentId: 'a' }] })).toThrow(
      /Assemblies form a cycle \(a → Gearbox → c → a\)/,
    );
    expect(() => massProperties({ lines: [], assemblies: [{ id: 'a', parentId: 'zz' }] })).toThrow(/Assembly "a": parent assembly "zz" is not in the assembly list/);
    expect(() => massProperties({ lines: [line('l', { assemblyId: 'nope' })], assemblies: [] })).toThrow(/Part line "l": assembly "nope"/);
    expect(() => massProperties({ lines: [line('l', { sectionId: 'X' })], assemblies: [] })).toThrow(/Part line "l": section "X" is not in the section list/);
    expect(() => massProperties({ lines: [], assemblies: [{ id: 'a', parentId: null }, { id: 'a', parentId: null }] })).toThrow(/Assembly "a": id "a" appears twice/);
    expect(() => massProperties({ lines: [], assemblies: [], addOns: [{ id: 'f', sectionId: 'Q', massKg: 1, cogMm: [0, 0, 0] }] })).toThrow(/Add-on "f": section "Q"/);
    expect(() => massProperties({ lines: [], assemblies: [], marginPercent: -5 })).toThrow(/margin must be a finite percentage/);
  });
});
