import { Fragment, useState } from 'react';
import { Link } from 'react-router-dom';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HandlingTaskInput, LiftingSettingsView } from '@domain/contracts/lifting-api.ts';
import { handlingCautions, type NioshResult } from '@domain/lifting/index.ts';
import { Alert, Button, buttonClasses, Card, ChoiceGroup, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { api, ApiError, errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useHandling, useSaveHandlingTask, type HandlingItem } from '../api/handling.ts';
import { liftingBase, liftingKeys } from '../api/keys.ts';
import { HandlingBadge } from './badges.tsx';
import { CautionsPanel } from './cautions-panel.tsx';
import { num } from './format.ts';

const KIND: Record<string, string> = { section: 'Section', 'loose-part': 'Loose part', crate: 'Crate' };

/** `/p/:productionId/lifting/handling`: a verdict for every item people may have to lift. */
export function HandlingPage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const handling = useHandling(pid);
  const units = useUnits();
  const [open, setOpen] = useState<string | null>(null);
  const mayEdit = useMay('liftplan.edit');

  if (handling.isPending) return <PageLoading />;
  if (handling.isError) return <ErrorState title="The handling verdicts could not be loaded" error={handling.error} onRetry={() => handling.refetch()} />;
  const { settings, items } = handling.data;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Lifting"
        title="Manual handling"
        description={`Every section, loose part and crate over ${settings.handlingThresholdKg} kg: lifted by one person, a team, or not by hand at all.`}
        actions={
          <Link to=".." relative="path" className={buttonClasses({ variant: 'secondary' })}>
            Lift plans
          </Link>
        }
      />
      <CautionsPanel cautions={handlingCautions()} />
      <SettingsCard productionId={pid} settings={settings} />
      <Card>
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="text-ink-600">
              <tr>
                <th className="py-2 pr-3">Item</th>
                <th className="py-2 pr-3">Mass</th>
                <th className="py-2 pr-3">Verdict</th>
                <th className="py-2 pr-3">Capability</th>
                <th className="py-2">Working</th>
              </tr>
            </thead>
            <tbody>
              {items.map((it) => {
                const v = it.assessment.verdict;
                const key = `${it.kind}:${it.id}`;
                return (
                  <Fragment key={key}>
                    <tr className="border-t border-ink-100 align-top">
                      <td className="py-2 pr-3">
                        <span className="font-semibold">{it.code}</span> {it.label}
                        <span className="block text-ink-600">{KIND[it.kind]}</span>
                      </td>
                      <td className="py-2 pr-3">
                        {it.massKg === null ? '—' : units.formatMass(it.massKg)}
                        <span className="block text-ink-600">{it.massNote}</span>
                      </td>
                      <td className="py-2 pr-3">
                        <HandlingBadge verdict={v.verdict} teamSize={v.teamSize} />
                        {it.assessment.estimated.length > 0 && <span className="block text-caution-800">from estimated inputs</span>}
                      </td>
                      <td className="py-2 pr-3">{Number.isFinite(v.capacityKg ?? Number.NaN) && v.capacityKg !== null ? units.formatMass(v.capacityKg) : '—'}</td>
                      <td className="py-2">
                        <Button size="sm" variant="ghost" aria-expanded={open === key} onClick={() => setOpen(open === key ? null : key)}>
                          {open === key ? 'Hide' : 'Show'} working
                        </Button>
                      </td>
                    </tr>
                    {open === key && (
                      <tr>
                        <td colSpan={5} className="bg-ink-50 px-3 py-3">
                          <Working item={it} productionId={pid} mayEdit={mayEdit} method={settings.handlingMethod} />
                        </td>
                      </tr>
                    )}
                  </Fragment>
                );
              })}
            </tbody>
          </table>
        </div>
      </Card>
    </div>
  );
}

function Multipliers({ label, r }: { label: string; r: NioshResult }) {
  return (
    <tr className="border-t border-ink-200">
      <th className="py-1 pr-3 text-left font-semibold">{label}</th>
      {[r.lcKg ?? 23, r.hm, r.vm, r.dm, r.am, r.fm, r.cm].map((x, i) => (
        <td key={i} className="py-1 pr-3">
          {num(x, i === 0 ? 0 : 3)}
        </td>
      ))}
      <td className="py-1 font-semibold">{r.applies ? `${num(r.rwlKg, 1)} kg` : 'does not apply'}</td>
    </tr>
  );
}

function Working({ item, productionId, mayEdit, method }: { item: HandlingItem; productionId: string; mayEdit: boolean; method: string }) {
  const a = item.assessment;
  const est = new Set(a.estimated);
  return (
    <div className="flex flex-col gap-3">
      <p>
        <strong>Method:</strong> {a.verdict.method}
      </p>
      <ul className="list-disc pl-5">
        {a.verdict.reasons.map((r, i) => (
          <li key={i}>{r}</li>
        ))}
      </ul>
      {a.nioshResult && (
        <div className="overflow-x-auto">
          <table className="text-sm">
            <caption className="text-left font-semibold">NIOSH multipliers {method !== 'niosh' && '(for reference; the production uses the guideline filter)'}</caption>
            <thead>
              <tr className="text-ink-600">
                <th />
                {['LC', 'HM', 'VM', 'DM', 'AM', 'FM', 'CM', 'RWL'].map((h) => (
                  <th key={h} className="py-1 pr-3 text-left">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              <Multipliers label="Origin" r={a.nioshResult.origin} />
              {a.nioshResult.destination && <Multipliers label="Destination" r={a.nioshResult.destination} />}
            </tbody>
          </table>
          <p className="text-sm">
            Lifting index: {Number.isFinite(a.nioshResult.liftingIndex) ? a.nioshResult.liftingIndex.toFixed(2) : '—'} (governing: {a.nioshResult.governingEnd})
          </p>
        </div>
      )}
      {a.niosh && (
        <p className="text-sm">
          Task: origin H {num(a.niosh.origin.hCm, 1)} cm{est.has('niosh.origin.hCm') ? ' (estimate)' : ''}, V {a.niosh.origin.vCm} cm{est.has('niosh.origin.vCm') ? ' (estimate)' : ''}; destination H {num(a.niosh.destination.hCm, 1)} cm
          {est.has('niosh.destination.hCm') ? ' (estimate)' : ''}, V {a.niosh.destination.vCm} cm{est.has('niosh.destination.vCm') ? ' (estimate)' : ''}; {a.niosh.liftsPerMin} lifts/min{est.has('niosh.liftsPerMin') ? ' (estimate)' : ''} for{' '}
          {a.niosh.durationHours} h; coupling {a.niosh.coupling}
          {est.has('niosh.coupling') ? ' (estimate)' : ''}.
        </p>
      )}
      {a.guidelineResult && (
        <p className="text-sm">
          Guideline filter: zones {a.guideline.zones.join(', ')}, {a.guideline.reach} reach, {a.guideline.column}'s column → {num(a.guidelineResult.guidelineKg, 1)} kg for one person.
        </p>
      )}
      {a.notes.length > 0 && (
        <Alert tone="caution" title="Estimates, not measurements">
          <ul className="list-disc pl-5">
            {a.notes.map((x, i) => (
              <li key={i}>{x}</li>
            ))}
          </ul>
        </Alert>
      )}
      <CautionsPanel cautions={a.verdict.cautions} title="Cautions for this verdict" />
      {mayEdit && <TaskForm item={item} productionId={productionId} />}
    </div>
  );
}

const numOrUndef = (s: string) => (s.trim() === '' ? undefined : Number(s));

function TaskForm({ item, productionId }: { item: HandlingItem; productionId: string }) {
  const t = item.task ?? {};
  const [v, setV] = useState({
    oh: t.niosh?.origin?.hCm?.toString() ?? '',
    ov: t.niosh?.origin?.vCm?.toString() ?? '',
    dh: t.niosh?.destination?.hCm?.toString() ?? '',
    dv: t.niosh?.destination?.vCm?.toString() ?? '',
    a: t.niosh?.origin?.asymmetryDeg?.toString() ?? '',
    f: t.niosh?.liftsPerMin?.toString() ?? '',
    d: t.niosh?.durationHours?.toString() ?? '',
    c: t.niosh?.coupling ?? '',
    reach: t.guideline?.reach ?? '',
  });
  const save = useSaveHandlingTask(productionId);
  const stale = save.error instanceof ApiError && save.error.status === 409;
  const text = (k: keyof typeof v, label: string) => <TextField label={label} type="number" value={v[k]} onChange={(e) => setV((x) => ({ ...x, [k]: e.target.value }))} hint="Empty: estimated" />;
  function submit() {
    const task: HandlingTaskInput = {
      niosh: {
        origin: { hCm: numOrUndef(v.oh), vCm: numOrUndef(v.ov), asymmetryDeg: numOrUndef(v.a) },
        destination: { hCm: numOrUndef(v.dh), vCm: numOrUndef(v.dv), asymmetryDeg: numOrUndef(v.a) },
        liftsPerMin: numOrUndef(v.f),
        durationHours: numOrUndef(v.d),
        coupling: (v.c || undefined) as 'good' | 'fair' | 'poor' | undefined,
      },
      guideline: { reach: (v.reach || undefined) as 'close' | 'extended' | undefined },
    };
    save.mutate({ itemId: item.id, itemKind: item.kind, version: item.version, task });
  }
  return (
    <form
      className="flex flex-col gap-3 rounded-control border border-ink-200 bg-white p-3"
      aria-label={`Task of ${item.code}`}
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <p className="font-semibold">Task as the crew measured it</p>
      {stale && <Alert tone="caution" title="Someone else saved this task in the meantime">The list has been reloaded with their version; enter your figures again to keep yours.</Alert>}
      {save.error && !stale ? <Alert tone="danger">{errorMessage(save.error)}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-4">
        {text('oh', 'Origin H (cm)')}
        {text('ov', 'Origin V (cm)')}
        {text('dh', 'Destination H (cm)')}
        {text('dv', 'Destination V (cm)')}
        {text('a', 'Asymmetry (°)')}
        {text('f', 'Lifts per minute')}
        {text('d', 'Duration (h)')}
        <SelectField label="Coupling" value={v.c} onChange={(e) => setV((x) => ({ ...x, c: e.target.value }))}>
          <option value="">estimate</option>
          <option value="good">good</option>
          <option value="fair">fair</option>
          <option value="poor">poor</option>
        </SelectField>
        <SelectField label="Reach (guideline)" value={v.reach} onChange={(e) => setV((x) => ({ ...x, reach: e.target.value }))}>
          <option value="">estimate</option>
          <option value="close">close to the body</option>
          <option value="extended">arm's length</option>
        </SelectField>
      </div>
      <div>
        <Button type="submit" loading={save.isPending}>
          Save task
        </Button>
      </div>
    </form>
  );
}

function SettingsCard({ productionId, settings }: { productionId: string; settings: LiftingSettingsView }) {
  const mayEdit = useMay('production.settings.edit');
  const qc = useQueryClient();
  const [df, setDf] = useState({ value: String(settings.dynamicFactor), source: settings.dynamicFactorSource });
  const update = useMutation({
    mutationFn: (body: Partial<LiftingSettingsView>) => api.patch(`${liftingBase(productionId)}/settings`, { ...body, version: settings.version }),
    onSettled: () => qc.invalidateQueries({ queryKey: liftingKeys.all(productionId) }),
  });
  return (
    <Card title="Method" description={mayEdit ? 'A production setting: it applies to every item and every member.' : 'Set by the production’s planners.'}>
      <div className="flex flex-col gap-3">
        {update.error ? <Alert tone="danger">{errorMessage(update.error)}</Alert> : null}
        <div className="flex flex-wrap gap-6">
          <ChoiceGroup
            legend="Handling method"
            name="handlingMethod"
            value={settings.handlingMethod}
            disabled={!mayEdit || update.isPending}
            choices={[
              { value: 'niosh', label: 'NIOSH equation' },
              { value: 'uk-guideline', label: 'UK guideline filter' },
            ]}
            onChange={(m) => update.mutate({ handlingMethod: m })}
          />
          <ChoiceGroup
            legend="Guideline column"
            name="guidelineColumn"
            value={settings.guidelineColumn}
            disabled={!mayEdit || update.isPending}
            choices={[
              { value: 'women', label: "Women's" },
              { value: 'men', label: "Men's" },
            ]}
            onChange={(c) => update.mutate({ guidelineColumn: c })}
          />
        </div>
        {mayEdit ? (
          <div className="grid gap-3 sm:grid-cols-[10rem_1fr_auto] sm:items-end">
            <TextField label="Dynamic factor (lift plans)" type="number" step="0.01" value={df.value} onChange={(e) => setDf((d) => ({ ...d, value: e.target.value }))} />
            <TextField label="Its source" value={df.source} onChange={(e) => setDf((d) => ({ ...d, source: e.target.value }))} />
            <Button variant="secondary" onClick={() => update.mutate({ dynamicFactor: Number(df.value), dynamicFactorSource: df.source })}>
              Save factor
            </Button>
          </div>
        ) : (
          <p className="text-sm">
            Dynamic factor {settings.dynamicFactor} ({settings.dynamicFactorSource})
          </p>
        )}
      </div>
    </Card>
  );
}
