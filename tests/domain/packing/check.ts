import { expect } from 'vitest';
import { validatePacking, type PackContainer, type PackItem, type PackResult } from '../../../src/domain/packing/index.ts';

/** Runs the independent validator on an engine result and fails the test with its messages if invalid. */
export function expectValid(container: PackContainer, items: PackItem[], result: PackResult, fullSupport = true) {
  const check = validatePacking(container, items, result.placements, { fullSupport, unplaced: result.unplaced });
  expect(check.messages).toEqual([]);
  expect(check.ok).toBe(true);
  const vol = result.placements.reduce((s, p) => s + p.lengthMm * p.widthMm * p.heightMm, 0);
  expect(result.volumeUtilisation).toBeCloseTo(vol / (container.lengthMm * container.widthMm * container.heightMm), 9);
  return check;
}
