import { formatNumber, fromKg, fromMm } from '../../src/domain/units.ts';

/**
 * Figures as printed on Ballast paperwork: metric always, with imperial alongside for venues and
 * productions whose paperwork is imperial. Conversion only; the figures come from the cores.
 */

/** "1,234.5 kg" or, with imperial, "1,234.5 kg (2,721.7 lb)"; "—" for an unknown mass. */
export function massText(kg: number | null | undefined, imperial: boolean, digits = 1): string {
  if (kg === null || kg === undefined || !Number.isFinite(kg)) return '—';
  const metric = `${formatNumber(kg, digits)} kg`;
  return imperial ? `${metric} (${formatNumber(fromKg(kg, 'lb'), digits)} lb)` : metric;
}

/** "1,200 mm" or "1,200 mm (47.2 in)". */
export function lengthText(mm: number | null | undefined, imperial: boolean): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return '—';
  const metric = `${formatNumber(mm, 0)} mm`;
  return imperial ? `${metric} (${formatNumber(fromMm(mm, 'in'), 1)} in)` : metric;
}

/** "1,200 × 800 × 950 mm" or with "(47.2 × 31.5 × 37.4 in)" alongside. */
export function sizeText(mm: readonly number[], imperial: boolean): string {
  const metric = `${mm.map((v) => formatNumber(v, 0)).join(' × ')} mm`;
  return imperial ? `${metric} (${mm.map((v) => formatNumber(fromMm(v, 'in'), 1)).join(' × ')} in)` : metric;
}
