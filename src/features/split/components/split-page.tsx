import { useMemo, useState } from 'react';
import type { ProposalSectionView, SectionUnitBody, SplitInputView, SplitLimitsQuery, SplitLimitsView, SplitRunView } from '@domain/contracts/split.ts';
import { checkSplit } from '@domain/split/index.ts';
import { Alert, Badge, Button, Card, EmptyState, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { errorMessage, isApiError } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { useUnits, type Units } from '../../../lib/use-units.ts';
import { useAdoptSplit, useSplitInput, useSplitLimits, useSplitRun, useStartSplitRun } from '../api/split-api.ts';

type Labels = Map<string, string>;

/** `/p/:productionId/split`: limits with their sources, the advisor's proposals side by side, adopt or edit by hand. */
export function SplitPage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const mayEdit = useMay('machine.edit');
  const [q, setQ] = useState<Partial<SplitLimitsQuery>>({ liftMode: 'hoist', sizeFrom: 'tour' });
  const input = useSplitInput(pid);
  const limits = useSplitLimits(pid, q);
  const start = useStartSplitRun(pid);
  const [runId, setRunId] = useState<string | null>(null);
  const run = useSplitRun(pid, runId);
  const [editing, setEditing] = useState<SectionUnitBody[][] | null>(null);

  const labels: Labels = useMemo(() => new Map((input.data?.assemblies ?? []).map((a) => [a.id, `${a.number}${a.name ? ` ${a.name}` : ''}`])), [input.data]);

  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Split advisor" description="How the machine splits into sections that the largest hoist can lift and the tightest door on the tour lets through." />
      {input.isPending ? (
        <PageLoading label="Loading the breakdown…" />
      ) : input.isError ? (
        <ErrorState title="The breakdown could not be loaded" error={input.error} onRetry={() => input.refetch()} />
      ) : input.data.parts.length === 0 ? (
        <EmptyState title="No parts yet">Add or import the machine's parts list first: the advisor splits along its assemblies.</EmptyState>
      ) : (
        <>
          <LimitsPanel q={q} onChange={setQ} limits={limits.data} loading={limits.isPending} error={limits.isError ? limits.error : null} input={input.data} />
          {mayEdit && (
            <Card title="Run the advisor">
              <div className="flex flex-wrap items-center gap-3">
                <Button
                  loading={start.isPending}
                  disabled={!limits.data?.limits}
                  onClick={() => start.mutate({ ...q, timeLimitMs: 3000 }, { onSuccess: (r) => { setRunId(r.id); setEditing(null); } })}
                >
                  Propose splits
                </Button>
                {run.data && (run.data.status === 'queued' || run.data.status === 'running') && (
                  <span role="status" className="text-sm text-ink-700">
                    Searching… {Math.round(run.data.progress * 100)} %
                    <progress className="ml-2 align-middle" max={1} value={run.data.progress} aria-label="Advisor progress" />
                  </span>
                )}
                {!limits.data?.limits && limits.data && <span className="text-sm text-danger-800">No mass limit: see the limits above.</span>}
              </div>
              {start.isError && <Alert tone="danger" title="The advisor could not start" className="mt-3">{errorMessage(start.error)}</Alert>}
            </Card>
          )}
          {run.isError && <ErrorState title="The advisor run could not be loaded" error={run.error} onRetry={() => run.refetch()} />}
          {run.data?.status === 'failed' && <Alert tone="danger" title="The advisor run failed">{run.data.error}</Alert>}
          {run.data?.status === 'done' && run.data.result && (
            <Proposals run={run.data} labels={labels} mayEdit={mayEdit} onEdit={(sections) => setEditing(sections)} productionId={pid} />
          )}
          {editing && run.data?.limits?.limits && (
            <ManualEdit key={JSON.stringify(editing)} productionId={pid} input={input.data} limits={run.data.limits} run={run.data} start={editing} labels={labels} onDone={() => setEditing(null)} />
          )}
        </>
      )}
    </div>
  );
}

function LimitsPanel({ q, onChange, limits, loading, error, input }: { q: Partial<SplitLimitsQuery>; onChange: (q: Partial<SplitLimitsQuery>) => void; limits?: SplitLimitsView; loading: boolean; error: unknown; input: SplitInputView }) {
  const u = useUnits();
  const size = limits?.size;
  return (
    <Card title="Limits and where they come from" description="Each limit is worked out from the gear, the lift plans, the venues and the crate design; change the inputs here.">
      <div className="grid gap-3 sm:grid-cols-4">
        <SelectField label="Lifted by" name="liftMode" value={q.liftMode ?? 'hoist'} onChange={(e) => onChange({ ...q, liftMode: e.target.value as 'hoist' | 'hand' })}>
          <option value="hoist">the largest usable hoist</option>
          <option value="hand">hand (a team, small sections)</option>
        </SelectField>
        <SelectField label="Crate size from" name="sizeFrom" value={q.sizeFrom ?? 'tour'} onChange={(e) => onChange({ ...q, sizeFrom: e.target.value as 'tour' | 'vehicles' | 'none' })}>
          <option value="tour">every venue of the tour and the vehicles</option>
          <option value="vehicles">the largest vehicle only</option>
          <option value="none">not limited</option>
        </SelectField>
        <TextField
          label="Sections at most"
          name="maxSections"
          inputMode="numeric"
          hint="Empty: as few as possible"
          value={q.maxSections ?? ''}
          onChange={(e) => onChange({ ...q, maxSections: e.target.value && Number(e.target.value) > 0 ? Math.floor(Number(e.target.value)) : undefined })}
        />
        {q.liftMode !== 'hand' && (
          <TextField
            label="Rigging below the hook, kg"
            name="riggingKg"
            inputMode="decimal"
            hint="Empty: from the lift plans"
            value={q.riggingKg ?? ''}
            onChange={(e) => onChange({ ...q, riggingKg: e.target.value === '' || !Number.isFinite(Number(e.target.value)) ? undefined : Number(e.target.value) })}
          />
        )}
      </div>
      {input.gaps.length > 0 && (
        <Alert tone="caution" title={`${input.gaps.length} gap(s) in the breakdown`} className="mt-3">
          <ul className="list-disc pl-5">{input.gaps.slice(0, 5).map((g) => <li key={g}>{g}</li>)}</ul>
        </Alert>
      )}
      {loading && <PageLoading label="Working out the limits…" />}
      {error !== null && <ErrorState title="The limits could not be worked out" error={error} />}
      {limits && (
        <div className="mt-4 grid gap-4 md:grid-cols-2">
          <section aria-label="Mass limit">
            <h3 className="font-semibold">
              Mass per section: {limits.mass.maxSectionMassKg === null ? <Badge tone="danger">no verdict</Badge> : u.formatMass(limits.mass.maxSectionMassKg, 0)}
            </h3>
            <ol className="mt-1 list-decimal pl-5 text-sm text-ink-700">{limits.mass.working.map((w) => <li key={w}>{w}</li>)}</ol>
            {limits.mass.problems.map((p) => <p key={p} className="text-sm text-danger-800">{p}</p>)}
          </section>
          <section aria-label="Size limit">
            <h3 className="font-semibold">
              Largest crate: {size?.crateMaxMm.map((v) => (v === null ? 'not limited' : u.formatLength(v))).join(' × ')}; section box{' '}
              {size?.sectionMaxMm ? size.sectionMaxMm.map((v) => (v >= 100_000 ? 'not limited' : u.formatLength(v))).join(' × ') : 'not limited'}
            </h3>
            <ul className="mt-1 text-sm text-ink-700">
              {size?.setBy.map((s) => (
                <li key={s.axis}>
                  {s.axis}: {u.formatLength(s.limitMm)} set by {s.venueName}, {s.where}
                </li>
              ))}
              {size && <li>Crate walls, skids and clearance: {size.crateOverheadMm.map((v) => u.formatLength(v)).join(' / ')} (crate design)</li>}
            </ul>
            {size && size.verified.length > 0 && (
              <details className="mt-1 text-sm">
                <summary>Checked at {size.verified.length} venue(s)</summary>
                <ul>{size.verified.map((v) => <li key={v.venueId}>{v.venueName}: {v.verdict}{v.tightest ? ` (${v.tightest})` : ''}</li>)}</ul>
              </details>
            )}
            {size?.problems.map((p) => <p key={p} className="text-sm text-caution-800">{p}</p>)}
          </section>
        </div>
      )}
      {limits && (
        <Alert tone="caution" title="Cautions" className="mt-4">
          <ul className="list-disc pl-5 text-sm">{limits.cautions.map((c) => <li key={c}>{c}</li>)}</ul>
        </Alert>
      )}
    </Card>
  );
}

function sectionLine(s: ProposalSectionView, u: Units): string {
  return `${u.formatMass(s.massKg, 0)} · ${s.sizeMm.map((v) => u.formatLength(v)).join(' × ')}`;
}

function Proposals({ run, labels, mayEdit, onEdit, productionId }: { run: SplitRunView; labels: Labels; mayEdit: boolean; onEdit: (s: SectionUnitBody[][]) => void; productionId: string }) {
  const u = useUnits();
  const adopt = useAdoptSplit(productionId);
  const result = run.result!;
  if (result.proposals.length === 0) {
    return (
      <Card title="No split satisfies every limit">
        <ul className="flex flex-col gap-2" aria-label="What makes it impossible">
          {result.infeasible.map((i) => (
            <li key={i.assemblyId + i.reason} className="rounded-control border border-danger-200 bg-danger-50 p-2 text-sm text-danger-800">
              {i.assemblyNumber ? <strong>Assembly {labels.get(i.assemblyId) ?? i.assemblyNumber}: </strong> : null}
              {i.reason}
            </li>
          ))}
        </ul>
      </Card>
    );
  }
  return (
    <Card title="Proposals" description={`Best first: fewest sections, then the lightest heaviest section, then CoGs nearest their footprint's centre (${result.method === 'exact' ? 'proven best by exhaustive search' : 'best found in the time given'}).`}>
      {adopt.isSuccess && <Alert tone="ok" title="Split adopted" className="mb-3">Sections {adopt.data.adopted.sections.map((s) => s.code).join(', ')} now hold the machine{adopt.data.adopted.emptied.length ? `; ${adopt.data.adopted.emptied.join(', ')} left empty` : ''}.</Alert>}
      {adopt.isError && (
        <Alert tone="danger" title={isApiError(adopt.error, 'conflict') ? 'The breakdown changed meanwhile' : 'The split could not be adopted'} className="mb-3">
          {errorMessage(adopt.error)}
        </Alert>
      )}
      <div className="grid gap-4" style={{ gridTemplateColumns: `repeat(${result.proposals.length}, minmax(14rem, 1fr))` }}>
        {result.proposals.map((p, k) => (
          <section key={k} aria-label={`Proposal ${k + 1}`} className="rounded-control border border-ink-200 p-3">
            <h3 className="font-semibold">
              Proposal {k + 1}: {p.sections.length} sections
            </h3>
            {p.score && <p className="text-sm text-ink-600">heaviest {u.formatMass(p.score.heaviestKg, 0)}</p>}
            <ol className="mt-2 flex flex-col gap-2">
              {p.sections.map((s, i) => (
                <li key={i} className="text-sm">
                  <p className="font-semibold">S{i + 1}: {sectionLine(s, u)}</p>
                  <p className="text-ink-700">{s.units.map((x) => `${labels.get(x.assemblyId) ?? x.assemblyId}${x.scope === 'own-parts' ? ' (own parts)' : ''}`).join(', ')}</p>
                  <p className="text-ok-800">
                    mass margin {u.formatMass(s.massMarginKg, 0)}
                    {s.sizeMarginMm ? `; size margin ${s.sizeMarginMm.map((v) => (v > 50_000 ? '—' : u.formatLength(v))).join(' / ')}` : ''}
                  </p>
                </li>
              ))}
            </ol>
            {mayEdit && (
              <div className="mt-3 flex flex-wrap gap-2">
                <Button
                  size="sm"
                  loading={adopt.isPending}
                  onClick={() => adopt.mutate({ machineVersion: run.machineVersion, stamp: run.stamp, sections: p.sections.map((s) => ({ units: s.units })), limits: limitsQueryOf(run) })}
                >
                  Adopt proposal {k + 1}
                </Button>
                <Button size="sm" variant="secondary" onClick={() => onEdit(p.sections.map((s) => s.units))}>
                  Edit by hand
                </Button>
              </div>
            )}
          </section>
        ))}
      </div>
    </Card>
  );
}

/** The limits query a run was made with, so adoption re-checks against the same limits. */
function limitsQueryOf(run: SplitRunView): SplitLimitsQuery {
  const l = run.limits;
  return {
    liftMode: l?.mass.mode ?? 'hoist',
    sizeFrom: !l?.limits?.maxSectionSizeMm ? 'none' : l.size.venuesChecked > 0 ? 'tour' : 'vehicles',
    ...(l?.maxSections ? { maxSections: l.maxSections } : {}),
    ...(l?.mass.hoist ? { riggingKg: l.mass.hoist.riggingKg } : {}),
  };
}

/** Hand edit: move units between sections; every limit is re-checked live by the split core. */
function ManualEdit({ productionId, input, limits, run, start, labels, onDone }: { productionId: string; input: SplitInputView; limits: SplitLimitsView; run: SplitRunView; start: SectionUnitBody[][]; labels: Labels; onDone: () => void }) {
  const u = useUnits();
  const adopt = useAdoptSplit(productionId);
  const units = useMemo(() => start.flatMap((s, k) => s.map((x) => ({ ...x, section: k }))), [start]);
  const [where, setWhere] = useState<number[]>(units.map((x) => x.section));
  const count = Math.max(start.length, ...where.map((w) => w + 1));
  const sections: SectionUnitBody[][] = Array.from({ length: count }, () => []);
  units.forEach((x, i) => sections[where[i]].push({ assemblyId: x.assemblyId, scope: x.scope }));
  const nonEmpty = sections.filter((s) => s.length > 0);
  const core = limits.limits!;
  const check = checkSplit(
    { assemblies: input.assemblies.map((a) => ({ id: a.id, parentId: a.parentId, keepTogether: a.keepTogether })), parts: input.parts, limits: core },
    nonEmpty,
  );
  return (
    <Card title="Edit by hand" description="Move each piece to a section; the limits are checked again as you go.">
      <table className="w-full text-sm">
        <thead>
          <tr className="text-left">
            <th>Piece</th>
            <th>Section</th>
          </tr>
        </thead>
        <tbody>
          {units.map((x, i) => (
            <tr key={`${x.assemblyId}-${x.scope}`}>
              <td>
                {labels.get(x.assemblyId) ?? x.assemblyId}
                {x.scope === 'own-parts' ? ' (own parts)' : ''}
              </td>
              <td>
                <select
                  aria-label={`Section of ${labels.get(x.assemblyId) ?? x.assemblyId}`}
                  value={where[i]}
                  onChange={(e) => setWhere(where.map((w, j) => (j === i ? Number(e.target.value) : w)))}
                  className="rounded-control border border-ink-300 px-2 py-1"
                >
                  {Array.from({ length: count + 1 }, (_, k) => (
                    <option key={k} value={k}>
                      {k < count ? `S${k + 1}` : 'new section'}
                    </option>
                  ))}
                </select>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <h3 className="mt-4 font-semibold">Live check</h3>
      <ul className="text-sm" aria-label="Live check">
        {check.sections.map((s, k) => (
          <li key={k} className={s.withinLimits ? 'text-ok-800' : 'text-danger-800'}>
            S{k + 1}: {u.formatMass(s.massKg, 0)} (margin {u.formatMass(s.massMarginKg, 0)}), {s.sizeMm.map((v) => u.formatLength(v)).join(' × ')}
            {s.sizeMarginMm ? ` (margin ${s.sizeMarginMm.map((v) => (v > 50_000 ? '—' : u.formatLength(v))).join(' / ')})` : ''} — {s.withinLimits ? 'within every limit' : 'over a limit'}
          </li>
        ))}
      </ul>
      {check.problems.length > 0 && (
        <Alert tone="danger" title="This split breaks a rule" className="mt-2">
          <ul className="list-disc pl-5">{check.problems.map((p) => <li key={p}>{p.replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, (id) => labels.get(id) ?? id)}</li>)}</ul>
        </Alert>
      )}
      {adopt.isError && <Alert tone="danger" title="Not adopted" className="mt-2">{errorMessage(adopt.error)}</Alert>}
      {adopt.isSuccess && <Alert tone="ok" title="Split adopted" className="mt-2">Sections {adopt.data.adopted.sections.map((s) => s.code).join(', ')}.</Alert>}
      <div className="mt-3 flex gap-2">
        <Button disabled={!check.ok} loading={adopt.isPending} onClick={() => adopt.mutate({ machineVersion: run.machineVersion, stamp: run.stamp, sections: nonEmpty.map((s) => ({ units: s })), limits: limitsQueryOf(run) })}>
          Adopt this split
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Close
        </Button>
      </div>
    </Card>
  );
}
