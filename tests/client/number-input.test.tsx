import { fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '../../src/app/providers.tsx';
import { createQueryClient } from '../../src/lib/query-client.ts';
import { replaceSession } from '../../src/lib/session.ts';
import { NumberInput } from '../../src/features/tour/components/number-input.tsx';
import { planner } from './helpers/fixtures.ts';

/** Venue measures in the person's units: typed in inches or pounds, held in mm and kg. */
function Harness({ measure, initial, seen }: { measure: 'length' | 'mass' | 'pressure' | 'force'; initial: number | null; seen: (v: number | null) => void }) {
  const [v, setV] = useState(initial);
  return (
    <NumberInput
      label="Clear width"
      measure={measure}
      value={v}
      onChange={(n) => {
        setV(n);
        seen(n);
      }}
    />
  );
}

function show(units: 'metric' | 'imperial', measure: 'length' | 'mass' | 'pressure' | 'force', initial: number | null, seen: (v: number | null) => void = () => undefined) {
  const qc = createQueryClient({ retry: false });
  replaceSession(qc, { ...planner, units });
  render(
    <AppProviders queryClient={qc}>
      <Harness measure={measure} initial={initial} seen={seen} />
    </AppProviders>,
  );
}

describe('venue measures in the person’s units', () => {
  it('shows and takes inches for a person who chose imperial, holding millimetres', () => {
    const seen: (number | null)[] = [];
    show('imperial', 'length', 2438.4, (v) => seen.push(v));
    const box = screen.getByLabelText('Clear width (in)') as HTMLInputElement;
    // 2,438.4 mm = 96 in exactly (1 in = 25.4 mm, by definition: NIST SP 811, 2008, B.8).
    expect(box.value).toBe('96');
    fireEvent.change(box, { target: { value: '100' } });
    expect(seen.at(-1)).toBeCloseTo(2540, 9);
    fireEvent.change(box, { target: { value: '' } });
    expect(seen.at(-1)).toBeNull();
  });

  it('pounds for masses, and millimetres as typed for metric', () => {
    const seen: (number | null)[] = [];
    show('imperial', 'mass', 453.59237, (v) => seen.push(v));
    // 1 lb = 0.453 592 37 kg exactly (NIST SP 811, 2008, B.8): 453.592 37 kg = 1,000 lb.
    expect((screen.getByLabelText('Clear width (lb)') as HTMLInputElement).value).toBe('1000');
    fireEvent.change(screen.getByLabelText('Clear width (lb)'), { target: { value: '2000' } });
    expect(seen.at(-1)).toBeCloseTo(907.18474, 9);
  });

  it('pounds-force per square foot for floor ratings and pounds-force for point loads, held in kN/m² and kN', () => {
    const seen: (number | null)[] = [];
    // 150 psf = 7.18 kN/m² (REFERENCES: ASCE 7 stage floors); 1 psf = 47.880 26 Pa (NIST SP 811, 2008, B.8).
    show('imperial', 'pressure', 150 * 0.04788026, (v) => seen.push(v));
    expect((screen.getByLabelText('Clear width (psf)') as HTMLInputElement).value).toBe('150');
    fireEvent.change(screen.getByLabelText('Clear width (psf)'), { target: { value: '100' } });
    expect(seen.at(-1)).toBeCloseTo(4.788026, 6);
    show('imperial', 'force', 4.448222, (v) => seen.push(v));
    // 1 lbf = 4.448 222 N (NIST SP 811, 2008, B.8): 4.448 222 kN = 1,000 lbf.
    expect((screen.getByLabelText('Clear width (lbf)') as HTMLInputElement).value).toBe('1000');
    show('metric', 'pressure', 5, () => undefined);
    expect((screen.getByLabelText('Clear width (kN/m²)') as HTMLInputElement).value).toBe('5');
  });

  it('keeps millimetres for a metric person', () => {
    show('metric', 'length', 1250, () => undefined);
    expect((screen.getByLabelText('Clear width (mm)') as HTMLInputElement).value).toBe('1250');
  });
});
