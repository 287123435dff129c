import { useState } from 'react';
import type { z } from 'zod';
import { apiFieldErrors, validate, type FieldErrors } from './form-errors.ts';

/** What a save's mutation is told to do when it ends (TanStack Query's per-call callbacks). */
export interface SendHandlers {
  onSuccess: (answer: unknown) => void;
  onError: (error: unknown) => void;
}

/**
 * The state of a versioned edit form: the record as last loaded or saved (`base`, whose version the next
 * save names), the person's values as typed, field errors, and whether the last save went through.
 * `adopt` takes a record as the new starting point: the answer of a save (`saved`), or theirs after a
 * stale save, or one changed by another action (an upload). `send` checks a body against its schema
 * (errors shown by field, nothing sent), sends it, and adopts the saved record the answer holds.
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
  const send = <S extends z.ZodType>(schema: S, body: unknown, mutate: (data: z.output<S>, handlers: SendHandlers) => void, savedOf: (answer: unknown) => View) => {
    const checked = validate(schema, body);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    mutate(checked.data, { onSuccess: (answer) => adopt(savedOf(answer), { saved: true }), onError: (err) => setErrors(apiFieldErrors(err)) });
  };
  return { base, values, setValues, errors, setErrors, saved, setSaved, edit, adopt, send };
}
