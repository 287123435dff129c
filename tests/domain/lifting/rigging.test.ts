import { describe, expect, it } from 'vitest';
import {
  bridleLegTensionKg,
  slingAngleFactor,
  slingAngleFromGeometryDeg,
  slingAngleProblem,
  slingRatingAtAngleKg,
} from '../../../src/domain/lifting/sling-angle.ts';
import { hitchFactor } from '../../../src/domain/lifting/hitch.ts';
import { en13414LegFactor } from '../../../src/domain/lifting/leg-factors.ts';
import { hoistRatingForUse, HOIST_RULE_SETS } from '../../../src/domain/lifting/hoist-classes.ts';
import { gearUsableOn, liftingPointRatingKg } from '../../../src/domain/lifting/gear.ts';
import { DEFAULT_DYNAMIC_FACTOR, dynamicFactorProblem, en13001Phi2 } from '../../../src/domain/lifting/dynamic-factor.ts';
import { gearItem, liftPlanInput } from '../../../src/domain/contracts/lifting.ts';
import type { LiftingPointItem } from '../../../src/domain/contracts/lifting.ts';
import { KG_PER_POUND } from '../../../src/domain/units.ts';

// Check values from /work/shared/REFERENCES.md §2 with their tags. Where a check is in pounds, the
// functions are unit-free in the force (kg in, kg out), so pounds go in and out unchanged.

describe('sling angle factor 1/sin θ [PUB-2, ASME B30.9 tables as reproduced by sling makers]', () => {
  it('90/75/60/45/30° → 1.000/1.035/1.155/1.414/2.000 within 0.002', () => {
    const table: [number, number][] = [[90, 1.0], [75, 1.035], [60, 1.155], [45, 1.414], [30, 2.0]];
    for (const [deg, f] of table) expect(Math.abs(slingAngleFactor(deg) - f)).toBeLessThanOrEqual(0.002);
  });

  it('below 30° from horizontal is refused [PUB-2, NAVEDTRA 14080]', () => {
    expect(slingAngleProblem(30)).toBeNull();
    expect(slingAngleProblem(29.9)).toMatch(/below the 30° minimum/);
    expect(() => bridleLegTensionKg({ loadKg: 1000, legs: 2, legAngleFromHorizontalDeg: 29 })).toThrow(/30°/);
  });
});

describe('bridle leg tension T = (W/n)/sin θ', () => {
  it('2-leg bridle, W 1000 lb at 90/60/45/30° → 500 / 577.35 / 707.1 / 1000 lb per leg [PUB-2 NAVEDTRA 14080; COMP]', () => {
    const t = (deg: number) => bridleLegTensionKg({ loadKg: 1000, legs: 2, legAngleFromHorizontalDeg: deg });
    expect(t(90)).toBeCloseTo(500, 6);
    expect(t(60)).toBeCloseTo(577.35, 2);
    expect(t(45)).toBeCloseTo(707.1, 1);
    expect(t(30)).toBeCloseTo(1000, 6);
  });

  it('three or four legs: two carry unless told otherwise [PUB-2 NAVEDTRA 14080]', () => {
    expect(bridleLegTensionKg({ loadKg: 1000, legs: 4, legAngleFromHorizontalDeg: 60 })).toBeCloseTo(577.35, 2);
    expect(bridleLegTensionKg({ loadKg: 1000, legs: 3, legAngleFromHorizontalDeg: 90 })).toBeCloseTo(500, 6);
    expect(bridleLegTensionKg({ loadKg: 900, legs: 3, legAngleFromHorizontalDeg: 90, carryingLegs: 3 })).toBeCloseTo(300, 6);
    expect(() => bridleLegTensionKg({ loadKg: 900, legs: 3, legAngleFromHorizontalDeg: 90, carryingLegs: 4 })).toThrow(/1 to 3/);
  });

  it('tension factor: 1,200 lb per leg, L 120 in, H 96 in → factor 1.25, leg needs a 1,500 lb rating [PUB-2 sling maker guidance]', () => {
    const deg = slingAngleFromGeometryDeg({ slingLengthMm: 120, heightMm: 96 });
    expect(slingAngleFactor(deg)).toBeCloseTo(1.25, 10);
    // Per-leg vertical share 1,200 lb: 2 legs of a 2,400 lb load.
    expect(bridleLegTensionKg({ loadKg: 2400, legs: 2, legAngleFromHorizontalDeg: deg })).toBeCloseTo(1500, 6);
  });

  it('reduction factor: vertical rating 8,000 lb, H 84 in, L 96 in → 7,000 lb [PUB-2 same]', () => {
    const deg = slingAngleFromGeometryDeg({ slingLengthMm: 96 * 25.4, heightMm: 84 * 25.4 });
    expect(slingRatingAtAngleKg({ verticalRatingKg: 8000 * KG_PER_POUND, legAngleFromHorizontalDeg: deg }) / KG_PER_POUND).toBeCloseTo(7000, 6);
    expect(() => slingAngleFromGeometryDeg({ slingLengthMm: 80, heightMm: 84 })).toThrow(/shorter/);
  });
});

describe('hitch factors [PUB-2 sling makers]', () => {
  it('choker 0.75 wire rope, 0.8 web, roundsling, chain; basket 2× and 2× sin θ', () => {
    expect(hitchFactor({ slingType: 'wire-rope', hitch: 'choker' }).factor).toBe(0.75);
    expect(hitchFactor({ slingType: 'web', hitch: 'choker' }).factor).toBe(0.8);
    expect(hitchFactor({ slingType: 'roundsling', hitch: 'choker' }).factor).toBe(0.8);
    expect(hitchFactor({ slingType: 'chain', hitch: 'choker' }).factor).toBe(0.8);
    expect(hitchFactor({ slingType: 'web', hitch: 'basket' }).factor).toBe(2);
    expect(hitchFactor({ slingType: 'web', hitch: 'basket', legAngleFromHorizontalDeg: 60 }).factor).toBeCloseTo(2 * Math.sin(Math.PI / 3), 12);
    expect(hitchFactor({ slingType: 'web', hitch: 'vertical' }).factor).toBe(1);
  });

  it('choke angle below 120° gets no factor; maker figures override', () => {
    const r = hitchFactor({ slingType: 'wire-rope', hitch: 'choker', chokeAngleDeg: 90 });
    expect(r.factor).toBeNull();
    expect(r.reason).toMatch(/120°/);
    expect(hitchFactor({ slingType: 'web', hitch: 'choker', makerFactors: { choker: 0.7 } }).factor).toBe(0.7);
  });
});

describe('EN 13414-1 Table 4 leg factors [PUB-2 makers quoting the standard]', () => {
  it('2-leg 1.4 / 1.0; 3- and 4-leg 2.1 / 1.5; none beyond 60° from vertical', () => {
    expect(en13414LegFactor({ legs: 2, betaFromVerticalDeg: 45 }).factor).toBe(1.4);
    expect(en13414LegFactor({ legs: 2, betaFromVerticalDeg: 50 }).factor).toBe(1.0);
    expect(en13414LegFactor({ legs: 3, betaFromVerticalDeg: 30 }).factor).toBe(2.1);
    expect(en13414LegFactor({ legs: 4, betaFromVerticalDeg: 60 }).factor).toBe(1.5);
    expect(en13414LegFactor({ legs: 4, betaFromVerticalDeg: 61 }).factor).toBeNull();
    expect(en13414LegFactor({ legs: 5, betaFromVerticalDeg: 30 }).factor).toBeNull();
  });

  it('the table is the trigonometry rounded down at the band edge: 2 cos 45° = 1.414 ≥ 1.4, 3 cos 45° = 2.12 ≥ 2.1 [COMP]', () => {
    const c45 = Math.cos(Math.PI / 4);
    expect(2 * c45).toBeGreaterThanOrEqual(en13414LegFactor({ legs: 2, betaFromVerticalDeg: 45 }).factor!);
    expect(3 * c45).toBeGreaterThanOrEqual(en13414LegFactor({ legs: 3, betaFromVerticalDeg: 45 }).factor!);
    expect(2 * 0.5).toBeGreaterThanOrEqual(en13414LegFactor({ legs: 2, betaFromVerticalDeg: 60 }).factor!);
    expect(3 * 0.5).toBeGreaterThanOrEqual(en13414LegFactor({ legs: 3, betaFromVerticalDeg: 60 }).factor!);
  });
});

describe('hoist class rule set (IGVW SQ P2 as quoted) [PUB-2]', () => {
  it('D8 used as D8+ is derated to half and needs a second brake', () => {
    const ok = hoistRatingForUse({ ratedLoadKg: 1000, hoistClass: 'D8', usedAs: 'D8+', hasSecondBrake: true });
    expect(ok.effectiveRatingKg).toBe(500);
    expect(ok.problems).toEqual([]);
    const noBrake = hoistRatingForUse({ ratedLoadKg: 1000, hoistClass: 'D8', usedAs: 'D8+' });
    expect(noBrake.problems.join(' ')).toMatch(/second brake/);
  });

  it('a class used as itself or for a lower duty keeps its rating; D8 cannot serve as C1', () => {
    expect(hoistRatingForUse({ ratedLoadKg: 1000, hoistClass: 'D8' }).effectiveRatingKg).toBe(1000);
    expect(hoistRatingForUse({ ratedLoadKg: 1000, hoistClass: 'C1', usedAs: 'D8' }).effectiveRatingKg).toBe(1000);
    const c1 = hoistRatingForUse({ ratedLoadKg: 1000, hoistClass: 'D8', usedAs: 'C1' });
    expect(c1.effectiveRatingKg).toBeNull();
    expect(c1.problems[0]).toMatch(/may not be used as C1/);
    expect(HOIST_RULE_SETS['igvw-sq-p2'].classes.C1.overPeople).toBe(true);
    expect(HOIST_RULE_SETS['igvw-sq-p2'].classes.D8.overPeople).toBe(false);
  });
});

describe('gear: inspection dates and lifting point derating', () => {
  const sling = { kind: 'sling' as const, identifier: 'WS-07', nextInspectionDate: '2026-06-30' };
  it('usable up to its next inspection date, not after; the reason names the item and the date', () => {
    expect(gearUsableOn(sling, '2026-06-29').usable).toBe(true);
    expect(gearUsableOn(sling, '2026-06-30').usable).toBe(true);
    const late = gearUsableOn(sling, '2026-07-01');
    expect(late.usable).toBe(false);
    expect(late.reason).toMatch(/WS-07.*2026-06-30/);
    expect(gearUsableOn({ ...sling, nextInspectionDate: '2026-02-30' }, '2026-01-01').usable).toBe(false);
  });

  it('lifting point: full rating on axis, maker table off axis, refused beyond it or without a table', () => {
    const eye: LiftingPointItem = {
      id: 'e1', identifier: 'EB-M16-1', kind: 'lifting-point', pointType: 'eyebolt', ratingKg: 700, massKg: 0.3, nextInspectionDate: '2027-01-01',
      angleDerating: [{ upToDegFromAxis: 45, factor: 0.7 }, { upToDegFromAxis: 90, factor: 0.5 }],
    };
    expect(liftingPointRatingKg(eye, 0).ratingKg).toBe(700);
    expect(liftingPointRatingKg(eye, 30).ratingKg).toBeCloseTo(490, 10);
    expect(liftingPointRatingKg(eye, 60).ratingKg).toBe(350);
    expect(liftingPointRatingKg({ ...eye, angleDerating: [{ upToDegFromAxis: 45, factor: 0.7 }] }, 60).ratingKg).toBeNull();
    expect(liftingPointRatingKg({ ...eye, angleDerating: undefined }, 20).reason).toMatch(/no angle derating/);
  });
});

describe('dynamic factor and contracts', () => {
  it('default 1.10 with its source [PUB-2 GL Noble Denton 0027/ND Table 5-1]; a factor without source is refused', () => {
    expect(DEFAULT_DYNAMIC_FACTOR.value).toBe(1.1);
    expect(DEFAULT_DYNAMIC_FACTOR.source).toMatch(/0027/);
    expect(dynamicFactorProblem({ value: 1.2, source: ' ' })).toMatch(/source/);
    expect(dynamicFactorProblem({ value: 0.9, source: 'x' })).toMatch(/at least 1/);
    expect(en13001Phi2({ hoistingClass: 'HC2', hoistingSpeedMPerS: 0.1 }).value).toBeCloseTo(1.134, 10);
  });

  it('zod schemas accept a gear item and a plan, and reject a bad date or a negative rating', () => {
    const hoist = { id: 'h1', identifier: 'CH-1', kind: 'hoist', ratedLoadKg: 1000, selfWeightKg: 50, chainWeightKg: 20, hoistClass: 'D8+', nextInspectionDate: '2027-01-01' };
    expect(gearItem.safeParse(hoist).success).toBe(true);
    expect(gearItem.safeParse({ ...hoist, nextInspectionDate: '01/01/2027' }).success).toBe(false);
    expect(gearItem.safeParse({ ...hoist, ratedLoadKg: -1 }).success).toBe(false);
    const plan = liftPlanInput.parse({
      evaluationDate: '2026-03-01',
      load: { massKg: 400, cogMm: [0, 0, 300] },
      pickPoints: [{ id: 'A', positionMm: [-500, 0, 600] }, { id: 'B', positionMm: [500, 0, 600] }],
      suspension: { kind: 'single-hook', hoistGearId: 'h1', hangingPoint: { label: 'Beam 3', ratingKg: 2000, source: 'venue' } },
      peopleBelow: false,
      gear: [hoist],
    });
    expect(plan.legRating).toBe('two-carry');
    expect(plan.exclusionMarginMm).toBe(1000);
    expect(plan.pickPoints[0].hitch).toBe('vertical');
  });
});
