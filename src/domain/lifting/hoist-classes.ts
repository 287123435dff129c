/**
 * Hoist class rule sets, as data, selectable per production. The one given here is German event
 * practice (IGVW SQ P2 class definitions, quoted in trade press and makers' statements) [PUB-2]:
 * - D8: "is not to be used for moving or holding loads overhead" of people; in events it lifts only
 *   during set-up and dismantling, and a load held over people needs a secondary suspension;
 * - D8+: "constructed and dimensioned in such a way that the moving of overhead loads is possible
 *   provided that no persons are standing under the load and that it is not necessary to install
 *   safety backups when the hoist is switched off"; a D8 hoist used as D8+ is derated to half its
 *   rating and has a second brake (makers' statements);
 * - C1: may move and hold loads over people (designed to 10:1 against 5:1 for D8, trade press 2005).
 * These are one country's practice: local codes prevail. Ballast plans transport and installation
 * lifts, always with nobody beneath the load, so it never relies on a class allowing people below.
 */

export type HoistClass = 'D8' | 'D8+' | 'C1';

export interface HoistClassRule {
  label: string;
  /** What the class allows, in words for the screens and the PDF. */
  allows: string;
  /** May it move a load with nobody beneath (set-up and dismantling)? */
  movesLoadsWithNobodyBelow: boolean;
  /** May it hold a load in the show position without a secondary suspension? */
  holdsWithoutSecondarySuspension: boolean;
  /** May a load be moved or held over people? (Ballast refuses such plans anyway.) */
  overPeople: boolean;
  /** Design factor quoted for the class (tension at failure / rated load), where one is published. */
  designFactor: number | null;
}

/** How a hoist of one class may be used as another, with the factor on its rated load. */
export interface HoistUseAsRule {
  from: HoistClass;
  as: HoistClass;
  ratingFactor: number;
  requires: string[];
  source: string;
}

export interface HoistRuleSet {
  id: string;
  name: string;
  source: string;
  classes: Record<HoistClass, HoistClassRule>;
  useAs: HoistUseAsRule[];
}

export const HOIST_RULE_SETS: Record<string, HoistRuleSet> = {
  'igvw-sq-p2': {
    id: 'igvw-sq-p2',
    name: 'German event practice (IGVW SQ P2 classes D8, D8+, C1)',
    source: 'IGVW SQ P2 class definitions as quoted in trade press and makers\' statements [PUB-2]',
    classes: {
      D8: {
        label: 'D8',
        allows: 'Moving loads during set-up and dismantling with nobody beneath; not for moving or holding loads over people; a load held over people needs a secondary suspension.',
        movesLoadsWithNobodyBelow: true,
        holdsWithoutSecondarySuspension: false,
        overPeople: false,
        designFactor: 5,
      },
      'D8+': {
        label: 'D8+',
        allows: 'Moving loads with nobody standing beneath, and holding them without a safety backup when switched off.',
        movesLoadsWithNobodyBelow: true,
        holdsWithoutSecondarySuspension: true,
        overPeople: false,
        designFactor: null,
      },
      C1: {
        label: 'C1',
        allows: 'Moving and holding loads over people.',
        movesLoadsWithNobodyBelow: true,
        holdsWithoutSecondarySuspension: true,
        overPeople: true,
        designFactor: 10,
      },
    },
    useAs: [
      {
        from: 'D8',
        as: 'D8+',
        ratingFactor: 0.5,
        requires: ['a second brake'],
        source: 'makers\' statements: a D8 hoist used as D8+ is derated to half its rating and has a second brake [PUB-2]',
      },
    ],
  },
};

export const DEFAULT_HOIST_RULE_SET = 'igvw-sq-p2';

export interface HoistUseResult {
  /** Rating that applies in this use, kg; null where the use is not allowed. */
  effectiveRatingKg: number | null;
  problems: string[];
  notes: string[];
}

/**
 * The rating of a hoist used as a class (default: its own class), under a rule set. A class may be
 * used as itself; a lower class as a higher one only where the rule set says how (D8 as D8+: half
 * the rating and a second brake); a higher class may always serve a lower duty.
 */
export function hoistRatingForUse(input: {
  ratedLoadKg: number;
  hoistClass: HoistClass;
  usedAs?: HoistClass;
  hasSecondBrake?: boolean;
  ruleSetId?: string;
  label?: string;
}): HoistUseResult {
  const name = input.label ?? 'Hoist';
  const set = HOIST_RULE_SETS[input.ruleSetId ?? DEFAULT_HOIST_RULE_SET];
  if (!set) return { effectiveRatingKg: null, problems: [`${name}: unknown hoist rule set "${String(input.ruleSetId)}".`], notes: [] };
  if (!(typeof input.ratedLoadKg === 'number' && input.ratedLoadKg > 0 && Number.isFinite(input.ratedLoadKg))) {
    return { effectiveRatingKg: null, problems: [`${name}: rated load missing (got ${String(input.ratedLoadKg)}).`], notes: [] };
  }
  if (!(input.hoistClass in set.classes)) return { effectiveRatingKg: null, problems: [`${name}: class "${String(input.hoistClass)}" is not in ${set.name}.`], notes: [] };
  const as = input.usedAs ?? input.hoistClass;
  if (!(as in set.classes)) return { effectiveRatingKg: null, problems: [`${name}: class "${String(as)}" is not in ${set.name}.`], notes: [] };
  const order: HoistClass[] = ['D8', 'D8+', 'C1'];
  const notes = [`${name}: ${set.classes[as].label} — ${set.classes[as].allows}`];
  if (order.indexOf(as) <= order.indexOf(input.hoistClass)) {
    return { effectiveRatingKg: input.ratedLoadKg, problems: [], notes };
  }
  const rule = set.useAs.find((r) => r.from === input.hoistClass && r.as === as);
  if (!rule) {
    return { effectiveRatingKg: null, problems: [`${name}: a ${input.hoistClass} hoist may not be used as ${as} under ${set.name}.`], notes };
  }
  const problems: string[] = [];
  if (rule.requires.includes('a second brake') && !input.hasSecondBrake) {
    problems.push(`${name}: a ${rule.from} hoist used as ${rule.as} needs a second brake; none is recorded.`);
  }
  notes.push(`${name}: ${rule.from} used as ${rule.as}: rating × ${rule.ratingFactor} (${rule.source}).`);
  return { effectiveRatingKg: input.ratedLoadKg * rule.ratingFactor, problems, notes };
}
