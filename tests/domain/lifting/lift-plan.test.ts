import { describe, expect, it } from 'vitest';
import { evaluateLiftPlan } from '../../../src/domain/lifting/lift-plan.ts';
import { LIFTING_CAUTIONS } from '../../../src/domain/lifting/cautions.ts';
import type { GearItem, LiftPlanInput } from '../../../src/domain/contracts/lifting.ts';

// Sources: REFERENCES.md §2 (sling angles, two-carry rule, EN 13414-1, hoist classes, DAF 1.10 from
// GL Noble Denton 0027/ND Table 5-1) [PUB-2]; expected figures are computed here by hand from those
// formulas [COMP] unless the comment says otherwise.

// Independent three-leg statics by Cramer's rule: Σ Tᵢ uᵢ = W·up, null if a leg would push.
function solveTriple(p: [number, number, number][], hook: number[], up: number[], W: number): number[] | null {
  const u = p.map((q) => {
    const d = [hook[0] - q[0], hook[1] - q[1], hook[2] - q[2]];
    const l = Math.hypot(d[0], d[1], d[2]);
    return d.map((x) => x / l);
  });
  const m = [0, 1, 2].map((r) => [u[0][r], u[1][r], u[2][r]]);
  const det = (a: number[][]) => a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) - a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0]) + a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
  const D = det(m);
  if (Math.abs(D) < 1e-12) return null;
  const b = up.map((x) => x * W);
  const t = [0, 1, 2].map((k) => det(m.map((row, i) => row.map((v, j) => (j === k ? b[i] : v)))) / D);
  return t.every((x) => x >= 0) ? t : null;
}

const gear: GearItem[] = [
  { id: 'h1', identifier: 'CH-1', kind: 'hoist', ratedLoadKg: 1000, selfWeightKg: 40, chainWeightKg: 15, hoistClass: 'D8+', nextInspectionDate: '2027-01-01' },
  { id: 'h2', identifier: 'CH-2', kind: 'hoist', ratedLoadKg: 1000, selfWeightKg: 40, chainWeightKg: 15, hoistClass: 'D8+', nextInspectionDate: '2027-01-01' },
  { id: 's1', identifier: 'RS-1', kind: 'sling', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1200, massKg: 2, nextInspectionDate: '2027-01-01' },
  { id: 's2', identifier: 'RS-2', kind: 'sling', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1200, massKg: 2, nextInspectionDate: '2027-01-01' },
  { id: 'k1', identifier: 'SH-1', kind: 'shackle', ratingKg: 1000, massKg: 0.5, nextInspectionDate: '2027-01-01' },
  { id: 'k2', identifier: 'SH-2', kind: 'shackle', ratingKg: 1000, massKg: 0.5, nextInspectionDate: '2027-01-01' },
  {
    id: 'e1', identifier: 'EB-1', kind: 'lifting-point', pointType: 'eyebolt', ratingKg: 700, massKg: 0.3, nextInspectionDate: '2027-01-01',
    angleDerating: [{ upToDegFromAxis: 45, factor: 0.7 }],
  },
  {
    id: 'e2', identifier: 'EB-2', kind: 'lifting-point', pointType: 'eyebolt', ratingKg: 700, massKg: 0.3, nextInspectionDate: '2027-01-01',
    angleDerating: [{ upToDegFromAxis: 45, factor: 0.7 }],
  },
  { id: 'b1', identifier: 'SB-1', kind: 'spreader-beam', ratingKg: 2000, massKg: 60, nextInspectionDate: '2027-01-01' },
];

function basePlan(over: Partial<LiftPlanInput> = {}): LiftPlanInput {
  return {
    evaluationDate: '2026-03-01',
    load: { massKg: 400, massWeighed: true, cogMm: [0, 0, 300], boundsMm: { minMm: [-700, -400, 0], maxMm: [700, 400, 600] } },
    pickPoints: [
      { id: 'A', positionMm: [-600, 0, 600], slingGearId: 's1', shackleGearIds: ['k1'], liftingPointGearId: 'e1' },
      { id: 'B', positionMm: [600, 0, 600], slingGearId: 's2', shackleGearIds: ['k2'], liftingPointGearId: 'e2' },
    ],
    suspension: { kind: 'single-hook', hoistGearId: 'h1', hangingPoint: { label: 'Beam 3', ratingKg: 2000, source: 'venue' } },
    peopleBelow: false,
    gear,
    ...over,
  };
}

describe('evaluateLiftPlan: one hook, two legs', () => {
  const r = evaluateLiftPlan(basePlan());

  it('is ok, with legs at 60° and tension W / (2 sin 60°) = 230.94 kg', () => {
    expect(r.problems).toEqual([]);
    expect(r.verdict).toBe('ok');
    for (const leg of r.legs) {
      expect(leg.angleFromHorizontalDeg).toBeCloseTo(60, 6);
      expect(leg.worstTensionKg).toBeCloseTo(400 / (2 * Math.sin(Math.PI / 3)), 4);
      expect(leg.designTensionKg).toBeCloseTo(1.1 * 400 / (2 * Math.sin(Math.PI / 3)), 4);
    }
    expect(r.tiltDeg).toBeCloseTo(0, 6);
  });

  it('static hook load = load + all rigging below the hook; dynamic × 1.10 (GL ND 0027 Table 5-1 [PUB-2])', () => {
    expect(r.loads!.riggingBelowHookKg).toBeCloseTo(2 * (2 + 0.5 + 0.3), 10);
    expect(r.loads!.staticHookLoadKg).toBeCloseTo(405.6, 10);
    expect(r.loads!.dynamicHookLoadKg).toBeCloseTo(405.6 * 1.1, 10);
    expect(r.loads!.dynamicFactor.source).toMatch(/0027/);
  });

  it('each component against the load it sees: hoist dynamic hook load; hanging point + hoist and chain; legs tension × DAF', () => {
    const hoist = r.components.find((c) => c.kind === 'hoist')!;
    expect(hoist.loadKg).toBeCloseTo(446.16, 6);
    expect(hoist.utilisation).toBeCloseTo(0.44616, 6);
    const hp = r.components.find((c) => c.kind === 'hanging-point')!;
    expect(hp.loadKg).toBeCloseTo(446.16 + 40 + 15, 6);
    expect(hp.capacityKg).toBe(2000);
    const sling = r.components.find((c) => c.kind === 'sling')!;
    expect(sling.loadKg).toBeCloseTo(254.03, 2);
    expect(sling.capacityKg).toBe(1000);
    // Eyebolt pulled 30° off its axis: × 0.7 of 700 kg.
    const eye = r.components.find((c) => c.kind === 'lifting-point')!;
    expect(eye.capacityKg).toBeCloseTo(490, 10);
    expect(r.components.filter((c) => c.kind === 'shackle')).toHaveLength(2);
  });

  it('always carries the cautions, the methods with sources, and an exclusion zone of footprint + margin [PRACTICE]', () => {
    for (const c of LIFTING_CAUTIONS) expect(r.cautions).toContain(c);
    expect(r.methods.join(' ')).toMatch(/NAVEDTRA/);
    expect(r.exclusionZone).toMatchObject({ minXMm: -1700, maxXMm: 1700, minYMm: -1400, maxYMm: 1400, marginMm: 1000 });
    expect(r.exclusionZone!.note).toMatch(/common practice/);
  });
});

describe('evaluateLiftPlan: every problem named', () => {
  it('anyone beneath the load: refused', () => {
    const r = evaluateLiftPlan(basePlan({ peopleBelow: true }));
    expect(r.verdict).toBe('no verdict');
    expect(r.findings.map((f) => f.code)).toContain('people-below');
  });

  it('an occupied area inside the exclusion zone: refused', () => {
    const r = evaluateLiftPlan(basePlan({ occupiedAreasMm: [{ minMm: [1500, -200, 0], maxMm: [2500, 200, 2000] }] }));
    expect(r.verdict).toBe('no verdict');
    expect(r.problems.join(' ')).toMatch(/Occupied area 1 overlaps/);
    expect(evaluateLiftPlan(basePlan({ occupiedAreasMm: [{ minMm: [1800, -200, 0], maxMm: [2500, 200, 2000] }] })).verdict).toBe('ok');
  });

  it('gear past its inspection date: named and refused', () => {
    const late = gear.map((g) => (g.id === 's2' ? { ...g, nextInspectionDate: '2026-02-28' } : g));
    const r = evaluateLiftPlan(basePlan({ gear: late }));
    expect(r.verdict).toBe('no verdict');
    expect(r.problems.join(' ')).toMatch(/sling RS-2: inspection was due 2026-02-28/);
  });

  it('missing hanging point rating: no verdict, never a pass', () => {
    const r = evaluateLiftPlan(basePlan({ suspension: { kind: 'single-hook', hoistGearId: 'h1', hangingPoint: { label: 'Beam 9', ratingKg: null, source: 'typed' } } }));
    expect(r.verdict).toBe('no verdict');
    expect(r.problems.join(' ')).toMatch(/hanging point Beam 9: no rating/);
  });

  it('slings shorter than the span between their pick points', () => {
    const short = gear.map((g) => (g.kind === 'sling' ? { ...g, lengthMm: 500 } : g));
    const r = evaluateLiftPlan(basePlan({ gear: short }));
    expect(r.verdict).toBe('no verdict');
    expect(r.findings.map((f) => f.code)).toContain('sling-too-short');
  });

  it('sling angle below 30° from horizontal: refused', () => {
    const r = evaluateLiftPlan(
      basePlan({
        pickPoints: [
          { id: 'A', positionMm: [-1100, 0, 600], slingGearId: 's1', shackleGearIds: ['k1'] },
          { id: 'B', positionMm: [1100, 0, 600], slingGearId: 's2', shackleGearIds: ['k2'] },
        ],
      }),
    );
    expect(r.findings.map((f) => f.code)).toContain('sling-angle-below-30');
    expect(r.legs[0].angleFromHorizontalDeg).toBeCloseTo((Math.acos(1100 / 1200) * 180) / Math.PI, 6);
  });

  it('pick points that do not surround the CoG in plan', () => {
    const r = evaluateLiftPlan(basePlan({ load: { massKg: 400, massWeighed: true, cogMm: [700, 0, 300] } }));
    expect(r.findings.map((f) => f.code)).toContain('cog-not-surrounded');
    expect(r.verdict).not.toBe('ok');
  });

  it('over capacity names the component and its utilisation', () => {
    const weak = gear.map((g) => (g.id === 'h1' ? { ...g, ratedLoadKg: 400 } : g));
    const r = evaluateLiftPlan(basePlan({ gear: weak }));
    expect(r.verdict).toBe('over capacity');
    expect(r.problems.join(' ')).toMatch(/hoist CH-1: 446 kg against 400 kg \(112 %\)/);
  });

  it('a D8 hoist used as D8+ is derated to half and needs a second brake [PUB-2]', () => {
    const d8 = gear.map((g) => (g.id === 'h1' ? { ...g, hoistClass: 'D8' as const } : g));
    const r = evaluateLiftPlan(basePlan({ gear: d8, suspension: { kind: 'single-hook', hoistGearId: 'h1', hoistUsedAs: 'D8+', hangingPoint: { label: 'Beam 3', ratingKg: 2000, source: 'venue' } } }));
    expect(r.components.find((c) => c.kind === 'hoist')!.capacityKg).toBe(500);
    expect(r.problems.join(' ')).toMatch(/second brake/);
  });

  it('bad input: no verdict with the field named', () => {
    const r = evaluateLiftPlan({ ...basePlan(), load: { massKg: -5, cogMm: [0, 0, 0] } });
    expect(r.verdict).toBe('no verdict');
    expect(r.problems[0]).toMatch(/^load\.massKg/);
    expect(r.cautions.length).toBeGreaterThan(0);
  });

  it('a missing sling gives no verdict', () => {
    const r = evaluateLiftPlan(basePlan({ pickPoints: [{ id: 'A', positionMm: [-600, 0, 600] }, { id: 'B', positionMm: [600, 0, 600], slingGearId: 's2' }] }));
    expect(r.verdict).toBe('no verdict');
    expect(r.problems.join(' ')).toMatch(/Pick point A: no sling chosen/);
  });
});

describe('evaluateLiftPlan: tilt with unequal slings', () => {
  it('shows the tilt; refuses it beyond maxTiltDeg', () => {
    const uneven = gear.map((g) => (g.id === 's2' ? { ...g, lengthMm: 1400 } : g));
    const r = evaluateLiftPlan(basePlan({ gear: uneven }));
    expect(r.tiltDeg!).toBeGreaterThan(5);
    expect(r.findings.find((f) => f.code === 'tilt')!.message).toMatch(/tilts/);
    expect(r.hanging!.world.hookMm[0]).toBeCloseTo(0, 6);
    const strict = evaluateLiftPlan(basePlan({ gear: uneven, maxTiltDeg: 5 }));
    expect(strict.verdict).toBe('no verdict');
  });
});

describe('evaluateLiftPlan: load picked from below its CoG', () => {
  it('two slings to points below the CoG: the load turns over about the pick line, refused', () => {
    const r = evaluateLiftPlan(
      basePlan({
        load: { massKg: 400, massWeighed: true, cogMm: [0, 0, 500], boundsMm: { minMm: [-700, -400, 0], maxMm: [700, 400, 1000] } },
        pickPoints: [
          { id: 'A', positionMm: [-600, 0, 0], slingGearId: 's1' },
          { id: 'B', positionMm: [600, 0, 0], slingGearId: 's2' },
        ],
      }),
    );
    expect(r.verdict).toBe('no verdict');
    expect(r.findings.map((f) => f.code)).toContain('load-turns-over');
    expect(r.tiltDeg!).toBeGreaterThan(90);
  });
});

describe('evaluateLiftPlan: vertical legs', () => {
  const hoists = (over: Partial<LiftPlanInput> = {}) =>
    basePlan({
      suspension: {
        kind: 'hoists',
        legs: [
          { pickPointId: 'A', hoistGearId: 'h1', hangingPoint: { label: 'P1', ratingKg: 1000, source: 'venue' } },
          { pickPointId: 'B', hoistGearId: 'h2', hangingPoint: { label: 'P2', ratingKg: 1000, source: 'venue' } },
        ],
      },
      ...over,
    });

  it('CoG uncertainty ±100 mm in x: the worst share is the lever rule at the extreme, 400 × 700/1200 [COMP]', () => {
    const r = evaluateLiftPlan(hoists({ load: { massKg: 400, massWeighed: true, cogMm: [0, 0, 300], cogUncertainty: { plusMinusMm: [100, 0, 0] }, boundsMm: { minMm: [-700, -400, 0], maxMm: [700, 400, 600] } } }));
    expect(r.verdict).toBe('ok');
    expect(r.legs[0].nominalTensionKg).toBeCloseTo(200, 9);
    expect(r.legs[0].worstTensionKg).toBeCloseTo((400 * 700) / 1200, 9);
    expect(r.legs[0].governingCase).toMatch(/x−/);
    expect(r.legs[1].governingCase).toMatch(/x\+/);
    const hoistA = r.components.find((c) => c.subject === 'hoist CH-1')!;
    expect(hoistA.loadKg).toBeCloseTo(((400 * 700) / 1200 + 2.8) * 1.1, 9);
  });

  it('two-point pick, W 10,000 lb, CoG 2 ft from B, 8 ft from A → B 8,000 lb, A 2,000 lb [PUB-2 sling maker page]', () => {
    const ft = 304.8;
    const big = gear.map((g) => (g.kind === 'hoist' ? { ...g, ratedLoadKg: 20000 } : g.kind === 'sling' ? { ...g, verticalRatingKg: 20000 } : g.kind === 'shackle' ? { ...g, ratingKg: 20000 } : g));
    const r = evaluateLiftPlan(
      hoists({
        gear: big,
        load: { massKg: 10000, massWeighed: true, cogMm: [8 * ft, 0, 0], boundsMm: { minMm: [0, -300, 0], maxMm: [10 * ft, 300, 500] } },
        pickPoints: [
          { id: 'A', positionMm: [0, 0, 500], slingGearId: 's1', shackleGearIds: ['k1'] },
          { id: 'B', positionMm: [10 * ft, 0, 500], slingGearId: 's2', shackleGearIds: ['k2'] },
        ],
      }),
    );
    expect(r.legs[0].worstTensionKg).toBeCloseTo(2000, 6);
    expect(r.legs[1].worstTensionKg).toBeCloseTo(8000, 6);
  });

  it('four vertical legs: rated as if two carry (W/2), and noted [PUB-2 NAVEDTRA 14080]', () => {
    const four = basePlan({
      pickPoints: [
        { id: 'A', positionMm: [-600, -300, 600], slingGearId: 's1' },
        { id: 'B', positionMm: [600, -300, 600], slingGearId: 's2' },
        { id: 'C', positionMm: [600, 300, 600], slingGearId: 's1' },
        { id: 'D', positionMm: [-600, 300, 600], slingGearId: 's2' },
      ],
      suspension: { kind: 'spreader-beam', beamGearId: 'b1', hoistGearId: 'h1', hangingPoint: { label: 'P1', ratingKg: 2000, source: 'venue' } },
    });
    const r = evaluateLiftPlan(four);
    expect(r.findings.map((f) => f.code)).toContain('four-plus-legs-two-carry');
    r.legs.forEach((l) => expect(l.worstTensionKg).toBeCloseTo(200, 9));
    const beam = r.components.find((c) => c.kind === 'spreader-beam')!;
    expect(beam.loadKg).toBeCloseTo((400 + 2 * 4) * 1.1, 9);
    expect(r.loads!.staticHookLoadKg).toBeCloseTo(400 + 8 + 60, 9);
  });
});

describe('evaluateLiftPlan: four legs on one hook', () => {
  const four = (legRating: 'two-carry' | 'en13414-symmetric') =>
    basePlan({
      legRating,
      pickPoints: [
        { id: 'A', positionMm: [-500, -500, 600], slingGearId: 's1' },
        { id: 'B', positionMm: [500, -500, 600], slingGearId: 's2' },
        { id: 'C', positionMm: [500, 500, 600], slingGearId: 's1' },
        { id: 'D', positionMm: [-500, 500, 600], slingGearId: 's2' },
      ],
    });

  it('two-carry: W / (2 sin θ) per leg', () => {
    const r = evaluateLiftPlan(four('two-carry'));
    const theta = Math.asin(Math.sqrt(1200 ** 2 - 2 * 500 ** 2) / 1200);
    r.legs.forEach((l) => expect(l.worstTensionKg).toBeCloseTo(400 / (2 * Math.sin(theta)), 6));
    expect(r.findings.map((f) => f.code)).toContain('four-plus-legs-two-carry');
  });

  it('off-centre CoG: each leg is rated at least at its share in any three-leg subset (independent statics)', () => {
    const plan = { ...four('two-carry'), load: { massKg: 400, massWeighed: true, cogMm: [-200, -150, 300] as [number, number, number] } };
    const r = evaluateLiftPlan(plan);
    const hook = r.hanging!.hookInLoadMm;
    const up = r.hanging!.upInLoad;
    const pts = plan.pickPoints.map((p) => p.positionMm as [number, number, number]);
    // Statics in the load's frame at the hanging pose: the weight acts along −up.
    let feasible = 0;
    for (const tri of [[0, 1, 3], [0, 1, 2], [0, 2, 3], [1, 2, 3]]) {
      const t = solveTriple(tri.map((i) => pts[i]), hook, up, 400);
      if (!t) continue;
      feasible++;
      tri.forEach((legIdx, q) => expect(r.legs[legIdx].worstTensionKg).toBeGreaterThanOrEqual(t[q] - 1e-6));
    }
    expect(feasible).toBeGreaterThan(0);
    // Leg A, nearest the CoG, carries more than W / (2 sin θ) in some subset: the subset figure governs.
    const theta = (r.legs[0].angleFromHorizontalDeg * Math.PI) / 180;
    expect(r.legs[0].worstTensionKg).toBeGreaterThan(400 / (2 * Math.sin(theta)));
  });

  it('EN 13414-1 as an explicit choice: W / 2.1 for β ≤ 45° (here 53.9° from horizontal → β 36.1°) [PUB-2]', () => {
    const r = evaluateLiftPlan(four('en13414-symmetric'));
    const beta = 90 - (Math.asin(Math.sqrt(1200 ** 2 - 2 * 500 ** 2) / 1200) * 180) / Math.PI;
    expect(beta).toBeLessThan(45);
    r.legs.forEach((l) => expect(l.worstTensionKg).toBeCloseTo(400 / 2.1, 9));
    expect(r.findings.find((f) => f.code === 'en13414-choice')!.message).toMatch(/symmetric/);
    // Longer slings push β past 45°: the factor drops to 1.5.
    const long = evaluateLiftPlan({ ...four('en13414-symmetric'), gear: gear.map((g) => (g.kind === 'sling' ? { ...g, lengthMm: 900 } : g)) });
    const beta2 = 90 - (Math.asin(Math.sqrt(900 ** 2 - 2 * 500 ** 2) / 900) * 180) / Math.PI;
    expect(beta2).toBeGreaterThan(45);
    long.legs.forEach((l) => expect(l.worstTensionKg).toBeCloseTo(400 / 1.5, 9));
  });
});

describe('evaluateLiftPlan: property — leg forces balance the load', () => {
  it('random three-leg single-hook plans: Σ T sin θ = W and the hook stays plumb above the CoG', () => {
    let s = 17;
    const rnd = () => (s = (s * 16807) % 2147483647) / 2147483647;
    let count = 0;
    for (let k = 0; k < 40; k++) {
      const pts: [number, number, number][] = [[-800 + rnd() * 200, -600 + rnd() * 200, 600], [800 - rnd() * 200, -600 + rnd() * 200, 600], [rnd() * 200 - 100, 700 + rnd() * 200, 600]];
      const cog: [number, number, number] = [rnd() * 200 - 100, rnd() * 200 - 100, 300];
      const slings: GearItem[] = pts.map((_, i) => ({ id: `x${i}`, identifier: `X-${i}`, kind: 'sling', slingType: 'web', verticalRatingKg: 5000, lengthMm: 1500 + rnd() * 300, massKg: 1, nextInspectionDate: '2027-01-01' }));
      const r = evaluateLiftPlan(
        basePlan({
          gear: [...gear, ...slings],
          load: { massKg: 500, massWeighed: true, cogMm: cog },
          pickPoints: pts.map((p, i) => ({ id: `P${i}`, positionMm: p, slingGearId: `x${i}` })),
        }),
      );
      if (!r.hanging || r.legs.length !== 3) continue;
      const vertical = r.legs.reduce((a, l) => a + l.nominalTensionKg * Math.sin((l.angleFromHorizontalDeg * Math.PI) / 180), 0);
      expect(vertical).toBeCloseTo(500, 6);
      expect(r.hanging.world.hookMm[0]).toBeCloseTo(cog[0], 9);
      expect(r.hanging.world.hookMm[1]).toBeCloseTo(cog[1], 9);
      count++;
    }
    expect(count).toBeGreaterThan(30);
  });
});
