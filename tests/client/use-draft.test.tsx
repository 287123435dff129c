import { act, renderHook } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { useDraft } from '../../src/lib/use-draft.ts';

interface Rec {
  id: string;
  name: string;
  version: number;
}
const valuesOf = (r: Rec) => ({ name: r.name });

describe('useDraft', () => {
  it('edits values against the base, and adopts a saved record as the new base', () => {
    const { result } = renderHook(() => useDraft<Rec, { name: string }>({ id: 'a', name: 'Old', version: 3 }, valuesOf));
    act(() => result.current.edit('name', 'Mine'));
    expect(result.current.values).toEqual({ name: 'Mine' });
    expect(result.current.base.version).toBe(3);
    act(() => result.current.setErrors({ name: 'Too long' }));
    act(() => result.current.adopt({ id: 'a', name: 'Mine', version: 4 }, { saved: true }));
    expect(result.current).toMatchObject({ base: { version: 4 }, values: { name: 'Mine' }, errors: {}, saved: true });
    act(() => result.current.edit('name', 'Again'));
    expect(result.current.saved).toBe(false);
  });

  it('takes theirs after a stale save: their values, no errors, nothing claimed saved', () => {
    const { result } = renderHook(() => useDraft<Rec, { name: string }>({ id: 'a', name: 'Old', version: 3 }, valuesOf));
    act(() => result.current.edit('name', 'Mine'));
    act(() => result.current.adopt({ id: 'a', name: 'Theirs', version: 5 }));
    expect(result.current).toMatchObject({ base: { version: 5 }, values: { name: 'Theirs' }, saved: false });
  });
});
