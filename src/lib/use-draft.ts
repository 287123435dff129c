import { useState } from 'react';
import type { FieldErrors } from './form-errors.ts';

/**
 * The state of a versioned edit form: the record as last loaded or saved (`base`, whose version the next
 * save names), the person's values as typed, field errors, and whether the last save went through.
 * `adopt` takes a record as the new starting point: the answer of a save (`saved`), or theirs after a
 * stale save, or one changed by another action (an upload).
 */
export function useDraft<View, Values>(initial: View, valuesOf: (v: View) => Values) {
  const [base, setBase] = useState(initial);
  const [values, setValues] = useState<Values>(() => valuesOf(initial));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const edit = <K extends keyof Values>(k: K, v: Values[K]) => {
    setSaved(false);
    setValues((s) => ({ ...s, [k]: v }));
  };
  const adopt = (next: View, opts: { saved?: boolean } = {}) => {
    setBase(next);
    setValues(valuesOf(next));
    setErrors({});
    setSaved(opts.saved ?? false);
  };
  return { base, values, setValues, errors, setErrors, saved, setSaved, edit, adopt };
}
