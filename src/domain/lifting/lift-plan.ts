/**
 * The lift-plan evaluator: from a load (mass, CoG and its uncertainty), pick points, rigging, hoists
 * and hanging points, the loads every component sees, and a verdict with every problem named.
 *
 * Method, in order:
 * 1. Design load W = mass × (1 + contingency). Leg tensions carry W; the rigging's own weight is
 *    added to the hook load (it hangs mostly above the pick points and is small against the load).
 * 2. CoG cases: the nominal CoG and every corner of its uncertainty box. Each case is solved; for each
 *    leg and component the worst case governs (and is named).
 * 3. Legs.
 *    - One hook: the load hangs freely with its CoG plumb under the hook. Ballast finds where the hook
 *      sits on the load and how the load tilts from the sling lengths (see hanging-equilibrium.ts),
 *      then the tensions by statics: two or three legs exactly. Four or more legs are statically
 *      indeterminate: each leg is rated as if only two legs carry, W / (2 sin θ), and never below what
 *      it carries in any three-leg subset that can hold the load at that geometry (NAVEDTRA 14080:
 *      "it is possible for two of the legs to take practically the full load") [PUB-2]. EN 13414-1
 *      leg factors (three legs share) only as an explicit choice, labelled, for symmetric loads.
 *    - Two or more hoists, or a spreader beam: vertical legs, shares by statics (lever rule,
 *      barycentric shares); four or more as if two carry (W / 2, and never below any three-leg share).
 * 4. Angles: below 30° from the horizontal refused [PUB-2 NAVEDTRA 14080; B30.9].
 * 5. Hook load: static = W + all rigging below the hook; dynamic = static × DAF (default 1.10, GL Noble
 *    Denton 0027/ND Table 5-1 [PUB-2]; a production setting with its source).
 * 6. Utilisation of each component against the load it sees: hoist — dynamic hook load, against its
 *    rating in the class it is used as; hanging point — dynamic hook load + the hoist's own weight and
 *    chain; each sling, shackle and lifting point — its leg tension × DAF, against the sling's vertical
 *    rating × hitch factor, the shackle's rating, the lifting point's rating derated for the pull angle
 *    from its axis (maker's table). The leg tension acts along the sling, so the sling angle is already
 *    in it; a basket's two parts run along the leg, so its factor is 2.
 * 7. Exclusion zone: plan footprint + margin [PRACTICE]. A plan with anyone beneath the load, or an
 *    occupied area inside the zone, is refused.
 * 8. Verdict: 'over capacity' if any component is over 100 %; otherwise 'no verdict' if anything is
 *    missing or refused; otherwise 'ok'. Cautions are always attached.
 */
import { liftPlanInput, type GearItem, type HoistItem, type LiftPlanInput, type LiftingPointItem, type ShackleItem, type SlingItem, type SpreaderBeamItem } from '../contracts/lifting.ts';
import { dot, type Vec3 } from '../geometry/vec3.ts';
import { liftPlanCautions } from './cautions.ts';
import { DEFAULT_DYNAMIC_FACTOR, dynamicFactorProblem, type DynamicFactor } from './dynamic-factor.ts';
import { exclusionZone, rectsOverlap, type ExclusionZone, type PlanRect } from './exclusion-zone.ts';
import { gearLabel, gearUsableOn, liftingPointRatingKg } from './gear.ts';
import { hangingEquilibrium, type HangingResult } from './hanging-equilibrium.ts';
import { hitchFactor } from './hitch.ts';
import { hoistRatingForUse, HOIST_RULE_SETS } from './hoist-classes.ts';
import { en13414LegFactor, EN13414_LABEL } from './leg-factors.ts';
import { solveLinear } from './linear-solve.ts';
import { verticalPickLoadsKg } from './pick-point-loads.ts';
import { marginInside, type Xy } from './plan-polygon.ts';
import { MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG } from './sling-angle.ts';

export type LiftFindingSeverity = 'refusal' | 'missing' | 'over capacity' | 'notice';

export type LiftFindingCode =
  | 'invalid-input'
  | 'missing-gear'
  | 'wrong-gear-kind'
  | 'gear-expired'
  | 'missing-rating'
  | 'people-below'
  | 'occupied-area'
  | 'cog-not-surrounded'
  | 'hook-below-pick-points'
  | 'sling-too-short'
  | 'sling-angle-below-30'
  | 'load-turns-over'
  | 'tilt'
  | 'slack-sling'
  | 'four-plus-legs-two-carry'
  | 'en13414-choice'
  | 'hoist-class'
  | 'hitch'
  | 'lifting-point-angle'
  | 'dynamic-factor'
  | 'mass-estimate'
  | 'bounds-missing'
  | 'over-capacity';

/** One problem or notice, with the item it concerns. Only 'notice' findings leave an 'ok' possible. */
export interface LiftFinding {
  severity: LiftFindingSeverity;
  code: LiftFindingCode;
  message: string;
  subject?: string;
}

/** One component against the load it sees. Loads are dynamic (× DAF), kg. */
export interface ComponentUse {
  subject: string;
  kind: 'hoist' | 'hanging-point' | 'sling' | 'shackle' | 'lifting-point' | 'spreader-beam';
  gearId?: string;
  pickPointId?: string;
  loadKg: number;
  capacityKg: number | null;
  /** load / capacity; null when the capacity is missing. */
  utilisation: number | null;
  /** The CoG case that governs, where it matters. */
  governingCase?: string;
  basis: string;
}

export interface LegResult {
  pickPointId: string;
  /** Static tension along the leg at the nominal CoG, kg. */
  nominalTensionKg: number;
  /** Largest static tension over the CoG cases (as rated), kg. */
  worstTensionKg: number;
  governingCase: string;
  /** worst × DAF, kg: what the sling, shackle and lifting point are checked against. */
  designTensionKg: number;
  angleFromHorizontalDeg: number;
  minAngleFromHorizontalDeg: number;
  /** Taut at the nominal CoG. */
  taut: boolean;
  ratingBasis: 'statics' | 'two-carry' | 'en13414';
}

export interface CogCaseResult {
  label: string;
  cogMm: Vec3;
  /** Static leg tensions as rated, kg, in pick point order; null where the case could not be solved. */
  tensionsKg: number[] | null;
  tiltDeg: number | null;
}

export interface LiftLoads {
  massKg: number;
  contingency: number;
  /** mass × (1 + contingency), kg. */
  designLoadKg: number;
  riggingBelowHookKg: number;
  staticHookLoadKg: number;
  dynamicFactor: DynamicFactor;
  dynamicHookLoadKg: number;
}

export interface LiftPlanResult {
  verdict: 'ok' | 'over capacity' | 'no verdict';
  findings: LiftFinding[];
  /** The messages of every finding that is not a notice. */
  problems: string[];
  cautions: string[];
  methods: string[];
  loads: LiftLoads | null;
  legs: LegResult[];
  components: ComponentUse[];
  cogCases: CogCaseResult[];
  /** Nominal hanging geometry for one hook (hook, pick points and tilt, for the 3D view). */
  hanging: HangingResult | null;
  tiltDeg: number | null;
  exclusionZone: ExclusionZone | null;
}

/** Tilt above which a freely hanging load is taken to turn over or hang unworkably steeply, degrees [PRACTICE]. */
export const TURN_OVER_TILT_DEG = 45;

const DEG = 180 / Math.PI;
const fmt = (kg: number) => `${Math.round(kg).toLocaleString('en-GB')} kg`;

interface LegRig {
  id: string;
  positionMm: Vec3;
  axis: Vec3;
  sling: SlingItem | null;
  shackles: ShackleItem[];
  liftingPoint: LiftingPointItem | null;
  riggingKg: number;
  hitch: 'vertical' | 'choker' | 'basket';
  chokeAngleDeg?: number;
  legLengthMm?: number;
}

interface CaseLegs {
  label: string;
  cogMm: Vec3;
  tensions: number[];
  dirs: Vec3[];
  angles: number[];
  taut: boolean[];
  tilt: number | null;
}

function unit(v: Vec3): Vec3 {
  const l = Math.hypot(v[0], v[1], v[2]);
  return l > 0 ? [v[0] / l, v[1] / l, v[2] / l] : [0, 0, 1];
}

/** The nominal CoG and the corners of its uncertainty box, without repeats. */
function cogCases(cog: Vec3, unc: LiftPlanInput['load']['cogUncertainty']): { label: string; cogMm: Vec3 }[] {
  const out: { label: string; cogMm: Vec3 }[] = [{ label: 'nominal', cogMm: cog }];
  if (!unc) return out;
  let lo: Vec3;
  let hi: Vec3;
  if ('plusMinusMm' in unc) {
    const d = unc.plusMinusMm.map((v) => Math.abs(v)) as Vec3;
    lo = [cog[0] - d[0], cog[1] - d[1], cog[2] - d[2]];
    hi = [cog[0] + d[0], cog[1] + d[1], cog[2] + d[2]];
  } else {
    lo = unc.boxMm.minMm;
    hi = unc.boxMm.maxMm;
  }
  const seen = new Set<string>([cog.join(',')]);
  for (const sx of [0, 1]) {
    for (const sy of [0, 1]) {
      for (const sz of [0, 1]) {
        const c: Vec3 = [sx ? hi[0] : lo[0], sy ? hi[1] : lo[1], sz ? hi[2] : lo[2]];
        const key = c.join(',');
        if (seen.has(key)) continue;
        seen.add(key);
        out.push({ label: `CoG extreme x${sx ? '+' : '−'} y${sy ? '+' : '−'} z${sz ? '+' : '−'}`, cogMm: c });
      }
    }
  }
  return out;
}

/** Tensions of every 3-leg subset that can hold W·up at this geometry without a leg pushing. */
function tripleMaxima(dirs: Vec3[], up: Vec3, W: number): number[] {
  const n = dirs.length;
  const best = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      for (let k = j + 1; k < n; k++) {
        const s = [i, j, k];
        const t = solveLinear([0, 1, 2].map((d) => s.map((m) => dirs[m][d])), [W * up[0], W * up[1], W * up[2]]);
        if (!t || t.some((x) => x < -1e-9 * Math.max(W, 1))) continue;
        s.forEach((m, q) => (best[m] = Math.max(best[m], t[q])));
      }
    }
  }
  return best;
}

function emptyResult(findings: LiftFinding[], methods: string[]): LiftPlanResult {
  return {
    verdict: findings.some((f) => f.severity === 'over capacity') ? 'over capacity' : 'no verdict',
    findings,
    problems: findings.filter((f) => f.severity !== 'notice').map((f) => f.message),
    cautions: liftPlanCautions(),
    methods,
    loads: null,
    legs: [],
    components: [],
    cogCases: [],
    hanging: null,
    tiltDeg: null,
    exclusionZone: null,
  };
}

/** Evaluates a lift plan. Never throws on bad input: every problem becomes a finding. */
export function evaluateLiftPlan(input: LiftPlanInput): LiftPlanResult {
  const findings: LiftFinding[] = [];
  const methods: string[] = [];
  const add = (severity: LiftFindingSeverity, code: LiftFindingCode, message: string, subject?: string) => {
    if (!findings.some((f) => f.code === code && f.message === message)) findings.push({ severity, code, message, subject });
  };

  const parsed = liftPlanInput.safeParse(input);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) add('missing', 'invalid-input', `${issue.path.join('.') || 'plan'}: ${issue.message}`);
    return emptyResult(findings, methods);
  }
  const plan = parsed.data;
  const ids = new Set<string>();
  for (const p of plan.pickPoints) {
    if (ids.has(p.id)) add('missing', 'invalid-input', `Pick point id "${p.id}" is used twice.`);
    ids.add(p.id);
  }

  // Safety refusals that need no arithmetic.
  if (plan.peopleBelow) {
    add('refusal', 'people-below', 'The plan holds the load over people. Ballast plans lifts with nobody beneath the load and refuses this plan.');
  }

  // Gear.
  const gearById = new Map<string, GearItem>(plan.gear.map((g) => [g.id, g]));
  const checked = new Set<string>();
  function takeGear<K extends GearItem['kind']>(id: string | undefined, kind: K, role: string): Extract<GearItem, { kind: K }> | null {
    if (!id) return null;
    const g = gearById.get(id);
    if (!g) {
      add('missing', 'missing-gear', `${role}: gear "${id}" is not in the plan's gear list.`, role);
      return null;
    }
    if (g.kind !== kind) {
      add('missing', 'wrong-gear-kind', `${role}: ${gearLabel(g)} is a ${g.kind}, not a ${kind}.`, role);
      return null;
    }
    if (!checked.has(g.id)) {
      checked.add(g.id);
      const u = gearUsableOn(g, plan.evaluationDate);
      if (!u.usable) add('refusal', 'gear-expired', u.reason, gearLabel(g));
    }
    return g as Extract<GearItem, { kind: K }>;
  }

  // Load, contingency, dynamic factor.
  const W = plan.load.massKg * (1 + plan.contingency);
  if (!plan.load.massWeighed) {
    add('notice', 'mass-estimate', `The mass ${fmt(plan.load.massKg)} has not been weighed: it is an estimate${plan.contingency > 0 ? ` (contingency +${Math.round(plan.contingency * 1000) / 10} % applied)` : ', and no contingency is applied'}.`);
  }
  const df = plan.dynamicFactor ?? DEFAULT_DYNAMIC_FACTOR;
  const dfProblem = dynamicFactorProblem(df);
  if (dfProblem) add('missing', 'dynamic-factor', dfProblem);
  methods.push(`Dynamic factor ${df.value}: ${df.source}.`);

  // Rigging at each pick point.
  const rigs: LegRig[] = plan.pickPoints.map((p) => {
    const role = `Pick point ${p.id}`;
    const sling = takeGear(p.slingGearId, 'sling', `${role} sling`);
    const shackles = p.shackleGearIds.map((id, k) => takeGear(id, 'shackle', `${role} shackle ${k + 1}`)).filter((s): s is ShackleItem => s !== null);
    const liftingPoint = takeGear(p.liftingPointGearId, 'lifting-point', `${role} lifting point`);
    const riggingKg = (sling?.massKg ?? 0) + shackles.reduce((a, s) => a + s.massKg, 0) + (liftingPoint?.massKg ?? 0);
    return {
      id: p.id, positionMm: p.positionMm, axis: unit(p.axis ?? [0, 0, 1]), sling, shackles, liftingPoint, riggingKg,
      hitch: p.hitch, chokeAngleDeg: p.chokeAngleDeg, legLengthMm: p.legLengthMm,
    };
  });
  plan.pickPoints.forEach((p) => {
    if (!p.slingGearId) add('missing', 'missing-gear', `Pick point ${p.id}: no sling chosen.`, `pick point ${p.id}`);
    if (!p.liftingPointGearId) {
      add('notice', 'missing-rating', `Pick point ${p.id}: no lifting point item recorded; its rating is not checked here (confirm the attachment to the load).`, `pick point ${p.id}`);
    }
  });

  const n = rigs.length;
  const pickXy: Xy[] = rigs.map((r) => [r.positionMm[0], r.positionMm[1]]);
  const cases = cogCases(plan.load.cogMm, plan.load.cogUncertainty);
  if (plan.load.cogUncertainty && 'boxMm' in plan.load.cogUncertainty) {
    const b = plan.load.cogUncertainty.boxMm;
    if (!plan.load.cogMm.every((v, i) => v >= b.minMm[i] && v <= b.maxMm[i])) add('notice', 'invalid-input', 'The nominal CoG lies outside its uncertainty box.');
  }
  methods.push(`CoG evaluated at ${cases.length === 1 ? 'its nominal position only (no uncertainty given)' : `its nominal position and the ${cases.length - 1} corners of its uncertainty box; the worst case governs each leg and component`}.`);

  // Pick points must surround the CoG in plan, in every case.
  if (n >= 2) {
    const outside = cases.filter((c) => marginInside([c.cogMm[0], c.cogMm[1]], pickXy) < -1);
    if (outside.length) {
      add(
        'refusal',
        'cog-not-surrounded',
        `The pick points do not surround the CoG in plan at ${outside.map((c) => c.label).join(', ')}: the load would tilt until it hangs on fewer points.`,
      );
    }
  }

  const kind = plan.suspension.kind;
  const sus = plan.suspension;
  const caseResults: CaseLegs[] = [];
  let hanging: HangingResult | null = null;
  let ratingBasis: LegResult['ratingBasis'] = n >= 4 ? 'two-carry' : 'statics';
  const twoCarryNote = `${n} legs: statically indeterminate, rated as if only two legs carry ("it is possible for two of the legs to take practically the full load", NAVEDTRA 14080) and never below any three-leg share.`;

  if (kind === 'single-hook') {
    methods.push('One hook: the load hangs with its CoG plumb under the hook; the hook position and tilt follow from the sling lengths (least potential energy), tensions by statics.');
    const lengths: (number | null)[] = rigs.map((r) => {
      if (r.legLengthMm !== undefined) return r.legLengthMm;
      if (!r.sling) return null;
      if (r.hitch === 'basket') return r.sling.lengthMm / 2;
      if (r.hitch === 'choker') {
        add('missing', 'hitch', `Pick point ${r.id}: a choker's effective leg length depends on the wrap: type it.`, `pick point ${r.id}`);
        return null;
      }
      return r.sling.lengthMm;
    });
    const useEn = plan.legRating === 'en13414-symmetric' && n >= 4;
    if (plan.legRating === 'en13414-symmetric' && n < 4) add('notice', 'en13414-choice', `EN 13414-1 leg factors not used: ${n} legs are solved by statics.`);
    if (useEn) {
      ratingBasis = 'en13414';
      add('notice', 'en13414-choice', `Legs rated by ${EN13414_LABEL}, chosen explicitly: valid only if the load is symmetric and all legs share.`);
      methods.push(EN13414_LABEL + ' [PUB-2].');
    } else if (n >= 4) {
      add('notice', 'four-plus-legs-two-carry', twoCarryNote);
    }
    if (lengths.every((l): l is number => l !== null)) {
      for (const c of cases) {
        const eq = hangingEquilibrium({ loadKg: W, cogMm: c.cogMm, pickPointsMm: rigs.map((r) => r.positionMm), slingLengthsMm: lengths });
        if (!eq.ok) {
          for (const m of eq.problems) add('refusal', m.includes('shorter than') ? 'sling-too-short' : 'invalid-input', c.label === 'nominal' ? m : `At ${c.label}: ${m}`);
          continue;
        }
        const r = eq.result;
        if (c.label === 'nominal') hanging = r;
        const thetas = r.legAnglesFromHorizontalDeg;
        let tensions: number[];
        if (useEn) {
          const beta = Math.max(...thetas.map((t) => 90 - t));
          const f = en13414LegFactor({ legs: n, betaFromVerticalDeg: beta });
          if (f.factor === null) {
            add('refusal', 'en13414-choice', `EN 13414-1: ${f.reason}`);
            tensions = thetas.map(() => Number.NaN);
          } else tensions = thetas.map(() => W / f.factor!);
          if (r.taut.some((t) => !t)) add('refusal', 'en13414-choice', `EN 13414-1 assumes all legs share, but at ${c.label} leg${r.taut.filter((t) => !t).length > 1 ? 's' : ''} ${rigs.filter((_, i) => !r.taut[i]).map((x) => x.id).join(', ')} hang slack.`);
        } else if (n >= 4 || r.tensionsKg === null) {
          const triples = tripleMaxima(r.legDirectionsInLoad, r.upInLoad, W);
          tensions = thetas.map((t, i) => Math.max(W / 2 / Math.sin(Math.max(t, 1e-6) / DEG), triples[i], r.tensionsKg?.[i] ?? 0));
        } else tensions = r.tensionsKg;
        caseResults.push({ label: c.label, cogMm: c.cogMm, tensions, dirs: r.legDirectionsInLoad, angles: thetas, taut: r.taut, tilt: r.tiltDeg });
        if (thetas.some((t) => t <= 0)) add('refusal', 'hook-below-pick-points', `At ${c.label} the hook would be below or level with a pick point.`);
        if (r.tiltDeg > TURN_OVER_TILT_DEG) {
          add('refusal', 'load-turns-over', `At ${c.label} the load would tilt ${r.tiltDeg.toFixed(0)}°: it turns over or hangs on fewer slings (CoG above the pick points, or slings very unequal).`);
        }
      }
      const nominal = caseResults.find((c) => c.label === 'nominal');
      if (nominal && nominal.tilt !== null) {
        if (nominal.tilt > 1) add('notice', 'tilt', `With these sling lengths the load tilts ${nominal.tilt.toFixed(1)}° as it hangs.`);
        if (plan.maxTiltDeg !== undefined) {
          const worst = caseResults.reduce((a, c) => Math.max(a, c.tilt ?? 0), 0);
          if (worst > plan.maxTiltDeg) add('refusal', 'tilt', `The load tilts up to ${worst.toFixed(1)}°, more than the ${plan.maxTiltDeg}° allowed for this lift.`);
        }
        nominal.taut.forEach((t, i) => {
          if (!t) add('notice', 'slack-sling', `Sling at pick point ${rigs[i].id} hangs slack: the other legs carry the load.`, `pick point ${rigs[i].id}`);
        });
      }
    }
  } else {
    // Vertical legs: one hoist per pick point, or a spreader beam.
    methods.push('Vertical legs: each pick point\'s share of the load by statics (lever rule for two, barycentric shares for three).');
    if (plan.legRating === 'en13414-symmetric') add('notice', 'en13414-choice', 'EN 13414-1 leg factors rate multi-leg slings on one master link: not used for separate vertical legs.');
    if (n >= 4) add('notice', 'four-plus-legs-two-carry', twoCarryNote);
    const up: Vec3 = [0, 0, 1];
    for (const c of cases) {
      let tensions: number[] | null = null;
      if (n === 1) tensions = [W];
      else if (n <= 3) {
        try {
          tensions = verticalPickLoadsKg({ loadKg: W, cogMm: c.cogMm, pickPointsMm: rigs.map((r) => r.positionMm) });
        } catch (e) {
          const m = e instanceof Error ? e.message : String(e);
          add('refusal', m.includes('surround') ? 'cog-not-surrounded' : 'invalid-input', c.label === 'nominal' ? m : `At ${c.label}: ${m}`);
        }
      } else {
        // Vertical legs are parallel, so the 3-leg subsets come from the plan statics.
        const planTriples = new Array<number>(n).fill(0);
        for (let i = 0; i < n; i++) {
          for (let j = i + 1; j < n; j++) {
            for (let k = j + 1; k < n; k++) {
              try {
                const s = verticalPickLoadsKg({ loadKg: W, cogMm: c.cogMm, pickPointsMm: [rigs[i].positionMm, rigs[j].positionMm, rigs[k].positionMm] });
                [i, j, k].forEach((m, q) => (planTriples[m] = Math.max(planTriples[m], s[q])));
              } catch {
                // This subset cannot hold the load without a leg pushing: it is not a way the load can hang.
              }
            }
          }
        }
        tensions = rigs.map((_, i) => Math.max(W / 2, planTriples[i]));
      }
      let tilt: number | null = 0;
      if (n === 2) {
        const [a, b] = rigs.map((r) => r.positionMm);
        const span = Math.hypot(b[0] - a[0], b[1] - a[1]);
        if (span > 0) {
          const off = Math.abs((b[0] - a[0]) * (c.cogMm[1] - a[1]) - (b[1] - a[1]) * (c.cogMm[0] - a[0])) / span;
          const drop = (a[2] + b[2]) / 2 - c.cogMm[2];
          tilt = off < 1e-9 ? (drop >= 0 ? 0 : 180) : Math.atan2(off, drop) * DEG;
        }
      } else if (n === 1) {
        const a = rigs[0].positionMm;
        tilt = Math.atan2(Math.hypot(c.cogMm[0] - a[0], c.cogMm[1] - a[1]), a[2] - c.cogMm[2]) * DEG;
      }
      caseResults.push({ label: c.label, cogMm: c.cogMm, tensions: tensions ?? rigs.map(() => Number.NaN), dirs: rigs.map(() => up), angles: rigs.map(() => 90), taut: rigs.map(() => true), tilt });
    }
    const nominal = caseResults.find((c) => c.label === 'nominal');
    if (nominal && nominal.tilt !== null && nominal.tilt > 1) {
      add(nominal.tilt > TURN_OVER_TILT_DEG ? 'refusal' : 'notice', nominal.tilt > TURN_OVER_TILT_DEG ? 'load-turns-over' : 'tilt',
        `On ${n === 1 ? 'one point' : 'two points'} the load turns until its CoG hangs below the pick ${n === 1 ? 'point' : 'line'}: a tilt of ${nominal.tilt.toFixed(1)}°.`);
    }
  }

  // Legs: worst case governs.
  const legs: LegResult[] = [];
  const solved = caseResults.filter((c) => c.tensions.every(Number.isFinite));
  const nominalCase = caseResults.find((c) => c.label === 'nominal');
  if (solved.length > 0 && nominalCase) {
    rigs.forEach((r, i) => {
      let worst = -Infinity;
      let gov = 'nominal';
      let minAngle = Infinity;
      for (const c of solved) {
        if (c.tensions[i] > worst) {
          worst = c.tensions[i];
          gov = c.label;
        }
        if (c.taut[i]) minAngle = Math.min(minAngle, c.angles[i]);
      }
      if (!Number.isFinite(minAngle)) minAngle = nominalCase.angles[i];
      legs.push({
        pickPointId: r.id,
        nominalTensionKg: nominalCase.tensions[i],
        worstTensionKg: worst,
        governingCase: gov,
        designTensionKg: worst * df.value,
        angleFromHorizontalDeg: nominalCase.angles[i],
        minAngleFromHorizontalDeg: minAngle,
        taut: nominalCase.taut[i],
        ratingBasis,
      });
      if (minAngle < MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG - 1e-9) {
        add('refusal', 'sling-angle-below-30', `Leg at pick point ${r.id}: ${minAngle.toFixed(1)}° from horizontal, below the ${MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG}° minimum: not to be used (NAVEDTRA 14080; B30.9).`, `pick point ${r.id}`);
      }
    });
  }

  // Hook loads.
  const legRiggingKg = rigs.reduce((a, r) => a + r.riggingKg, 0);
  let beam: SpreaderBeamItem | null = null;
  let topRiggingKg = 0;
  if (sus.kind === 'spreader-beam') {
    beam = takeGear(sus.beamGearId, 'spreader-beam', 'Spreader beam');
    for (const id of sus.topRiggingGearIds) {
      const g = gearById.get(id);
      if (!g) add('missing', 'missing-gear', `Spreader beam top rigging: gear "${id}" is not in the plan's gear list.`);
      else {
        const u = gearUsableOn(g, plan.evaluationDate);
        if (!u.usable) add('refusal', 'gear-expired', u.reason, gearLabel(g));
        topRiggingKg += 'massKg' in g ? g.massKg : 0;
      }
    }
    add('notice', 'tilt', 'Hang the spreader beam so that its hook is plumb above the combined CoG of beam and load.');
  }
  const riggingBelowHookKg = legRiggingKg + (beam?.massKg ?? 0) + topRiggingKg;
  const staticHookLoadKg = W + riggingBelowHookKg;
  const loads: LiftLoads = {
    massKg: plan.load.massKg,
    contingency: plan.contingency,
    designLoadKg: W,
    riggingBelowHookKg,
    staticHookLoadKg,
    dynamicFactor: df,
    dynamicHookLoadKg: staticHookLoadKg * df.value,
  };

  // Components.
  const components: ComponentUse[] = [];
  const pushComponent = (c: ComponentUse) => {
    components.push(c);
    if (c.capacityKg === null) add('missing', 'missing-rating', `${c.subject}: no rating, so no verdict.`, c.subject);
  };
  if (legs.length === n) {
    rigs.forEach((r, i) => {
      const leg = legs[i];
      if (r.sling) {
        const hf = hitchFactor({
          slingType: r.sling.slingType, hitch: r.hitch, chokeAngleDeg: r.chokeAngleDeg, makerFactors: r.sling.hitchFactors,
          // A basket's two parts run along the leg, so the full basket factor applies to the leg tension.
          legAngleFromHorizontalDeg: 90,
        });
        if (hf.factor === null) add('missing', 'hitch', `Pick point ${r.id}: ${hf.reason}`, gearLabel(r.sling));
        pushComponent({
          subject: `${gearLabel(r.sling)} (leg ${r.id})`, kind: 'sling', gearId: r.sling.id, pickPointId: r.id,
          loadKg: leg.designTensionKg, capacityKg: hf.factor === null ? null : r.sling.verticalRatingKg * hf.factor,
          utilisation: null, governingCase: leg.governingCase,
          basis: `leg tension ${fmt(leg.worstTensionKg)} × DAF ${df.value}; vertical rating ${fmt(r.sling.verticalRatingKg)} × ${hf.reason}`,
        });
      }
      r.shackles.forEach((s) => {
        pushComponent({
          subject: `${gearLabel(s)} (leg ${r.id})`, kind: 'shackle', gearId: s.id, pickPointId: r.id, loadKg: leg.designTensionKg,
          capacityKg: s.ratingKg, utilisation: null, governingCase: leg.governingCase, basis: `leg tension ${fmt(leg.worstTensionKg)} × DAF ${df.value}; rating ${fmt(s.ratingKg)}`,
        });
      });
      if (r.liftingPoint) {
        // Worst over the CoG cases of tension against the rating at that case's pull angle.
        let worstU = -Infinity;
        let pick: ComponentUse | null = null;
        for (const c of solved) {
          const ang = Math.acos(Math.max(-1, Math.min(1, dot(c.dirs[i], r.axis)))) * DEG;
          const rt = liftingPointRatingKg(r.liftingPoint, ang);
          const load = c.tensions[i] * df.value;
          if (rt.ratingKg === null) {
            add('refusal', 'lifting-point-angle', c.label === 'nominal' ? rt.reason : `At ${c.label}: ${rt.reason}`, gearLabel(r.liftingPoint));
            pick = { subject: `${gearLabel(r.liftingPoint)} (pick point ${r.id})`, kind: 'lifting-point', gearId: r.liftingPoint.id, pickPointId: r.id, loadKg: load, capacityKg: null, utilisation: null, governingCase: c.label, basis: rt.reason };
            worstU = Infinity;
            continue;
          }
          const u = load / rt.ratingKg;
          if (u > worstU) {
            worstU = u;
            pick = { subject: `${gearLabel(r.liftingPoint)} (pick point ${r.id})`, kind: 'lifting-point', gearId: r.liftingPoint.id, pickPointId: r.id, loadKg: load, capacityKg: rt.ratingKg, utilisation: null, governingCase: c.label, basis: `leg tension ${fmt(c.tensions[i])} × DAF ${df.value}; ${rt.reason}` };
          }
        }
        if (pick) {
          if (pick.capacityKg === null) components.push(pick);
          else pushComponent(pick);
        }
      }
    });
  }

  const hoistAndPoint = (hoistGearId: string, usedAs: 'D8' | 'D8+' | 'C1' | undefined, hp: { label: string; ratingKg: number | null; source: string }, dynamicLoadKg: number, role: string, gov?: string) => {
    const hoist: HoistItem | null = takeGear(hoistGearId, 'hoist', role);
    if (!hoist) return;
    const use = hoistRatingForUse({ ratedLoadKg: hoist.ratedLoadKg, hoistClass: hoist.hoistClass, usedAs, hasSecondBrake: hoist.hasSecondBrake, ruleSetId: plan.hoistRuleSet, label: gearLabel(hoist) });
    for (const p of use.problems) add('refusal', 'hoist-class', p, gearLabel(hoist));
    methods.push(...use.notes);
    pushComponent({
      subject: gearLabel(hoist), kind: 'hoist', gearId: hoist.id, loadKg: dynamicLoadKg, capacityKg: use.effectiveRatingKg, utilisation: null, governingCase: gov,
      basis: `dynamic hook load ${fmt(dynamicLoadKg)}; rating ${fmt(hoist.ratedLoadKg)} as ${usedAs ?? hoist.hoistClass}`,
    });
    const hpLoad = dynamicLoadKg + hoist.selfWeightKg + hoist.chainWeightKg;
    pushComponent({
      subject: `hanging point ${hp.label}`, kind: 'hanging-point', loadKg: hpLoad, capacityKg: hp.ratingKg, utilisation: null, governingCase: gov,
      basis: `dynamic hook load ${fmt(dynamicLoadKg)} + hoist ${fmt(hoist.selfWeightKg)} + chain ${fmt(hoist.chainWeightKg)}; rating ${hp.ratingKg === null ? 'missing' : fmt(hp.ratingKg)} (${hp.source})`,
    });
  };

  if (sus.kind === 'single-hook' || sus.kind === 'spreader-beam') {
    hoistAndPoint(sus.hoistGearId, sus.hoistUsedAs, sus.hangingPoint, loads.dynamicHookLoadKg, 'Hoist');
    if (beam) {
      const below = (W + legRiggingKg) * df.value;
      pushComponent({
        subject: gearLabel(beam), kind: 'spreader-beam', gearId: beam.id, loadKg: below, capacityKg: beam.ratingKg, utilisation: null,
        basis: `(load ${fmt(W)} + rigging below the beam ${fmt(legRiggingKg)}) × DAF ${df.value}; rating ${fmt(beam.ratingKg)}`,
      });
    }
  } else {
    const byPick = new Map(sus.legs.map((l) => [l.pickPointId, l]));
    for (const l of sus.legs) if (!ids.has(l.pickPointId)) add('missing', 'invalid-input', `Hoist leg names pick point "${l.pickPointId}", which the plan does not have.`);
    rigs.forEach((r, i) => {
      const l = byPick.get(r.id);
      if (!l) {
        add('missing', 'missing-gear', `Pick point ${r.id}: no hoist above it.`, `pick point ${r.id}`);
        return;
      }
      const leg = legs[i];
      if (!leg) return;
      const dyn = (leg.worstTensionKg + r.riggingKg) * df.value;
      hoistAndPoint(l.hoistGearId, l.hoistUsedAs, l.hangingPoint, dyn, `Hoist over pick point ${r.id}`, leg.governingCase);
    });
  }
  for (const c of components) {
    c.utilisation = c.capacityKg === null ? null : c.loadKg / c.capacityKg;
    if (c.utilisation !== null && c.utilisation > 1 + 1e-9) {
      add('over capacity', 'over-capacity', `${c.subject}: ${fmt(c.loadKg)} against ${fmt(c.capacityKg!)} (${Math.round(c.utilisation * 100)} %)${c.governingCase && c.governingCase !== 'nominal' ? ` at ${c.governingCase}` : ''}.`, c.subject);
    }
  }
  if (legs.length !== n && !findings.some((f) => f.severity !== 'notice')) add('missing', 'invalid-input', 'The leg tensions could not be found.');

  // Exclusion zone.
  let footprint: PlanRect;
  let basis: string;
  if (plan.load.boundsMm) {
    const b = plan.load.boundsMm;
    footprint = { minXMm: b.minMm[0], minYMm: b.minMm[1], maxXMm: b.maxMm[0], maxYMm: b.maxMm[1] };
    basis = 'the load\'s bounding box in plan';
  } else {
    const xs = [...pickXy.map((p) => p[0]), plan.load.cogMm[0]];
    const ys = [...pickXy.map((p) => p[1]), plan.load.cogMm[1]];
    footprint = { minXMm: Math.min(...xs), minYMm: Math.min(...ys), maxXMm: Math.max(...xs), maxYMm: Math.max(...ys) };
    basis = 'the pick points and CoG only (load bounds missing)';
    add('notice', 'bounds-missing', 'The load\'s bounds are missing: the exclusion zone is drawn around the pick points only. Enter the bounds.');
  }
  const zone = exclusionZone(footprint, plan.exclusionMarginMm, basis);
  methods.push(zone.note);
  plan.occupiedAreasMm.forEach((a, k) => {
    const rect = { minXMm: a.minMm[0], minYMm: a.minMm[1], maxXMm: a.maxMm[0], maxYMm: a.maxMm[1] };
    if (rectsOverlap(rect, zone)) add('refusal', 'occupied-area', `Occupied area ${k + 1} overlaps the exclusion zone: nobody may be beneath or beside the load. Refused.`);
  });
  const set = HOIST_RULE_SETS[plan.hoistRuleSet];
  if (set) methods.push(`Hoist classes: ${set.name} (${set.source}); local codes prevail.`);
  methods.push(`Sling angles below ${MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG}° from horizontal refused (NAVEDTRA 14080; ASME B30.9 sheets) [PUB-2].`);

  const verdict: LiftPlanResult['verdict'] = findings.some((f) => f.severity === 'over capacity')
    ? 'over capacity'
    : findings.some((f) => f.severity === 'refusal' || f.severity === 'missing')
      ? 'no verdict'
      : 'ok';
  return {
    verdict,
    findings,
    problems: findings.filter((f) => f.severity !== 'notice').map((f) => f.message),
    cautions: liftPlanCautions(),
    methods,
    loads,
    legs,
    components,
    cogCases: caseResults.map((c) => ({ label: c.label, cogMm: c.cogMm, tensionsKg: c.tensions.every(Number.isFinite) ? c.tensions : null, tiltDeg: c.tilt })),
    hanging,
    tiltDeg: hanging ? hanging.tiltDeg : (caseResults.find((c) => c.label === 'nominal')?.tilt ?? null),
    exclusionZone: zone,
  };
}
