import type { FormEvent } from 'react';
import { createSectionBody, sectionView, updateSectionBody, type SectionView } from '@domain/contracts/machine.ts';
import { fromMm, toMm } from '@domain/units.ts';
import { Alert, Button, StaleSaveAlert, TextField, type StaleField } from '../../../components/ui/index.ts';
import { apiFieldErrors, formLevelError, validate } from '../../../lib/form-errors.ts';
import { useDraft } from '../../../lib/use-draft.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { staleCurrent } from '../../../lib/api.ts';
import { useMachineChange } from '../api/edit-machine.ts';

interface Values {
  code: string;
  name: string;
  margin: string;
  uncertainty: string;
}

const FIELDS = ['code', 'name', 'marginPercent', 'cogUncertaintyMm'];
const round = (v: number, digits: number) => String(Math.round(v * 10 ** digits) / 10 ** digits);

/**
 * A section's code, name, its own margin (blank: the machine's) and how far its CoG may be off (blank: not
 * stated). Without `section` it adds a new one; with it, it edits that one and saves only what changed, with
 * the version the edit started from, so a stale save is refused and the person chooses reload or keep mine.
 */
export function SectionForm({ productionId, section, onDone }: { productionId: string; section?: SectionView; onDone: () => void }) {
  const u = useUnits();
  const valuesOf = (s: SectionView | undefined): Values => ({
    code: s?.code ?? '',
    name: s?.name ?? '',
    margin: s?.marginPercent == null ? '' : String(s.marginPercent),
    uncertainty: s?.cogUncertaintyMm == null ? '' : round(fromMm(s.cogUncertaintyMm, u.lengthUnit), 3),
  });
  const { base, values, errors, setErrors, edit, adopt } = useDraft<SectionView | undefined, Values>(section, valuesOf);
  const change = useMachineChange(productionId);
  const theirsParsed = base ? sectionView.safeParse(staleCurrent(change.error)) : null;
  const theirs = theirsParsed?.success ? theirsParsed.data : null;

  function fields(v: Values) {
    return {
      code: v.code,
      name: v.name,
      marginPercent: v.margin.trim() === '' ? null : Number(v.margin),
      cogUncertaintyMm: v.uncertainty.trim() === '' ? null : toMm(Number(v.uncertainty), u.lengthUnit),
    };
  }
  function save(version: number | null) {
    const mine = fields(values);
    if (!base || version === null) {
      const checked = validate(createSectionBody, mine);
      if (!checked.ok) return setErrors(checked.errors);
      return change.mutate({ kind: 'createSection', body: checked.data }, { onSuccess: onDone, onError: (err) => setErrors(apiFieldErrors(err)) });
    }
    // Only the fields this person changed, so keeping mine never undoes someone else's other edits.
    const start = fields(valuesOf(base));
    const changed = Object.fromEntries(Object.entries(mine).filter(([k, v]) => v !== start[k as keyof typeof start]));
    const checked = validate(updateSectionBody, { version, ...changed });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    change.mutate({ kind: 'updateSection', id: base.id, body: checked.data }, { onSuccess: onDone, onError: (err) => setErrors(apiFieldErrors(err)) });
  }
  function submit(e: FormEvent) {
    e.preventDefault();
    save(base ? base.version : null);
  }
  const problem = theirs ? null : formLevelError(change.error, FIELDS);
  const staleFields = (t: Values): StaleField[] => [
    { label: 'Code', theirs: t.code, mine: values.code },
    { label: 'Name', theirs: t.name, mine: values.name },
    { label: 'Margin (%)', theirs: t.margin || "the machine's", mine: values.margin || "the machine's" },
    { label: `CoG uncertainty (${u.lengthUnit})`, theirs: t.uncertainty || 'not stated', mine: values.uncertainty || 'not stated' },
  ];

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label={base ? `Edit section ${base.code}` : 'New section'}>
      {theirs && (
        <StaleSaveAlert
          title="Someone else saved this section while you were editing"
          busy={change.isPending}
          fields={staleFields(valuesOf(theirs))}
          onReload={() => {
            adopt(theirs);
            change.reset();
          }}
          onKeepMine={() => save(theirs.version)}
        />
      )}
      {problem && <Alert tone="danger">{problem}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4">
        <TextField label="Code" value={values.code} onChange={(e) => edit('code', e.target.value)} error={errors.code} hint="e.g. BQ1" />
        <TextField label="Name" value={values.name} onChange={(e) => edit('name', e.target.value)} error={errors.name} />
        <TextField label="Margin (%)" inputMode="decimal" value={values.margin} onChange={(e) => edit('margin', e.target.value)} error={errors.marginPercent} hint="Blank: the machine's margin" />
        <TextField label={`CoG uncertainty (${u.lengthUnit})`} inputMode="decimal" value={values.uncertainty} onChange={(e) => edit('uncertainty', e.target.value)} error={errors.cogUncertaintyMm} hint="Blank: not stated" />
      </div>
      <div className="flex gap-2">
        <Button type="submit" loading={change.isPending}>
          {base ? 'Save section' : 'Add section'}
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
