import { describe, expect, it } from 'vitest';
import { EUR_PALLET, ISO_6780_PALLETS, STOCK_CASES } from '../../../src/domain/crates/index.ts';

describe('pallets and stock cases as data', () => {
  // EN 13698-1 EUR pallet: 1,200 × 800 × 144 mm, about 25 kg, 1,500 kg safe working load
  // (REFERENCES §4.1 [S, EPAL]).
  it('EUR pallet', () => {
    expect(EUR_PALLET.outerMm).toEqual([1200, 800, 144]);
    expect(EUR_PALLET.tareKg).toBe(25);
    expect(EUR_PALLET.maxLoadKg).toBe(1500);
  });
  // ISO 6780 plan sizes (REFERENCES §4.1 [S, 3rd party]).
  it('ISO 6780 plan sizes', () => {
    expect(ISO_6780_PALLETS.map((p) => [p.outerMm[0], p.outerMm[1]])).toEqual([
      [1200, 800],
      [1200, 1000],
      [1219, 1016],
      [1140, 1140],
      [1067, 1067],
      [1100, 1100],
    ]);
  });
  it('stock cases have inner sizes inside their outer sizes and tile a EUR pallet plan', () => {
    for (const c of STOCK_CASES) {
      c.innerMm?.forEach((v, i) => expect(v).toBeLessThan(c.outerMm[i]));
      expect(1200 % c.outerMm[0] === 0 || 1200 % c.outerMm[1] === 0).toBe(true);
      expect(800 % c.outerMm[1] === 0 || 800 % c.outerMm[0] === 0).toBe(true);
    }
  });
});
