import { describe, expect, it } from 'vitest';
import { packBoxes, type PackContainer, type PackItem } from '../../../src/domain/packing/index.ts';
import { seededRandom } from '../../../src/domain/packing/rng.ts';
import { expectValid } from './check.ts';

// Property test: random loads with every rule switched on at random; the independent validator must
// find no fault in any result, and every item must be either placed or reported [PRACTICE: invariant checks].
describe('packBoxes on random loads with mixed rules', () => {
  const rnd = seededRandom(20261202);
  const int = (a: number, b: number) => a + Math.floor(rnd() * (b - a + 1));
  for (let k = 0; k < 24; k++) {
    const fullSupport = k % 4 !== 3;
    it(`case ${k + 1} (${fullSupport ? 'full support' : 'no support'})`, async () => {
      const container: PackContainer = {
        lengthMm: int(800, 2400),
        widthMm: int(600, 1400),
        heightMm: int(500, 1200),
        maxPayloadKg: rnd() < 0.3 ? int(200, 2000) : undefined,
        doorHeightMm: rnd() < 0.3 ? int(400, 1100) : undefined,
      };
      const lines = int(1, 8);
      const items: PackItem[] = [];
      for (let i = 0; i < lines; i++) {
        const o = rnd();
        items.push({
          id: `L${i}`,
          lengthMm: int(100, 700),
          widthMm: int(100, 600),
          heightMm: int(80, 600),
          massKg: int(1, 120),
          quantity: int(1, 12),
          orientation: o < 0.4 ? 'any' : o < 0.8 ? 'upright' : 'fixed',
          stackable: rnd() < 0.8,
          maxLoadOnTopKg: rnd() < 0.3 ? int(0, 200) : undefined,
          stopIndex: rnd() < 0.4 ? int(1, 3) : undefined,
        });
      }
      const r = await packBoxes(container, items, { maxIterations: 40, seed: k, fullSupport });
      expectValid(container, items, r, fullSupport);
      for (const u of r.unplaced) expect(u.reason).toContain(`"${u.id}"`);
    });
  }
});
