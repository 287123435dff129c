/**
 * Ramp check: some piece of handling equipment at hand (the venue's or the production's) must be
 * allowed on the ramp's gradient (handling.ts) and carry the crate's gross mass.
 */
import { HANDLING_LABEL, rampLimitPct } from './handling.ts';
import { fmt, isKnownPositive } from './known.ts';
import type { AccessCrate, AccessFinding, AccessRamp, HandlingEquipment } from './types.ts';

export function checkRamp(crate: AccessCrate, ramp: AccessRamp, index: number, equipment: HandlingEquipment[]): AccessFinding {
  const where = ramp.name?.trim() || `ramp ${index + 1}`;
  const base = { check: 'ramp' as const, where };
  if (!(typeof ramp.gradientPct === 'number' && Number.isFinite(ramp.gradientPct) && ramp.gradientPct >= 0)) {
    return { ...base, verdict: 'unknown', reason: `not checked: ${where} gradient unknown` };
  }
  const g = ramp.gradientPct;
  if (crate.carriedByHand) {
    return { ...base, verdict: 'pass', reason: `${where} at ${fmt(g, 1)} %: carried by hand, no truck on the ramp` };
  }
  if (equipment.length === 0) {
    return { ...base, verdict: 'unknown', reason: `not checked: no handling equipment recorded for the ${fmt(g, 1)} % ${where}` };
  }
  const gross = crate.grossKg;
  type Option = { e: HandlingEquipment; limit: number; capacity: 'ok' | 'over' | 'unknown' };
  const options: Option[] = equipment.map((e) => ({
    e,
    limit: rampLimitPct(e),
    capacity: !isKnownPositive(e.capacityKg) || !isKnownPositive(gross) ? 'unknown' : e.capacityKg >= gross ? 'ok' : 'over',
  }));
  const best = [...options].sort((a, b) => b.limit - a.limit);
  const ok = best.find((o) => o.limit >= g && o.capacity === 'ok');
  if (ok) {
    const margin = ok.limit - g;
    return {
      ...base,
      verdict: 'pass',
      reason: `${where} at ${fmt(g, 1)} %: ${HANDLING_LABEL[ok.e.kind]} allowed up to ${fmt(ok.limit, 1)} %`,
      margin,
      marginUnit: '%',
      marginRatio: g > 0 ? ok.limit / g - 1 : Infinity,
    };
  }
  const maybe = best.find((o) => o.limit >= g && o.capacity === 'unknown');
  if (maybe) {
    return {
      ...base,
      verdict: 'unknown',
      reason: `not checked: ${HANDLING_LABEL[maybe.e.kind]} may take the ${fmt(g, 1)} % ${where}, but its capacity or the crate's gross mass is unknown`,
    };
  }
  const steepest = best[0];
  const margin = steepest.limit - g;
  const list = options.map((o) => `${HANDLING_LABEL[o.e.kind]} ${fmt(o.limit, 1)} %${o.capacity === 'over' ? ' (over capacity)' : ''}`).join(', ');
  return {
    ...base,
    verdict: 'fail',
    reason: `${where} at ${fmt(g, 1)} %: no equipment at hand may take it (${list}); winch, or bring a truck rated for the gradient`,
    margin: Math.min(margin, 0),
    marginUnit: '%',
    marginRatio: g > 0 ? Math.min(steepest.limit / g - 1, 0) : undefined,
  };
}
