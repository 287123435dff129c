import { describe, expect, it } from 'vitest';
import { nioshRwl, nioshRwlUs, liftingIndex, liftingIndexBand } from '../../../src/domain/lifting/niosh.ts';
import { nioshTask } from '../../../src/domain/lifting/niosh-task.ts';
import { frequencyMultiplier, FM_FREQUENCIES } from '../../../src/domain/lifting/niosh-tables.ts';
import { estimateHandDistanceCm } from '../../../src/domain/lifting/hand-distance.ts';
import { classifyCoupling } from '../../../src/domain/lifting/coupling.ts';
import { KG_PER_POUND } from '../../../src/domain/units.ts';

// Source for this file unless noted: Waters, Putz-Anderson, Garg, Applications Manual for the Revised
// NIOSH Lifting Equation, DHHS (NIOSH) Publication 94-110, 1994, rev. 2021; check values from
// /work/shared/REFERENCES.md §1.1 with their tags.

const ideal = { hCm: 25, vCm: 75, dCm: 25, asymmetryDeg: 0, liftsPerMin: 0.2, durationHours: 1, coupling: 'good' as const };

describe('nioshRwl: check values of REFERENCES §1.1', () => {
  it('ideal lift gives the load constant, 23 kg [COMP] p. 7', () => {
    const r = nioshRwl(ideal);
    expect(r.applies).toBe(true);
    expect(r.rwlKg).toBeCloseTo(23, 6);
    expect([r.hm, r.vm, r.am, r.fm, r.cm]).toEqual([1, 1, 1, 1, 1]);
    // DM at D = 25 cm is 0.82 + 4.5/25 = 1.0 exactly.
    expect(r.dm).toBeCloseTo(1, 12);
  });

  it('multipliers from the formulas: HM(28) .8929, VM(0) .775, DM(40) .9325, AM(90) .712 [COMP]; Tables 1–4 print .89 .78 .93 .71', () => {
    const r = nioshRwl({ ...ideal, hCm: 28, vCm: 0, dCm: 40, asymmetryDeg: 90 });
    expect(r.hm).toBeCloseTo(0.8929, 4);
    expect(r.vm).toBeCloseTo(0.775, 6);
    expect(r.dm).toBeCloseTo(0.9325, 6);
    expect(r.am).toBeCloseTo(0.712, 6);
    // Agreement with the printed, two-decimal tables (tolerance half a unit in the last place, plus the
    // VM .775 → .78 round-half-up the manual uses).
    expect(Math.abs(r.hm - 0.89)).toBeLessThanOrEqual(0.005 + 1e-9);
    expect(Math.abs(r.vm - 0.78)).toBeLessThanOrEqual(0.005 + 1e-9);
    expect(Math.abs(r.dm - 0.93)).toBeLessThanOrEqual(0.005 + 1e-9);
    expect(Math.abs(r.am - 0.71)).toBeLessThanOrEqual(0.005 + 1e-9);
  });

  it('mixed case: L 15 kg, H 40, V 30, D 50, A 30°, 1/min, ≤1 h, fair → RWL 9.1345 kg, LI 1.642 [COMP]', () => {
    const r = nioshRwl({ hCm: 40, vCm: 30, dCm: 50, asymmetryDeg: 30, liftsPerMin: 1, durationHours: 1, coupling: 'fair' });
    expect(r.rwlKg).toBeCloseTo(9.1345, 4);
    expect(r.cm).toBe(0.95);
    expect(liftingIndex(15, r.rwlKg)).toBeCloseTo(1.642, 3);
  });

  it('same at the destination V 80 (FM from V_origin 30, CM 1.0) → 10.949 kg; governing 9.1345 [COMP] p. 21', () => {
    const d = nioshRwl({ hCm: 40, vCm: 80, dCm: 50, asymmetryDeg: 30, liftsPerMin: 1, durationHours: 1, coupling: 'fair', vOriginCm: 30 });
    expect(d.rwlKg).toBeCloseTo(10.949, 3);
    expect(d.cm).toBe(1);
    expect(d.frequencyColumn).toBe('low');
    const t = nioshTask({
      loadKg: 15,
      origin: { hCm: 40, vCm: 30, asymmetryDeg: 30 },
      destination: { hCm: 40, vCm: 80, asymmetryDeg: 30 },
      liftsPerMin: 1,
      durationHours: 1,
      coupling: 'fair',
      significantControlAtDestination: true,
    });
    expect(t.governingRwlKg).toBeCloseTo(9.1345, 4);
    expect(t.governingEnd).toBe('origin');
    expect(t.liftingIndex).toBeCloseTo(1.642, 3);
    // Without significant control only the origin counts.
    expect(nioshTask({ ...t.origin, loadKg: 15, origin: { hCm: 40, vCm: 30, asymmetryDeg: 30 }, destination: { hCm: 10, vCm: 80, asymmetryDeg: 0 }, liftsPerMin: 1, durationHours: 1, coupling: 'fair', significantControlAtDestination: false }).destination).toBeNull();
  });

  it('interpolation: ideal but F 2.4/min, ≤1 h → FM 0.898, RWL 20.654 kg [COMP] p. 7 (Example 7 interpolates F 2.4 the same way)', () => {
    const r = nioshRwl({ ...ideal, liftsPerMin: 2.4 });
    expect(r.fm).toBeCloseTo(0.898, 6);
    expect(r.rwlKg).toBeCloseTo(20.654, 3);
  });

  it('out of range: H 64 cm or A 136° gives RWL 0 [PUB] p. 8, p. 12', () => {
    const h = nioshRwl({ ...ideal, hCm: 64 });
    expect(h.hm).toBe(0);
    expect(h.rwlKg).toBe(0);
    expect(h.reasons.join(' ')).toMatch(/63 cm/);
    const a = nioshRwl({ ...ideal, asymmetryDeg: 136 });
    expect(a.am).toBe(0);
    expect(a.rwlKg).toBe(0);
    expect(a.reasons.join(' ')).toMatch(/135/);
    // Just inside the limits the multipliers are not zero.
    expect(nioshRwl({ ...ideal, hCm: 63 }).hm).toBeCloseTo(25 / 63, 10);
    expect(nioshRwl({ ...ideal, asymmetryDeg: 135 }).am).toBeCloseTo(0.568, 10);
  });

  it('V and D beyond 175 cm set VM and DM to 0 [PUB] pp. 9–11', () => {
    expect(nioshRwl({ ...ideal, vCm: 176 }).vm).toBe(0);
    expect(nioshRwl({ ...ideal, dCm: 176 }).dm).toBe(0);
    expect(nioshRwl({ ...ideal, vCm: 175 }).vm).toBeCloseTo(0.7, 10);
  });

  it('H and D below 25 cm count as 25; F below 0.2 counts as 0.2 [PUB] pp. 8, 10, 14', () => {
    expect(nioshRwl({ ...ideal, hCm: 10 }).hm).toBe(1);
    expect(nioshRwl({ ...ideal, dCm: 5 }).dm).toBeCloseTo(1, 12);
    expect(nioshRwl({ ...ideal, liftsPerMin: 0.01 }).fm).toBe(1);
  });
});

describe('nioshRwl: Example 4 of the manual (Package inspection, Fig. 14, p. 46) [PUB]', () => {
  // Worksheet: LC 51 lb, origin V 22 in, D 37 in, HM 1.0, VM .94, DM .87, AM 1.0, FM .88, CM .95 (fair);
  // destination V 59 in (VM .78), HM .50 (H 20 in, inferred from HM), CM 1.0. F and duration are not in
  // our transcription: F 3/min for ≤ 1 h is chosen because it gives the printed FM .88 (so is F 1/min
  // for ≤ 2 h); the check is of the equation, not of that choice.
  const common = { dIn: 37, asymmetryDeg: 0, liftsPerMin: 3, durationHours: 1, coupling: 'fair' as const, vOriginIn: 22 };

  it('origin: multipliers as printed to two decimals, RWL 34.8 lb at full precision (34.9 with rounded multipliers)', () => {
    const o = nioshRwlUs({ ...common, hIn: 10, vIn: 22 });
    expect(o.hm).toBe(1);
    expect(o.vm).toBeCloseTo(0.94, 10);
    expect(Math.abs(o.dm - 0.87)).toBeLessThan(0.005);
    expect(o.fm).toBeCloseTo(0.88, 10);
    expect(o.cm).toBe(0.95);
    expect(o.rwlLb).toBeCloseTo(34.8, 1);
    // The worksheet's own arithmetic with its rounded multipliers.
    const rounded = 51 * 1.0 * 0.94 * 0.87 * 1.0 * 0.88 * 0.95;
    expect(rounded).toBeCloseTo(34.9, 1);
    expect(Math.abs(o.rwlLb - rounded)).toBeLessThan(0.2);
  });

  it('destination: RWL 15.3 lb at full precision (15.2 printed with rounded multipliers)', () => {
    const d = nioshRwlUs({ ...common, hIn: 20, vIn: 59 });
    expect(d.hm).toBeCloseTo(0.5, 10);
    expect(Math.abs(d.vm - 0.78)).toBeLessThan(0.005);
    expect(d.cm).toBe(1);
    expect(d.rwlLb).toBeCloseTo(15.25, 1);
    expect(Math.abs(d.rwlLb - 15.2)).toBeLessThan(0.1);
  });

  it('converted to metric (in → cm, lb → kg): within 4 % of the U.S. result, and below it', () => {
    // The metric and U.S. constants are parallel, not exact conversions (LC 23 kg vs 51 lb = 23.13 kg,
    // −0.6 %; HM 25/H vs 10/H in inches, −1.6 %; V optimum 75 cm vs 30 in = 76.2 cm), hence the
    // tolerance; every metric constant is the stricter one here, so metric comes out lower.
    const cm = (inch: number) => inch * 2.54;
    const o = nioshRwl({ hCm: cm(10), vCm: cm(22), dCm: cm(37), asymmetryDeg: 0, liftsPerMin: 3, durationHours: 1, coupling: 'fair' });
    const d = nioshRwl({ hCm: cm(20), vCm: cm(59), dCm: cm(37), asymmetryDeg: 0, liftsPerMin: 3, durationHours: 1, coupling: 'fair', vOriginCm: cm(22) });
    const usO = 34.8 * KG_PER_POUND;
    const usD = 15.3 * KG_PER_POUND;
    expect(Math.abs(o.rwlKg - usO) / usO).toBeLessThan(0.04);
    expect(Math.abs(d.rwlKg - usD) / usD).toBeLessThan(0.04);
    expect(o.rwlKg).toBeLessThan(usO);
    expect(d.rwlKg).toBeLessThan(usD);
  });
});

describe('nioshRwl: frequency table and bands', () => {
  it('duration bands ≤1, ≤2, ≤8 h select the Table 5 columns; over 8 h does not apply (p. 14)', () => {
    const f = (h: number) => nioshRwl({ ...ideal, liftsPerMin: 1, durationHours: h });
    expect(f(1).fm).toBe(0.94);
    expect(f(1.5).fm).toBe(0.88);
    expect(f(2).fm).toBe(0.88);
    expect(f(8).fm).toBe(0.75);
    const over = f(9);
    expect(over.applies).toBe(false);
    expect(Number.isNaN(over.rwlKg)).toBe(true);
    expect(over.reasons.join(' ')).toMatch(/8 hours/);
  });

  it('vOriginCm selects the V column: 9/min for 8 h is .00 below 75 cm and .15 at or above (Table 5)', () => {
    expect(nioshRwl({ ...ideal, vCm: 80, liftsPerMin: 9, durationHours: 8, vOriginCm: 50 }).fm).toBe(0);
    expect(nioshRwl({ ...ideal, vCm: 50, liftsPerMin: 9, durationHours: 8, vOriginCm: 80 }).fm).toBe(0.15);
    expect(nioshRwl({ ...ideal, vCm: 80, liftsPerMin: 9, durationHours: 8 }).fm).toBe(0.15);
  });

  it('F above 15/min gives FM 0 in every column (Table 5)', () => {
    for (const h of [1, 2, 8]) for (const v of [50, 80]) expect(nioshRwl({ ...ideal, vCm: v, liftsPerMin: 16, durationHours: h }).fm).toBe(0);
  });

  it('property: FM never rises with frequency, stays in [0, 1], and equals the table at every row', () => {
    for (const band of ['1h', '2h', '8h'] as const) {
      for (const col of ['low', 'high'] as const) {
        let prev = 1;
        for (let f = 0; f <= 16; f += 0.05) {
          const fm = frequencyMultiplier(f, band, col);
          expect(fm).toBeGreaterThanOrEqual(0);
          expect(fm).toBeLessThanOrEqual(prev + 1e-12);
          prev = fm;
        }
      }
    }
    expect(FM_FREQUENCIES.map((f) => frequencyMultiplier(f, '2h', 'high'))).toEqual([0.95, 0.92, 0.88, 0.84, 0.79, 0.72, 0.6, 0.5, 0.42, 0.35, 0.3, 0.26, 0.23, 0.21, 0, 0, 0]);
  });

  it('property: RWL never exceeds the load constant, for random inputs in range', () => {
    let seed = 7;
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    for (let i = 0; i < 500; i++) {
      const r = nioshRwl({
        hCm: rnd() * 70, vCm: rnd() * 180, dCm: rnd() * 180, asymmetryDeg: rnd() * 140, liftsPerMin: rnd() * 16,
        durationHours: 0.1 + rnd() * 7.9, coupling: (['good', 'fair', 'poor'] as const)[Math.floor(rnd() * 3)],
      });
      expect(r.applies).toBe(true);
      expect(r.rwlKg).toBeGreaterThanOrEqual(0);
      expect(r.rwlKg).toBeLessThanOrEqual(23 + 1e-9);
      expect(r.rwlKg).toBeCloseTo(23 * r.hm * r.vm * r.dm * r.am * r.fm * r.cm, 10);
    }
  });
});

describe('nioshRwl: outside the method (p. 6) and bad input', () => {
  it('a recorded limitation gives applies false, a reason and no number', () => {
    const r = nioshRwl({ ...ideal, limitations: ['one-handed', 'unstable-load'] });
    expect(r.applies).toBe(false);
    expect(Number.isNaN(r.rwlKg)).toBe(true);
    expect(r.reasons.join(' ')).toMatch(/one hand/);
    expect(r.reasons.join(' ')).toMatch(/unstable/);
  });

  it('negative or missing inputs name the field', () => {
    const r = nioshRwl({ ...ideal, hCm: -1 });
    expect(r.applies).toBe(false);
    expect(r.reasons[0]).toMatch(/^H /);
    const n = nioshRwl({ ...ideal, liftsPerMin: Number.NaN });
    expect(n.applies).toBe(false);
    expect(n.reasons[0]).toMatch(/frequency/);
  });

  it('LI: Infinity at RWL 0, NaN when the method did not apply; bands at 1 and 3 (p. 20)', () => {
    expect(liftingIndex(10, 0)).toBe(Number.POSITIVE_INFINITY);
    expect(Number.isNaN(liftingIndex(10, Number.NaN))).toBe(true);
    expect(liftingIndexBand(1)).toBe('goal met');
    expect(liftingIndexBand(1.01)).toBe('increased risk for some workers');
    expect(liftingIndexBand(3.01)).toBe('increased risk for nearly all workers');
    expect(liftingIndexBand(Number.NaN)).toBe('unknown');
  });
});

describe('hand distance estimate and coupling class', () => {
  it('H = 20 + W/2 at V ≥ 25 cm, 25 + W/2 below, flagged as an estimate [PUB-2] manual p. 8', () => {
    const a = estimateHandDistanceCm({ loadDepthCm: 40, vCm: 75 });
    expect(a.hCm).toBe(40);
    expect(a.estimated).toBe(true);
    expect(a.basis).toMatch(/Estimate/);
    expect(estimateHandDistanceCm({ loadDepthCm: 40, vCm: 10 }).hCm).toBe(45);
    expect(() => estimateHandDistanceCm({ loadDepthCm: -1, vCm: 10 })).toThrow(/depth/);
  });

  it('containers over 40 cm long or 30 cm high are not optimal → poor (Table 6 notes 3, 5) [PUB-2]', () => {
    expect(classifyCoupling({ kind: 'container', frontalLengthCm: 41, heightCm: 20, handles: 'optimal' }).coupling).toBe('poor');
    expect(classifyCoupling({ kind: 'container', frontalLengthCm: 40, heightCm: 31, handles: 'optimal' }).coupling).toBe('poor');
    expect(classifyCoupling({ kind: 'container', frontalLengthCm: 40, heightCm: 30, handles: 'optimal' }).coupling).toBe('good');
    expect(classifyCoupling({ kind: 'container', frontalLengthCm: 30, heightCm: 20, handles: 'none', fingersFlexed90: true }).coupling).toBe('fair');
    expect(classifyCoupling({ kind: 'container', frontalLengthCm: 30, heightCm: 20, handles: 'none' }).coupling).toBe('poor');
    // In doubt, the more stressful class (p. 16).
    expect(classifyCoupling({ kind: 'container', handles: 'optimal' }).coupling).toBe('poor');
    expect(classifyCoupling({ kind: 'loose-object', bulky: false, optimalGrip: true }).coupling).toBe('good');
    expect(classifyCoupling({ kind: 'loose-object' }).coupling).toBe('poor');
  });
});
