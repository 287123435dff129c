/**
 * Crate materials: density for tare from volume, and the wood kind that decides ISPM 15.
 *
 * TODO(unify): src/domain/mass/materials.ts holds the production's density table (same codes). It was
 * not committed when this was written, so the few crate materials are defined here with their sources;
 * `designCrate` accepts the production's table through `options.materials`, which takes precedence.
 */

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

/** Densities from REFERENCES §4.4 (Wood Handbook FPL-GTR-190; EN 1991-1-1 Annex A). */
export const CRATE_MATERIALS: readonly CrateMaterial[] = Object.freeze([
  {
    code: 'plywood-birch',
    name: 'Birch plywood',
    densityKgPerM3: 680,
    kind: 'processed-wood',
    source: '[S, 3rd party / M] about 680 kg/m³; EN 1991-1-1 Annex A gives 7.0 kN/m³ (REFERENCES §4.4)',
  },
  {
    code: 'plywood-softwood',
    name: 'Softwood plywood',
    densityKgPerM3: 480,
    kind: 'processed-wood',
    source: '[S, 3rd party / M] 460–500 kg/m³, middle taken (REFERENCES §4.4)',
  },
  {
    code: 'osb',
    name: 'OSB',
    densityKgPerM3: 620,
    kind: 'processed-wood',
    source: '[M] about 600–650 kg/m³ for OSB/3; check the board maker’s sheet',
  },
  {
    code: 'spruce',
    name: 'Spruce, 12 % moisture',
    densityKgPerM3: 450,
    kind: 'solid-wood',
    source: '[S, 3rd party / M] about 450 kg/m³, USDA Wood Handbook FPL-GTR-190 (REFERENCES §4.4)',
  },
  {
    code: 'steel',
    name: 'Structural steel',
    densityKgPerM3: 7850,
    kind: 'not-wood',
    source: '[S, 3rd party / M] 7,850 kg/m³ (REFERENCES §4.4)',
  },
  {
    code: 'aluminium',
    name: 'Aluminium alloy',
    densityKgPerM3: 2700,
    kind: 'not-wood',
    source: '[S, 3rd party / M] 2,700 kg/m³ (REFERENCES §4.4)',
  },
].map((m) => Object.freeze(m as CrateMaterial)));

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
