/**
 * One verdict per item handled by people: one person, a team of N, mechanical aid required, or no
 * verdict, with the method named, the working and the cautions.
 *
 * The individual capability comes from the selected method (a production setting):
 * - 'niosh': the governing RWL of the Revised NIOSH Lifting Equation (NIOSH 94-110);
 * - 'uk-guideline': the HSE guideline-weight filter (INDG143 Fig. 1, L23 App. 3).
 * Teams use the L23 team rule (2 people: 2/3 of the sum, 3 people: 1/2 of the sum) applied to the
 * individual capability at the same task geometry; four or more have no published factor, so the
 * largest team considered is three. With the NIOSH method the team rule is borrowed from the UK
 * guidance (the manual gives no team factor): the verdict says so.
 */
import { handlingCautions } from './cautions.ts';
import { guidelineWeightKg, type GuidelineTask } from './guideline-weights.ts';
import { nioshTask, type NioshTask } from './niosh-task.ts';
import { MAX_TEAM_WITH_PUBLISHED_FACTOR, teamCapacityKg } from './team.ts';

export type HandlingMethod = 'niosh' | 'uk-guideline';

export type HandlingVerdictKind = 'one person' | 'team of N' | 'mechanical aid required' | 'no verdict';

export interface HandlingItem {
  label: string;
  /** Item mass, kg (add any container or packing). */
  massKg: number;
  method: HandlingMethod;
  /** Task description for the NIOSH method (its `loadKg` is overwritten by `massKg`). */
  niosh?: Omit<NioshTask, 'loadKg'>;
  /** Task description for the guideline filter. */
  guideline?: GuidelineTask;
  /** Largest team the crew can field for this item (1–3); default 3. */
  maxTeamSize?: number;
}

export interface HandlingVerdict {
  verdict: HandlingVerdictKind;
  /** People needed: 1, 2 or 3; null unless the verdict is one person or a team. */
  teamSize: number | null;
  /** Capability of one person by the method, kg (NaN when the method does not apply). */
  individualCapacityKg: number;
  /** Capability of the team chosen (or of one person), kg. */
  capacityKg: number;
  method: string;
  reasons: string[];
  cautions: string[];
}

const METHOD_NAMES: Record<HandlingMethod, string> = {
  niosh: 'Revised NIOSH Lifting Equation (NIOSH Publication 94-110, 2021 revision)',
  'uk-guideline': 'HSE guideline-weight filter (INDG143 rev4 Figure 1; L23 Appendix 3)',
};

/** The verdict for one item. Missing or out-of-method input gives 'no verdict' with reasons, never a pass. */
export function handlingVerdict(item: HandlingItem): HandlingVerdict {
  const reasons: string[] = [];
  const cautions = handlingCautions();
  const name = METHOD_NAMES[item.method] ?? String(item.method);
  const none = (why: string[]): HandlingVerdict => ({
    verdict: 'no verdict', teamSize: null, individualCapacityKg: Number.NaN, capacityKg: Number.NaN, method: name, reasons: [...reasons, ...why], cautions,
  });
  if (!(item.method in METHOD_NAMES)) return none([`Unknown method "${String(item.method)}".`]);
  if (typeof item.massKg !== 'number' || !Number.isFinite(item.massKg) || item.massKg <= 0) {
    return none([`${item.label}: mass missing or invalid (got ${String(item.massKg)}): no verdict until it is known.`]);
  }
  const maxTeam = item.maxTeamSize ?? MAX_TEAM_WITH_PUBLISHED_FACTOR;
  if (!Number.isInteger(maxTeam) || maxTeam < 1) return none([`Largest team must be a whole number of at least 1 (got ${String(maxTeam)}).`]);

  let individual: number;
  if (item.method === 'niosh') {
    if (!item.niosh) return none([`${item.label}: no NIOSH task description (hand positions, frequency, duration, coupling).`]);
    const r = nioshTask({ ...item.niosh, loadKg: item.massKg });
    reasons.push(...r.reasons);
    if (!r.applies) return none([`${item.label}: the NIOSH equation does not apply to this task, so it gives no verdict.`]);
    individual = r.governingRwlKg;
    reasons.push(`RWL ${individual.toFixed(1)} kg (governing: ${r.governingEnd}); lifting index ${Number.isFinite(r.liftingIndex) ? r.liftingIndex.toFixed(2) : '∞'}.`);
  } else {
    if (!item.guideline) return none([`${item.label}: no guideline task description (zones, reach, frequency, twist).`]);
    const g = guidelineWeightKg(item.guideline);
    reasons.push(...g.reasons);
    if (!g.applies) return none([`${item.label}: the guideline filter cannot be applied to this input.`]);
    individual = g.guidelineKg;
    reasons.push(`Guideline figure for one person ${individual.toFixed(1)} kg.`);
  }

  if (item.massKg <= individual) {
    reasons.push(`${item.massKg} kg is within one person's figure.`);
    return { verdict: 'one person', teamSize: 1, individualCapacityKg: individual, capacityKg: individual, method: name, reasons, cautions };
  }
  const largest = Math.min(maxTeam, MAX_TEAM_WITH_PUBLISHED_FACTOR);
  for (let n = 2; n <= largest; n++) {
    const cap = teamCapacityKg(new Array<number>(n).fill(individual));
    if (cap !== null && item.massKg <= cap) {
      reasons.push(
        `Team of ${n}: capability ${cap.toFixed(1)} kg by the L23 team rule (${n === 2 ? 'two-thirds' : 'half'} of the sum of individual figures)` +
          (item.method === 'niosh' ? ', applied to each person\'s NIOSH RWL (the NIOSH manual has no team factor).' : '.'),
      );
      return { verdict: 'team of N', teamSize: n, individualCapacityKg: individual, capacityKg: cap, method: name, reasons, cautions };
    }
  }
  if (individual === 0) reasons.push('The method recommends no load at this geometry: change the task or use a mechanical aid.');
  reasons.push(
    `${item.massKg} kg exceeds what ${largest === 1 ? 'one person' : `a team of ${largest}`} may handle by this method; ` +
      'no factor is published for teams of four or more.',
  );
  const cap = teamCapacityKg(new Array<number>(largest).fill(individual)) ?? Number.NaN;
  return { verdict: 'mechanical aid required', teamSize: null, individualCapacityKg: individual, capacityKg: cap, method: name, reasons, cautions };
}
