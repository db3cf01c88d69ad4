import { z } from 'zod';
import { calendarDate } from '../contracts/run-spec.fields.js';
import { RUN_STATES } from './run.model.js';

/** Run ids travel as text (the ingest contract calls them opaque); the server's are positive integers. */
export const runIdParams = z.object({ id: z.string().regex(/^[1-9]\d{0,9}$/, 'a run id').transform(Number) });

export const seriesParams = z.object({
  id: z.string().regex(/^[1-9]\d{0,9}$/, 'a run id').transform(Number),
  security: z.string().min(1).max(200),
});

const page = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
};

const stateList = z
  .string()
  .transform((text) => text.split(',').filter((s) => s !== ''))
  .pipe(z.array(z.enum(RUN_STATES)).min(1));

export const listRunsQuery = z.object({
  state: stateList.optional().describe('One state or several separated by commas.'),
  spec: z.string().min(1).max(100).optional().describe('Spec name.'),
  asOfFrom: calendarDate.optional(),
  asOfTo: calendarDate.optional(),
  sort: z.enum(['asOf', '-asOf', 'createdAt', '-createdAt', 'id', '-id']).default('-id'),
  ...page,
});

export const RESULT_SORTS = ['security', '-security', 'beta', '-beta', 'adjustedBeta', '-adjustedBeta', 'rSquared', '-rSquared', 'expectedReturn', '-expectedReturn'] as const;

export const listResultsQuery = z.object({
  attempt: z.coerce.number().int().min(1).optional().describe('Default: the run\'s current attempt.'),
  status: z.enum(['ok', 'insufficient']).optional(),
  flag: z.enum(['thin-data', 'low-fit', 'stale-prices', 'unstable', 'big-move', 'degenerate']).optional(),
  sort: z.enum(RESULT_SORTS).default('security'),
  ...page,
});

export const rerunBody = z.strictObject({ reason: z.string().min(1).max(2000) }).partial().default({});

export type ListRunsQuery = z.output<typeof listRunsQuery>;
export type ListResultsQuery = z.output<typeof listResultsQuery>;
