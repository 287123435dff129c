import type { CrateView } from '@domain/contracts/crate-loads.ts';
import { Alert, Badge, Card } from '../../../components/ui/index.ts';
import { useUnits } from '../../../lib/use-units.ts';

const VERDICT_TONE = { 'one person': 'ok', 'team of N': 'caution', 'mechanical aid required': 'danger', 'no verdict': 'neutral' } as const;

/** The handling verdict as people read it: "team of 2" rather than the core's "team of N". */
export function verdictLabel(crate: CrateView): string {
  const h = crate.figures.handling;
  return h.verdict === 'team of N' ? `team of ${h.teamSize}` : h.verdict;
}

/** Gross, net, tare, CoG, tipping, the manual-handling verdict with its cautions, and the warnings. */
export function CrateFigures({ crate }: { crate: CrateView }) {
  const u = useUnits();
  const f = crate.figures;
  const bound = f.massComplete ? '' : ' (at least)';
  return (
    <Card title="Figures" description="Worked out by the server from the crate and its contents.">
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-3">
        <div>
          <dt className="text-ink-600">Gross</dt>
          <dd className="text-lg font-semibold" data-testid="gross">
            {u.formatMass(f.grossKg)}
            {bound}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Net (contents)</dt>
          <dd className="text-lg font-semibold">
            {u.formatMass(f.netKg)}
            {bound}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Tare</dt>
          <dd className="text-lg font-semibold">{u.formatMass(f.tareKg)}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Outer size L × W × H</dt>
          <dd>{crate.outerMm.map((v) => u.formatLength(v)).join(' × ')}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Inner size</dt>
          <dd>{crate.innerMm ? crate.innerMm.map((v) => u.formatLength(v)).join(' × ') : 'not given'}</dd>
        </div>
        <div>
          <dt className="text-ink-600">CoG (x, y, z from the outer bottom corner)</dt>
          <dd>{f.cogMm ? f.cogMm.map((v) => u.formatLength(v)).join(', ') : 'not known'}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Maximum gross</dt>
          <dd>{crate.maxGrossKg === null ? 'not set' : u.formatMass(crate.maxGrossKg)}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Stacking</dt>
          <dd>{crate.stackable ? (crate.maxLoadOnTopKg === null ? 'may be stacked on' : `at most ${u.formatMass(crate.maxLoadOnTopKg, 0)} on top`) : 'do not stack'}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Tipping (road, 1.0 g forward, 0.5 g sideways)</dt>
          <dd>
            {f.tipping ? (
              <Badge tone={f.tipping.tips ? 'danger' : 'ok'}>{f.tipping.tips ? 'lash or block' : 'free-standing'}</Badge>
            ) : (
              <Badge tone="neutral">no verdict</Badge>
            )}
          </dd>
        </div>
      </dl>
      <p className="mt-2 text-sm text-ink-700">{f.tipping?.note ?? f.tippingUnknownReason}</p>
      <div className="mt-4 flex flex-wrap gap-2">
        {crate.thisWayUp && <Badge tone="accent">This way up</Badge>}
        {crate.fragile && <Badge tone="caution">Fragile</Badge>}
        {crate.mayTilt && <Badge>May tilt</Badge>}
        {crate.ispm15Required && <Badge tone="caution">ISPM 15 mark abroad</Badge>}
      </div>
      <section className="mt-4" aria-label="Manual handling">
        <h3 className="font-semibold text-ink-900">
          Handling by people: <Badge tone={VERDICT_TONE[f.handling.verdict]}>{verdictLabel(crate)}</Badge>
        </h3>
        <p className="text-sm text-ink-600">{f.handling.method}</p>
        <ul className="mt-1 list-disc pl-5 text-sm text-ink-700">
          {f.handling.reasons.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
        <Alert tone="caution" title="Cautions" className="mt-3">
          <ul className="list-disc pl-5 text-sm">
            {f.handling.cautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </Alert>
      </section>
      {f.warnings.length > 0 && (
        <Alert tone="caution" title="Warnings" className="mt-3">
          <ul className="list-disc pl-5 text-sm">
            {f.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Alert>
      )}
      <section className="mt-4">
        <h3 className="font-semibold text-ink-900">On the packing list</h3>
        <ul className="list-disc pl-5 text-sm text-ink-700">
          {f.packingListNotes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      </section>
    </Card>
  );
}
