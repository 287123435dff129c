import { describe, expect, it } from 'vitest';
import { accessMatrix, overallVerdict } from '../../../src/domain/access/index.ts';
import { controlDesk, driveCoreCrate, forumAurelian, havsljusScen, planetCase, salaVentolina, teatrBursztynowy } from './scenario-fixtures.ts';

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
