import { useState } from 'react';
import { fromKg, fromMm, toKg, toMm } from '@domain/units.ts';
import { TextField } from '../../../components/ui/index.ts';
import { useUnits } from '../../../lib/use-units.ts';

/**
 * A number field in the person's units (mm or in, kg or lb) holding its value in mm or kg. Empty means
 * "not known" (null), never zero.
 */
export function UnitInput({
  label,
  kind,
  valueSi,
  onChange,
  error,
  hint,
  name,
}: {
  label: string;
  kind: 'length' | 'mass';
  valueSi: number | null;
  onChange: (si: number | null) => void;
  error?: string;
  hint?: string;
  name?: string;
}) {
  const u = useUnits();
  const unit = kind === 'length' ? u.lengthUnit : u.massUnit;
  const show = (si: number | null) => (si === null ? '' : String(Number((kind === 'length' ? fromMm(si, u.lengthUnit) : fromKg(si, u.massUnit)).toFixed(kind === 'length' && unit === 'mm' ? 0 : 2))));
  const [text, setText] = useState(() => show(valueSi));
  const [bad, setBad] = useState<string | null>(null);
  return (
    <TextField
      label={`${label} (${unit})`}
      name={name}
      inputMode="decimal"
      value={text}
      error={bad ?? error}
      hint={hint}
      onChange={(e) => {
        const t = e.target.value;
        setText(t);
        if (t.trim() === '') {
          setBad(null);
          return onChange(null);
        }
        const n = Number(t.replace(',', '.'));
        if (!Number.isFinite(n)) return setBad('Enter a number.');
        setBad(null);
        onChange(kind === 'length' ? toMm(n, u.lengthUnit) : toKg(n, u.massUnit));
      }}
    />
  );
}
