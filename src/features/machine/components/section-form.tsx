import { useState, type FormEvent } from 'react';
import { createSectionBody } from '@domain/contracts/machine.ts';
import { Alert, Button, TextField } from '../../../components/ui/index.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useMachineChange } from '../api/edit-machine.ts';

/** A new section: code, name, its own margin (blank: the machine's). */
export function SectionForm({ productionId, onDone }: { productionId: string; onDone: () => void }) {
  const [code, setCode] = useState('');
  const [name, setName] = useState('');
  const [margin, setMargin] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const change = useMachineChange(productionId);
  function submit(e: FormEvent) {
    e.preventDefault();
    const checked = validate(createSectionBody, { code, name, marginPercent: margin.trim() === '' ? null : Number(margin) });
    if (!checked.ok) return setErrors(checked.errors);
    change.mutate({ kind: 'createSection', body: checked.data }, { onSuccess: onDone, onError: (err) => setErrors(apiFieldErrors(err)) });
  }
  const problem = formLevelError(change.error, ['code', 'name', 'marginPercent']);
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4">
      {problem && <Alert tone="danger">{problem}</Alert>}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Code" value={code} onChange={(e) => setCode(e.target.value)} error={errors.code} hint="e.g. BQ1" />
        <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
        <TextField label="Margin (%)" inputMode="decimal" value={margin} onChange={(e) => setMargin(e.target.value)} error={errors.marginPercent} hint="Blank: the machine's margin" />
      </div>
      <div className="flex gap-2">
        <Button type="submit" loading={change.isPending}>
          Add section
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
