import { Component as ReactComponent, lazy, Suspense, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { PackingRunView, PlacementView, RunItemView, VehicleFiguresView } from '@domain/contracts/crate-loads.ts';
import { combineMasses } from '@domain/mass/index.ts';
import { validatePacking } from '@domain/packing/index.ts';
import { Alert, Badge, Button, Card, EmptyState, ErrorState, PageHeader, PageLoading, SelectField, Spinner, StaleSaveAlert } from '../../../components/ui/index.ts';
import { errorMessage, staleCurrent } from '../../../lib/api.ts';
import { useQueryClient } from '@tanstack/react-query';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { useUnits, type Units } from '../../../lib/use-units.ts';
import { loadKeys, useRun, useSavePlacements } from '../api/loads-api.ts';
import type { SceneCrate } from './load-view-3d.tsx';

const LoadView3d = lazy(() => import('./load-view-3d.tsx'));

type Vec3 = [number, number, number];
type ColourBy = 'crate' | 'destination' | 'weight';
const pct = (x: number) => `${(100 * x).toFixed(1)} %`;

/** `/p/:productionId/loads/:runId`: a packing run: progress while it packs, then its figures and the 3D load. */
export function RunPage({ runId }: { runId: string }) {
  const { productionId } = useCurrentProduction();
  const run = useRun(productionId ?? '', runId);
  if (run.isPending) return <PageLoading label="Loading the packing run…" />;
  if (run.isError) return <ErrorState title="The packing run could not be loaded" error={run.error} onRetry={() => run.refetch()} retrying={run.isFetching} />;
  const r = run.data;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader eyebrow={<Link to="..">Vehicles and packing runs</Link>} title={r.name} description={r.legId ? 'Packing run for a leg of the tour.' : 'Ad hoc packing run.'} />
      {(r.status === 'queued' || r.status === 'running') && (
        <Card title={r.status === 'queued' ? 'Waiting for a worker…' : 'Packing…'}>
          <div className="flex items-center gap-3" role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(r.progress * 100)} aria-label="Packing progress">
            <Spinner decorative />
            <div className="h-3 flex-1 overflow-hidden rounded bg-ink-100">
              <div className="h-full bg-tide-600 transition-all" style={{ width: `${Math.round(r.progress * 100)}%` }} />
            </div>
            <span className="text-sm">{Math.round(r.progress * 100)} %</span>
          </div>
          {r.bestUtilisation !== null && <p className="mt-2 text-sm text-ink-600">Best volume use so far: {pct(r.bestUtilisation)}</p>}
          {r.error && <p className="mt-2 text-sm text-caution-800">{r.error}</p>}
        </Card>
      )}
      {r.status === 'failed' && <Alert tone="danger" title="The run failed">{r.error}</Alert>}
      {r.status === 'done' && r.result && r.figures && r.input && <RunResult key={r.id} productionId={productionId!} run={r as Required<PackingRunView>} />}
    </div>
  );
}

function VehicleFigures({ f, u, name }: { f: VehicleFiguresView; u: Units; name: string }) {
  const plan = f.loadPlan as unknown as {
    ok: boolean;
    reasons: string[];
    cogAlong?: { offsetMm: number; limitMm: number; ok: boolean };
    cogAcross?: { offsetMm: number; limitMm: number; ok: boolean };
    axles?: { groups: { name: string; totalKg: number; permittedKg: number; ok: boolean; reason: string }[] };
  };
  return (
    <Card title={name} actions={<Badge tone={f.validation.ok && plan.ok ? 'ok' : 'danger'}>{f.validation.ok && plan.ok ? 'all checks pass' : 'check failed'}</Badge>}>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4" data-testid="vehicle-figures">
        <div>
          <dt className="text-ink-600">Crates</dt>
          <dd className="font-semibold">{f.itemCount}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Volume use</dt>
          <dd className="font-semibold">{pct(f.volumeUtilisation)}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Floor use</dt>
          <dd className="font-semibold">{pct(f.floorUtilisation)}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Payload</dt>
          <dd className="font-semibold">
            {u.formatMass(f.loadKg, 0)} of {u.formatMass(f.maxPayloadKg, 0)}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Load CoG along (from the middle)</dt>
          <dd>
            {f.cogAlongOffsetMm === null ? '—' : u.formatLength(f.cogAlongOffsetMm)}
            {plan.cogAlong && ` (limit ±${u.formatLength(plan.cogAlong.limitMm)})`}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Load CoG across (from the middle)</dt>
          <dd>
            {f.cogAcrossOffsetMm === null ? '—' : u.formatLength(f.cogAcrossOffsetMm)}
            {plan.cogAcross && ` (limit ±${u.formatLength(plan.cogAcross.limitMm)})`}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Loading metres</dt>
          <dd>{f.loadingMetres.toFixed(2)} m</dd>
        </div>
      </dl>
      {plan.axles && (
        <table className="mt-3 w-full text-left text-sm">
          <caption className="text-left font-semibold">Axle groups (by statics)</caption>
          <tbody>
            {plan.axles.groups.map((g) => (
              <tr key={g.name}>
                <td className="pr-3">{g.name}</td>
                <td className="pr-3">
                  {u.formatMass(g.totalKg, 0)} of {u.formatMass(g.permittedKg, 0)}
                </td>
                <td>
                  <Badge tone={g.ok ? 'ok' : 'danger'}>{g.ok ? 'within' : 'over'}</Badge>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {f.steering && f.steering.advice.length > 0 && (
        <Alert tone="caution" className="mt-3" title={f.steering.alongMm !== 0 || f.steering.acrossMm !== 0 ? 'Load moved for the axles and CoG' : 'Weight distribution'}>
          <ul className="list-disc pl-5">
            {f.steering.advice.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </Alert>
      )}
      {(plan.reasons.length > 0 || !f.validation.ok) && (
        <Alert tone="danger" className="mt-3" title="What fails">
          <ul className="list-disc pl-5">
            {[...plan.reasons, ...f.validation.messages].map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </Alert>
      )}
    </Card>
  );
}

const STOP_COLOURS = ['#22877e', '#d0463a', '#f3c164', '#389857', '#7b5ea7', '#3b7dd8', '#c9762b', '#6cc1b7'];
function hue(id: string): string {
  let h = 0;
  for (const ch of id) h = (h * 31 + ch.charCodeAt(0)) >>> 0;
  return `hsl(${h % 360}, 55%, 58%)`;
}

class ViewBoundary extends ReactComponent<{ children: ReactNode }, { error: Error | null }> {
  override state = { error: null as Error | null };
  static getDerivedStateFromError(error: Error) {
    return { error };
  }
  override render() {
    if (this.state.error) return <EmptyState title="The 3D view cannot be shown here">{this.state.error.message || 'This browser offers no WebGL.'} The figures above stand.</EmptyState>;
    return this.props.children;
  }
}

function RunResult({ productionId, run }: { productionId: string; run: Required<PackingRunView> }) {
  const u = useUnits();
  const mayEdit = useMay('crate.edit');
  const result = run.result!;
  const figures = run.figures!;
  const input = run.input!;
  const items = useMemo(() => new Map<string, RunItemView>(input.items.map((i) => [i.id, i])), [input.items]);
  const usedVehicles = input.vehicles.filter((v) => result.placements.some((p) => p.vehicleId === v.id));
  const [vehicleId, setVehicleId] = useState(usedVehicles[0]?.id ?? input.vehicles[0]?.id ?? '');
  const [colourBy, setColourBy] = useState<ColourBy>('crate');
  const [draft, setDraftState] = useState<PlacementView[] | null>(null);
  // The run's version when the hand edits began: the save carries it, so someone else's edit in between is not
  // overwritten silently (a refetch may bring a newer run while the edits are still on screen).
  const [draftVersion, setDraftVersion] = useState<number | null>(null);
  const setDraft = (d: PlacementView[] | null) => {
    setDraftState(d);
    setDraftVersion(d === null ? null : (v) => v ?? run.version);
  };
  const [selected, setSelected] = useState<string | null>(null);
  const save = useSavePlacements(productionId, run.id);
  const qc = useQueryClient();
  const theirs = staleCurrent<PackingRunView>(save.error);
  const vehicle = input.vehicles.find((v) => v.id === vehicleId);
  const original = result.placements.filter((p) => p.vehicleId === vehicleId);
  const mine = draft ?? original;
  const [step, setStep] = useState(mine.length);
  const vf = figures.vehicles.find((f) => f.vehicleId === vehicleId);
  // Each crate's CoG relative to its corner, from the server's figures; moving a crate carries it along.
  const cogOffset = useMemo(() => {
    const m = new Map<string, Vec3>();
    for (const p of original) {
      const c = vf?.crateCogs.find((x) => x.id === p.id)?.cogMm;
      if (c) m.set(p.id, [c[0] - p.xMm, c[1] - p.yMm, c[2] - p.zMm]);
    }
    return m;
  }, [original, vf]);
  const masses = input.items.map((i) => i.massKg);
  const maxMass = Math.max(1, ...masses);
  const shown: SceneCrate[] = mine.slice(0, step).map((p) => {
    const it = items.get(p.id);
    const off = cogOffset.get(p.id) ?? [p.lengthMm / 2, p.widthMm / 2, p.heightMm / 2];
    const color =
      colourBy === 'crate' ? hue(p.id) : colourBy === 'destination' ? (it?.stopIndex === undefined ? '#8a94a6' : STOP_COLOURS[it.stopIndex % STOP_COLOURS.length]) : `hsl(${Math.round(200 - 200 * ((it?.massKg ?? 0) / maxMass))}, 70%, 50%)`;
    return { ...p, code: it?.code ?? p.id, color, cogMm: [p.xMm + off[0], p.yMm + off[1], p.zMm + off[2]] };
  });
  const loadCog = shown.length > 0 ? (combineMasses(shown.map((c) => ({ massKg: items.get(c.id)?.massKg ?? 0, cogMm: c.cogMm }))).cogMm as Vec3) : null;
  // The rules, re-checked in the browser on every move by the same validator the server runs on save.
  const check = useMemo(() => (draft && vehicle ? validatePacking(vehicle, input.items, draft, { fullSupport: input.options.fullSupport }) : null), [draft, vehicle, input]);
  const sel = mine.find((p) => p.id === selected);

  function move(axis: 'xMm' | 'yMm' | 'zMm', deltaMm: number) {
    if (!sel || sel.pinned) return;
    setDraft(mine.map((p) => (p.id === sel.id ? { ...p, [axis]: Math.max(0, p[axis] + deltaMm) } : p)));
  }
  function pin() {
    if (!sel) return;
    setDraft(mine.map((p) => (p.id === sel.id ? { ...p, pinned: !p.pinned } : p)));
  }

  return (
    <>
      <section aria-label="Run figures" className="flex flex-col gap-4">
        <Card title="Shipment">
          <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4" data-testid="run-figures">
            <div>
              <dt className="text-ink-600">Placed</dt>
              <dd className="font-semibold">
                {figures.placedCount} crates in {figures.vehiclesUsed} vehicle(s)
              </dd>
            </div>
            <div>
              <dt className="text-ink-600">Total</dt>
              <dd className="font-semibold">{u.formatMass(figures.totalKg, 0)}</dd>
            </div>
            <div>
              <dt className="text-ink-600">Air, chargeable ({figures.chargeable.air.divisorCm3PerKg} cm³/kg)</dt>
              <dd>{u.formatMass(figures.chargeable.air.chargeableKg, 0)}</dd>
            </div>
            <div>
              <dt className="text-ink-600">Road, loading metres</dt>
              <dd>
                {figures.chargeable.road.loadingMetres.toFixed(2)} m ({u.formatMass(figures.chargeable.road.chargeableKg, 0)} at {figures.chargeable.road.kgPerLoadingMetre} kg/m)
              </dd>
            </div>
            <div>
              <dt className="text-ink-600">Sea, revenue tonnes</dt>
              <dd>{figures.chargeable.sea.revenueTonnes.toFixed(2)}</dd>
            </div>
          </dl>
          {result.editedByHand && <p className="mt-2 text-sm text-ink-600">Edited by hand after packing; re-checked on save.</p>}
        </Card>
        {result.unplaced.length > 0 && (
          <Alert tone="danger" title={`${figures.unplacedCount} crate(s) did not fit`}>
            <ul className="list-disc pl-5">
              {result.unplaced.map((x) => (
                <li key={x.id}>{x.reason}</li>
              ))}
            </ul>
          </Alert>
        )}
        {figures.vehicles.map((f) => (
          <VehicleFigures key={f.vehicleId} f={f} u={u} name={input.vehicles.find((v) => v.id === f.vehicleId)?.name ?? f.vehicleId} />
        ))}
      </section>
      <Card title="Load in 3D" description="Step through the load order; click a crate to pick it.">
        <div className="mb-3 flex flex-wrap items-end gap-3">
          <SelectField label="Vehicle" name="vehicle" value={vehicleId} onChange={(e) => { setVehicleId(e.target.value); setDraft(null); setSelected(null); setStep(result.placements.filter((p) => p.vehicleId === e.target.value).length); }}>
            {input.vehicles.map((v) => (
              <option key={v.id} value={v.id}>
                {v.code} {v.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Colour by" name="colourBy" value={colourBy} onChange={(e) => setColourBy(e.target.value as ColourBy)}>
            <option value="crate">crate</option>
            <option value="destination">destination (stop)</option>
            <option value="weight">weight</option>
          </SelectField>
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Load order: {Math.min(step, mine.length)} of {mine.length}
            <input type="range" min={0} max={mine.length} value={Math.min(step, mine.length)} onChange={(e) => setStep(Number(e.target.value))} aria-label="Crates loaded" />
          </label>
        </div>
        {vehicle && (
          <div className="h-[28rem] w-full overflow-hidden rounded-control border border-ink-200" role="img" aria-label={`3D view of ${vehicle.name}: ${shown.length} crates, the load's CoG in red`}>
            <ViewBoundary>
              <Suspense fallback={<PageLoading label="Loading the 3D view…" />}>
                <LoadView3d spaceMm={[vehicle.lengthMm, vehicle.widthMm, vehicle.heightMm]} crates={shown} loadCogMm={loadCog} selectedId={selected} onSelect={setSelected} />
              </Suspense>
            </ViewBoundary>
          </div>
        )}
        <p className="mt-2 text-sm text-ink-600">
          x runs from the front wall to the doors. Small dark balls: each crate's CoG; red ball: the load's CoG{loadCog ? ` at ${loadCog.map((v) => u.formatLength(v)).join(', ')}` : ''}.
        </p>
        {sel && (
          <div className="mt-3 flex flex-wrap items-center gap-2 text-sm" aria-label="Selected crate">
            <span className="font-semibold">
              Crate {items.get(sel.id)?.code}: at {u.formatLength(sel.xMm)}, {u.formatLength(sel.yMm)}, {u.formatLength(sel.zMm)}
              {sel.pinned ? ' (pinned)' : ''}
            </span>
            {mayEdit && (
              <>
                {(['xMm', 'yMm'] as const).flatMap((a) =>
                  [-100, 100].map((d) => (
                    <Button key={`${a}${d}`} size="sm" variant="secondary" disabled={sel.pinned} onClick={() => move(a, d)}>
                      {a[0]} {d > 0 ? '+' : '−'}100 mm
                    </Button>
                  )),
                )}
                <Button size="sm" variant="secondary" onClick={pin}>
                  {sel.pinned ? 'Unpin' : 'Pin here'}
                </Button>
              </>
            )}
          </div>
        )}
        {check && (
          <Alert tone={check.ok ? 'ok' : 'danger'} className="mt-3" title={check.ok ? 'The edited load keeps every rule' : 'The edited load breaks a rule'}>
            {!check.ok && (
              <ul className="list-disc pl-5">
                {check.messages.map((m) => (
                  <li key={m}>{m}</li>
                ))}
              </ul>
            )}
          </Alert>
        )}
        {draft && mayEdit && (
          <div className="mt-3 flex gap-2">
            <Button
              loading={save.isPending}
              disabled={!check?.ok}
              onClick={() => save.mutate({ version: draftVersion ?? run.version, vehicleId, placements: draft.map(({ vehicleId: _v, ...p }) => p) }, { onSuccess: () => setDraft(null) })}
            >
              Save the edited load
            </Button>
            <Button variant="ghost" onClick={() => setDraft(null)}>
              Discard edits
            </Button>
          </div>
        )}
        {theirs && draft && (
          <div className="mt-3">
            <StaleSaveAlert
              title="Someone else changed this load while you were moving crates"
              busy={save.isPending}
              fields={[
                { label: 'Crates in this vehicle', theirs: (theirs.result?.placements ?? []).filter((p) => p.vehicleId === vehicleId).length, mine: draft.length },
                {
                  label: 'Crates placed elsewhere than in your edit',
                  theirs: draft.filter((d) => !(theirs.result?.placements ?? []).some((p) => p.id === d.id && p.vehicleId === vehicleId && p.xMm === d.xMm && p.yMm === d.yMm && p.zMm === d.zMm)).length,
                  mine: 0,
                },
              ]}
              note="Keep mine replaces this vehicle's load with yours, re-checked by the rules."
              onReload={() => {
                qc.setQueryData(loadKeys.run(productionId, run.id), theirs);
                setDraft(null);
                save.reset();
              }}
              onKeepMine={() => save.mutate({ version: theirs.version, vehicleId, placements: draft.map(({ vehicleId: _v, ...p }) => p) }, { onSuccess: () => setDraft(null) })}
            />
          </div>
        )}
        {save.isError && !theirs && <Alert tone="danger" className="mt-3">{errorMessage(save.error)}</Alert>}
      </Card>
    </>
  );
}
