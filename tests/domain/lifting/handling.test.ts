import { describe, expect, it } from 'vitest';
import { guidelineWeightKg, type GUIDELINE_WEIGHTS_KG, repetitionReduction, twistReduction } from '../../../src/domain/lifting/guideline-weights.ts';
import { teamCapacityKg } from '../../../src/domain/lifting/team.ts';
import { handlingVerdict } from '../../../src/domain/lifting/handling-verdict.ts';
import { LIFTING_CAUTIONS } from '../../../src/domain/lifting/cautions.ts';

// HSE INDG143(rev4) Manual handling at work (2020) Figure 1 and L23 (2016) Appendix 3 [PUB-2], as
// transcribed in /work/shared/REFERENCES.md §1.2.

describe('UK guideline weights', () => {
  it('Figure 1 values by zone, column and reach [PUB-2]', () => {
    const rows: [keyof typeof GUIDELINE_WEIGHTS_KG, number, number, number, number][] = [
      ['above-shoulder', 10, 5, 7, 3],
      ['elbow-to-shoulder', 20, 10, 13, 7],
      ['knuckle-to-elbow', 25, 15, 16, 10],
      ['lower-leg-to-knuckle', 20, 10, 13, 7],
      ['below-lower-leg', 10, 5, 7, 3],
    ];
    for (const [zone, mc, me, wc, we] of rows) {
      const g = (column: 'men' | 'women', reach: 'close' | 'extended') =>
        guidelineWeightKg({ zones: [zone], column, reach, liftsPerMin: 0.1, twistDeg: 0 }).guidelineKg;
      expect([g('men', 'close'), g('men', 'extended'), g('women', 'close'), g('women', 'extended')]).toEqual([mc, me, wc, we]);
    }
  });

  it('several zones: the smallest figure counts [PUB-2]', () => {
    const r = guidelineWeightKg({ zones: ['knuckle-to-elbow', 'below-lower-leg'], column: 'men', reach: 'close', liftsPerMin: 0.1, twistDeg: 0 });
    expect(r.guidelineKg).toBe(10);
  });

  it('repetition −30 % at 1–2/min, −50 % at 5–8/min, −80 % above 12/min; twist −10 % beyond 45°, −20 % beyond 90° [PUB-2]', () => {
    expect(repetitionReduction(1)).toBe(0.3);
    expect(repetitionReduction(2)).toBe(0.3);
    expect(repetitionReduction(5)).toBe(0.5);
    expect(repetitionReduction(8)).toBe(0.5);
    expect(repetitionReduction(13)).toBe(0.8);
    // Gaps in the guidance take the next stricter band (our reading).
    expect(repetitionReduction(3)).toBe(0.5);
    expect(repetitionReduction(10)).toBe(0.8);
    expect(repetitionReduction(0.5)).toBe(0);
    expect(twistReduction(45)).toBe(0);
    expect(twistReduction(46)).toBe(0.1);
    expect(twistReduction(91)).toBe(0.2);
    const r = guidelineWeightKg({ zones: ['knuckle-to-elbow'], column: 'men', reach: 'close', liftsPerMin: 1.5, twistDeg: 60 });
    expect(r.guidelineKg).toBeCloseTo(25 * 0.7 * 0.9, 10);
  });

  it('bad input gives applies false with the field named', () => {
    const r = guidelineWeightKg({ zones: [], column: 'men', reach: 'close', liftsPerMin: 0, twistDeg: 0 });
    expect(r.applies).toBe(false);
    expect(r.reasons[0]).toMatch(/zone/);
  });
});

describe('team rule (L23)', () => {
  it('two men at 25 kg: 33.3 kg; three: 37.5 kg [COMP from the L23 rule]; four: null (nothing published)', () => {
    expect(teamCapacityKg([25, 25])).toBeCloseTo(33.333, 3);
    expect(teamCapacityKg([25, 25, 25])).toBeCloseTo(37.5, 10);
    expect(teamCapacityKg([25, 25, 25, 25])).toBeNull();
    expect(teamCapacityKg([])).toBeNull();
    expect(teamCapacityKg([20])).toBe(20);
    // Mixed team: two-thirds of the sum.
    expect(teamCapacityKg([25, 16])).toBeCloseTo((2 / 3) * 41, 10);
    expect(() => teamCapacityKg([25, -1])).toThrow(/member 2/);
  });
});

describe('handling verdict', () => {
  const guideline = { zones: ['knuckle-to-elbow' as const], column: 'men' as const, reach: 'close' as const, liftsPerMin: 0.1, twistDeg: 0 };
  const v = (massKg: number, extra: object = {}) => handlingVerdict({ label: 'Crate 3', massKg, method: 'uk-guideline', guideline, ...extra });

  it('one person, team of 2, team of 3, mechanical aid by the guideline filter', () => {
    expect(v(25).verdict).toBe('one person');
    const two = v(30);
    expect(two.verdict).toBe('team of N');
    expect(two.teamSize).toBe(2);
    expect(two.capacityKg).toBeCloseTo(33.333, 3);
    const three = v(36);
    expect(three.teamSize).toBe(3);
    expect(three.capacityKg).toBeCloseTo(37.5, 10);
    const aid = v(40);
    expect(aid.verdict).toBe('mechanical aid required');
    expect(aid.reasons.join(' ')).toMatch(/four or more/);
    expect(v(30, { maxTeamSize: 1 }).verdict).toBe('mechanical aid required');
  });

  it('every verdict names the method and carries the standard cautions', () => {
    for (const r of [v(10), v(36), v(50), v(Number.NaN)]) {
      expect(r.method).toMatch(/HSE/);
      for (const c of LIFTING_CAUTIONS) expect(r.cautions).toContain(c);
    }
  });

  it('missing mass or task gives no verdict, never a pass', () => {
    expect(v(Number.NaN).verdict).toBe('no verdict');
    expect(handlingVerdict({ label: 'Box', massKg: 10, method: 'niosh' }).verdict).toBe('no verdict');
  });

  it('NIOSH method: RWL 23 kg at the ideal lift; team rule borrowed and said so; limitation → no verdict', () => {
    const niosh = {
      origin: { hCm: 25, vCm: 75, asymmetryDeg: 0 },
      destination: { hCm: 25, vCm: 100, asymmetryDeg: 0 },
      liftsPerMin: 0.2,
      durationHours: 1,
      coupling: 'good' as const,
      significantControlAtDestination: false,
    };
    expect(handlingVerdict({ label: 'Case', massKg: 23, method: 'niosh', niosh }).verdict).toBe('one person');
    const team = handlingVerdict({ label: 'Case', massKg: 30, method: 'niosh', niosh });
    expect(team.teamSize).toBe(2);
    expect(team.method).toMatch(/NIOSH/);
    expect(team.reasons.join(' ')).toMatch(/no team factor/);
    const limited = handlingVerdict({ label: 'Case', massKg: 5, method: 'niosh', niosh: { ...niosh, limitations: ['seated-or-kneeling'] } });
    expect(limited.verdict).toBe('no verdict');
    // H beyond 63 cm: the manual recommends no load → mechanical aid (or change the task).
    const far = handlingVerdict({ label: 'Case', massKg: 5, method: 'niosh', niosh: { ...niosh, origin: { hCm: 70, vCm: 75, asymmetryDeg: 0 } } });
    expect(far.verdict).toBe('mechanical aid required');
  });
});
