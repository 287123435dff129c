import { useState, type FormEvent } from 'react';
import { recordWeighingBody } from '@domain/contracts/machine.ts';
import { weighingFromLoadCells } from '@domain/mass/index.ts';
import { toKg, toMm } from '@domain/units.ts';
import { Alert, Button, ChoiceGroup, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { apiFieldErrors, fieldError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useMachineChange } from '../api/edit-machine.ts';

interface Cell {
  x: string;
  y: string;
  reading: string;
}

const today = () => new Date().toISOString().slice(0, 10);

/**
 * Records a weighing of a whole section: one reading, or three or four load cells at known support points.
 * The derived mass and plan CoG show as the crew types (the same statics the server runs).
 */
export function WeighingForm({ productionId, sectionId, sectionCode, onDone }: { productionId: string; sectionId: string; sectionCode: string; onDone: () => void }) {
  const u = useUnits();
  const lengthUnit = u.lengthUnit;
  const massUnit = u.massUnit;
  const [mode, setMode] = useState<'single' | 'cells'>('cells');
  const [weighedOn, setWeighedOn] = useState(today);
  const [weighedBy, setWeighedBy] = useState('');
  const [scale, setScale] = useState('');
  const [cells, setCells] = useState<Cell[]>(() => Array.from({ length: 4 }, () => ({ x: '', y: '', reading: '' })));
  const [errors, setErrors] = useState<FieldErrors>({});
  const change = useMachineChange(productionId);

  const used = mode === 'single' ? cells.slice(0, 1) : cells;
  const readings = used.map((c) => ({
    positionMm: [mode === 'single' ? 0 : toMm(Number(c.x), lengthUnit), mode === 'single' ? 0 : toMm(Number(c.y), lengthUnit)] as [number, number],
    readingKg: toKg(Number(c.reading), massUnit),
  }));
  const complete = used.every((c) => c.reading.trim() !== '' && (mode === 'single' || (c.x.trim() !== '' && c.y.trim() !== '')));
  let derived: ReturnType<typeof weighingFromLoadCells> | null = null;
  let derivedProblem: string | null = null;
  if (complete) {
    try {
      derived = weighingFromLoadCells(readings);
    } catch (e) {
      derivedProblem = errorMessage(e);
    }
  }

  function setCell(i: number, key: keyof Cell, value: string) {
    setCells((cs) => cs.map((c, j) => (j === i ? { ...c, [key]: value } : c)));
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    const checked = validate(recordWeighingBody, { weighedOn, weighedBy, scale, readings });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    change.mutate({ kind: 'weighing', sectionId, body: checked.data }, { onSuccess: onDone, onError: (err) => setErrors(apiFieldErrors(err)) });
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label={`Record a weighing of ${sectionCode}`}>
      {change.isError && Object.keys(errors).length === 0 && (
        <Alert tone="danger" title="Could not record the weighing">
          {errorMessage(change.error)}
        </Alert>
      )}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Date" type="date" value={weighedOn} onChange={(e) => setWeighedOn(e.target.value)} error={errors.weighedOn} />
        <TextField label="Weighed by" value={weighedBy} onChange={(e) => setWeighedBy(e.target.value)} error={errors.weighedBy} />
        <TextField label="Scale or load cells" value={scale} onChange={(e) => setScale(e.target.value)} hint="Make, capacity, calibration date" />
      </div>
      <ChoiceGroup
        legend="Readings"
        name="weighing-mode"
        value={mode}
        onChange={setMode}
        choices={[
          { value: 'single', label: 'One scale' },
          { value: 'cells', label: 'Load cells' },
        ]}
      />
      <div className="flex flex-col gap-2">
        {used.map((c, i) => (
          <div key={i} className="grid grid-cols-3 gap-2">
            {mode === 'cells' && (
              <>
                <TextField label={`Cell ${i + 1} x (${lengthUnit})`} inputMode="decimal" value={c.x} onChange={(e) => setCell(i, 'x', e.target.value)} />
                <TextField label={`Cell ${i + 1} y (${lengthUnit})`} inputMode="decimal" value={c.y} onChange={(e) => setCell(i, 'y', e.target.value)} />
              </>
            )}
            <TextField
              label={mode === 'single' ? `Reading (${massUnit})` : `Cell ${i + 1} reading (${massUnit})`}
              inputMode="decimal"
              value={c.reading}
              onChange={(e) => setCell(i, 'reading', e.target.value)}
              className={mode === 'single' ? 'col-span-3 sm:col-span-1' : undefined}
              error={fieldError(errors, `readings.${i}`)}
            />
          </div>
        ))}
        {mode === 'cells' && (
          <div className="flex gap-2">
            <Button size="sm" variant="ghost" disabled={cells.length >= 16} onClick={() => setCells((cs) => [...cs, { x: '', y: '', reading: '' }])}>
              Add a cell
            </Button>
            <Button size="sm" variant="ghost" disabled={cells.length <= 1} onClick={() => setCells((cs) => cs.slice(0, -1))}>
              Remove the last cell
            </Button>
          </div>
        )}
        <p className="text-sm text-ink-600">Readings net of tare; positions of the support points in the machine frame.</p>
      </div>
      {derived && (
        <Alert tone="accent" title={`Derived: ${u.formatMass(derived.massKg)}`}>
          {derived.cogPlanMm && <p className="text-sm">CoG in plan: {derived.cogPlanMm.map((v) => u.formatLength(v)).join(', ')}</p>}
          <ul className="text-sm">
            {derived.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        </Alert>
      )}
      {derivedProblem && <Alert tone="danger">{derivedProblem}</Alert>}
      <div className="flex gap-2">
        <Button type="submit" loading={change.isPending}>
          Record weighing
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
