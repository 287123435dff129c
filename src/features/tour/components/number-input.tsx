import { useState } from 'react';
import { fromKg, fromKn, fromKnPerM2, fromMm, toKg, toKn, toKnPerM2, toMm } from '@domain/units.ts';
import { controlClasses, Field } from '../../../components/ui/index.ts';
import { useUnits } from '../../../lib/use-units.ts';

/**
 * A measure that may not be known: an empty box is null ("unknown", and the check says so), never 0.
 * Holds its own text while typing so "1." or "" do not jump. With `measure`, the person types in their own units
 * (mm or in, kg or lb, kN/m² or psf, kN or lbf) and the value stays in mm, kg, kN/m² or kN; otherwise `unit`
 * names the one unit it takes.
 */
export function NumberInput({
  label,
  value,
  onChange,
  unit,
  measure,
  error,
  hint,
  className,
}: {
  label: string;
  value: number | null | undefined;
  onChange: (v: number | null) => void;
  unit?: string;
  measure?: 'length' | 'mass' | 'pressure' | 'force';
  error?: string;
  hint?: string;
  className?: string;
}) {
  const u = useUnits();
  const shownUnit = measure === 'length' ? u.lengthUnit : measure === 'mass' ? u.massUnit : measure === 'pressure' ? u.pressureUnit : measure === 'force' ? u.forceUnit : (unit ?? '');
  const toShown = (si: number) =>
    measure === 'length' ? fromMm(si, u.lengthUnit) : measure === 'mass' ? fromKg(si, u.massUnit) : measure === 'pressure' ? fromKnPerM2(si, u.pressureUnit) : measure === 'force' ? fromKn(si, u.forceUnit) : si;
  const fromShown = (n: number) =>
    measure === 'length' ? toMm(n, u.lengthUnit) : measure === 'mass' ? toKg(n, u.massUnit) : measure === 'pressure' ? toKnPerM2(n, u.pressureUnit) : measure === 'force' ? toKn(n, u.forceUnit) : n;
  // Metric figures as typed; converted ones to 2 decimals (0.01 in = 0.25 mm, 0.01 lb = 4.5 g, 0.01 psf = 0.5 N/m²).
  const converted = u.system === 'imperial' && measure !== undefined;
  const format = (si: number | null | undefined) => (si === null || si === undefined ? '' : converted ? String(Number(toShown(si).toFixed(2))) : String(toShown(si)));
  const [text, setText] = useState(() => format(value));
  const [lastValue, setLastValue] = useState(value);
  if (value !== lastValue) {
    // The value changed from outside (reload after a conflict): show it.
    setLastValue(value);
    const typed = text.trim() === '' ? null : fromShown(Number(text.replace(',', '.')));
    const same = typed === value || (typed !== null && value != null && Math.abs(typed - value) < 1e-6 * Math.max(1, Math.abs(value)));
    if (!same) setText(format(value));
  }
  return (
    <Field label={`${label} (${shownUnit})`} error={error} hint={hint} className={className}>
      {(control) => (
        <input
          {...control}
          className={controlClasses}
          inputMode="decimal"
          placeholder="unknown"
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            const t = e.target.value.trim().replace(',', '.');
            const n = t === '' ? null : Number(t);
            const next = n === null ? null : Number.isFinite(n) ? fromShown(n) : NaN;
            setLastValue(next);
            onChange(next);
          }}
        />
      )}
    </Field>
  );
}
