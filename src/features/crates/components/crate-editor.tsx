import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import type { CrateView, UpdateCrateBody } from '@domain/contracts/crate-loads.ts';
import { Alert, Button, Card, CheckboxField, EmptyState, ErrorState, PageHeader, PageLoading, StaleSaveAlert, TextField, type StaleField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { apiFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useDraft } from '../../../lib/use-draft.ts';
import { useUnits, type Units } from '../../../lib/use-units.ts';
import { conflictCrate, useAddContent, useCrate, useDeleteContent, useUpdateCrate, type ContentInput } from '../api/crates-api.ts';
import { CrateFigures } from './crate-figures.tsx';
import { UnitInput } from './unit-input.tsx';

/** `/p/:productionId/crates/:crateId`: one crate, its contents and its figures. */
export function CrateEditorPage({ crateId }: { crateId: string }) {
  const { productionId } = useCurrentProduction();
  const crate = useCrate(productionId ?? '', crateId);
  if (crate.isPending) return <PageLoading label="Loading the crate…" />;
  if (crate.isError) return <ErrorState title="The crate could not be loaded" error={crate.error} onRetry={() => crate.refetch()} retrying={crate.isFetching} />;
  // Keyed by id only: a newer record from the server (a refetch when the window regains focus) must not throw
  // away unsaved edits; the editor adopts it only while nothing is edited.
  return <CrateEditor key={crate.data.id} productionId={productionId!} crate={crate.data} />;
}

type Values = Pick<CrateView, 'code' | 'name' | 'notes' | 'stackable' | 'thisWayUp' | 'fragile' | 'mayTilt' | 'ispm15Required' | 'maxLoadOnTopKg' | 'maxGrossKg' | 'outerMm' | 'tareKg'> & { clearanceMm: number | null };

function valuesOf(c: CrateView): Values {
  const opts = (c.design.options ?? {}) as { clearanceMm?: unknown };
  return {
    code: c.code,
    name: c.name,
    notes: c.notes,
    stackable: c.stackable,
    thisWayUp: c.thisWayUp,
    fragile: c.fragile,
    mayTilt: c.mayTilt,
    ispm15Required: c.ispm15Required,
    maxLoadOnTopKg: c.maxLoadOnTopKg,
    maxGrossKg: c.maxGrossKg,
    outerMm: c.outerMm,
    tareKg: c.tareKg,
    clearanceMm: typeof opts.clearanceMm === 'number' ? opts.clearanceMm : 50,
  };
}

/** Their values beside mine, formatted in the person's units, for the stale-save box. */
function crateFields(theirs: Values, mine: Values, u: Units): StaleField[] {
  const yesNo = (b: boolean) => (b ? 'yes' : 'no');
  const kg = (v: number | null) => (v === null ? 'none' : u.formatMass(v));
  return [
    { label: 'Code', theirs: theirs.code, mine: mine.code },
    { label: 'Name', theirs: theirs.name, mine: mine.name },
    { label: 'Notes', theirs: theirs.notes, mine: mine.notes },
    { label: 'Outer size', theirs: theirs.outerMm.map((v) => u.formatLength(v)).join(' × '), mine: mine.outerMm.map((v) => u.formatLength(v)).join(' × ') },
    { label: 'Tare', theirs: kg(theirs.tareKg), mine: kg(mine.tareKg) },
    { label: 'Clearance', theirs: theirs.clearanceMm === null ? 'none' : u.formatLength(theirs.clearanceMm), mine: mine.clearanceMm === null ? 'none' : u.formatLength(mine.clearanceMm) },
    { label: 'Stackable', theirs: yesNo(theirs.stackable), mine: yesNo(mine.stackable) },
    { label: 'This way up', theirs: yesNo(theirs.thisWayUp), mine: yesNo(mine.thisWayUp) },
    { label: 'Fragile', theirs: yesNo(theirs.fragile), mine: yesNo(mine.fragile) },
    { label: 'May tilt', theirs: yesNo(theirs.mayTilt), mine: yesNo(mine.mayTilt) },
    { label: 'ISPM 15 needed', theirs: yesNo(theirs.ispm15Required), mine: yesNo(mine.ispm15Required) },
    { label: 'Max load on top', theirs: kg(theirs.maxLoadOnTopKg), mine: kg(mine.maxLoadOnTopKg) },
    { label: 'Max gross', theirs: kg(theirs.maxGrossKg), mine: kg(mine.maxGrossKg) },
  ];
}

/** Only what changed, so a save never undoes someone else's other edits. */
function changes(base: CrateView, v: Values): Omit<UpdateCrateBody, 'version'> {
  const b = valuesOf(base);
  const out: Record<string, unknown> = {};
  for (const k of ['code', 'name', 'notes', 'stackable', 'thisWayUp', 'fragile', 'mayTilt', 'ispm15Required', 'maxLoadOnTopKg', 'maxGrossKg'] as const) if (v[k] !== b[k]) out[k] = v[k];
  if (base.kind !== 'designed') {
    if (v.outerMm.some((x, i) => x !== b.outerMm[i])) out.outerMm = v.outerMm;
    if (v.tareKg !== b.tareKg) out.tareKg = v.tareKg;
  } else if (v.clearanceMm !== b.clearanceMm && v.clearanceMm !== null) {
    out.designOptions = { ...((base.design.options ?? {}) as object), clearanceMm: v.clearanceMm };
  }
  return out as Omit<UpdateCrateBody, 'version'>;
}

function CrateEditor({ productionId, crate }: { productionId: string; crate: CrateView }) {
  const u = useUnits();
  const mayEdit = useMay('crate.edit');
  const { base, values, errors, setErrors, edit, adopt, setValues } = useDraft(crate, valuesOf);
  const update = useUpdateCrate(productionId, crate.id);
  const theirs = conflictCrate(update.error);
  const diff = changes(base, values);
  const dirty = Object.keys(diff).length > 0;
  // A newer record arrived (someone saved, then a refetch): take it while nothing is edited; with edits in the
  // form keep them, and the save shows their version beside mine.
  const [seenVersion, setSeenVersion] = useState(crate.version);
  if (crate.version !== seenVersion) {
    setSeenVersion(crate.version);
    if (!dirty && !theirs && crate.version > base.version) adopt(crate);
  }

  function save(from: CrateView) {
    update.mutate(
      { version: from.version, ...diff },
      {
        onSuccess: (savedCrate) => adopt(savedCrate, { saved: true }),
        onError: (e) => setErrors(apiFieldErrors(e)),
      },
    );
  }
  function submit(e: FormEvent) {
    e.preventDefault();
    save(base);
  }

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={<Link to="..">Crates & loads</Link>}
        title={`Crate ${crate.code}${crate.name ? ` — ${crate.name}` : ''}`}
        description={crate.kind === 'designed' ? 'Designed around a section: size and tare follow from the design.' : crate.kind === 'pallet' ? 'A pallet: set the loaded height as its outer height.' : 'A stock case.'}
      />
      {theirs && (
        <StaleSaveAlert
          title="Someone else saved this crate while you were editing"
          busy={update.isPending}
          fields={crateFields(valuesOf(theirs), values, u)}
          note="Keep mine saves only the fields you changed, on top of their version."
          onReload={() => {
            adopt(theirs);
            update.reset();
          }}
          onKeepMine={() => save(theirs)}
        />
      )}
      <div className="grid gap-5 xl:grid-cols-2">
        <Card title="Crate">
          <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label="Crate details">
            {update.isError && !theirs && Object.keys(apiFieldErrors(update.error)).length === 0 && <Alert tone="danger" title="Could not save">{errorMessage(update.error)}</Alert>}
            <div className="grid gap-4 sm:grid-cols-2">
              <TextField label="Code" name="code" value={values.code} disabled={!mayEdit} onChange={(e) => edit('code', e.target.value)} error={errors.code} />
              <TextField label="Name" name="name" value={values.name} disabled={!mayEdit} onChange={(e) => edit('name', e.target.value)} error={errors.name} />
            </div>
            {crate.kind === 'designed' ? (
              <UnitInput label="Clearance around the section" kind="length" valueSi={values.clearanceMm} onChange={(v) => edit('clearanceMm', v)} error={errors.designOptions} hint="Saving designs the crate again around the section as it is now." />
            ) : (
              <div className="grid gap-4 sm:grid-cols-4">
                {(['Length', 'Width', 'Height'] as const).map((l, i) => (
                  <UnitInput key={l} label={`Outer ${l.toLowerCase()}`} kind="length" valueSi={values.outerMm[i]} onChange={(v) => edit('outerMm', values.outerMm.map((x, j) => (j === i ? (v ?? 0) : x)) as [number, number, number])} error={errors[`outerMm.${i}`]} />
                ))}
                <UnitInput label="Tare" kind="mass" valueSi={values.tareKg} onChange={(v) => edit('tareKg', v ?? 0)} error={errors.tareKg} />
              </div>
            )}
            <div className="grid gap-4 sm:grid-cols-2">
              <UnitInput label="Maximum gross" kind="mass" valueSi={values.maxGrossKg} onChange={(v) => edit('maxGrossKg', v)} error={errors.maxGrossKg} />
              <UnitInput label="Most on top" kind="mass" valueSi={values.maxLoadOnTopKg} onChange={(v) => edit('maxLoadOnTopKg', v)} error={errors.maxLoadOnTopKg} />
            </div>
            <div className="flex flex-wrap gap-4">
              <CheckboxField label="May be stacked on" checked={values.stackable} disabled={!mayEdit} onChange={(e) => edit('stackable', e.target.checked)} />
              <CheckboxField label="This way up" checked={values.thisWayUp} disabled={!mayEdit} onChange={(e) => edit('thisWayUp', e.target.checked)} />
              <CheckboxField label="Fragile" checked={values.fragile} disabled={!mayEdit} onChange={(e) => edit('fragile', e.target.checked)} />
              <CheckboxField label="May tilt" checked={values.mayTilt} disabled={!mayEdit} onChange={(e) => edit('mayTilt', e.target.checked)} />
              <CheckboxField label="Needs the ISPM 15 mark abroad" checked={values.ispm15Required} disabled={!mayEdit} onChange={(e) => edit('ispm15Required', e.target.checked)} />
            </div>
            <TextField label="Notes" name="notes" value={values.notes} disabled={!mayEdit} onChange={(e) => edit('notes', e.target.value)} error={errors.notes} />
            {mayEdit && (
              <div className="flex gap-2">
                <Button type="submit" loading={update.isPending && !theirs} disabled={!dirty || Boolean(theirs)}>
                  Save crate
                </Button>
                {dirty && (
                  <Button variant="ghost" onClick={() => setValues(valuesOf(base))}>
                    Discard changes
                  </Button>
                )}
              </div>
            )}
          </form>
        </Card>
        <CrateFigures crate={crate} />
      </div>
      <ContentsCard productionId={productionId} crate={crate} mayEdit={mayEdit} formatMass={u.formatMass} />
    </div>
  );
}

function ContentsCard({ productionId, crate, mayEdit, formatMass }: { productionId: string; crate: CrateView; mayEdit: boolean; formatMass: (kg: number) => string }) {
  const add = useAddContent(productionId, crate.id);
  const del = useDeleteContent(productionId, crate.id);
  const empty: ContentInput = { description: '', quantity: 1, massKg: null, cogMm: null };
  const [line, setLine] = useState<ContentInput>(empty);
  const [errors, setErrors] = useState<FieldErrors>({});
  return (
    <Card title="Contents" description="What the crate holds. A line without a mass leaves the gross a lower bound.">
      {crate.contents.length === 0 ? (
        <EmptyState title="Nothing in this crate yet">Add the section or the loose parts it carries.</EmptyState>
      ) : (
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="border-b border-ink-200">
              <th scope="col" className="py-1 pr-3">Content</th>
              <th scope="col" className="py-1 pr-3">Quantity</th>
              <th scope="col" className="py-1 pr-3">Mass</th>
              <th scope="col" className="py-1 pr-3">CoG given</th>
              {mayEdit && <th scope="col" className="py-1"><span className="sr-only">Remove</span></th>}
            </tr>
          </thead>
          <tbody>
            {crate.contents.map((c) => (
              <tr key={c.id} className="border-b border-ink-100">
                <td className="py-1 pr-3">{c.description}</td>
                <td className="py-1 pr-3">{c.quantity}</td>
                <td className="py-1 pr-3">{c.massKg === null ? <span className="text-caution-800">unknown</span> : formatMass(c.massKg)}</td>
                <td className="py-1 pr-3">{c.cogMm ? 'yes' : 'no'}</td>
                {mayEdit && (
                  <td className="py-1">
                    <Button variant="ghost" size="sm" onClick={() => del.mutate(c.id)} disabled={del.isPending}>
                      Remove
                    </Button>
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {mayEdit && (
        <form
          noValidate
          aria-label="Add a content line"
          className="mt-4 grid items-end gap-3 sm:grid-cols-4"
          onSubmit={(e) => {
            e.preventDefault();
            if (!line.description.trim()) return setErrors({ description: 'Describe the content.' });
            setErrors({});
            add.mutate(line, { onSuccess: () => setLine(empty), onError: (er) => setErrors(apiFieldErrors(er)) });
          }}
        >
          <TextField label="Description" name="description" value={line.description} onChange={(e) => setLine({ ...line, description: e.target.value })} error={errors.description} />
          <TextField label="Quantity" name="quantity" inputMode="decimal" value={String(line.quantity)} onChange={(e) => setLine({ ...line, quantity: Number(e.target.value) || 0 })} error={errors.quantity} />
          <UnitInput key={`m${crate.contents.length}`} label="Mass of the line" kind="mass" valueSi={line.massKg} onChange={(v) => setLine({ ...line, massKg: v })} error={errors.massKg} />
          <Button type="submit" loading={add.isPending}>
            Add content
          </Button>
        </form>
      )}
    </Card>
  );
}
