import { useState, type FormEvent } from 'react';
import { createAddOnBody, type AddOnView } from '@domain/contracts/machine.ts';
import { MASS_SOURCES, type MassSource } from '@domain/contracts/mass.ts';
import { toKg } from '@domain/units.ts';
import { Alert, Button, SelectField, TextField } from '../../../components/ui/index.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useMachineChange } from '../api/edit-machine.ts';

/**
 * What travels with a section without being a machine part (transport frame, cradle, lifting beam): listed
 * with its mass, and for planners added or removed. An add-on without a CoG is listed as a gap by the core.
 */
export function AddOnsPanel({ productionId, sectionId, addOns, mayEdit }: { productionId: string; sectionId: string; addOns: AddOnView[]; mayEdit: boolean }) {
  const u = useUnits();
  const change = useMachineChange(productionId);
  const [name, setName] = useState('');
  const [mass, setMass] = useState('');
  const [source, setSource] = useState<MassSource>('estimated');
  const [errors, setErrors] = useState<FieldErrors>({});
  if (addOns.length === 0 && !mayEdit) return null;

  function submit(e: FormEvent) {
    e.preventDefault();
    const checked = validate(createAddOnBody, { name, massKg: mass.trim() === '' ? null : toKg(Number(mass), u.massUnit), massSource: source });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    change.mutate(
      { kind: 'createAddOn', sectionId, body: checked.data },
      { onSuccess: () => (setName(''), setMass('')), onError: (err) => setErrors(apiFieldErrors(err)) },
    );
  }
  const problem = formLevelError(change.error, ['name', 'massKg', 'massSource']);

  return (
    <div className="rounded-panel border border-ink-200 bg-white px-4 py-3">
      <p className="text-sm font-semibold text-ink-800">Travels with it</p>
      {addOns.length === 0 ? (
        <p className="text-sm text-ink-600">No add-ons (transport frame, cradle, lifting beam).</p>
      ) : (
        <ul className="mt-1 flex flex-col gap-1 text-sm">
          {addOns.map((a) => (
            <li key={a.id} className="flex items-center gap-2">
              <span className="font-semibold">{a.name}</span>
              <span className="tabular-nums">{a.massKg === null ? 'no mass' : u.formatMass(a.massKg)}</span>
              <span className="text-ink-600">{a.massSource ?? 'estimated'}</span>
              {!a.cogMm && <span className="text-caution-800">no CoG</span>}
              {mayEdit && (
                <Button size="sm" variant="ghost" className="ml-auto" onClick={() => change.mutate({ kind: 'deleteAddOn', id: a.id })} aria-label={`Remove ${a.name}`}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {mayEdit && (
        <form noValidate onSubmit={submit} className="mt-3 grid grid-cols-2 items-end gap-2 sm:grid-cols-4">
          <TextField label="Add-on" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
          <TextField label={`Mass (${u.massUnit})`} inputMode="decimal" value={mass} onChange={(e) => setMass(e.target.value)} error={errors.massKg} />
          <SelectField label="Source" value={source} onChange={(e) => setSource(e.target.value as MassSource)}>
            {MASS_SOURCES.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </SelectField>
          <Button type="submit" variant="secondary" loading={change.isPending}>
            Add
          </Button>
          {problem && (
            <Alert tone="danger" className="col-span-full">
              {problem}
            </Alert>
          )}
        </form>
      )}
    </div>
  );
}
