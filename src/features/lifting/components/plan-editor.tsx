import { lazy, Suspense, useMemo, useState, type FormEvent, type ReactNode } from 'react';
import { evaluatePlanFields, liftPlanFields, type GearView, type HangingPointView, type LiftingSettingsView, type LiftLoadView, type LiftPlanFields, type LiftPlanFieldsInput } from '@domain/contracts/lifting-api.ts';
import type { GearItem } from '@domain/contracts/lifting.ts';
import { gearUsableOn } from '@domain/lifting/index.ts';
import { Alert, Button, Card, CheckboxField, SelectField, Spinner, StaleSaveAlert, TextField, controlClasses, type StaleField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { PlanResultView } from './plan-result.tsx';
import { today } from './format.ts';

const Plan3d = lazy(() => import('./plan-3d.tsx'));

type Vec3 = [number, number, number];
type Suspension = LiftPlanFieldsInput['suspension'];
type PickPoint = LiftPlanFieldsInput['pickPoints'][number];
type HangingPoint = Extract<Suspension, { kind: 'single-hook' }>['hangingPoint'];

export interface PlanEditorContext {
  loads: LiftLoadView[];
  gear: GearView[];
  settings: LiftingSettingsView;
  hangingPoints: HangingPointView[];
}

export interface PlanEditorProps {
  ctx: PlanEditorContext;
  initial: LiftPlanFields | null;
  saving: boolean;
  saveLabel: string;
  error?: unknown;
  onSave: (fields: LiftPlanFields) => void;
  /** Extra buttons next to save (discard, cancel). */
  actions?: ReactNode;
  /** The save was refused as stale: someone else saved the plan meanwhile (their inputs). */
  stale?: { theirs: LiftPlanFields; note?: ReactNode; onReload: () => void; onKeepMine: (mine: LiftPlanFields) => void };
}

/** The plan's inputs as a person reads them, for the stale-save box. */
function planFields(theirs: LiftPlanFields, mine: LiftPlanFieldsInput, ctx: PlanEditorContext): StaleField[] {
  const section = (id: string) => ctx.loads.find((l) => l.sectionId === id)?.code ?? 'another section';
  const venue = (id: string | null | undefined) => (id ? (ctx.hangingPoints.find((p) => p.venueId === id)?.venueName ?? 'another venue') : 'none');
  const mm = (v: number | null | undefined) => (v === null || v === undefined ? 'default' : `${v} mm`);
  const picks = (pp: LiftPlanFieldsInput['pickPoints']) => pp.map((p) => `${p.id} (${p.positionMm.join(', ')})`).join('; ');
  return [
    { label: 'Title', theirs: theirs.title, mine: mine.title },
    { label: 'Section', theirs: section(theirs.sectionId), mine: section(mine.sectionId) },
    { label: 'Venue', theirs: venue(theirs.venueId), mine: venue(mine.venueId) },
    { label: 'Lift date', theirs: theirs.liftDate, mine: mine.liftDate },
    { label: 'Suspension', theirs: theirs.suspension.kind, mine: mine.suspension.kind },
    { label: 'Pick points (mm)', theirs: picks(theirs.pickPoints), mine: picks(mine.pickPoints) },
    { label: 'People below', theirs: theirs.peopleBelow ? 'yes' : 'no', mine: mine.peopleBelow ? 'yes' : 'no' },
    { label: 'CoG uncertainty', theirs: mm(theirs.cogUncertaintyMm), mine: mm(mine.cogUncertaintyMm) },
    { label: 'Exclusion margin', theirs: mm(theirs.exclusionMarginMm), mine: mm(mine.exclusionMarginMm) },
    { label: 'Largest tilt', theirs: theirs.maxTiltDeg === null ? 'not checked' : `${theirs.maxTiltDeg}°`, mine: mine.maxTiltDeg == null ? 'not checked' : `${mine.maxTiltDeg}°` },
    { label: 'Method statement', theirs: theirs.method, mine: mine.method ?? '' },
  ];
}

/** A sensible first plan for a section: two pick points either side of the CoG at the top of its box, one hook. */
export function starterPlan(load: LiftLoadView | undefined, gear: GearView[]): LiftPlanFieldsInput {
  const cog = load?.cogMm ?? [0, 0, 0];
  const top = load?.boundsMm ? load.boundsMm.maxMm[2] : cog[2] + 500;
  const half = load?.boundsMm ? Math.max(100, Math.round(Math.min(load.boundsMm.maxMm[0] - cog[0], cog[0] - load.boundsMm.minMm[0]) / 2)) : 300;
  const hoist = gear.find((g) => g.kind === 'hoist');
  return {
    title: load ? `${load.code} ${load.name}: lift` : '',
    sectionId: load?.sectionId ?? '',
    venueId: null,
    liftDate: today(),
    cogUncertaintyMm: null,
    pickPoints: [
      { id: 'A', positionMm: [cog[0] - half, cog[1], top], hitch: 'vertical', shackleGearIds: [] },
      { id: 'B', positionMm: [cog[0] + half, cog[1], top], hitch: 'vertical', shackleGearIds: [] },
    ],
    suspension: { kind: 'single-hook', hoistGearId: hoist?.id ?? '', hangingPoint: { label: '', ratingKg: null, source: 'typed' } },
    legRating: 'two-carry',
    peopleBelow: false,
    occupiedAreasMm: [],
    exclusionMarginMm: null,
    maxTiltDeg: null,
    method: '',
  };
}

const numberOrNull = (s: string): number | null => (s.trim() === '' ? null : Number(s));

function NumberField({ label, value, onChange, hint, step = 'any' }: { label: ReactNode; value: number | null | undefined; onChange: (v: number | null) => void; hint?: ReactNode; step?: string }) {
  return <TextField label={label} type="number" step={step} inputMode="decimal" value={value ?? ''} onChange={(e) => onChange(numberOrNull(e.target.value))} hint={hint} />;
}

function GearSelect({ label, kind, gear, value, onChange, date, optional = true }: { label: string; kind: GearItem['kind']; gear: GearView[]; value: string | undefined; onChange: (id: string | undefined) => void; date: string; optional?: boolean }) {
  const items = gear.filter((g) => g.kind === kind);
  return (
    <SelectField label={label} value={value ?? ''} onChange={(e) => onChange(e.target.value || undefined)}>
      <option value="">{optional ? '— none —' : '— choose —'}</option>
      {items.map((g) => {
        const usable = gearUsableOn(g, date).usable;
        return (
          <option key={g.id} value={g.id}>
            {g.identifier}
            {g.description ? ` — ${g.description}` : ''}
            {usable ? '' : ' (inspection overdue on the lift date)'}
          </option>
        );
      })}
    </SelectField>
  );
}

function HangingPointFields({ value, onChange, points, venueId }: { value: HangingPoint; onChange: (hp: HangingPoint) => void; points: HangingPointView[]; venueId: string | null | undefined }) {
  const venuePoints = points.filter((p) => p.venueId === venueId);
  return (
    <div className="grid gap-3 sm:grid-cols-3">
      <SelectField label="Hanging point from" value={value.source} onChange={(e) => onChange({ label: '', ratingKg: null, source: e.target.value as 'typed' | 'venue' })}>
        <option value="typed">typed here</option>
        <option value="venue" disabled={venuePoints.length === 0}>
          the venue's list{venuePoints.length === 0 ? ' (choose a venue with points)' : ''}
        </option>
      </SelectField>
      {value.source === 'venue' ? (
        <SelectField label="Venue hanging point" value={value.label} onChange={(e) => onChange({ ...value, label: e.target.value, ratingKg: venuePoints.find((p) => p.label === e.target.value)?.ratingKg ?? null })}>
          <option value="">— choose —</option>
          {venuePoints.map((p) => (
            <option key={p.id} value={p.label}>
              {p.label} ({p.ratingKg === null ? 'rating unknown' : `${p.ratingKg} kg`})
            </option>
          ))}
        </SelectField>
      ) : (
        <>
          <TextField label="Hanging point" value={value.label} onChange={(e) => onChange({ ...value, label: e.target.value })} hint="e.g. beam and its drawing" />
          <NumberField label="Its rating (kg)" value={value.ratingKg} onChange={(v) => onChange({ ...value, ratingKg: v })} hint="Empty: unknown, so no verdict." />
        </>
      )}
    </div>
  );
}

/**
 * The lift plan form with an instant preview: the same core function the server runs, on the same
 * input (evaluatePlanFields), so what the person sees while typing is what the server will save.
 */
export function PlanEditor({ ctx, initial, saving, saveLabel, error, onSave, actions, stale }: PlanEditorProps) {
  const units = useUnits();
  const [draft, setDraft] = useState<LiftPlanFieldsInput>(() => initial ?? starterPlan(ctx.loads.find((l) => l.massKg !== null) ?? ctx.loads[0], ctx.gear));
  const [show3d, setShow3d] = useState(false);
  const parsed = useMemo(() => liftPlanFields.safeParse(draft), [draft]);
  const preview = useMemo(() => {
    if (!parsed.success) return null;
    return evaluatePlanFields(parsed.data, {
      load: ctx.loads.find((l) => l.sectionId === parsed.data.sectionId) ?? null,
      gear: ctx.gear,
      settings: ctx.settings,
      venuePoints: ctx.hangingPoints.filter((p) => p.venueId === parsed.data.venueId).map((p) => ({ label: p.label, ratingKg: p.ratingKg })),
    });
  }, [parsed, ctx]);

  const set = (patch: Partial<LiftPlanFieldsInput>) => setDraft((d) => ({ ...d, ...patch }));
  const setPick = (i: number, patch: Partial<PickPoint>) => setDraft((d) => ({ ...d, pickPoints: d.pickPoints.map((p, k) => (k === i ? { ...p, ...patch } : p)) }));
  const setPos = (i: number, axis: 0 | 1 | 2, v: number | null) =>
    setDraft((d) => ({ ...d, pickPoints: d.pickPoints.map((p, k) => (k === i ? { ...p, positionMm: p.positionMm.map((x, a) => (a === axis ? (v ?? Number.NaN) : x)) as Vec3 } : p)) }));
  const nextId = () => {
    const used = new Set(draft.pickPoints.map((p) => p.id));
    return 'ABCDEFGH'.split('').find((c) => !used.has(c)) ?? `P${draft.pickPoints.length + 1}`;
  };
  const addPick = (positionMm: Vec3) => {
    if (draft.pickPoints.length >= 8) return;
    setDraft((d) => ({ ...d, pickPoints: [...d.pickPoints, { id: nextId(), positionMm, hitch: 'vertical', shackleGearIds: [] }] }));
  };
  const sus = draft.suspension;
  const setSus = (s: Suspension) => set({ suspension: s });
  const changeKind = (kind: Suspension['kind']) => {
    const hoistGearId = sus.kind === 'hoists' ? (sus.legs[0]?.hoistGearId ?? '') : sus.hoistGearId;
    const hangingPoint: HangingPoint = sus.kind === 'hoists' ? (sus.legs[0]?.hangingPoint ?? { label: '', ratingKg: null, source: 'typed' }) : sus.hangingPoint;
    if (kind === 'single-hook') setSus({ kind, hoistGearId, hangingPoint });
    else if (kind === 'spreader-beam') setSus({ kind, hoistGearId, hangingPoint, beamGearId: ctx.gear.find((g) => g.kind === 'spreader-beam')?.id ?? '', topRiggingGearIds: [] });
    else setSus({ kind, legs: draft.pickPoints.map((p) => ({ pickPointId: p.id, hoistGearId, hangingPoint: { ...hangingPoint } })) });
  };

  const issues = parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join('.') || 'plan'}: ${i.message}`);

  function submit(e: FormEvent) {
    e.preventDefault();
    if (parsed.success) onSave(parsed.data);
  }

  const date = draft.liftDate || today();
  const venues = [...new Map(ctx.hangingPoints.map((p) => [p.venueId, p.venueName])).entries()];

  return (
    <form noValidate onSubmit={submit} className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]" aria-label="Lift plan">
      <div className="flex flex-col gap-5">
        <Card title="The lift">
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField label="Title" value={draft.title} onChange={(e) => set({ title: e.target.value })} className="sm:col-span-2" />
            <SelectField label="Section" value={draft.sectionId} onChange={(e) => set({ sectionId: e.target.value })}>
              <option value="">— choose —</option>
              {ctx.loads.map((l) => (
                <option key={l.sectionId} value={l.sectionId}>
                  {l.code} {l.name} ({l.massKg === null ? 'mass unknown' : `${units.formatMass(l.massKg)}${l.weighed ? ', weighed' : ''}`})
                </option>
              ))}
            </SelectField>
            <TextField label="Lift date" type="date" value={draft.liftDate} onChange={(e) => set({ liftDate: e.target.value })} hint="Gear inspection dates are checked against it." />
            <SelectField label="Venue" value={draft.venueId ?? ''} onChange={(e) => set({ venueId: e.target.value || null })}>
              <option value="">— none —</option>
              {venues.map(([id, name]) => (
                <option key={id} value={id}>
                  {name}
                </option>
              ))}
            </SelectField>
            <NumberField
              label="CoG uncertainty ± (mm)"
              value={draft.cogUncertaintyMm}
              onChange={(v) => set({ cogUncertaintyMm: v })}
              hint={`Empty: the section's (${ctx.loads.find((l) => l.sectionId === draft.sectionId)?.cogUncertaintyMm ?? 'none'} mm).`}
            />
          </div>
        </Card>

        <Card title="Suspension">
          <div className="flex flex-col gap-3">
            <SelectField label="How it hangs" value={sus.kind} onChange={(e) => changeKind(e.target.value as Suspension['kind'])}>
              <option value="single-hook">One hook (the CoG settles plumb under it)</option>
              <option value="spreader-beam">Spreader beam under one hook (vertical legs)</option>
              <option value="hoists">One hoist per pick point (vertical legs)</option>
            </SelectField>
            {sus.kind !== 'hoists' ? (
              <>
                <div className="grid gap-3 sm:grid-cols-2">
                  <GearSelect label="Hoist" kind="hoist" gear={ctx.gear} value={sus.hoistGearId || undefined} onChange={(id) => setSus({ ...sus, hoistGearId: id ?? '' })} date={date} optional={false} />
                  <SelectField label="Hoist used as" value={sus.hoistUsedAs ?? ''} onChange={(e) => setSus({ ...sus, hoistUsedAs: (e.target.value || undefined) as 'D8' | 'D8+' | 'C1' | undefined })}>
                    <option value="">its own class</option>
                    <option value="D8">D8</option>
                    <option value="D8+">D8+</option>
                    <option value="C1">C1</option>
                  </SelectField>
                </div>
                {sus.kind === 'spreader-beam' && (
                  <GearSelect label="Spreader beam" kind="spreader-beam" gear={ctx.gear} value={sus.beamGearId || undefined} onChange={(id) => setSus({ ...sus, beamGearId: id ?? '' })} date={date} optional={false} />
                )}
                <HangingPointFields value={sus.hangingPoint} onChange={(hp) => setSus({ ...sus, hangingPoint: hp })} points={ctx.hangingPoints} venueId={draft.venueId} />
              </>
            ) : (
              sus.legs.map((leg, i) => (
                <fieldset key={i} className="rounded-control border border-ink-200 p-3">
                  <legend className="px-1 text-sm font-semibold">Hoist over pick point {leg.pickPointId}</legend>
                  <GearSelect label="Hoist" kind="hoist" gear={ctx.gear} value={leg.hoistGearId || undefined} onChange={(id) => setSus({ ...sus, legs: sus.legs.map((l, k) => (k === i ? { ...l, hoistGearId: id ?? '' } : l)) })} date={date} optional={false} />
                  <HangingPointFields value={leg.hangingPoint} onChange={(hp) => setSus({ ...sus, legs: sus.legs.map((l, k) => (k === i ? { ...l, hangingPoint: hp } : l)) })} points={ctx.hangingPoints} venueId={draft.venueId} />
                </fieldset>
              ))
            )}
          </div>
        </Card>

        <Card
          title="Pick points"
          description="Positions in the section's frame (mm, z up), as it stands before the lift. Type them, or click the section in the 3D view."
          actions={
            <Button size="sm" variant="secondary" onClick={() => addPick(ctx.loads.find((l) => l.sectionId === draft.sectionId)?.cogMm ?? [0, 0, 0])} disabled={draft.pickPoints.length >= 8}>
              Add pick point
            </Button>
          }
        >
          <div className="flex flex-col gap-4">
            {draft.pickPoints.map((p, i) => (
              <fieldset key={i} className="rounded-control border border-ink-200 p-3" aria-label={`Pick point ${p.id}`}>
                <legend className="px-1 text-sm font-semibold">Pick point {p.id}</legend>
                <div className="grid gap-3 sm:grid-cols-4">
                  <TextField label="Id" value={p.id} onChange={(e) => setPick(i, { id: e.target.value })} />
                  <NumberField label={`${p.id} x (mm)`} value={Number.isFinite(p.positionMm[0]) ? p.positionMm[0] : null} onChange={(v) => setPos(i, 0, v)} />
                  <NumberField label={`${p.id} y (mm)`} value={Number.isFinite(p.positionMm[1]) ? p.positionMm[1] : null} onChange={(v) => setPos(i, 1, v)} />
                  <NumberField label={`${p.id} z (mm)`} value={Number.isFinite(p.positionMm[2]) ? p.positionMm[2] : null} onChange={(v) => setPos(i, 2, v)} />
                  <GearSelect label={`${p.id} sling`} kind="sling" gear={ctx.gear} value={p.slingGearId} onChange={(id) => setPick(i, { slingGearId: id })} date={date} />
                  <SelectField label={`${p.id} hitch`} value={p.hitch ?? 'vertical'} onChange={(e) => setPick(i, { hitch: e.target.value as 'vertical' | 'choker' | 'basket' })}>
                    <option value="vertical">vertical</option>
                    <option value="choker">choker</option>
                    <option value="basket">basket</option>
                  </SelectField>
                  <NumberField label={`${p.id} leg length (mm)`} value={p.legLengthMm ?? null} onChange={(v) => setPick(i, { legLengthMm: v ?? undefined })} hint="Empty: from the sling." />
                  <GearSelect label={`${p.id} shackle`} kind="shackle" gear={ctx.gear} value={p.shackleGearIds?.[0]} onChange={(id) => setPick(i, { shackleGearIds: id ? [id] : [] })} date={date} />
                  <GearSelect label={`${p.id} lifting point`} kind="lifting-point" gear={ctx.gear} value={p.liftingPointGearId} onChange={(id) => setPick(i, { liftingPointGearId: id })} date={date} />
                </div>
                <div className="mt-2">
                  <Button size="sm" variant="ghost" onClick={() => setDraft((d) => ({ ...d, pickPoints: d.pickPoints.filter((_, k) => k !== i) }))}>
                    Remove {p.id}
                  </Button>
                </div>
              </fieldset>
            ))}
          </div>
        </Card>

        <Card title="Safety and method">
          <div className="flex flex-col gap-3">
            <CheckboxField
              label="Anyone beneath the load at any time"
              checked={draft.peopleBelow ?? false}
              onChange={(e) => set({ peopleBelow: e.target.checked })}
              hint="Ballast plans lifts with nobody beneath the load and refuses any plan where someone is."
            />
            <div className="grid gap-3 sm:grid-cols-3">
              <NumberField label="Exclusion margin (mm)" value={draft.exclusionMarginMm} onChange={(v) => set({ exclusionMarginMm: v })} hint={`Empty: the production's ${ctx.settings.exclusionMarginMm} mm.`} />
              <NumberField label="Largest tilt allowed (°)" value={draft.maxTiltDeg} onChange={(v) => set({ maxTiltDeg: v })} hint="Empty: not checked." />
              <SelectField label="Legs of 3+ rated as" value={draft.legRating ?? 'two-carry'} onChange={(e) => set({ legRating: e.target.value as 'two-carry' | 'en13414-symmetric' })}>
                <option value="two-carry">two carry (default)</option>
                <option value="en13414-symmetric">EN 13414-1 (symmetric loads only)</option>
              </SelectField>
            </div>
            <label className="flex flex-col gap-1.5">
              <span className="text-sm font-semibold text-ink-800">Method statement</span>
              <textarea className={`${controlClasses} min-h-24 py-2`} value={draft.method ?? ''} onChange={(e) => set({ method: e.target.value })} />
            </label>
          </div>
        </Card>
        {stale && (
          <StaleSaveAlert
            title="Someone else saved this plan while you were editing"
            fields={planFields(stale.theirs, draft, ctx)}
            busy={saving}
            note={stale.note}
            onReload={stale.onReload}
            onKeepMine={() => parsed.success && stale.onKeepMine(parsed.data)}
          />
        )}
        {!stale && error !== undefined && error !== null && (
          <Alert tone="danger" title="Could not save">
            {errorMessage(error)}
          </Alert>
        )}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" loading={saving} disabled={!parsed.success}>
            {saveLabel}
          </Button>
          {actions}
        </div>
      </div>

      <div className="flex flex-col gap-4" aria-label="Preview">
        <p className="text-sm text-ink-600">Preview: worked out in your browser with the same function the server uses. The server's result is saved with the plan.</p>
        {!parsed.success && (
          <Alert tone="caution" title="No verdict: the plan is incomplete">
            <ul className="list-disc pl-5">
              {issues.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          </Alert>
        )}
        {preview && (
          <>
            <div className="flex gap-2">
              <Button size="sm" variant="secondary" onClick={() => setShow3d((v) => !v)}>
                {show3d ? 'Hide 3D view' : 'Show 3D view'}
              </Button>
            </div>
            {show3d && (
              <div className="h-96 overflow-hidden rounded-panel border border-ink-200">
                <Suspense fallback={<Spinner />}>
                  <Plan3d input={preview.input} result={preview.result} formatMass={(kg) => units.formatMass(kg)} onPick={addPick} />
                </Suspense>
              </div>
            )}
            <PlanResultView result={preview.result} input={preview.input} title="Preview" />
          </>
        )}
      </div>
    </form>
  );
}
