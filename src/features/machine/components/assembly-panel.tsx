import { useState, type FormEvent } from 'react';
import { assemblyView, updateAssemblyBody, type AssemblyView, type NodeMassView, type SectionView } from '@domain/contracts/machine.ts';
import { Alert, Button, Card, CheckboxField, SelectField, StaleSaveAlert, TextField } from '../../../components/ui/index.ts';
import { ApiError, errorMessage, staleCurrent } from '../../../lib/api.ts';
import { formLevelError } from '../../../lib/form-errors.ts';
import { useDraft } from '../../../lib/use-draft.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useMachineChange } from '../api/edit-machine.ts';

interface Values {
  number: string;
  name: string;
  sectionId: string;
  keepTogether: boolean;
  notes: string;
}
const valuesOf = (a: AssemblyView): Values => ({ number: a.number, name: a.name, sectionId: a.sectionId ?? '', keepTogether: a.keepTogether, notes: a.notes });
const FIELDS = ['number', 'name', 'sectionId', 'keepTogether', 'notes'];

/**
 * One assembly of the breakdown: its figures, and for planners its number, name, section, whether it must travel
 * in one piece, notes, and deleting it (with what it holds only after a second, explicit choice). Saves carry the
 * version the edit started from and only the fields changed; a stale save shows theirs beside mine.
 */
export function AssemblyPanel({ productionId, assembly, sections, mass, mayEdit, onClose }: { productionId: string; assembly: AssemblyView; sections: SectionView[]; mass: NodeMassView | undefined; mayEdit: boolean; onClose: () => void }) {
  const u = useUnits();
  const { base, values, errors, saved, edit, adopt, send } = useDraft(assembly, valuesOf);
  const [deleting, setDeleting] = useState<'no' | 'ask' | 'withContents'>('no');
  const change = useMachineChange(productionId);
  const remove = useMachineChange(productionId);
  const parsed = assemblyView.safeParse(staleCurrent(change.error));
  const theirs = parsed.success ? parsed.data : null;
  const sectionCode = (id: string) => sections.find((s) => s.id === id)?.code ?? 'none (its parent’s)';
  function save(version: number) {
    const start = valuesOf(base);
    const changed: Record<string, unknown> = {};
    for (const k of Object.keys(values) as (keyof Values)[]) if (values[k] !== start[k]) changed[k] = k === 'sectionId' ? values.sectionId || null : values[k];
    send(
      updateAssemblyBody,
      { version, ...changed },
      (body, handlers) => change.mutate({ kind: 'updateAssembly', id: base.id, body }, handlers),
      (answer) => assemblyView.parse((answer as { assembly: unknown }).assembly),
    );
  }
  function submit(e: FormEvent) {
    e.preventDefault();
    save(base.version);
  }
  // The server refuses to delete an assembly that holds anything unless asked to take its contents too.
  const holds = remove.error instanceof ApiError && remove.error.status === 409 ? remove.error.message : null;
  const problem = theirs ? null : formLevelError(change.error, FIELDS);

  return (
    <Card
      title={`Assembly ${base.number}${base.name ? ` ${base.name}` : ''}`}
      description={mass ? `${u.formatMass(mass.massKg)} in ${mass.lineCount} lines${mass.gaps.length ? `, ${mass.gaps.length} gaps` : ''}` : undefined}
      actions={
        <Button size="sm" variant="ghost" onClick={onClose}>
          Close
        </Button>
      }
    >
      {!mayEdit ? (
        <dl className="grid grid-cols-2 gap-3 text-sm">
          <dt className="text-ink-600">Section</dt>
          <dd>{sectionCode(base.sectionId ?? '')}</dd>
          <dt className="text-ink-600">Travels in one piece</dt>
          <dd>{base.keepTogether ? 'yes' : 'no'}</dd>
          <dt className="text-ink-600">Notes</dt>
          <dd>{base.notes || '—'}</dd>
        </dl>
      ) : (
        <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label={`Edit assembly ${base.number}`}>
          {theirs && (
            <StaleSaveAlert
              title="Someone else saved this assembly while you were editing"
              busy={change.isPending}
              fields={[
                { label: 'Number', theirs: theirs.number, mine: values.number },
                { label: 'Name', theirs: theirs.name, mine: values.name },
                { label: 'Section', theirs: sectionCode(theirs.sectionId ?? ''), mine: sectionCode(values.sectionId) },
                { label: 'Travels in one piece', theirs: theirs.keepTogether ? 'yes' : 'no', mine: values.keepTogether ? 'yes' : 'no' },
                { label: 'Notes', theirs: theirs.notes, mine: values.notes },
              ]}
              onReload={() => {
                adopt(theirs);
                change.reset();
              }}
              onKeepMine={() => save(theirs.version)}
            />
          )}
          {problem && <Alert tone="danger">{problem}</Alert>}
          {saved && <Alert tone="ok">Saved.</Alert>}
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Number" value={values.number} onChange={(e) => edit('number', e.target.value)} error={errors.number} />
            <TextField label="Name" value={values.name} onChange={(e) => edit('name', e.target.value)} error={errors.name} />
          </div>
          <SelectField label="Section" value={values.sectionId} onChange={(e) => edit('sectionId', e.target.value)} error={errors.sectionId} hint="None: it travels with its parent assembly's section.">
            <option value="">none (its parent’s)</option>
            {sections.map((s) => (
              <option key={s.id} value={s.id}>
                {s.code} {s.name}
              </option>
            ))}
          </SelectField>
          <CheckboxField label="Travels in one piece (the split advisor keeps it together)" checked={values.keepTogether} onChange={(e) => edit('keepTogether', e.target.checked)} />
          <TextField label="Notes" value={values.notes} onChange={(e) => edit('notes', e.target.value)} error={errors.notes} />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" loading={change.isPending}>
              Save assembly
            </Button>
            {deleting === 'no' && (
              <Button variant="ghost" onClick={() => setDeleting('ask')}>
                Delete assembly
              </Button>
            )}
          </div>
          {deleting !== 'no' && (
            <Alert tone="caution" title={`Delete assembly ${base.number}?`}>
              {holds ? <p className="text-sm">{holds}</p> : remove.isError && <p className="text-sm">{errorMessage(remove.error)}</p>}
              <div className="mt-2 flex flex-wrap gap-2">
                {holds ? (
                  <Button variant="danger" size="sm" loading={remove.isPending} onClick={() => remove.mutate({ kind: 'deleteAssembly', id: base.id, withContents: true }, { onSuccess: onClose })}>
                    Delete it with everything it holds
                  </Button>
                ) : (
                  <Button variant="danger" size="sm" loading={remove.isPending} onClick={() => remove.mutate({ kind: 'deleteAssembly', id: base.id, withContents: false }, { onSuccess: onClose })}>
                    Delete {base.number}
                  </Button>
                )}
                <Button size="sm" variant="ghost" onClick={() => (setDeleting('no'), remove.reset())}>
                  Keep it
                </Button>
              </div>
            </Alert>
          )}
        </form>
      )}
    </Card>
  );
}
