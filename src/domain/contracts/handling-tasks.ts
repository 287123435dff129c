import {
  classifyCoupling,
  estimateHandDistanceCm,
  guidelineWeightKg,
  handlingVerdict,
  nioshTask,
  type GuidelineResult,
  type GuidelineTask,
  type GuidelineZone,
  type HandlingVerdict,
  type NioshTask,
  type NioshTaskResult,
} from '../lifting/index.ts';
import type { HandlingItemKind, HandlingTaskInput, LiftingSettingsFields } from './lifting-api.ts';

/**
 * A manual-handling task for one item as the core needs it: what the crew typed, and for every field
 * they left out an estimate that is named as such (so the screen and the PDF can mark it). The
 * verdict itself is the core's `handlingVerdict`; the NIOSH and guideline working is the core's too,
 * returned so that every multiplier can be shown.
 */

/** One item handled by people: a section, a loose part (one unit) or a crate. */
export interface HandlingSubject {
  kind: HandlingItemKind;
  id: string;
  code: string;
  label: string;
  /** Mass of one item as handled, kg; null while unknown. */
  massKg: number | null;
  /** Where the mass comes from, for the screen ("computed, 10 % margin", "weighed 2027-01-18"). */
  massNote: string;
  /** Outer size [x, y, z], mm; null while unknown. */
  sizeMm: [number, number, number] | null;
}

export interface HandlingAssessment {
  niosh: Omit<NioshTask, 'loadKg'> | null;
  guideline: GuidelineTask;
  /** Dotted paths of the fields that are estimates, e.g. `niosh.origin.hCm`. */
  estimated: string[];
  /** How each estimate was made. */
  notes: string[];
  verdict: HandlingVerdict;
  nioshResult: NioshTaskResult | null;
  guidelineResult: GuidelineResult | null;
}

/**
 * Hand heights that bound the guideline zones, cm: lower leg (mid-shin) 25, knuckle 75, elbow 105,
 * shoulder 140 — round figures for an adult [PRACTICE], used only to turn estimated hand heights into
 * zones. The crew may pick the zones themselves.
 */
const ZONE_BOUNDS_CM: [number, GuidelineZone][] = [
  [25, 'below-lower-leg'],
  [75, 'lower-leg-to-knuckle'],
  [105, 'knuckle-to-elbow'],
  [140, 'elbow-to-shoulder'],
  [Infinity, 'above-shoulder'],
];

function zoneAt(vCm: number): GuidelineZone {
  return ZONE_BOUNDS_CM.find(([upTo]) => vCm < upTo)![1];
}

/** Every zone the hands pass through between two heights. */
function zonesBetween(aCm: number, bCm: number): GuidelineZone[] {
  const lo = Math.min(aCm, bCm);
  const hi = Math.max(aCm, bCm);
  const out: GuidelineZone[] = [];
  let prev = 0;
  for (const [upTo, zone] of ZONE_BOUNDS_CM) {
    if (hi >= prev && lo < upTo) out.push(zone);
    prev = upTo;
  }
  return out.length ? out : [zoneAt(lo)];
}

/** Default hand heights: from the floor (25 cm) to knuckle height (75 cm) [PRACTICE]. */
export const DEFAULT_ORIGIN_V_CM = 25;
export const DEFAULT_DESTINATION_V_CM = 75;
/** Default frequency: an occasional lift during load-in, less than one every five minutes (manual p. 14: counted as 0.2). */
export const DEFAULT_LIFTS_PER_MIN = 0.2;
export const DEFAULT_DURATION_HOURS = 1;

/** The task of one item, with estimates for what the crew left out, and the core's verdict. */
export function assessHandling(
  subject: HandlingSubject,
  saved: HandlingTaskInput | null,
  settings: Pick<LiftingSettingsFields, 'handlingMethod' | 'guidelineColumn' | 'maxTeamSize'>,
): HandlingAssessment {
  const estimated: string[] = [];
  const notes: string[] = [];
  const n = saved?.niosh ?? {};
  const pick = <T>(path: string, typed: T | undefined, estimate: () => T): T => {
    if (typed !== undefined) return typed;
    estimated.push(path);
    return estimate();
  };

  const originV = pick('niosh.origin.vCm', n.origin?.vCm, () => DEFAULT_ORIGIN_V_CM);
  const destV = pick('niosh.destination.vCm', n.destination?.vCm, () => DEFAULT_DESTINATION_V_CM);
  if (estimated.includes('niosh.origin.vCm') || estimated.includes('niosh.destination.vCm')) {
    notes.push(`Hand heights assumed: from ${originV} cm (near the floor) to ${destV} cm (knuckle height); measure them for a real task.`);
  }
  // The load's depth away from the body: the smaller of its plan dimensions (how it is usually carried).
  const depthCm = subject.sizeMm ? Math.min(subject.sizeMm[0], subject.sizeMm[1]) / 10 : null;
  const hFor = (end: 'origin' | 'destination', typed: number | undefined, vCm: number): number | null => {
    if (typed !== undefined) return typed;
    if (depthCm === null) return null;
    estimated.push(`niosh.${end}.hCm`);
    const e = estimateHandDistanceCm({ loadDepthCm: depthCm, vCm });
    notes.push(`${end === 'origin' ? 'Origin' : 'Destination'} H ${e.hCm.toFixed(1)} cm: ${e.basis}`);
    return e.hCm;
  };
  const originH = hFor('origin', n.origin?.hCm, originV);
  const destH = hFor('destination', n.destination?.hCm, destV);
  const originA = pick('niosh.origin.asymmetryDeg', n.origin?.asymmetryDeg, () => 0);
  const destA = pick('niosh.destination.asymmetryDeg', n.destination?.asymmetryDeg, () => 0);
  const liftsPerMin = pick('niosh.liftsPerMin', n.liftsPerMin, () => DEFAULT_LIFTS_PER_MIN);
  const durationHours = pick('niosh.durationHours', n.durationHours, () => DEFAULT_DURATION_HOURS);
  const control = pick('niosh.significantControlAtDestination', n.significantControlAtDestination, () => true);
  const coupling = pick('niosh.coupling', n.coupling, () => {
    const c =
      subject.kind === 'crate' && subject.sizeMm
        ? classifyCoupling({ kind: 'container', frontalLengthCm: Math.max(subject.sizeMm[0], subject.sizeMm[1]) / 10, heightCm: subject.sizeMm[2] / 10 })
        : classifyCoupling({ kind: subject.kind === 'crate' ? 'container' : 'loose-object' });
    notes.push(`Coupling estimated ${c.coupling}: ${c.reasons.join(' ')}`);
    return c.coupling;
  });

  let niosh: Omit<NioshTask, 'loadKg'> | null = null;
  const reasonsBefore: string[] = [];
  if (originH === null || destH === null) {
    reasonsBefore.push(`${subject.label}: the load's size is unknown, so the hand distance H cannot be estimated: type H for the NIOSH method.`);
  } else {
    niosh = {
      origin: { hCm: originH, vCm: originV, asymmetryDeg: originA },
      destination: { hCm: destH, vCm: destV, asymmetryDeg: destA },
      liftsPerMin,
      durationHours,
      coupling,
      significantControlAtDestination: control,
      limitations: n.limitations ?? [],
    };
  }

  const g = saved?.guideline ?? {};
  const zones = pick('guideline.zones', g.zones, () => zonesBetween(originV, destV));
  const reach = pick('guideline.reach', g.reach, () => {
    const h = Math.max(originH ?? 0, destH ?? 0);
    const r = originH === null ? 'extended' : h > 40 ? 'extended' : 'close';
    notes.push(`Reach estimated ${r} (${originH === null ? 'size unknown' : `hands about ${h.toFixed(0)} cm from the ankles`}) [practice].`);
    return r;
  });
  const guideline: GuidelineTask = {
    zones,
    reach,
    column: settings.guidelineColumn,
    liftsPerMin: pick('guideline.liftsPerMin', g.liftsPerMin, () => liftsPerMin),
    twistDeg: pick('guideline.twistDeg', g.twistDeg, () => originA),
  };

  const maxTeamSize = saved?.maxTeamSize ?? settings.maxTeamSize;
  const massKg = subject.massKg ?? Number.NaN;
  const verdict = handlingVerdict({
    label: `${subject.code} ${subject.label}`.trim(),
    massKg,
    method: settings.handlingMethod,
    ...(niosh ? { niosh } : {}),
    guideline,
    maxTeamSize,
  });
  if (reasonsBefore.length && settings.handlingMethod === 'niosh') verdict.reasons.unshift(...reasonsBefore);
  if (subject.massKg === null) verdict.reasons.unshift(`${subject.label}: ${subject.massNote || 'mass unknown'}.`);
  const nioshResult = niosh && Number.isFinite(massKg) ? nioshTask({ ...niosh, loadKg: massKg }) : null;
  const guidelineResult = guidelineWeightKg(guideline);
  if (estimated.length > 0) verdict.reasons.push(`Estimated inputs (not measured): ${estimated.join(', ')}.`);
  return { niosh, guideline, estimated, notes, verdict, nioshResult, guidelineResult };
}
