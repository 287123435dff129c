import type { LiftPlanInput, LiftPlanResult } from '@domain/lifting/index.ts';
import { Card } from '../../../components/ui/index.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { PlanVerdictBadge } from './badges.tsx';
import { CautionsPanel } from './cautions-panel.tsx';
import { deg, pct } from './format.ts';

/**
 * What the core answered for a lift plan: verdict, every problem, hook loads, each leg (worst over
 * the CoG uncertainty), each component's utilisation, tilt and exclusion zone, methods and cautions.
 * It only shows the result; it computes nothing.
 */
export function PlanResultView({ result, input, title = 'Figures' }: { result: LiftPlanResult; input: LiftPlanInput; title?: string }) {
  const { formatMass, formatLength } = useUnits();
  const problems = result.findings.filter((f) => f.severity !== 'notice');
  const notices = result.findings.filter((f) => f.severity === 'notice');
  const l = result.loads;
  return (
    <div className="flex flex-col gap-4" data-testid="plan-result">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-semibold text-ink-900">{title}</h2>
        <PlanVerdictBadge verdict={result.verdict} problemCount={result.problems.length} />
      </div>
      <CautionsPanel cautions={result.cautions} />
      {problems.length > 0 && (
        <div role="alert" className="rounded-control border border-danger-300 bg-danger-50 px-4 py-3 text-danger-800">
          <p className="font-semibold">Unresolved problems: no approval until each is resolved</p>
          <ul className="mt-1 list-disc pl-5" aria-label="Problems">
            {problems.map((f, i) => (
              <li key={i}>{f.message}</li>
            ))}
          </ul>
        </div>
      )}
      {l && (
        <Card title="Hook">
          <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm">
            <dt className="text-ink-600">Load</dt>
            <dd>
              {formatMass(l.massKg)} {input.load.massWeighed ? '(weighed)' : '(estimate, not weighed)'} + {(l.contingency * 100).toFixed(1)} % = {formatMass(l.designLoadKg)}
            </dd>
            <dt className="text-ink-600">Rigging below the hook</dt>
            <dd>{formatMass(l.riggingBelowHookKg)}</dd>
            <dt className="text-ink-600">Static hook load</dt>
            <dd data-testid="static-hook-load">{formatMass(l.staticHookLoadKg)}</dd>
            <dt className="text-ink-600">Dynamic hook load</dt>
            <dd data-testid="dynamic-hook-load">
              {formatMass(l.dynamicHookLoadKg)} (× {l.dynamicFactor.value}; {l.dynamicFactor.source})
            </dd>
            <dt className="text-ink-600">Tilt as it hangs</dt>
            <dd>{deg(result.tiltDeg)}</dd>
            <dt className="text-ink-600">Exclusion zone</dt>
            <dd>
              {result.exclusionZone
                ? `${formatLength(result.exclusionZone.maxXMm - result.exclusionZone.minXMm)} × ${formatLength(result.exclusionZone.maxYMm - result.exclusionZone.minYMm)} in plan (${result.exclusionZone.basis}, + ${formatLength(result.exclusionZone.marginMm)})`
                : '—'}
            </dd>
          </dl>
        </Card>
      )}
      {result.legs.length > 0 && (
        <Card title="Legs" description="Worst tension over the CoG uncertainty governs each leg.">
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="text-ink-600">
                <tr>
                  <th className="py-1 pr-3">Pick point</th>
                  <th className="py-1 pr-3">Angle (min)</th>
                  <th className="py-1 pr-3">Nominal</th>
                  <th className="py-1 pr-3">Worst</th>
                  <th className="py-1 pr-3">Governing case</th>
                  <th className="py-1">× DAF</th>
                </tr>
              </thead>
              <tbody>
                {result.legs.map((leg) => (
                  <tr key={leg.pickPointId} className="border-t border-ink-100">
                    <td className="py-1 pr-3 font-semibold">{leg.pickPointId}</td>
                    <td className="py-1 pr-3">
                      {deg(leg.angleFromHorizontalDeg)} ({deg(leg.minAngleFromHorizontalDeg)})
                    </td>
                    <td className="py-1 pr-3">{formatMass(leg.nominalTensionKg)}</td>
                    <td className="py-1 pr-3" data-testid={`leg-${leg.pickPointId}-worst`}>
                      {formatMass(leg.worstTensionKg)}
                    </td>
                    <td className="py-1 pr-3">
                      {leg.governingCase} ({leg.ratingBasis})
                    </td>
                    <td className="py-1">{formatMass(leg.designTensionKg)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Card>
      )}
      {result.components.length > 0 && (
        <Card title="Utilisation of each component">
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="text-ink-600">
                <tr>
                  <th className="py-1 pr-3">Component</th>
                  <th className="py-1 pr-3">Load</th>
                  <th className="py-1 pr-3">Capacity</th>
                  <th className="py-1 pr-3">Use</th>
                  <th className="py-1">Basis</th>
                </tr>
              </thead>
              <tbody>
                {result.components.map((c, i) => (
                  <tr key={i} className={`border-t border-ink-100 ${(c.utilisation ?? 2) > 1 ? 'text-danger-700' : ''}`}>
                    <td className="py-1 pr-3">{c.subject}</td>
                    <td className="py-1 pr-3">{formatMass(c.loadKg)}</td>
                    <td className="py-1 pr-3">{c.capacityKg === null ? 'no rating' : formatMass(c.capacityKg)}</td>
                    <td className="py-1 pr-3 font-semibold">{pct(c.utilisation)}</td>
                    <td className="py-1 text-ink-600">{c.basis}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Card>
      )}
      {notices.length > 0 && (
        <Card title="Notices">
          <ul className="list-disc pl-5 text-sm">
            {notices.map((f, i) => (
              <li key={i}>{f.message}</li>
            ))}
          </ul>
        </Card>
      )}
      <Card title="Method and sources">
        <ul className="list-disc pl-5 text-sm text-ink-700">
          {result.methods.map((m, i) => (
            <li key={i}>{m}</li>
          ))}
        </ul>
      </Card>
    </div>
  );
}
