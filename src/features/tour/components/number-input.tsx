import { useState } from 'react';
import { controlClasses, Field } from '../../../components/ui/index.ts';

/**
 * A measure that may not be known: an empty box is null ("unknown", and the check says so), never 0.
 * Holds its own text while typing so "1." or "" do not jump.
 */
export function NumberInput({
  label,
  value,
  onChange,
  unit,
  error,
  hint,
  className,
}: {
  label: string;
  value: number | null | undefined;
  onChange: (v: number | null) => void;
  unit: string;
  error?: string;
  hint?: string;
  className?: string;
}) {
  const [text, setText] = useState(value === null || value === undefined ? '' : String(value));
  const [lastValue, setLastValue] = useState(value);
  if (value !== lastValue) {
    // The value changed from outside (reload after a conflict): show it.
    setLastValue(value);
    const parsed = text.trim() === '' ? null : Number(text);
    if (parsed !== value) setText(value === null || value === undefined ? '' : String(value));
  }
  return (
    <Field label={`${label} (${unit})`} error={error} hint={hint} className={className}>
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
            const next = n === null || Number.isFinite(n) ? n : NaN;
            setLastValue(next);
            onChange(next);
          }}
        />
      )}
    </Field>
  );
}
