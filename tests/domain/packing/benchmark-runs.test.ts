import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { packBoxes, packVehicles, validatePacking } from '../../../src/domain/packing/index.ts';
import { parseThpack, thpackToPackInput } from '../../../src/domain/packing/benchmarks/thpack-format.ts';
import { mpvToPackInput, parseMpv } from '../../../src/domain/packing/benchmarks/mpv-format.ts';
import { expectValid } from './check.ts';

// Engine runs on public benchmark instances (Bischoff & Ratcliff 1995 BR classes; Martello, Pisinger &
// Vigo 2000 3D-BPP) [PUB], checked by the validator. Utilisation figures are measured in
// scripts/bench/packing.ts, not here; these tests assert validity and bounds that cannot be beaten.
const DATA = '/work/shared/data/packing';

describe('BR instances: every packing valid, with and without support', () => {
  for (const cls of [1, 8, 15])
    for (const fullSupport of [true, false])
      it(`BR${cls} problem 2, ${fullSupport ? 'full support' : 'no support'}`, async () => {
        const inst = parseThpack(readFileSync(`${DATA}/br-0-15/BR${cls}.txt`, 'utf8'))[1];
        const { container, items } = thpackToPackInput(inst);
        const r = await packBoxes(container, items, { maxIterations: 60, fullSupport });
        expectValid(container, items, r, fullSupport);
        // Never above the cargo volume ratio (the README's upper bound), and well above a trivial packing.
        const cargo = items.reduce((s, i) => s + i.lengthMm * i.widthMm * i.heightMm * i.quantity, 0) / (587 * 233 * 220);
        expect(r.volumeUtilisation).toBeLessThanOrEqual(cargo + 1e-12);
        expect(r.volumeUtilisation).toBeGreaterThan(0.7);
      });
});

describe('3D-BPP: packVehicles', () => {
  it('packs class 1, n = 50, instance 1 into valid bins, no fewer than the lower bound 13', async () => {
    // bounds-mpv-code.csv row "1,50,1": L0 11, MPV lower bound 13, reference solution 15 [COMP].
    const inst = parseMpv(readFileSync(`${DATA}/mpv-3dbpp/1_50/1.txt`, 'utf8'));
    const { vehicles, items } = mpvToPackInput(inst);
    const r = await packVehicles(vehicles, items, { maxIterations: 20, fullSupport: false });
    expect(r.unplaced).toEqual([]);
    expect(r.placements).toHaveLength(50);
    expect(r.vehiclesUsed).toBeGreaterThanOrEqual(13);
    expect(r.vehiclesUsed).toBeLessThanOrEqual(50);
    const used = new Set(r.placements.map((p) => p.vehicleId));
    expect(used.size).toBe(r.vehiclesUsed);
    for (const v of vehicles.filter((x) => used.has(x.id))) {
      const check = validatePacking(v, items, r.placements.filter((p) => p.vehicleId === v.id), { fullSupport: false });
      expect(check.messages).toEqual([]);
    }
  });

  it('fills vehicles in the order given and reports what fits none', async () => {
    const vehicles = [
      { id: 'van', lengthMm: 200, widthMm: 200, heightMm: 200 },
      { id: 'truck', lengthMm: 400, widthMm: 200, heightMm: 200 },
    ];
    const items = [
      { id: 'cube', lengthMm: 100, widthMm: 100, heightMm: 100, quantity: 12, orientation: 'any' as const },
      { id: 'beam', lengthMm: 500, widthMm: 100, heightMm: 100, quantity: 1, orientation: 'any' as const },
    ];
    const r = await packVehicles(vehicles, items, { maxIterations: 20 });
    // The van takes 8 cubes (2 × 2 × 2), the truck the other 4 [COMP].
    expect(r.placements.filter((p) => p.vehicleId === 'van')).toHaveLength(8);
    expect(r.placements.filter((p) => p.vehicleId === 'truck')).toHaveLength(4);
    expect(r.vehiclesUsed).toBe(2);
    expect(r.unplaced).toHaveLength(1);
    expect(r.unplaced[0].reason).toMatch(/"beam".*fits none of the 2 vehicles.*larger than the container \(400×200×200 mm\)/);
    for (const v of vehicles) {
      const check = validatePacking(v, items, r.placements.filter((p) => p.vehicleId === v.id));
      expect(check.messages).toEqual([]);
    }
  });
});
