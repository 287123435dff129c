import type { FormEvent } from 'react';
import { partLineView, updatePartLineBody, type BreakdownLineView, type MaterialView, type PartLineView } from '@domain/contracts/machine.ts';
import { MASS_SOURCES, type MassSource } from '@domain/contracts/mass.ts';
import { fromKg, fromMm, toKg, toMm } from '@domain/units.ts';
import { Alert, Button, Card, SelectField, StaleSaveAlert, TextField, type StaleField } from '../../../components/ui/index.ts';
import { errorMessage, staleCurrent } from '../../../lib/api.ts';
import { fieldError, formLevelError } from '../../../lib/form-errors.ts';
import { useDraft } from '../../../lib/use-draft.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useMachineChange } from '../api/edit-machine.ts';
import { StlUpload } from './stl-upload.tsx';

interface Values {
  name: string;
  quantity: string;
  unitMass: string;
  massSource: MassSource | '';
  material: string;
  cog: [string, string, string];
}

/** Their values beside mine, as typed, for the stale-save box. */
function staleFields(theirs: Values, mine: Values, massUnit: string, lengthUnit: string): StaleField[] {
  return [
    { label: 'Name', theirs: theirs.name, mine: mine.name },
    { label: 'Quantity', theirs: theirs.quantity, mine: mine.quantity },
    { label: `Unit mass (${massUnit})`, theirs: theirs.unitMass || 'not known', mine: mine.unitMass || 'not known' },
    { label: 'Mass source', theirs: theirs.massSource || 'none', mine: mine.massSource || 'none' },
    { label: 'Material', theirs: theirs.material || 'none', mine: mine.material || 'none' },
    { label: `CoG (${lengthUnit})`, theirs: theirs.cog.join(', '), mine: mine.cog.join(', ') },
  ];
}

const num = (v: number | null, digits = 6) => (v === null ? '' : String(Math.round(v * 10 ** digits) / 10 ** digits));

/**
 * One part line: its figures, an edit form for planners (in the person's units; saved in mm and kg with the
 * version it started from), and the STL upload for made parts.
 */
export function LinePanel({ productionId, line, materials, mayEdit, onClose }: { productionId: string; line: BreakdownLineView | PartLineView; materials: MaterialView[]; mayEdit: boolean; onClose: () => void }) {
  const u = useUnits();
  const valuesOf = (l: PartLineView): Values => ({
    name: l.name,
    quantity: String(l.quantity),
    unitMass: l.unitMassKg === null ? '' : num(fromKg(l.unitMassKg, u.massUnit)),
    massSource: l.massSource ?? '',
    material: l.material ?? '',
    cog: (l.cogMm ? l.cogMm.map((v) => num(fromMm(v, u.lengthUnit), 3)) : ['', '', '']) as [string, string, string],
  });
  const { base, values, errors, saved, setSaved, edit, adopt, send } = useDraft<PartLineView, Values>(line, valuesOf);
  const change = useMachineChange(productionId);
  const theirsRaw = staleCurrent(change.error);
  const theirs = theirsRaw ? partLineView.safeParse(theirsRaw) : null;

  function body(version: number) {
    const cogEmpty = values.cog.every((c) => c.trim() === '');
    return {
      version,
      name: values.name,
      // With placed instances the quantity follows them; sending it again would only repeat it.
      ...(base.instances.length ? {} : { quantity: Number(values.quantity) }),
      unitMassKg: values.unitMass.trim() === '' ? null : toKg(Number(values.unitMass), u.massUnit),
      massSource: values.massSource || null,
      material: values.material || null,
      cogMm: cogEmpty ? null : values.cog.map((c) => toMm(Number(c), u.lengthUnit)),
    };
  }
  function save(version: number) {
    send(
      updatePartLineBody,
      body(version),
      (data, handlers) => change.mutate({ kind: 'updateLine', id: base.id, body: data }, handlers),
      (answer) => partLineView.parse((answer as { line: unknown }).line),
    );
  }
  function submit(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    save(base.version);
  }
  const problem = theirs ? null : formLevelError(change.error, ['name', 'quantity', 'unitMassKg', 'massSource', 'material', 'cogMm']);

  return (
    <Card
      title={`${base.partNumber} ${base.name}`}
      description={`${base.makeOrBuy ?? 'made or bought not given'}${base.instances.length ? ` · ${base.instances.length} placed instances` : ''}${base.hasMesh ? ' · has a mesh' : ''}`}
      actions={
        <Button size="sm" variant="ghost" onClick={onClose}>
          Close
        </Button>
      }
    >
      {!mayEdit ? (
        <dl className="grid grid-cols-2 gap-3 text-sm">
          <dt className="text-ink-600">Quantity</dt>
          <dd>{base.quantity}</dd>
          <dt className="text-ink-600">Unit mass</dt>
          <dd>{base.unitMassKg === null ? 'not known (a gap)' : u.formatMass(base.unitMassKg, 3)}</dd>
          <dt className="text-ink-600">Source</dt>
          <dd>{base.massSource ?? 'none'}</dd>
          <dt className="text-ink-600">CoG</dt>
          <dd>{base.cogMm ? base.cogMm.map((v) => u.formatLength(v)).join(', ') : 'not known (a gap)'}</dd>
        </dl>
      ) : (
        <form noValidate onSubmit={submit} className="flex flex-col gap-4">
          {theirs?.success && (
            <StaleSaveAlert
              title="Someone else saved this line while you were editing"
              busy={change.isPending}
              fields={staleFields(valuesOf(theirs.data), values, u.massUnit, u.lengthUnit)}
              onReload={() => (adopt(theirs.data), change.reset())}
              onKeepMine={() => save(theirs.data.version)}
            />
          )}
          {problem && <Alert tone="danger">{problem}</Alert>}
          {saved && <Alert tone="ok">Saved.</Alert>}
          <TextField label="Name" value={values.name} onChange={(e) => edit('name', e.target.value)} error={errors.name} />
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Quantity" inputMode="decimal" value={values.quantity} disabled={base.instances.length > 0} onChange={(e) => edit('quantity', e.target.value)} error={errors.quantity} />
            <TextField label={`Unit mass (${u.massUnit})`} inputMode="decimal" value={values.unitMass} onChange={(e) => edit('unitMass', e.target.value)} error={errors.unitMassKg} hint="Blank: not known" />
            <SelectField label="Mass source" value={values.massSource} onChange={(e) => edit('massSource', e.target.value as MassSource | '')} error={errors.massSource}>
              <option value="">none</option>
              {MASS_SOURCES.map((s) => (
                <option key={s} value={s}>
                  {s}
                </option>
              ))}
            </SelectField>
            <SelectField label="Material" value={values.material} onChange={(e) => edit('material', e.target.value)} error={errors.material}>
              <option value="">none</option>
              {materials.map((m) => (
                <option key={m.id} value={m.code}>
                  {m.name}
                </option>
              ))}
            </SelectField>
          </div>
          <fieldset className="grid grid-cols-3 gap-2">
            <legend className="mb-1 text-sm font-semibold text-ink-800">CoG ({u.lengthUnit}){base.instances.length ? ', in the part’s own frame' : ''}</legend>
            {(['x', 'y', 'z'] as const).map((axis, i) => (
              <TextField
                key={axis}
                label={axis}
                inputMode="decimal"
                value={values.cog[i]}
                onChange={(e) => edit('cog', values.cog.map((c, j) => (j === i ? e.target.value : c)) as Values['cog'])}
                error={i === 0 ? fieldError(errors, 'cogMm') : undefined}
              />
            ))}
          </fieldset>
          <div>
            <Button type="submit" loading={change.isPending && !theirs}>
              Save line
            </Button>
          </div>
        </form>
      )}
      {mayEdit && (
        <div className="mt-5 border-t border-ink-100 pt-4">
          <StlUpload productionId={productionId} line={base} materials={materials} onUploaded={(l) => adopt(l)} />
        </div>
      )}
      {change.isError && !theirs && !problem && Object.keys(errors).length === 0 && <Alert tone="danger">{errorMessage(change.error)}</Alert>}
    </Card>
  );
}
