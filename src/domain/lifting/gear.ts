/**
 * Rigging gear checks that do not depend on the plan's geometry: is the item within its inspection
 * date, and what does a lifting point carry at an angle to its axis.
 */
import type { GearItem, LiftingPointItem } from '../contracts/lifting.ts';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function validIsoDate(s: unknown): s is string {
  if (typeof s !== 'string') return false;
  const m = ISO_DATE.exec(s);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const dt = new Date(Date.UTC(y, mo - 1, d));
  return dt.getUTCFullYear() === y && dt.getUTCMonth() === mo - 1 && dt.getUTCDate() === d;
}

/** A short name for messages: kind and identifier. */
export function gearLabel(item: Pick<GearItem, 'kind' | 'identifier'>): string {
  return `${item.kind} ${item.identifier}`;
}

/**
 * Whether an item may be used on a date. Gear past its next inspection date cannot be used: usable up
 * to and including that date, not after it. A missing or malformed date is a gap, so the item is not
 * usable. Dates are calendar dates (YYYY-MM-DD) compared as such, free of time zones.
 */
export function gearUsableOn(item: Pick<GearItem, 'kind' | 'identifier' | 'nextInspectionDate'>, onDate: string): { usable: boolean; reason: string } {
  const name = gearLabel(item);
  if (!validIsoDate(onDate)) return { usable: false, reason: `Evaluation date "${String(onDate)}" is not a calendar date (YYYY-MM-DD).` };
  if (!validIsoDate(item.nextInspectionDate)) {
    return { usable: false, reason: `${name}: next inspection date missing or not a calendar date (got "${String(item.nextInspectionDate)}"): cannot be used.` };
  }
  if (onDate > item.nextInspectionDate) {
    return { usable: false, reason: `${name}: inspection was due ${item.nextInspectionDate}, before ${onDate}: cannot be used until inspected.` };
  }
  if (onDate === item.nextInspectionDate) return { usable: true, reason: `${name}: inspection due today (${onDate}).` };
  return { usable: true, reason: `${name}: inspected, next due ${item.nextInspectionDate}.` };
}

/**
 * Rating of a lifting point loaded at an angle from its axis, kg, from the maker's derating table
 * (the first row whose angle covers the load). Null, with a reason, where the angle is beyond the
 * table or the table is missing and the pull is off-axis (more than 1°).
 */
export function liftingPointRatingKg(item: LiftingPointItem, angleFromAxisDeg: number): { ratingKg: number | null; reason: string } {
  const name = gearLabel(item);
  if (!(typeof item.ratingKg === 'number' && item.ratingKg > 0)) return { ratingKg: null, reason: `${name}: rating missing.` };
  if (!Number.isFinite(angleFromAxisDeg) || angleFromAxisDeg < 0) return { ratingKg: null, reason: `${name}: pull angle unknown.` };
  if (angleFromAxisDeg <= 1) return { ratingKg: item.ratingKg, reason: `${name}: axial pull, full rating.` };
  const rows = [...(item.angleDerating ?? [])].sort((a, b) => a.upToDegFromAxis - b.upToDegFromAxis);
  if (rows.length === 0) {
    return { ratingKg: null, reason: `${name}: pulled ${angleFromAxisDeg.toFixed(1)}° off its axis and no angle derating is recorded: enter the maker's table.` };
  }
  const row = rows.find((r) => angleFromAxisDeg <= r.upToDegFromAxis + 1e-9);
  if (!row) {
    return { ratingKg: null, reason: `${name}: pulled ${angleFromAxisDeg.toFixed(1)}° off its axis, beyond the maker's table (up to ${rows[rows.length - 1].upToDegFromAxis}°): not to be used so.` };
  }
  return { ratingKg: item.ratingKg * row.factor, reason: `${name}: ${angleFromAxisDeg.toFixed(1)}° off axis → × ${row.factor} (maker's table, up to ${row.upToDegFromAxis}°).` };
}
