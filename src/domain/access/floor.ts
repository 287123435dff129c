/**
 * Floor checks.
 *
 * Average pressure: gross × g over the crate's upright footprint (length × width), in kN/m², against
 * the venue's floor rating (REFERENCES §4.5 "pressure check" [CP]). g is standard gravity,
 * 9.80665 m/s² (units.ts); the 9.81 differs by 0.03 %. A stage rated 5.0 kN/m² is the
 * EN 1991-1-1 category C4 recommended value [MEM]. On a fail the reason gives the spreader area that
 * would bring the pressure to the rating. The handling equipment's own wheel loads are not included.
 *
 * Point load: under castors or feet, the force per contact; under skids, the force on the rating's
 * square (EN 1991-1-1 §6.3.1.2 applies Q_k on a 50 mm square unless stated otherwise [MEM]) from the
 * skid bearing pressure. Against the venue's concentrated-load rating in kN [CP].
 * A base on four or more castors or feet is taken to rest on three of them, since an uneven floor or
 * a stiff base leaves one corner light [PRACTICE].
 */
import { STANDARD_GRAVITY_M_PER_S2 } from '../units.ts';
import { fmt, isKnownPositive } from './known.ts';
import type { AccessCrate, AccessFinding, AccessVenue } from './types.ts';

/** Average bearing pressure in kN/m² of a mass on an area given in mm². */
export function pressureKnPerM2(massKg: number, areaMm2: number): number {
  return (massKg * STANDARD_GRAVITY_M_PER_S2) / 1000 / (areaMm2 / 1e6);
}

export function checkFloor(crate: AccessCrate, ratingKnPerM2: AccessVenue['floorRatingKnPerM2']): AccessFinding {
  const base = { check: 'floor' as const, where: 'floor' };
  if (!isKnownPositive(ratingKnPerM2)) {
    return { ...base, verdict: 'unknown', reason: 'not checked: floor load rating unknown' };
  }
  if (!isKnownPositive(crate.grossKg)) {
    return { ...base, verdict: 'unknown', reason: 'not checked against the floor: crate gross mass unknown' };
  }
  const areaMm2 = crate.lengthMm * crate.widthMm;
  const p = pressureKnPerM2(crate.grossKg, areaMm2);
  const margin = ratingKnPerM2 - p;
  const ratio = ratingKnPerM2 / p - 1;
  const figures = `${fmt(p, 2)} kN/m² over the ${fmt(areaMm2 / 1e6, 2)} m² footprint against a rating of ${fmt(ratingKnPerM2, 2)} kN/m²`;
  if (margin < 0) {
    const neededM2 = (crate.grossKg * STANDARD_GRAVITY_M_PER_S2) / 1000 / ratingKnPerM2;
    return {
      ...base,
      verdict: 'fail',
      reason: `floor overloaded: ${figures}; spread the load over at least ${fmt(neededM2, 2)} m² (spreader plates)`,
      margin,
      marginUnit: 'kN/m²',
      marginRatio: ratio,
    };
  }
  return { ...base, verdict: 'pass', reason: `floor: ${figures}`, margin, marginUnit: 'kN/m²', marginRatio: ratio };
}

/** The largest force one contact or one rating square takes, kN, or a reason why it is not known. */
export function pointForceKn(crate: AccessCrate, areaSideMm: number): { forceKn: number; how: string } | { unknown: string } {
  const s = crate.supports;
  if (!s) return { unknown: 'crate supports (skids, castors or feet) unknown' };
  if (!isKnownPositive(crate.grossKg)) return { unknown: 'crate gross mass unknown' };
  if (!isKnownPositive(s.count) || !Number.isInteger(s.count)) return { unknown: `number of ${s.kind} unknown` };
  const weightKn = (crate.grossKg * STANDARD_GRAVITY_M_PER_S2) / 1000;
  if (s.kind === 'skids') {
    if (!isKnownPositive(s.widthMm)) return { unknown: 'skid width unknown' };
    const lengthMm = isKnownPositive(s.lengthMm) ? s.lengthMm : crate.lengthMm;
    const pKnPerMm2 = weightKn / (s.count * s.widthMm * lengthMm);
    const patchMm2 = Math.min(areaSideMm, s.widthMm) * Math.min(areaSideMm, lengthMm);
    return {
      forceKn: pKnPerMm2 * patchMm2,
      how: `${s.count} skids ${fmt(s.widthMm)} mm wide bear ${fmt(pKnPerMm2 * 1e6, 1)} kN/m²; on a ${fmt(areaSideMm)} mm square`,
    };
  }
  const carrying = s.count >= 4 ? 3 : s.count;
  return {
    forceKn: weightKn / carrying,
    how: `on ${s.count} ${s.kind}${s.count >= 4 ? ', taken as resting on 3' : ''}, per contact`,
  };
}

export function checkPointLoad(crate: AccessCrate, venue: AccessVenue): AccessFinding {
  const base = { check: 'point-load' as const, where: 'floor' };
  if (!isKnownPositive(venue.pointLoadRatingKn)) {
    return { ...base, verdict: 'unknown', reason: 'not checked: floor point-load rating unknown' };
  }
  const side = isKnownPositive(venue.pointLoadAreaSideMm) ? venue.pointLoadAreaSideMm : 50;
  const f = pointForceKn(crate, side);
  if ('unknown' in f) return { ...base, verdict: 'unknown', reason: `point load not checked: ${f.unknown}` };
  const rating = venue.pointLoadRatingKn;
  const margin = rating - f.forceKn;
  const text = `${f.how} ${fmt(f.forceKn, 2)} kN against a point-load rating of ${fmt(rating, 2)} kN`;
  return {
    ...base,
    verdict: margin < 0 ? 'fail' : 'pass',
    reason: margin < 0 ? `point load too high: ${text}; use spreader plates` : `point load: ${text}`,
    margin,
    marginUnit: 'kN',
    marginRatio: rating / f.forceKn - 1,
  };
}

