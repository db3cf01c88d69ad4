// The server's answers about specs, narrowed from unknown JSON (only the fields the CLI uses).
import { z } from 'zod';
import { CliError } from '../errors/cli-error.js';

const revisionSummary = z.object({
  number: z.number().int(),
  sha256: z.string(),
  authorKind: z.enum(['person', 'machine']).optional(),
  authorName: z.string(),
  createdAt: z.string(),
});

export const specSummarySchema = z.object({
  name: z.string(),
  description: z.string().nullable(),
  revisionCount: z.number().int(),
  latest: revisionSummary,
});

export const specListSchema = z.object({ items: z.array(specSummarySchema) });

export const specDetailSchema = specSummarySchema.extend({
  current: revisionSummary.extend({ specName: z.string(), text: z.string() }),
});

export const pushSpecAnswerSchema = z.object({ name: z.string(), created: z.boolean(), revision: revisionSummary });

export type SpecSummaryAnswer = z.infer<typeof specSummarySchema>;

export function parseAnswer<T>(schema: z.ZodType<T>, value: unknown, what: string): T {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  throw new CliError('INTERNAL', `${what}: the server's answer is not in the expected shape`);
}
