import type { LiftPlanStatus } from '@domain/contracts/lifting-api.ts';
import { Badge, type Tone } from '../../../components/ui/index.ts';

const STATUS: Record<LiftPlanStatus, { label: string; tone: Tone }> = {
  draft: { label: 'Draft', tone: 'neutral' },
  submitted: { label: 'Submitted', tone: 'accent' },
  approved: { label: 'Approved', tone: 'ok' },
  rejected: { label: 'Rejected', tone: 'danger' },
};

export function StatusBadge({ status }: { status: LiftPlanStatus }) {
  return <Badge tone={STATUS[status].tone}>{STATUS[status].label}</Badge>;
}

/** A plan's verdict: within capacity only when the core says ok and nothing is unresolved. */
export function PlanVerdictBadge({ verdict, problemCount }: { verdict: 'ok' | 'over capacity' | 'no verdict'; problemCount: number }) {
  if (verdict === 'ok' && problemCount === 0) return <Badge tone="ok">Within capacity</Badge>;
  if (verdict === 'over capacity') return <Badge tone="danger">Over capacity</Badge>;
  return <Badge tone="caution">No verdict{problemCount ? ` (${problemCount} problem${problemCount === 1 ? '' : 's'})` : ''}</Badge>;
}

const HANDLING: Record<string, Tone> = { 'one person': 'ok', 'team of N': 'accent', 'mechanical aid required': 'danger', 'no verdict': 'caution' };

export function HandlingBadge({ verdict, teamSize }: { verdict: string; teamSize: number | null }) {
  const label = verdict === 'team of N' ? `Team of ${teamSize}` : verdict === 'one person' ? 'One person' : verdict === 'mechanical aid required' ? 'Mechanical aid' : 'No verdict';
  return <Badge tone={HANDLING[verdict] ?? 'neutral'}>{label}</Badge>;
}
