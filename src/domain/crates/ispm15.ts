/**
 * ISPM 15 (REFERENCES §4.3 [S]): solid wood packaging crossing a border must be heat-treated (HT, 56 °C
 * core for 30 min) or fumigated (MB) and carry the IPPC mark; plywood, OSB and other processed wood,
 * and any wood 6 mm thick or less, are exempt. So an all-plywood crate needs no mark, but solid-timber
 * skids or cleats do.
 */
import { crateMaterial } from './materials.ts';
import type { CrateMakeUp } from './types.ts';

/** Wood this thin or thinner is exempt (ISPM 15, REFERENCES §4.3 [S]). */
export const ISPM15_THIN_WOOD_MM = 6;

export interface Ispm15Need {
  needed: boolean;
  /** The solid-wood parts that need treatment and the mark. */
  solidWoodParts: string[];
  reason: string;
}

/**
 * Whether a crate of this make-up needs the ISPM 15 mark on a leg. `international`: the leg crosses a
 * border (every border counts: the rules are national, many countries apply ISPM 15 to all imports).
 */
export function ispm15Need(makeUp: CrateMakeUp, international: boolean, table?: readonly { code: string; densityKgPerM3: number }[]): Ispm15Need {
  const parts: { name: string; code: string; thicknessMm: number }[] = [
    { name: 'panels', code: makeUp.panel.materialCode, thicknessMm: makeUp.panel.thicknessMm },
    { name: 'base', code: makeUp.base.materialCode, thicknessMm: makeUp.base.thicknessMm },
  ];
  if (makeUp.skids.count > 0) parts.push({ name: 'skids', code: makeUp.skids.materialCode, thicknessMm: Math.min(makeUp.skids.widthMm, makeUp.skids.heightMm) });
  if (makeUp.cleats) parts.push({ name: 'cleats', code: makeUp.cleats.materialCode, thicknessMm: makeUp.cleats.thicknessMm });
  const solid = parts.filter((p) => crateMaterial(p.code, table).kind === 'solid-wood' && p.thicknessMm > ISPM15_THIN_WOOD_MM).map((p) => p.name);
  if (!international) {
    return { needed: false, solidWoodParts: solid, reason: 'Domestic leg: ISPM 15 does not apply.' };
  }
  if (solid.length === 0) {
    return { needed: false, solidWoodParts: [], reason: 'No solid wood over 6 mm (plywood and processed wood are exempt): no ISPM 15 mark needed.' };
  }
  return {
    needed: true,
    solidWoodParts: solid,
    reason: `Solid wood in the ${solid.join(', ')}: heat-treated (HT) or fumigated timber with the ISPM 15 mark is needed for this international leg.`,
  };
}
