import { Badge, type Tone } from '../../../components/ui/index.ts';

export type Verdict = 'pass' | 'fail' | 'unknown';

const TONE: Record<Verdict, Tone> = { pass: 'ok', fail: 'danger', unknown: 'caution' };
/** Words, not only colours: "not checked" says plainly that missing data gave no verdict. */
export const VERDICT_LABEL: Record<Verdict, string> = { pass: 'passes', fail: 'fails', unknown: 'not checked' };
const MARK: Record<Verdict, string> = { pass: '✓', fail: '✗', unknown: '?' };

export function VerdictBadge({ verdict, className }: { verdict: Verdict; className?: string }) {
  return (
    <Badge tone={TONE[verdict]} className={className}>
      <span aria-hidden="true" className="mr-1">
        {MARK[verdict]}
      </span>
      {VERDICT_LABEL[verdict]}
    </Badge>
  );
}

/** A margin with its unit and sign, e.g. "−20 mm" or "+1.25 kN/m²". */
export function formatMargin(margin: number | undefined, unit: string | undefined): string | null {
  if (margin === undefined || !Number.isFinite(margin)) return null;
  const digits = unit === 'mm' || unit === 'kg' ? 0 : 2;
  const abs = Math.abs(margin).toLocaleString('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: digits });
  return `${margin < 0 ? '−' : '+'}${abs} ${unit ?? ''}`.trim();
}
