import { useState, type FormEvent } from 'react';
import type { MachineView } from '@domain/contracts/machine.ts';
import { Alert, Button, TextField } from '../../../components/ui/index.ts';
import { errorMessage, staleCurrent } from '../../../lib/api.ts';
import { useMachineChange } from '../api/edit-machine.ts';

/** The machine's contingency margin (%), which lifting and packing use for every section without its own. */
export function MarginForm({ productionId, machine }: { productionId: string; machine: MachineView }) {
  const [value, setValue] = useState(String(machine.marginPercent));
  // A newer machine from the server replaces the figure only while nobody is typing a different one.
  const [shown, setShown] = useState(machine.marginPercent);
  if (machine.marginPercent !== shown) {
    setShown(machine.marginPercent);
    if (value === String(shown)) setValue(String(machine.marginPercent));
  }
  const change = useMachineChange(productionId);
  const stale = staleCurrent<MachineView>(change.error);
  function submit(e: FormEvent) {
    e.preventDefault();
    change.mutate({ kind: 'machine', body: { version: stale?.version ?? machine.version, marginPercent: Number(value) } });
  }
  return (
    <form noValidate onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <TextField label="Contingency margin (%)" inputMode="decimal" value={value} onChange={(e) => setValue(e.target.value)} className="w-44" />
      <Button type="submit" variant="secondary" loading={change.isPending} disabled={value.trim() === '' || Number(value) === machine.marginPercent}>
        Set margin
      </Button>
      {stale && (
        <Alert tone="caution" className="basis-full">
          Someone set the margin to {stale.marginPercent} % meanwhile. Save again to keep yours.
        </Alert>
      )}
      {change.isError && !stale && (
        <Alert tone="danger" className="basis-full">
          {errorMessage(change.error)}
        </Alert>
      )}
    </form>
  );
}
