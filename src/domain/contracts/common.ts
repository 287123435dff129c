import { z } from 'zod';

/** Every editable record carries a version; a save names the version it started from. */
export const versioned = z.object({ version: z.number().int().nonnegative() });

export const idParam = z.string().uuid();

export const unitSystem = z.enum(['metric', 'imperial']);
export const paperSize = z.enum(['A4', 'Letter']);

/** The error body every API route returns on failure. */
export const apiError = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    /** Field-level problems, each naming the field path. */
    issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
    /** On 409: the current record, so the client can offer reload or merge. */
    current: z.unknown().optional(),
  }),
});
export type ApiError = z.infer<typeof apiError>;
