import { useState } from 'react';
import type { ImpactDraftParsed, ImpactRow, ImpactView } from '@domain/contracts/split.ts';
import { toKg, toMm } from '@domain/units.ts';
import { Alert, Badge, Button, Card, EmptyState, ErrorState, PageHeader, SelectField, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useApplyDraft, useEvaluateDraft, usePartLines, usePlansAndHoists, useVenues } from '../api/impact-api.ts';

type Draft = ImpactDraftParsed;
const EMPTY: Draft = { partMasses: [], newAssemblies: [], planHoists: [], venueDoors: [] };
const num = (s: string) => (s.trim() === '' || !Number.isFinite(Number(s)) ? undefined : Number(s));

/** `/p/:productionId/impact`: try a change as a draft, see what turns pass→fail or back, then apply it. */
export function ImpactPage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const mayApply = useMay('machine.edit');
  const [draft, setDraft] = useState<Draft>(EMPTY);
  const evaluate = useEvaluateDraft(pid);
  const apply = useApplyDraft(pid);
  const count = draft.partMasses.length + draft.newAssemblies.length + draft.planHoists.length + draft.venueDoors.length;
  const edit = (d: Draft) => {
    setDraft(d);
    evaluate.reset();
    apply.reset();
  };
  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Impact of a change" description="A draft change is evaluated without saving anything: sections, crates, lift plans, truck loads and venue access, before and after." />
      <DraftForm productionId={pid} draft={draft} onChange={edit} />
      <Card title={`Draft (${count} change${count === 1 ? '' : 's'})`}>
        {count === 0 ? (
          <EmptyState title="No change drafted yet">Add a weighed part, a new assembly, another hoist or a narrower door above.</EmptyState>
        ) : (
          <DraftList draft={draft} onChange={edit} />
        )}
        <div className="mt-3 flex flex-wrap gap-2">
          <Button disabled={count === 0} loading={evaluate.isPending} onClick={() => evaluate.mutate(draft)}>
            Show the impact
          </Button>
          {mayApply && (
            <Button variant="danger" disabled={count === 0 || !evaluate.isSuccess} loading={apply.isPending} onClick={() => apply.mutate(draft)}>
              Apply the draft
            </Button>
          )}
        </div>
        {evaluate.isError && <ErrorState title="The impact could not be worked out" error={evaluate.error} className="mt-3" />}
        {apply.isError && <Alert tone="danger" title="Not applied" className="mt-3">{errorMessage(apply.error)}</Alert>}
        {apply.isSuccess && <Alert tone="ok" title="Applied" className="mt-3">The draft is saved; lift plans whose figures moved went back to draft for review.</Alert>}
      </Card>
      {evaluate.isSuccess && <Results impact={evaluate.data} />}
    </div>
  );
}

function DraftList({ draft, onChange }: { draft: Draft; onChange: (d: Draft) => void }) {
  const u = useUnits();
  const drop = <K extends keyof Draft>(key: K, i: number) => onChange({ ...draft, [key]: draft[key].filter((_, j) => j !== i) });
  return (
    <ul className="flex flex-col gap-1 text-sm">
      {draft.partMasses.map((p, i) => (
        <li key={`p${i}`}>
          Part line {p.lineId.slice(0, 8)}: unit mass {u.formatMass(p.unitMassKg)} ({p.massSource ?? 'estimated'}) <Button size="sm" variant="ghost" onClick={() => drop('partMasses', i)}>Remove</Button>
        </li>
      ))}
      {draft.newAssemblies.map((a, i) => (
        <li key={`a${i}`}>
          New assembly {a.number}: {u.formatMass(a.massKg)} <Button size="sm" variant="ghost" onClick={() => drop('newAssemblies', i)}>Remove</Button>
        </li>
      ))}
      {draft.planHoists.map((h, i) => (
        <li key={`h${i}`}>
          Lift plan {h.planId.slice(0, 8)} with hoist {h.hoistGearId.slice(0, 8)} <Button size="sm" variant="ghost" onClick={() => drop('planHoists', i)}>Remove</Button>
        </li>
      ))}
      {draft.venueDoors.map((d, i) => (
        <li key={`d${i}`}>
          Venue {d.venueId.slice(0, 8)}, door {d.doorIndex + 1}: {d.widthMm ? u.formatLength(d.widthMm) : 'width as is'} × {d.heightMm ? u.formatLength(d.heightMm) : 'height as is'}{' '}
          <Button size="sm" variant="ghost" onClick={() => drop('venueDoors', i)}>Remove</Button>
        </li>
      ))}
    </ul>
  );
}

function DraftForm({ productionId, draft, onChange }: { productionId: string; draft: Draft; onChange: (d: Draft) => void }) {
  const u = useUnits();
  // Typed in the person's units, held in kg and mm.
  const kg = (t: string) => (num(t) === undefined ? undefined : toKg(num(t)!, u.massUnit));
  const mm = (t: string) => (num(t) === undefined ? undefined : toMm(num(t)!, u.lengthUnit));
  const [search, setSearch] = useState('');
  const lines = usePartLines(productionId, search);
  const venues = useVenues(productionId);
  const plans = usePlansAndHoists(productionId);
  const [lineId, setLineId] = useState('');
  const [mass, setMass] = useState('');
  const [asm, setAsm] = useState({ number: '', massKg: '', x: '0', y: '0', z: '0' });
  const [planId, setPlanId] = useState('');
  const [hoistId, setHoistId] = useState('');
  const [venueId, setVenueId] = useState('');
  const [doorIndex, setDoorIndex] = useState('0');
  const [doorW, setDoorW] = useState('');
  const [doorH, setDoorH] = useState('');
  const venue = venues.data?.find((v) => v.id === venueId);
  const line = lines.data?.find((l) => l.id === lineId);
  return (
    <Card title="Draft a change">
      <div className="grid gap-5 lg:grid-cols-2">
        <fieldset className="flex flex-col gap-2">
          <legend className="font-semibold">A part's mass (e.g. after weighing)</legend>
          <TextField label="Find a part" name="partSearch" value={search} onChange={(e) => setSearch(e.target.value)} />
          <SelectField label="Part line" name="lineId" value={lineId} onChange={(e) => setLineId(e.target.value)}>
            <option value="">Pick one…</option>
            {(lines.data ?? []).map((l) => (
              <option key={l.id} value={l.id}>
                {l.partNumber} {l.name} ({l.unitMassKg === null ? '—' : u.formatMass(l.unitMassKg)})
              </option>
            ))}
          </SelectField>
          <TextField label={`New unit mass, ${u.massUnit}`} name="unitMassKg" inputMode="decimal" value={mass} onChange={(e) => setMass(e.target.value)} />
          <Button
            variant="secondary"
            disabled={!line || kg(mass) === undefined || kg(mass)! < 0}
            onClick={() => {
              onChange({ ...draft, partMasses: [...draft.partMasses, { lineId, unitMassKg: kg(mass)!, massSource: 'weighed', version: line?.version }] });
              setMass('');
            }}
          >
            Add to the draft
          </Button>
        </fieldset>
        <fieldset className="flex flex-col gap-2">
          <legend className="font-semibold">A venue's door</legend>
          <SelectField label="Venue" name="venueId" value={venueId} onChange={(e) => setVenueId(e.target.value)}>
            <option value="">Pick one…</option>
            {(venues.data ?? []).map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Door" name="doorIndex" value={doorIndex} onChange={(e) => setDoorIndex(e.target.value)}>
            {(venue?.access?.doors ?? []).map((d, i) => (
              <option key={i} value={i}>
                {d.name || `door ${i + 1}`} ({d.widthMm == null ? '?' : u.formatLength(d.widthMm)} × {d.heightMm == null ? '?' : u.formatLength(d.heightMm)})
              </option>
            ))}
          </SelectField>
          <div className="grid grid-cols-2 gap-2">
            <TextField label={`Clear width, ${u.lengthUnit}`} name="doorWidthMm" inputMode="decimal" value={doorW} onChange={(e) => setDoorW(e.target.value)} />
            <TextField label={`Clear height, ${u.lengthUnit}`} name="doorHeightMm" inputMode="decimal" value={doorH} onChange={(e) => setDoorH(e.target.value)} />
          </div>
          <Button
            variant="secondary"
            disabled={!venue || !(venue.access?.doors?.length) || (mm(doorW) === undefined && mm(doorH) === undefined)}
            onClick={() => onChange({ ...draft, venueDoors: [...draft.venueDoors, { venueId, doorIndex: Number(doorIndex), ...(mm(doorW) ? { widthMm: mm(doorW) } : {}), ...(mm(doorH) ? { heightMm: mm(doorH) } : {}) }] })}
          >
            Add to the draft
          </Button>
        </fieldset>
        <fieldset className="flex flex-col gap-2">
          <legend className="font-semibold">A different hoist for a lift plan</legend>
          <SelectField label="Lift plan" name="planId" value={planId} onChange={(e) => setPlanId(e.target.value)}>
            <option value="">Pick one…</option>
            {(plans.data?.plans ?? []).map((p) => (
              <option key={p.id} value={p.id}>
                {p.title} ({p.status})
              </option>
            ))}
          </SelectField>
          <SelectField label="Hoist" name="hoistGearId" value={hoistId} onChange={(e) => setHoistId(e.target.value)}>
            <option value="">Pick one…</option>
            {(plans.data?.hoists ?? []).map((h) => (
              <option key={h.id} value={h.id}>
                {h.identifier}
              </option>
            ))}
          </SelectField>
          <Button variant="secondary" disabled={!planId || !hoistId} onClick={() => onChange({ ...draft, planHoists: [...draft.planHoists, { planId, hoistGearId: hoistId }] })}>
            Add to the draft
          </Button>
        </fieldset>
        <fieldset className="flex flex-col gap-2">
          <legend className="font-semibold">A new assembly (one estimated part)</legend>
          <div className="grid grid-cols-2 gap-2">
            <TextField label="Number" name="asmNumber" value={asm.number} onChange={(e) => setAsm({ ...asm, number: e.target.value })} />
            <TextField label={`Mass, ${u.massUnit}`} name="asmMassKg" inputMode="decimal" value={asm.massKg} onChange={(e) => setAsm({ ...asm, massKg: e.target.value })} />
          </div>
          <div className="grid grid-cols-3 gap-2">
            {(['x', 'y', 'z'] as const).map((k) => (
              <TextField key={k} label={`CoG ${k}, ${u.lengthUnit}`} name={`asmCog${k}`} inputMode="decimal" value={asm[k]} onChange={(e) => setAsm({ ...asm, [k]: e.target.value })} />
            ))}
          </div>
          <Button
            variant="secondary"
            disabled={!asm.number.trim() || kg(asm.massKg) === undefined || [asm.x, asm.y, asm.z].some((v) => mm(v) === undefined)}
            onClick={() => onChange({ ...draft, newAssemblies: [...draft.newAssemblies, { number: asm.number.trim(), name: '', parentId: null, sectionId: null, massKg: kg(asm.massKg)!, cogMm: [mm(asm.x)!, mm(asm.y)!, mm(asm.z)!], bboxMm: null }] })}
          >
            Add to the draft
          </Button>
        </fieldset>
      </div>
    </Card>
  );
}

const TONE = { pass: 'ok', fail: 'danger', unknown: 'caution' } as const;

function Results({ impact }: { impact: ImpactView }) {
  return (
    <Card title="What the draft changes" description={`${impact.counts.passToFail} pass→fail, ${impact.counts.failToPass} fail→pass, ${impact.counts.changed} with other figures. Nothing is saved yet.`}>
      {impact.approvalsWithdrawn.length > 0 && (
        <Alert tone="caution" title="Lift plan approvals that would be withdrawn" className="mb-3">
          <ul className="list-disc pl-5">{impact.approvalsWithdrawn.map((a) => <li key={a.planId}>{a.title}: {a.why}</li>)}</ul>
        </Alert>
      )}
      {impact.warnings.map((w) => <p key={w} className="text-sm text-caution-800">{w}</p>)}
      {impact.rows.length === 0 ? (
        <EmptyState title="Nothing changes">No check turns, and no figure moves.</EmptyState>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-sm" aria-label="Impact">
            <thead>
              <tr className="text-left">
                <th>Change</th>
                <th>What</th>
                <th>Check</th>
                <th>Before</th>
                <th>After</th>
              </tr>
            </thead>
            <tbody>
              {impact.rows.map((r: ImpactRow) => (
                <tr key={`${r.kind}:${r.id}`} className="border-t border-ink-100 align-top">
                  <td>
                    <Badge tone={r.change === 'pass→fail' ? 'danger' : r.change === 'fail→pass' ? 'ok' : 'neutral'}>{r.change}</Badge>
                  </td>
                  <td>
                    {r.label}
                    {r.note && <p className="text-ink-600">{r.note}</p>}
                  </td>
                  <td>{r.check}</td>
                  <td>
                    <Badge tone={TONE[r.before.verdict]}>{r.before.verdict}</Badge> {r.before.figure}
                  </td>
                  <td>
                    <Badge tone={TONE[r.after.verdict]}>{r.after.verdict}</Badge> {r.after.figure}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}
