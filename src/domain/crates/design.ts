/**
 * Crate design around a section.
 *
 * Layers, from the floor up (crate frame: origin at the outer bottom corner, x along the length, y
 * across, z up, mm):
 *   skids (full outer length) → base deck (full outer plan) → walls standing on the deck around the
 *   inside → lid on the walls → cleats framing each wall and the lid on the outside.
 *
 *   inner   = section box + clearance (sides each side, bottom, top)
 *   outer L = inner L + 2 × (panel + cleat thickness); outer W likewise
 *   outer H = skid height + base + inner H + panel (lid) + cleat thickness
 *
 * Volumes: walls are the ring (L_w × W_w − L_i × W_i) × H_i with L_w = L_i + 2 t; the lid is
 * L_w × W_w × t; each cleat frame is its perimeter less the four overlapping corners, × width ×
 * thickness. Fasteners, paint and handles are not counted (a few % of tare): weigh the crate.
 *
 * Rules of thumb [CP] (REFERENCES §4.4): 25–50 mm clearance around a blocked item (50 mm taken);
 * skids at least 100 × 100 mm to 1–2 t; at least 100 mm clear fork entry; plywood 12–18 mm for medium
 * crates (15 mm taken). Two skids up to 1,200 mm outer width, three above [PRACTICE].
 */
import { combineMasses, type PointMass } from '../mass/combine.ts';
import { add, sub, type Vec3 } from '../geometry/vec3.ts';
import { STANDARD_GRAVITY_M_PER_S2 } from '../units.ts';
import { crateMaterial } from './materials.ts';
import type {
  CrateClearance,
  CrateComponent,
  CrateDesign,
  CrateDesignOptions,
  CrateMakeUp,
  CrateSection,
  CrateStandardRange,
} from './types.ts';

/** Default clearance, mm each side [CP] (REFERENCES §4.4: 25–50 mm around a blocked item). */
export const DEFAULT_CLEARANCE_MM = 50;
/** Design load on lids for stacking, kN/m² (REFERENCES §4.4 [S], insurers' packaging handbook). */
export const LID_DESIGN_LOAD_KN_PER_M2 = 10;
/** Least clear fork entry height, mm [CP]. */
export const MIN_FORK_ENTRY_MM = 100;
/** Above this estimated gross, 100 × 100 mm skids are beyond the rule of thumb (1–2 t; lower end taken) [CP]. */
export const SKID_100_LIMIT_KG = 1000;

export const DEFAULT_MAKE_UP: CrateMakeUp = Object.freeze({
  panel: { materialCode: 'plywood-birch', thicknessMm: 15 },
  base: { materialCode: 'plywood-birch', thicknessMm: 18 },
  skids: { materialCode: 'spruce', count: 2, widthMm: 100, heightMm: 100 },
  cleats: { materialCode: 'spruce', widthMm: 70, thicknessMm: 22 },
}) as CrateMakeUp;

/** ASTM crate and box standards by net load (REFERENCES §4.4 [S]), lightest first. */
export const CRATE_STANDARDS: readonly CrateStandardRange[] = Object.freeze([
  { code: 'ASTM D6251', title: 'wood-cleated panelboard shipping boxes', maxNetKg: 454 },
  { code: 'ASTM D6256', title: 'skidded, load-bearing boxes', maxNetKg: 1134 },
  { code: 'ASTM D6039', title: 'open and covered wood crates', maxNetKg: 1814 },
  { code: 'ASTM D7478', title: 'heavy-duty sheathed wood crates', maxNetKg: 13607 },
]);

/** The lightest standard whose net-load range covers `netKg` (D6256 is "below" 1,134 kg). */
export function crateStandardFor(netKg: number): CrateStandardRange | undefined {
  return CRATE_STANDARDS.find((s) => (s.code === 'ASTM D6256' ? netKg < s.maxNetKg : netKg <= s.maxNetKg));
}

/** Largest mass that may stand on a lid of this plan size, kg, at a design load in kN/m². */
export function stackLimitKg(lengthMm: number, widthMm: number, designLoadKnPerM2 = LID_DESIGN_LOAD_KN_PER_M2): number {
  return (designLoadKnPerM2 * 1000 * ((lengthMm * widthMm) / 1e6)) / STANDARD_GRAVITY_M_PER_S2;
}

function positive(v: number, what: string): number {
  if (!Number.isFinite(v) || v <= 0) throw new Error(`${what} must be a finite number above zero (got ${String(v)}).`);
  return v;
}
function nonNegative(v: number, what: string): number {
  if (!Number.isFinite(v) || v < 0) throw new Error(`${what} must be a finite number, not below zero (got ${String(v)}).`);
  return v;
}

function resolveClearance(c: CrateDesignOptions['clearanceMm']): CrateClearance {
  if (typeof c === 'number') return { sidesMm: c, topMm: c, bottomMm: c };
  return {
    sidesMm: c?.sidesMm ?? DEFAULT_CLEARANCE_MM,
    topMm: c?.topMm ?? DEFAULT_CLEARANCE_MM,
    bottomMm: c?.bottomMm ?? DEFAULT_CLEARANCE_MM,
  };
}

/**
 * Designs a crate around a section: sizes, make-up, tare from volumes × densities, CoG of crate and
 * contents (via combineMasses), fork entry, stack limit, the ASTM range it falls in, handling flags.
 * Throws on bad input, naming the field and the limit.
 */
export function designCrate(section: CrateSection, options: CrateDesignOptions = {}): CrateDesign {
  const label = section.id ? `Section ${section.id}` : 'Section';
  positive(section.massKg, `${label}: mass (kg)`);
  const size = sub(section.bboxMaxMm, section.bboxMinMm);
  (['x', 'y', 'z'] as const).forEach((axis, i) => positive(size[i], `${label}: bounding box size along ${axis} (mm)`));
  const clearance = resolveClearance(options.clearanceMm);
  nonNegative(clearance.sidesMm, 'Clearance at the sides (mm)');
  nonNegative(clearance.topMm, 'Clearance at the top (mm)');
  nonNegative(clearance.bottomMm, 'Clearance at the bottom (mm)');
  const dunnageKg = nonNegative(options.dunnageKg ?? 0, 'Dunnage mass (kg)');

  const mu = options.makeUp ?? {};
  const panel = { ...DEFAULT_MAKE_UP.panel, ...mu.panel };
  const base = { ...DEFAULT_MAKE_UP.base, ...mu.base };
  const cleats = mu.cleats === undefined ? { ...(DEFAULT_MAKE_UP.cleats as NonNullable<CrateMakeUp['cleats']>) } : mu.cleats;
  positive(panel.thicknessMm, 'Panel thickness (mm)');
  positive(base.thicknessMm, 'Base thickness (mm)');
  if (cleats) {
    positive(cleats.widthMm, 'Cleat width (mm)');
    positive(cleats.thicknessMm, 'Cleat thickness (mm)');
  }

  const t = panel.thicknessMm;
  const c = cleats ? cleats.thicknessMm : 0;
  const cw = cleats ? cleats.widthMm : 0;
  const Li = size[0] + 2 * clearance.sidesMm;
  const Wi = size[1] + 2 * clearance.sidesMm;
  const Hi = size[2] + clearance.bottomMm + clearance.topMm;
  const Lw = Li + 2 * t;
  const Ww = Wi + 2 * t;
  const Lo = Lw + 2 * c;
  const Wo = Ww + 2 * c;

  const defaultSkidCount = Wo <= 1200 ? 2 : 3;
  const skids = { ...DEFAULT_MAKE_UP.skids, count: defaultSkidCount, ...mu.skids };
  if (!Number.isInteger(skids.count) || skids.count < 0) throw new Error(`Skid count must be a whole number, not below zero (got ${String(skids.count)}).`);
  const hs = skids.count > 0 ? positive(skids.heightMm, 'Skid height (mm)') : 0;
  if (skids.count > 0) positive(skids.widthMm, 'Skid width (mm)');
  if (skids.count * skids.widthMm > Wo) throw new Error(`Skids: ${skids.count} × ${skids.widthMm} mm do not fit under a crate ${Math.round(Wo)} mm wide.`);

  const zDeck = hs;
  const z0 = hs + base.thicknessMm; // inner floor
  const zLid = z0 + Hi;
  const Ho = zLid + t + c;

  const table = options.materials;
  const components: CrateComponent[] = [];
  const addPart = (name: string, code: string, volumeMm3: number, cogMm: Vec3) => {
    if (volumeMm3 <= 0) return;
    const m = crateMaterial(code, table);
    components.push({ name, materialCode: code, volumeMm3, massKg: volumeMm3 * 1e-9 * m.densityKgPerM3, cogMm });
  };
  const cx = Lo / 2;
  const cy = Wo / 2;

  // Skids, spread evenly with the outer ones flush with the sides.
  for (let k = 0; k < skids.count; k++) {
    const y = skids.count === 1 ? cy : skids.widthMm / 2 + (k * (Wo - skids.widthMm)) / (skids.count - 1);
    addPart(`skid ${k + 1}`, skids.materialCode, Lo * skids.widthMm * hs, [cx, y, hs / 2]);
  }
  addPart('base deck', base.materialCode, Lo * Wo * base.thicknessMm, [cx, cy, zDeck + base.thicknessMm / 2]);
  addPart('walls', panel.materialCode, (Lw * Ww - Li * Wi) * Hi, [cx, cy, z0 + Hi / 2]);
  addPart('lid', panel.materialCode, Lw * Ww * t, [cx, cy, zLid + t / 2]);
  if (cleats) {
    // A rectangular frame of battens on a face a × b: perimeter less the four corner overlaps.
    const frame = (a: number, b: number) => Math.max(0, 2 * (a + b) - 4 * cw) * cw * c;
    addPart('cleats, sides', cleats.materialCode, 2 * frame(Lw, Hi), [cx, cy, z0 + Hi / 2]);
    addPart('cleats, ends', cleats.materialCode, 2 * frame(Ww, Hi), [cx, cy, z0 + Hi / 2]);
    addPart('cleats, lid', cleats.materialCode, frame(Lw, Ww), [cx, cy, zLid + t + c / 2]);
  }

  const innerOrigin: Vec3 = [c + t, c + t, z0];
  const sectionOffsetMm = sub(add(innerOrigin, [clearance.sidesMm, clearance.sidesMm, clearance.bottomMm]), section.bboxMinMm);
  const innerCentre: Vec3 = [cx, cy, z0 + Hi / 2];

  const tareParts: PointMass[] = components.map((p) => ({ massKg: p.massKg, cogMm: p.cogMm }));
  // Dunnage is spread around the contents: taken at the middle of the inside [PRACTICE].
  if (dunnageKg > 0) tareParts.push({ massKg: dunnageKg, cogMm: innerCentre });
  const tare = combineMasses(tareParts);
  const contents: PointMass = { massKg: section.massKg, cogMm: add(section.cogMm, sectionOffsetMm) };
  const all = combineMasses([tare, contents]);

  const netKg = section.massKg;
  const standard = crateStandardFor(netKg);
  const fragile = options.fragile ?? false;
  const stackable = options.stackable ?? !fragile;
  const lidLoad = options.lidDesignLoadKnPerM2 ?? LID_DESIGN_LOAD_KN_PER_M2;
  const warnings: string[] = [];
  if (skids.count > 0 && hs < MIN_FORK_ENTRY_MM) {
    warnings.push(`Fork entry ${Math.round(hs)} mm is below the ${MIN_FORK_ENTRY_MM} mm rule of thumb: raise the skids.`);
  }
  if (skids.count === 0) warnings.push('No skids: the crate has no fork entry of its own; it needs a pallet or lifting points.');
  if (skids.count > 0 && Math.min(skids.widthMm, skids.heightMm) <= 100 && all.massKg > SKID_100_LIMIT_KG) {
    warnings.push(
      `Gross ${Math.round(all.massKg)} kg on ${skids.widthMm} × ${skids.heightMm} mm skids: beyond the 100 × 100 mm rule of thumb (to about 1–2 t); have the skids sized.`,
    );
  }
  if (!standard) warnings.push(`Net ${Math.round(netKg)} kg is above the heaviest ASTM crate range (13,607 kg): an engineered crate is needed.`);
  const forkEntryGapMm = skids.count >= 2 ? (Wo - skids.count * skids.widthMm) / (skids.count - 1) : 0;

  return {
    sectionId: section.id,
    makeUp: { panel, base, skids, cleats },
    clearance,
    innerMm: [Li, Wi, Hi],
    outerMm: [Lo, Wo, Ho],
    components,
    tareKg: tare.massKg,
    netKg,
    grossKg: all.massKg,
    tareCogMm: tare.cogMm,
    cogMm: all.cogMm,
    sectionOffsetMm,
    forkEntryHeightMm: hs,
    forkEntryGapMm,
    standard,
    maxGrossKg: standard ? standard.maxNetKg + tare.massKg : undefined,
    stackable,
    maxLoadOnTopKg: stackable ? stackLimitKg(Lo, Wo, lidLoad) : 0,
    thisWayUp: options.thisWayUp ?? true,
    fragile,
    warnings,
  };
}
