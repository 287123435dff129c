/**
 * Default material densities for mass from volume (CAD mass = volume × density). Each production starts
 * with a copy of this table and may edit it; these are starting values, not certified data: where a mass
 * matters for a lift, weigh the part.
 *
 * Source tags as in the project's reference list: [S] found in a named public source, "3rd party" when a
 * restatement of it; [M] from memory. Where the source gives a range, the middle is taken and the range noted.
 */

/** A material with a uniform density. */
export interface Material {
  /** Short stable key, lower-case kebab (used in parts lists and imports). */
  code: string;
  name: string;
  /** kg/m³, > 0. */
  densityKgPerM3: number;
  /** Where the figure comes from, with its tag. */
  source: string;
}

/** REFERENCES §4.4 gives these as third-party restatements of, or from memory checked against, these two. */
const HANDBOOKS = 'EN 1991-1-1:2002 Annex A; USDA Wood Handbook FPL-GTR-190 (2010)';
/** Plastics: typical values for the unfilled grade, third-party restatements; a filled grade differs. */
const PLASTICS = '[S, 3rd party / M] typical unfilled grade; check the maker’s sheet for filled grades';

/** The default table (REFERENCES §4.4). Frozen: copy it to edit per production. */
export const DEFAULT_MATERIALS: readonly Material[] = Object.freeze([
  { code: 'steel', name: 'Structural steel', densityKgPerM3: 7850, source: `[S, 3rd party / M] ${HANDBOOKS}` },
  { code: 'stainless-304', name: 'Stainless steel 304', densityKgPerM3: 7900, source: `[S, 3rd party / M] ${HANDBOOKS}` },
  { code: 'stainless-316', name: 'Stainless steel 316', densityKgPerM3: 8000, source: `[S, 3rd party / M] ${HANDBOOKS}` },
  { code: 'aluminium', name: 'Aluminium alloy', densityKgPerM3: 2700, source: `[S, 3rd party / M] ${HANDBOOKS}` },
  { code: 'brass', name: 'Brass', densityKgPerM3: 8450, source: `[S, 3rd party / M] 8,400–8,500 by alloy, middle taken; ${HANDBOOKS}` },
  { code: 'copper', name: 'Copper', densityKgPerM3: 8900, source: `[S, 3rd party / M] ${HANDBOOKS}` },
  { code: 'mdf', name: 'MDF', densityKgPerM3: 750, source: `[S, 3rd party / M] about 750, varies by board; ${HANDBOOKS}` },
  {
    code: 'plywood-birch',
    name: 'Birch plywood',
    densityKgPerM3: 680,
    source: '[S, 3rd party / M] about 680; EN 1991-1-1:2002 Annex A gives 7.0 kN/m³ (about 714 kg/m³) for load design',
  },
  { code: 'plywood-softwood', name: 'Softwood plywood', densityKgPerM3: 480, source: `[S, 3rd party / M] 460–500, middle taken; ${HANDBOOKS}` },
  { code: 'spruce', name: 'Spruce (12 % moisture)', densityKgPerM3: 450, source: '[S, 3rd party / M] USDA Wood Handbook FPL-GTR-190 (2010)' },
  { code: 'osb', name: 'OSB', densityKgPerM3: 620, source: '[M] about 600–650 for OSB/3, middle taken; check the board maker’s sheet' },
  { code: 'acrylic', name: 'Acrylic (PMMA)', densityKgPerM3: 1190, source: PLASTICS },
  { code: 'acetal', name: 'Acetal (POM)', densityKgPerM3: 1410, source: PLASTICS },
  { code: 'polycarbonate', name: 'Polycarbonate', densityKgPerM3: 1200, source: PLASTICS },
  { code: 'abs', name: 'ABS', densityKgPerM3: 1050, source: PLASTICS },
].map((m) => Object.freeze(m)));

/**
 * Finds a material by code or name, ignoring case and surrounding spaces. Returns undefined when none
 * matches (the caller reports it; an unknown material is never guessed).
 */
export function findMaterial(materials: readonly Material[], codeOrName: string): Material | undefined {
  const key = codeOrName.trim().toLowerCase();
  if (key === '') return undefined;
  return materials.find((m) => m.code.toLowerCase() === key) ?? materials.find((m) => m.name.toLowerCase() === key);
}

/**
 * CAD mass in kg from a volume in mm³ and a density in kg/m³ (1 mm³ = 10⁻⁹ m³).
 * @throws when either is not a finite number above zero, naming the item.
 */
export function cadMassKg(volumeMm3: number, densityKgPerM3: number, itemName = 'part'): number {
  if (!Number.isFinite(volumeMm3) || volumeMm3 <= 0) throw new Error(`${itemName}: volume must be a finite number of mm³ above zero (got ${String(volumeMm3)}).`);
  if (!Number.isFinite(densityKgPerM3) || densityKgPerM3 <= 0) {
    throw new Error(`${itemName}: density must be a finite number of kg/m³ above zero (got ${String(densityKgPerM3)}).`);
  }
  return volumeMm3 * 1e-9 * densityKgPerM3;
}
