import { z } from 'zod';

export const specNameParams = z.object({ name: z.string().min(1).max(100) });

export const revisionParams = z.object({
  name: z.string().min(1).max(100),
  number: z.coerce.number().int().min(1),
});

export const diffQuery = z.object({
  against: z.coerce.number().int().min(1).optional().describe('The revision to compare with; default the one before.'),
});

/** A push: the spec's YAML text exactly as written; `file` only names it in error messages. */
export const pushSpecBody = z.strictObject({
  text: z.string().min(1).max(1_000_000),
  file: z.string().min(1).max(255).optional(),
});
