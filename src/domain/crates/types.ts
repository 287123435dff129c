import type { Vec3 } from '../geometry/vec3.ts';

/**
 * A section to be crated, in its own frame (mm, kg). The crate keeps the section's axes: the section's
 * x becomes the crate's length, y its width and z its height, so set the section frame accordingly.
 */
export interface CrateSection {
  id?: string;
  name?: string;
  massKg: number;
  cogMm: Vec3;
  bboxMinMm: Vec3;
  bboxMaxMm: Vec3;
}

/** One sheet or board layer. */
export interface CrateLayer {
  materialCode: string;
  thicknessMm: number;
}

/** Skids under the base, running the full outer length. */
export interface CrateSkids {
  materialCode: string;
  /** 0 for a crate without skids (it then has no fork entry of its own). */
  count: number;
  widthMm: number;
  heightMm: number;
}

/** Battens framing each wall and the lid on the outside. */
export interface CrateCleats {
  materialCode: string;
  widthMm: number;
  thicknessMm: number;
}

export interface CrateMakeUp {
  /** Sides, ends and lid. */
  panel: CrateLayer;
  /** Floor deck on the skids. */
  base: CrateLayer;
  skids: CrateSkids;
  cleats: CrateCleats | null;
}

/** Clearance between the section's bounding box and the crate's inside, mm. */
export interface CrateClearance {
  sidesMm: number;
  topMm: number;
  bottomMm: number;
}

export interface CrateDesignOptions {
  /** One figure for every side, or per side. Default 50 mm all round (REFERENCES §4.4, 25–50 mm [CP]). */
  clearanceMm?: number | Partial<CrateClearance>;
  /** Make-up overrides; see DEFAULT_MAKE_UP. */
  makeUp?: Partial<Omit<CrateMakeUp, 'cleats'>> & { cleats?: CrateCleats | null };
  /** The production's density table (codes as in mass/materials), taking precedence over the crate table. */
  materials?: readonly { code: string; densityKgPerM3: number }[];
  /** Blocking, bracing and foam inside the crate, kg (counted in the tare). */
  dunnageKg?: number;
  /** May other crates stand on this one? Default true unless fragile. */
  stackable?: boolean;
  fragile?: boolean;
  /** "This way up": default true (a machine section travels upright). */
  thisWayUp?: boolean;
  /** Design load on the lid, kN/m². Default 10 (REFERENCES §4.4 [S]). */
  lidDesignLoadKnPerM2?: number;
}

export interface CrateComponent {
  name: string;
  materialCode: string;
  volumeMm3: number;
  massKg: number;
  /** CoG in the crate frame (origin at the outer bottom corner, x along the length, z up). */
  cogMm: Vec3;
}

export interface CrateStandardRange {
  code: 'ASTM D6251' | 'ASTM D6256' | 'ASTM D6039' | 'ASTM D7478';
  title: string;
  /** Largest net load of the standard's range, kg. */
  maxNetKg: number;
}

export interface CrateDesign {
  sectionId?: string;
  makeUp: CrateMakeUp;
  clearance: CrateClearance;
  /** Inside length, width, height, mm. */
  innerMm: Vec3;
  /** Outside length, width, height (skids to lid cleats), mm. */
  outerMm: Vec3;
  components: CrateComponent[];
  tareKg: number;
  netKg: number;
  grossKg: number;
  /** Crate frame: origin at the outer bottom corner (under the skids), x along the length, y across, z up. */
  tareCogMm: Vec3;
  /** CoG of crate and contents (the mark on the crate), crate frame. */
  cogMm: Vec3;
  /** Add to a point in the section frame to get it in the crate frame. */
  sectionOffsetMm: Vec3;
  /** Clear height under the base for forks (= skid height), mm; 0 without skids. */
  forkEntryHeightMm: number;
  /** Clear gap between the outer skids for forks entering from the ends, mm. */
  forkEntryGapMm: number;
  /** The ASTM crate standard whose net-load range covers this crate; undefined above all of them. */
  standard?: CrateStandardRange;
  /** Largest gross mass by that standard's range: its net limit plus this tare. */
  maxGrossKg?: number;
  stackable: boolean;
  /** Largest mass that may stand on the lid, kg (0 when not stackable). */
  maxLoadOnTopKg: number;
  thisWayUp: boolean;
  fragile: boolean;
  /** Rule-of-thumb warnings (fork entry, skid size), each naming the figure and the limit. */
  warnings: string[];
}
