import type { NodeMassView } from '@domain/contracts/machine.ts';
import { formatNumber } from '@domain/units.ts';

/**
 * How firm a mass is, as one stacked bar: weighed or catalogue (firm), CAD (volume × density), estimated.
 * Colours come from the design tokens; the numbers are also written out for people who cannot tell colours.
 */
export function ConfidenceBar({ confidence }: { confidence: NodeMassView['confidence'] }) {
  const parts = [
    { key: 'firm', label: 'Weighed or catalogue', pct: confidence.weighedOrCataloguePercent, cls: 'bg-ok-500' },
    { key: 'cad', label: 'CAD', pct: confidence.cadPercent, cls: 'bg-tide-400' },
    { key: 'est', label: 'Estimated', pct: confidence.estimatedPercent, cls: 'bg-caution-500' },
  ];
  return (
    <div>
      <div className="flex h-2.5 w-full overflow-hidden rounded-full bg-ink-100" aria-hidden="true">
        {parts.map((p) => (p.pct > 0 ? <div key={p.key} className={p.cls} style={{ width: `${p.pct}%` }} /> : null))}
      </div>
      <ul className="mt-1.5 flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-700">
        {parts.map((p) => (
          <li key={p.key} className="flex items-center gap-1.5">
            <span className={`inline-block size-2.5 rounded-full ${p.cls}`} aria-hidden="true" />
            {p.label} {formatNumber(p.pct, 0)} %
          </li>
        ))}
      </ul>
    </div>
  );
}
