import { z } from 'zod';
import { paperSize, unitSystem } from './common.ts';

export const productionView = z.object({
  id: z.string(),
  name: z.string(),
  machineName: z.string(),
  paperSize,
  /** Units printed on this production's paperwork by default; each user picks their own on screen. */
  defaultUnits: unitSystem,
  version: z.number().int(),
  updatedAt: z.string(),
});
export type ProductionView = z.infer<typeof productionView>;

export const productionSettingsBody = z.object({
  version: z.number().int().nonnegative(),
  name: z.string().trim().min(1).max(120).optional(),
  paperSize: paperSize.optional(),
  defaultUnits: unitSystem.optional(),
});
export type ProductionSettingsBody = z.infer<typeof productionSettingsBody>;
