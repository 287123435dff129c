import type { ReactNode } from 'react';
import type { NodeMassView, SectionMassView, SectionView } from '@domain/contracts/machine.ts';
import { formatNumber } from '@domain/units.ts';
import { Alert, Badge, Card } from '../../../components/ui/index.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { ConfidenceBar } from './confidence-bar.tsx';

export interface SectionCardProps {
  section: Pick<SectionView, 'id' | 'code' | 'name' | 'cogUncertaintyMm'>;
  mass: SectionMassView | (NodeMassView & { marginPercent: number; weighing?: SectionMassView['weighing'] });
  /** A client-side preview (a move not yet saved): marked, and the change from `before` shown. */
  preview?: boolean;
  before?: NodeMassView;
  actions?: ReactNode;
}

const GAPS_SHOWN = 5;

/**
 * One transportable section: mass (nominal and with margin), CoG, size, how firm the mass is, what is
 * missing, and the latest weighing, which governs over the computed figures.
 */
export function SectionCard({ section, mass, preview, before, actions }: SectionCardProps) {
  const u = useUnits();
  const size = mass.bboxMm ? mass.bboxMm.maxMm.map((max, i) => max - mass.bboxMm!.minMm[i]) : null;
  const w = mass.weighing ?? null;
  const delta = before ? mass.massKg - before.massKg : 0;
  return (
    <Card
      title={
        <span className="flex flex-wrap items-center gap-2">
          <span>{section.code}</span>
          <span className="text-base font-normal text-ink-700">{section.name}</span>
        </span>
      }
      actions={
        <>
          {preview && <Badge tone="accent">Preview</Badge>}
          {w && <Badge tone="ok">Weighed</Badge>}
          {mass.gaps.length > 0 && <Badge tone="caution">{mass.gaps.length === 1 ? '1 gap' : `${mass.gaps.length} gaps`}</Badge>}
          {actions}
        </>
      }
    >
      <dl className="grid grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-3" aria-label={`${section.code} mass properties`}>
        <Figure term="Mass">
          <span data-testid="section-mass">{u.formatMass(mass.massKg)}</span>
          {preview && before && Math.abs(delta) > 1e-9 && (
            <span className={delta > 0 ? 'ml-2 text-sm text-caution-800' : 'ml-2 text-sm text-ok-700'}>
              {delta > 0 ? '+' : '−'}
              {u.formatMass(Math.abs(delta))}
            </span>
          )}
        </Figure>
        <Figure term={`With ${formatNumber(mass.marginPercent, 1)} % margin`}>{u.formatMass(mass.massWithMarginKg)}</Figure>
        <Figure term="Lines">
          {formatNumber(mass.lineCount)} ({formatNumber(mass.unitCount)} units){mass.addOnCount > 0 ? `, ${mass.addOnCount} add-on${mass.addOnCount === 1 ? '' : 's'}` : ''}
        </Figure>
        <Figure term="CoG x, y, z">
          {mass.cogMm ? mass.cogMm.map((v) => u.formatLength(v)).join(', ') : <span className="text-ink-500">none yet</span>}
          {section.cogUncertaintyMm != null && <span className="block text-sm text-ink-600">± {u.formatLength(section.cogUncertaintyMm)}</span>}
        </Figure>
        <Figure term="Size L × W × H">{size ? size.map((v) => u.formatLength(v)).join(' × ') : <span className="text-ink-500">none yet</span>}</Figure>
      </dl>
      <div className="mt-4">
        <p className="mb-1 text-sm font-semibold text-ink-800">Where the mass comes from</p>
        <ConfidenceBar confidence={mass.confidence} />
      </div>
      {mass.approximateLineCount > 0 && (
        <p className="mt-3 text-sm text-ink-700">
          {mass.approximateLineCount} line{mass.approximateLineCount === 1 ? '' : 's'} with several units at one CoG ({u.formatMass(mass.approximateMassKg)}): approximate.
        </p>
      )}
      {w && (
        <Alert tone={w.comparison?.large ? 'caution' : 'ok'} className="mt-4" title={`Weighed ${u.formatMass(w.massKg)} on ${w.weighedOn}`}>
          <p className="text-sm">
            {w.weighedBy}
            {w.scale ? `, ${w.scale}` : ''}. {w.cogPlanMm ? `CoG in plan ${w.cogPlanMm.map((v) => u.formatLength(v)).join(', ')}.` : ''}
          </p>
          {w.comparison && (
            <p className="text-sm">
              Difference from computed: {w.comparison.differenceKg >= 0 ? '+' : '−'}
              {u.formatMass(Math.abs(w.comparison.differenceKg))} ({formatNumber(w.comparison.differencePercent, 1)} %).{' '}
              {w.comparison.notes[0]}
            </p>
          )}
        </Alert>
      )}
      {mass.gaps.length > 0 && (
        <div className="mt-4">
          <p className="text-sm font-semibold text-caution-800">Not counted (mass is a lower bound until these are filled in):</p>
          <ul className="mt-1 list-disc pl-5 text-sm text-ink-800">
            {mass.gaps.slice(0, GAPS_SHOWN).map((g) => (
              <li key={g.lineId}>
                <span className="font-semibold">{g.label}</span>: {g.reasons.join('; ')}
              </li>
            ))}
            {mass.gaps.length > GAPS_SHOWN && <li>and {mass.gaps.length - GAPS_SHOWN} more</li>}
          </ul>
        </div>
      )}
    </Card>
  );
}

function Figure({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-sm text-ink-600">{term}</dt>
      <dd className="text-lg font-semibold text-ink-900 tabular-nums">{children}</dd>
    </div>
  );
}
