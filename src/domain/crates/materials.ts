/**
 * Crate materials: density for tare from volume, and the wood kind that decides ISPM 15. Codes, names,
 * densities and their sources come from the default material table (src/domain/mass/materials.ts, the one
 * each production starts with); this adds the wood kind. `designCrate` accepts the production's own table
 * through `options.materials`, which takes precedence for the density.
 */
import { DEFAULT_MATERIALS } from '../mass/materials.ts';

/** For ISPM 15: solid wood needs treatment and the mark; processed wood (plywood, OSB, MDF) does not. */
export type WoodKind = 'solid-wood' | 'processed-wood' | 'not-wood';

export interface CrateMaterial {
  code: string;
  name: string;
  /** kg/m³, > 0. */
  densityKgPerM3: number;
  kind: WoodKind;
  source: string;
}

/** What crates are built from, by code, with its kind for ISPM 15 (ISPM 15, REFERENCES §4.3 [S]: processed wood is exempt). */
const CRATE_WOOD_KINDS: Readonly<Record<string, WoodKind>> = {
  'plywood-birch': 'processed-wood',
  'plywood-softwood': 'processed-wood',
  osb: 'processed-wood',
  mdf: 'processed-wood',
  spruce: 'solid-wood',
  steel: 'not-wood',
  aluminium: 'not-wood',
};

/** The crate materials, from the default table (REFERENCES §4.4). */
export const CRATE_MATERIALS: readonly CrateMaterial[] = Object.freeze(
  Object.entries(CRATE_WOOD_KINDS).map(([code, kind]) => {
    const m = DEFAULT_MATERIALS.find((x) => x.code === code);
    if (!m) throw new Error(`Crate material "${code}" is not in the default material table.`);
    return Object.freeze({ code, name: m.name, densityKgPerM3: m.densityKgPerM3, kind, source: m.source });
  }),
);

/** Density lookup: the caller's table first (by code), then this one. Throws naming the code. */
export function crateMaterial(code: string, table?: readonly { code: string; densityKgPerM3: number }[]): CrateMaterial {
  const local = CRATE_MATERIALS.find((m) => m.code === code);
  const given = table?.find((m) => m.code === code);
  if (given) {
    if (!Number.isFinite(given.densityKgPerM3) || given.densityKgPerM3 <= 0) {
      throw new Error(`Material "${code}": density must be a finite number of kg/m³ above zero (got ${String(given.densityKgPerM3)}).`);
    }
    return {
      code,
      name: local?.name ?? code,
      densityKgPerM3: given.densityKgPerM3,
      // A material we do not know is taken as solid wood for ISPM 15: the safe side.
      kind: local?.kind ?? 'solid-wood',
      source: 'production material table',
    };
  }
  if (!local) throw new Error(`Material "${code}" is not in the crate materials (${CRATE_MATERIALS.map((m) => m.code).join(', ')}).`);
  return local;
}
