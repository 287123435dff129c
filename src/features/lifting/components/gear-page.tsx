import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { gearInput, type GearInput, type GearView } from '@domain/contracts/lifting-api.ts';
import { gearUsableOn, HOIST_RULE_SETS, DEFAULT_HOIST_RULE_SET } from '@domain/lifting/index.ts';
import { Alert, Badge, Button, buttonClasses, Card, CheckboxField, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { ApiError, errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { zodFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useDeleteGear, useGear, useSaveGear } from '../api/gear.ts';
import { today } from './format.ts';

type Kind = GearInput['kind'];
const KIND_LABEL: Record<Kind, string> = { hoist: 'Hoist', sling: 'Sling', shackle: 'Shackle', 'lifting-point': 'Eyebolt / lifting point', 'spreader-beam': 'Spreader beam' };

/** Form values as text, so half-typed numbers survive. */
type Values = Record<string, string>;

const blank = (kind: Kind): Values => ({ kind, identifier: '', description: '', nextInspectionDate: '', hoistClass: 'D8+', slingType: 'roundsling', pointType: 'eyebolt', hasSecondBrake: '' });

function valuesOf(g: GearView): Values {
  const v: Values = { ...blank(g.kind) };
  for (const [k, x] of Object.entries(g)) {
    if (k === 'angleDerating' && Array.isArray(x)) v.angleDerating = x.map((r: { upToDegFromAxis: number; factor: number }) => `${r.upToDegFromAxis}:${r.factor}`).join(', ');
    else if (k === 'hitchFactors' && x && typeof x === 'object') {
      const h = x as { choker?: number; basket?: number };
      v.chokerFactor = h.choker === undefined ? '' : String(h.choker);
      v.basketFactor = h.basket === undefined ? '' : String(h.basket);
    } else if (typeof x === 'boolean') v[k] = x ? 'yes' : '';
    else if (x !== undefined && x !== null && typeof x !== 'object') v[k] = String(x);
  }
  return v;
}

const n = (s: string | undefined) => (s === undefined || s.trim() === '' ? undefined : Number(s));

function toInput(v: Values): unknown {
  const base = { kind: v.kind, identifier: v.identifier.trim(), description: v.description?.trim() || undefined, nextInspectionDate: v.nextInspectionDate };
  switch (v.kind as Kind) {
    case 'hoist':
      return { ...base, ratedLoadKg: n(v.ratedLoadKg), selfWeightKg: n(v.selfWeightKg), chainWeightKg: n(v.chainWeightKg), liftingSpeedMPerMin: n(v.liftingSpeedMPerMin), hoistClass: v.hoistClass, hasSecondBrake: v.hasSecondBrake === 'yes' };
    case 'sling': {
      const hf = { choker: n(v.chokerFactor), basket: n(v.basketFactor) };
      return { ...base, slingType: v.slingType, verticalRatingKg: n(v.verticalRatingKg), lengthMm: n(v.lengthMm), massKg: n(v.massKg), ...(hf.choker !== undefined || hf.basket !== undefined ? { hitchFactors: hf } : {}) };
    }
    case 'shackle':
      return { ...base, ratingKg: n(v.ratingKg), massKg: n(v.massKg) };
    case 'lifting-point': {
      const rows = (v.angleDerating ?? '').split(',').map((s) => s.trim()).filter(Boolean).map((s) => {
        const [a, f] = s.split(':').map(Number);
        return { upToDegFromAxis: a, factor: f };
      });
      return { ...base, pointType: v.pointType, ratingKg: n(v.ratingKg), massKg: n(v.massKg), ...(rows.length ? { angleDerating: rows } : {}) };
    }
    case 'spreader-beam':
      return { ...base, ratingKg: n(v.ratingKg), massKg: n(v.massKg), lengthMm: n(v.lengthMm) };
  }
}

function ratingText(g: GearView, fm: (kg: number) => string, fl: (mm: number) => string): string {
  switch (g.kind) {
    case 'hoist':
      return `${fm(g.ratedLoadKg)} · ${g.hoistClass} · self ${fm(g.selfWeightKg)} + chain ${fm(g.chainWeightKg)}`;
    case 'sling':
      return `${fm(g.verticalRatingKg)} vertical · ${g.slingType} · ${fl(g.lengthMm)}`;
    case 'lifting-point':
      return `${fm(g.ratingKg)} axial · ${g.pointType}${g.angleDerating?.length ? ` · derating ${g.angleDerating.map((r) => `≤${r.upToDegFromAxis}° ×${r.factor}`).join(', ')}` : ' · no derating table'}`;
    default:
      return fm(g.ratingKg);
  }
}

/** `/p/:productionId/lifting/gear`: the rigging inventory. Riggers edit; others read. */
export function GearPage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const gear = useGear(pid);
  const mayEdit = useMay('gear.edit');
  const units = useUnits();
  const [editing, setEditing] = useState<{ id?: string; version?: number; values: Values } | null>(null);
  const del = useDeleteGear(pid);
  const now = today();
  const set = HOIST_RULE_SETS[DEFAULT_HOIST_RULE_SET];

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Lifting"
        title="Rigging gear"
        description="Every item with its identifier and next inspection date. Gear past its inspection date cannot be used in a lift plan."
        actions={
          <>
            <Link to=".." relative="path" className={buttonClasses({ variant: 'secondary' })}>
              Lift plans
            </Link>
            {mayEdit && (
              <Button onClick={() => setEditing({ values: blank('shackle') })} disabled={Boolean(editing)}>
                Add gear
              </Button>
            )}
          </>
        }
      />
      {editing && <GearForm productionId={pid} editing={editing} onDone={() => setEditing(null)} />}
      {del.error ? (
        <Alert tone="danger" title="Not removed">
          {errorMessage(del.error)}
        </Alert>
      ) : null}
      {gear.isPending ? (
        <PageLoading />
      ) : gear.isError ? (
        <ErrorState title="The gear could not be loaded" error={gear.error} onRetry={() => gear.refetch()} />
      ) : (
        <Card>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="text-ink-600">
                <tr>
                  <th className="py-2 pr-3">Identifier</th>
                  <th className="py-2 pr-3">Kind</th>
                  <th className="py-2 pr-3">Rating</th>
                  <th className="py-2 pr-3">Next inspection</th>
                  <th className="py-2">{mayEdit ? 'Actions' : ''}</th>
                </tr>
              </thead>
              <tbody>
                {gear.data.map((g) => {
                  const u = gearUsableOn(g, now);
                  return (
                    <tr key={g.id} className="border-t border-ink-100">
                      <td className="py-2 pr-3 font-semibold">
                        {g.identifier}
                        {g.description && <span className="block font-normal text-ink-600">{g.description}</span>}
                      </td>
                      <td className="py-2 pr-3">{KIND_LABEL[g.kind]}</td>
                      <td className="py-2 pr-3">{ratingText(g, (kg) => units.formatMass(kg), (mm) => units.formatLength(mm))}</td>
                      <td className="py-2 pr-3">
                        {g.nextInspectionDate} {u.usable ? <Badge tone="ok">usable today</Badge> : <Badge tone="danger">overdue: not to be used</Badge>}
                      </td>
                      <td className="py-2">
                        {mayEdit && (
                          <div className="flex gap-1">
                            <Button size="sm" variant="secondary" onClick={() => setEditing({ id: g.id, version: g.version, values: valuesOf(g) })}>
                              Edit
                            </Button>
                            <Button size="sm" variant="ghost" onClick={() => del.mutate(g.id)}>
                              Remove
                            </Button>
                          </div>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </Card>
      )}
      {set && (
        <Card title={`Hoist classes: ${set.name}`} description={set.source}>
          <ul className="list-disc pl-5 text-sm">
            {Object.values(set.classes).map((c) => (
              <li key={c.label}>
                <strong>{c.label}</strong>: {c.allows}
              </li>
            ))}
            {set.useAs.map((r) => (
              <li key={`${r.from}-${r.as}`}>
                {r.from} used as {r.as}: rating × {r.ratingFactor}, needs {r.requires.join(', ')} ({r.source})
              </li>
            ))}
          </ul>
        </Card>
      )}
    </div>
  );
}

function GearForm({ productionId, editing, onDone }: { productionId: string; editing: { id?: string; version?: number; values: Values }; onDone: () => void }) {
  const [values, setValues] = useState<Values>(editing.values);
  const [version, setVersion] = useState(editing.version);
  const [errors, setErrors] = useState<FieldErrors>({});
  const save = useSaveGear(productionId);
  const kind = values.kind as Kind;
  const theirs = save.error instanceof ApiError && save.error.status === 409 && save.error.current ? (save.error.current as GearView) : null;
  const field = (name: string, label: string, hint?: string) => (
    <TextField key={name} label={label} name={name} value={values[name] ?? ''} onChange={(e) => setValues((v) => ({ ...v, [name]: e.target.value }))} error={errors[name]} hint={hint} />
  );

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = gearInput.safeParse(toInput(values));
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    save.mutate({ id: editing.id, version, item: parsed.data }, { onSuccess: onDone, onError: (err) => err instanceof ApiError && setErrors(Object.fromEntries(err.issues.map((i) => [i.path.replace(/^item\./, ''), i.message]))) });
  }

  return (
    <Card title={editing.id ? `Edit ${values.identifier}` : 'Add gear'}>
      <form noValidate onSubmit={submit} className="flex flex-col gap-3" aria-label="Gear item">
        {theirs && (
          <Alert
            tone="caution"
            title="Someone else saved this item while you were editing"
            actions={
              <>
                <Button variant="secondary" onClick={() => { setValues(valuesOf(theirs)); setVersion(theirs.version); save.reset(); }}>
                  Reload their version
                </Button>
                <Button onClick={() => { setVersion(theirs.version); save.reset(); }}>Keep mine (save again)</Button>
              </>
            }
          />
        )}
        {save.error && !theirs ? <Alert tone="danger" title="Could not save">{errorMessage(save.error)}</Alert> : null}
        <div className="grid gap-3 sm:grid-cols-3">
          <SelectField label="Kind" value={kind} disabled={Boolean(editing.id)} onChange={(e) => setValues((v) => ({ ...blank(e.target.value as Kind), identifier: v.identifier, description: v.description, nextInspectionDate: v.nextInspectionDate }))}>
            {(Object.keys(KIND_LABEL) as Kind[]).map((k) => (
              <option key={k} value={k}>
                {KIND_LABEL[k]}
              </option>
            ))}
          </SelectField>
          {field('identifier', 'Identifier (tag or serial)')}
          <TextField label="Next inspection" type="date" value={values.nextInspectionDate} onChange={(e) => setValues((v) => ({ ...v, nextInspectionDate: e.target.value }))} error={errors.nextInspectionDate} />
          {field('description', 'Description')}
          {kind === 'hoist' && (
            <>
              {field('ratedLoadKg', 'Rated load (kg)')}
              {field('selfWeightKg', 'Own weight (kg)')}
              {field('chainWeightKg', 'Chain weight (kg)')}
              {field('liftingSpeedMPerMin', 'Lifting speed (m/min)')}
              <SelectField label="Class" value={values.hoistClass} onChange={(e) => setValues((v) => ({ ...v, hoistClass: e.target.value }))}>
                <option value="D8">D8</option>
                <option value="D8+">D8+</option>
                <option value="C1">C1</option>
              </SelectField>
              <CheckboxField label="Second brake" checked={values.hasSecondBrake === 'yes'} onChange={(e) => setValues((v) => ({ ...v, hasSecondBrake: e.target.checked ? 'yes' : '' }))} />
            </>
          )}
          {kind === 'sling' && (
            <>
              <SelectField label="Sling type" value={values.slingType} onChange={(e) => setValues((v) => ({ ...v, slingType: e.target.value }))}>
                <option value="roundsling">roundsling</option>
                <option value="web">web sling</option>
                <option value="wire-rope">wire rope</option>
                <option value="chain">chain</option>
              </SelectField>
              {field('verticalRatingKg', 'Vertical rating (kg)')}
              {field('lengthMm', 'Length (mm)')}
              {field('massKg', 'Mass (kg)')}
              {field('chokerFactor', "Choker factor (maker's)", 'Empty: 0.75 wire rope, 0.8 others')}
              {field('basketFactor', "Basket factor (maker's)", 'Empty: 2')}
            </>
          )}
          {(kind === 'shackle' || kind === 'spreader-beam' || kind === 'lifting-point') && (
            <>
              {field('ratingKg', kind === 'lifting-point' ? 'Rating along its axis (kg)' : 'Rating (kg)')}
              {field('massKg', 'Mass (kg)')}
            </>
          )}
          {kind === 'spreader-beam' && field('lengthMm', 'Length (mm)')}
          {kind === 'lifting-point' && (
            <>
              <SelectField label="Type" value={values.pointType} onChange={(e) => setValues((v) => ({ ...v, pointType: e.target.value }))}>
                <option value="eyebolt">eyebolt</option>
                <option value="swivel">swivel</option>
                <option value="lug">lug</option>
                <option value="other">other</option>
              </SelectField>
              {field('angleDerating', "Angle derating (maker's table)", 'e.g. "15:1, 45:0.5" = up to 15° full, up to 45° half; beyond: not to be used')}
            </>
          )}
        </div>
        <div className="flex gap-2">
          <Button type="submit" loading={save.isPending}>
            Save
          </Button>
          <Button variant="ghost" onClick={onDone}>
            Cancel
          </Button>
        </div>
      </form>
    </Card>
  );
}
