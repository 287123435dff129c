import type { Vehicle } from './types.ts';

/**
 * Checks a vehicle the planner entered (or edited) and returns the list of problems, each naming the
 * field and the limit. Empty when it is usable.
 */
export function vehicleProblems(v: Vehicle): string[] {
  const out: string[] = [];
  const pos = (n: number | undefined | null, field: string, optional = false) => {
    if (n === undefined || n === null) {
      if (!optional) out.push(`${v.name || v.id}: ${field} is required.`);
      return;
    }
    if (!Number.isFinite(n) || n <= 0) out.push(`${v.name || v.id}: ${field} must be above zero (got ${String(n)}).`);
  };
  pos(v.lengthMm, 'inside length (mm)');
  pos(v.widthMm, 'inside width (mm)');
  pos(v.heightMm, 'inside height (mm)');
  pos(v.maxPayloadKg, 'payload (kg)');
  pos(v.doorWidthMm, 'door width (mm)', true);
  pos(v.doorHeightMm, 'door height (mm)', true);
  if (v.doorWidthMm && v.doorWidthMm > v.widthMm) out.push(`${v.name}: door width ${v.doorWidthMm} mm is wider than the inside (${v.widthMm} mm).`);
  if (v.doorHeightMm && v.doorHeightMm > v.heightMm) out.push(`${v.name}: door height ${v.doorHeightMm} mm is higher than the inside (${v.heightMm} mm).`);
  if (v.maxGrossKg !== undefined && v.tareKg !== undefined && v.tareKg + v.maxPayloadKg > v.maxGrossKg + 1e-6) {
    out.push(`${v.name}: tare ${v.tareKg} kg + payload ${v.maxPayloadKg} kg exceed the max gross ${v.maxGrossKg} kg.`);
  }
  if (v.axles) {
    const [a, b] = v.axles.kind === 'rigid' ? [v.axles.front, v.axles.rear] : [v.axles.kingpin, v.axles.axles];
    if (!(b.positionMm > a.positionMm)) out.push(`${v.name}: ${b.name} must lie behind ${a.name} (${b.positionMm} ≤ ${a.positionMm} mm).`);
    for (const g of [a, b]) {
      if (!(g.permittedKg > 0)) out.push(`${v.name}: ${g.name} permitted load must be above zero.`);
      if (!(g.unladenKg >= 0)) out.push(`${v.name}: ${g.name} unladen load must not be below zero.`);
    }
  }
  return out;
}

/** A custom vehicle, checked. Throws with every problem listed. */
export function customVehicle(v: Omit<Vehicle, 'kind' | 'source'> & { source?: string }): Vehicle {
  const out: Vehicle = { ...v, kind: 'custom', source: v.source ?? 'entered by the planner' };
  const problems = vehicleProblems(out);
  if (problems.length > 0) throw new Error(problems.join(' '));
  return out;
}
