import { z } from 'zod';
import { vec3Mm } from './mass.ts';

/**
 * Crate design inputs and results, shared by the crate editor, the server and the core
 * (src/domain/crates). mm, kg; the crate frame has its origin at the outer bottom corner, x along the
 * length, z up.
 */

const materialCode = z.string().trim().min(1).max(60);
const thicknessMm = z.number().positive().max(500);

export const crateLayer = z.object({ materialCode, thicknessMm });
export const crateSkids = z.object({
  materialCode,
  count: z.number().int().nonnegative().max(20),
  widthMm: z.number().positive().max(1000),
  heightMm: z.number().positive().max(1000),
});
export const crateCleats = z.object({ materialCode, widthMm: z.number().positive().max(500), thicknessMm });

export const crateMakeUp = z.object({ panel: crateLayer, base: crateLayer, skids: crateSkids, cleats: crateCleats.nullable() });

export const crateClearance = z.object({
  sidesMm: z.number().nonnegative().max(1000),
  topMm: z.number().nonnegative().max(1000),
  bottomMm: z.number().nonnegative().max(1000),
});

export const crateSection = z
  .object({
    id: z.string().optional(),
    name: z.string().optional(),
    massKg: z.number().positive(),
    cogMm: vec3Mm,
    bboxMinMm: vec3Mm,
    bboxMaxMm: vec3Mm,
  })
  .refine((s) => s.bboxMinMm.every((v, i) => v < s.bboxMaxMm[i]), { message: 'the section box must have a positive size on every axis', path: ['bboxMaxMm'] });

export const crateDesignOptions = z.object({
  clearanceMm: z.union([z.number().nonnegative().max(1000), crateClearance.partial()]).optional(),
  makeUp: z.object({ panel: crateLayer.optional(), base: crateLayer.optional(), skids: crateSkids.optional(), cleats: crateCleats.nullable().optional() }).optional(),
  materials: z.array(z.object({ code: materialCode, densityKgPerM3: z.number().positive().max(30_000) })).optional(),
  dunnageKg: z.number().nonnegative().max(10_000).optional(),
  stackable: z.boolean().optional(),
  fragile: z.boolean().optional(),
  thisWayUp: z.boolean().optional(),
  lidDesignLoadKnPerM2: z.number().positive().max(100).optional(),
});

/** The crate editor's request: design a crate around a section. */
export const crateDesignRequest = z.object({ section: crateSection, options: crateDesignOptions.optional() });
export type CrateDesignRequest = z.infer<typeof crateDesignRequest>;

export const crateDesignView = z.object({
  sectionId: z.string().optional(),
  makeUp: crateMakeUp,
  clearance: crateClearance,
  innerMm: vec3Mm,
  outerMm: vec3Mm,
  components: z.array(z.object({ name: z.string(), materialCode: z.string(), volumeMm3: z.number(), massKg: z.number(), cogMm: vec3Mm })),
  tareKg: z.number(),
  netKg: z.number(),
  grossKg: z.number(),
  tareCogMm: vec3Mm,
  cogMm: vec3Mm,
  sectionOffsetMm: vec3Mm,
  forkEntryHeightMm: z.number(),
  forkEntryGapMm: z.number(),
  standard: z.object({ code: z.enum(['ASTM D6251', 'ASTM D6256', 'ASTM D6039', 'ASTM D7478']), title: z.string(), maxNetKg: z.number() }).optional(),
  maxGrossKg: z.number().optional(),
  stackable: z.boolean(),
  maxLoadOnTopKg: z.number(),
  thisWayUp: z.boolean(),
  fragile: z.boolean(),
  warnings: z.array(z.string()),
});
export type CrateDesignView = z.infer<typeof crateDesignView>;

/** A stock case, box or pallet (catalogue entry). */
export const stockItem = z.object({
  id: z.string().min(1),
  name: z.string().min(1),
  kind: z.enum(['pallet', 'case', 'box']),
  outerMm: vec3Mm,
  innerMm: vec3Mm.optional(),
  tareKg: z.number().nonnegative(),
  maxLoadKg: z.number().positive().optional(),
  stackable: z.boolean(),
  source: z.string(),
});

/** Transport leg settings for the crate's packing-list notes. */
export const crateLegRequest = z.object({
  international: z.boolean(),
  profile: z.enum(['road-1g', 'road-ctu', 'sea-a', 'sea-b', 'sea-c']).optional(),
  ride: z.enum(['length-along', 'width-along', 'any']).optional(),
});
