import { useState, type FormEvent } from 'react';
import { z } from 'zod';
import { paperSize, unitSystem } from '@domain/contracts/common.ts';
import { productionSettingsBody } from '@domain/contracts/productions.ts';
import { Alert, Button, Card, ChoiceGroup, ErrorState, PageHeader, PageLoading, TextField } from '../../../components/ui/index.ts';
import { useCurrentProduction } from '../../../lib/current-production.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useProduction, type ProductionView } from '../api/get-production.ts';
import { conflictCurrent, useUpdateProduction } from '../api/update-production.ts';
import { ConflictNotice } from './conflict-notice.tsx';

export function SettingsPage() {
  const { productionId } = useCurrentProduction();
  const production = useProduction(productionId ?? '');
  if (production.isPending) return <PageLoading />;
  if (production.isError) {
    return <ErrorState title="The settings could not be loaded" error={production.error} onRetry={() => production.refetch()} retrying={production.isFetching} />;
  }
  // Keyed by id only: background refreshes must not wipe what the planner is typing.
  return <SettingsForm key={production.data.id} production={production.data} />;
}

const settingsForm = productionSettingsBody.omit({ version: true }).extend({
  name: z.string().trim().min(1, 'Enter a name for the production.').max(120, 'Use at most 120 characters.'),
  paperSize,
  defaultUnits: unitSystem,
});

export type SettingsValues = Pick<ProductionView, 'name' | 'paperSize' | 'defaultUnits'>;
const FIELDS = ['name', 'paperSize', 'defaultUnits'] as const;

function valuesOf(p: ProductionView): SettingsValues {
  return { name: p.name, paperSize: p.paperSize, defaultUnits: p.defaultUnits };
}

/** Only the fields the planner changed from `base`, so a save never undoes someone else's other edits. */
function changesFrom(base: ProductionView, values: SettingsValues): Partial<SettingsValues> {
  const out: Partial<SettingsValues> = {};
  for (const key of FIELDS) if (values[key] !== base[key]) Object.assign(out, { [key]: values[key] });
  return out;
}

function SettingsForm({ production }: { production: ProductionView }) {
  /** The record the edits started from; its version goes with the save. */
  const [base, setBase] = useState(production);
  const [values, setValues] = useState<SettingsValues>(() => valuesOf(production));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const update = useUpdateProduction(production.id);
  const theirs = conflictCurrent(update.error);
  const changes = changesFrom(base, values);
  const dirty = Object.keys(changes).length > 0;

  function edit<K extends keyof SettingsValues>(key: K, value: SettingsValues[K]) {
    setSaved(false);
    setValues((v) => ({ ...v, [key]: value }));
  }

  /** Saves what changed since `base`, claiming to start from `from` (base, or theirs to keep mine). */
  function save(from: ProductionView) {
    const checked = validate(settingsForm, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    update.mutate(
      { version: from.version, ...changesFrom(base, checked.data) },
      {
        onSuccess: (p) => {
          setBase(p);
          setValues(valuesOf(p));
          setSaved(true);
        },
        onError: (error) => setErrors(apiFieldErrors(error)),
      },
    );
  }

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    save(base);
  }

  function resetTo(current: ProductionView) {
    setBase(current);
    setValues(valuesOf(current));
    setErrors({});
    update.reset();
  }

  const problem = theirs ? null : formLevelError(update.error, FIELDS);

  return (
    <div className="flex flex-col gap-5">
      <PageHeader eyebrow={base.name} title="Production settings" description="What every member sees and what the paperwork uses." />
      {theirs && (
        <ConflictNotice
          mine={values}
          theirs={theirs}
          busy={update.isPending}
          onReload={() => resetTo(theirs)}
          onKeepMine={() => save(theirs)}
        />
      )}
      <Card>
        <form noValidate onSubmit={submit} className="flex max-w-xl flex-col gap-5">
          {problem && (
            <Alert tone="danger" title="Could not save">
              {problem}
            </Alert>
          )}
          {saved && !dirty && <Alert tone="ok">Settings saved.</Alert>}
          <TextField label="Production name" name="name" value={values.name} onChange={(e) => edit('name', e.target.value)} error={errors.name} />
          <ChoiceGroup
            legend="Paper size"
            name="paperSize"
            value={values.paperSize}
            choices={[
              { value: 'A4', label: 'A4' },
              { value: 'Letter', label: 'Letter' },
            ]}
            onChange={(v) => edit('paperSize', v)}
            hint="Packing lists, labels, lift plans and venue manifests print on this size."
            error={errors.paperSize}
          />
          <ChoiceGroup
            legend="Units on paperwork"
            name="defaultUnits"
            value={values.defaultUnits}
            choices={[
              { value: 'metric', label: 'Metric' },
              { value: 'imperial', label: 'Imperial' },
            ]}
            onChange={(v) => edit('defaultUnits', v)}
            hint="Each person still picks their own units on screen."
            error={errors.defaultUnits}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" loading={update.isPending && !theirs} disabled={!dirty || Boolean(theirs)}>
              Save settings
            </Button>
            {dirty && !theirs && (
              <Button variant="ghost" onClick={() => resetTo(base)}>
                Discard changes
              </Button>
            )}
          </div>
        </form>
      </Card>
    </div>
  );
}
