/**
 * Split advisor shapes (issue 8). mm, kg; frame as everywhere in the core (z up).
 */
export type Vec3Tuple = [number, number, number];

export interface SplitAssembly {
  id: string;
  parentId: string | null;
  /** Must travel whole: the advisor never divides it into its children. */
  keepTogether: boolean;
  /**
   * May share a section only with units it is adjacent to (see `adjacency`), so that a section is one
   * piece that can be crated. Optional.
   */
  adjacentOnly?: boolean;
}

export interface SplitPart {
  assemblyId: string;
  massKg: number;
  cogMm: Vec3Tuple;
  bboxMinMm: Vec3Tuple;
  bboxMaxMm: Vec3Tuple;
}

export interface SplitLimits {
  maxSectionMassKg: number;
  /** Largest crate-able size; a section fits when its extent fits in any orientation. */
  maxSectionSizeMm?: Vec3Tuple;
  /** Optional: no more sections than this. */
  maxSections?: number;
}

export interface SplitOptions {
  maxProposals?: number;
  timeLimitMs?: number;
  seed?: number;
  /** Improvement rounds of the heuristic; the same seed and maxIterations give the same result. */
  maxIterations?: number;
  /** Pairs of assembly ids that touch (for adjacent-only assemblies). */
  adjacency?: [string, string][];
  /** 'auto' (default): exhaustive for small machines, heuristic otherwise; 'heuristic' forces it. */
  method?: 'auto' | 'heuristic';
  /** Called with a fraction 0–1 as the search proceeds. */
  onProgress?: (fraction: number) => void;
}

export interface SplitInput {
  assemblies: SplitAssembly[];
  parts: SplitPart[];
  limits: SplitLimits;
  options?: SplitOptions;
}

/** One piece of a section: an assembly whole, or only the parts hung directly on a divided assembly. */
export interface SectionUnit {
  assemblyId: string;
  scope: 'whole' | 'own-parts';
}

export interface ProposedSection {
  assemblyIds: string[];
  massKg: number;
  cogMm: Vec3Tuple;
  sizeMm: Vec3Tuple;
  /** Exactly what the section holds. */
  units?: SectionUnit[];
  /** Why it is valid: each limit and its margin. */
  margins?: { massKg: number; sizeMm?: Vec3Tuple };
}

export interface SplitProposal {
  sections: ProposedSection[];
  /** The objective, for display: fewest sections, then the heaviest section, then CoG offsets. */
  score?: { sections: number; heaviestKg: number; cogOffsetSumMm: number };
}

export interface SplitResult {
  proposals: SplitProposal[];
  infeasible: { assemblyId: string; reason: string }[];
  /** How the answer was found: 'exact' (exhaustive; proven best) or 'heuristic'. */
  method?: 'exact' | 'heuristic';
}
