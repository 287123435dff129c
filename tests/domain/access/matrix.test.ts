import { describe, expect, it } from 'vitest';
import { accessMatrix, overallVerdict } from '../../../src/domain/access/index.ts';
import { controlDesk, driveCoreCrate, forumAurelian, havsljusScen, kelderwerfHall, planetCase, salaVentolina, teatrBursztynowy } from './scenario-fixtures.ts';

describe('overall verdict', () => {
  it('fail if any fail, else unknown if any unknown, else pass (all 27 combinations of three)', () => {
    const vs = ['pass', 'fail', 'unknown'] as const;
    for (const a of vs)
      for (const b of vs)
        for (const c of vs) {
          const list = [a, b, c].map((verdict) => ({ verdict }));
          const expected = [a, b, c].includes('fail') ? 'fail' : [a, b, c].includes('unknown') ? 'unknown' : 'pass';
          expect(overallVerdict(list)).toBe(expected);
        }
  });
});

describe('tour-wide matrix', () => {
  const crates = [
    { ...driveCoreCrate, id: 'DC' },
    { ...planetCase, id: 'PC1' },
    { ...controlDesk, id: 'CD' },
  ];
  const venues = [
    { id: 'sala', access: salaVentolina },
    { id: 'havsljus', access: havsljusScen },
    { id: 'teatr', access: teatrBursztynowy },
    { id: 'forum', access: forumAurelian },
  ];
  const m = accessMatrix(crates, venues);
  it('has a cell per crate and venue', () => {
    expect(m.cells).toHaveLength(12);
  });
  it('names the corridor door as the tightest point for the drive core crate at Sala Ventolina', () => {
    const cell = m.cells.find((c) => c.crateId === 'DC' && c.venueId === 'sala')!;
    expect(cell.verdict).toBe('fail');
    expect(cell.tightest?.where).toBe('corridor door');
    expect(cell.tightestText).toBe('corridor door: -50 mm');
  });
  it('per venue the tightest point is a failing finding where any fails', () => {
    const havsljus = m.venues.find((v) => v.id === 'havsljus')!;
    expect(havsljus.verdict).toBe('fail');
    expect(havsljus.tightest?.crateId).toBe('DC');
    expect(havsljus.tightest?.finding.check).toBe('lift');
  });
  it('the hand-carried planet case passes everywhere; on a truck it would fail the 9 % ramp', () => {
    const pc = m.cells.filter((c) => c.crateId === 'PC1');
    expect(pc.every((c) => c.verdict === 'pass')).toBe(true);
    const onTruck = accessMatrix([{ ...planetCase, id: 'PC1', carriedByHand: false }], venues);
    expect(onTruck.cells.find((c) => c.venueId === 'forum')?.verdict).toBe('fail');
  });
});

describe('vehicles of a leg', () => {
  // Kelderwerf Hall is at street level: the 520 kg drive core crate and its 65 kg pallet truck need a tail
  // lift of at least 585 kg (ramp-dock.test.ts). One truck has a 1,000 kg lift, the other 500 kg.
  const big = { tailLiftCapacityKg: 1000 };
  const small = { tailLiftCapacityKg: 500 };
  const crates = [
    { ...driveCoreCrate, id: 'on-big' },
    { ...driveCoreCrate, id: 'on-small' },
    { ...driveCoreCrate, id: 'not-placed' },
  ];
  const dock = (m: ReturnType<typeof accessMatrix>, id: string) => m.cells.find((c) => c.crateId === id)!.findings.find((f) => f.check === 'dock')!;

  it('checks each crate with the vehicle it comes on, and a crate not placed yet against the worst of them', () => {
    const m = accessMatrix(crates, [{ id: 'kelderwerf', access: kelderwerfHall, crateVehicles: { 'on-big': big, 'on-small': small }, vehicles: [big, small] }]);
    expect(dock(m, 'on-big').verdict).toBe('pass');
    expect(dock(m, 'on-big').margin).toBe(415);
    expect(dock(m, 'on-small').verdict).toBe('fail');
    expect(dock(m, 'not-placed').verdict).toBe('fail');
    expect(dock(m, 'not-placed').reason).toMatch(/tail lift 500 kg is short of 585 kg/);
  });

  it('without vehicles per crate or per leg uses the venue options, as before', () => {
    const m = accessMatrix(crates, [{ id: 'kelderwerf', access: kelderwerfHall, options: { vehicle: big } }]);
    expect(m.cells.every((c) => c.findings.find((f) => f.check === 'dock')!.verdict === 'pass')).toBe(true);
  });
});
