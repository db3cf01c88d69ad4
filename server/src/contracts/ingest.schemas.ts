import { z } from 'zod';
import { errorCodeSchema } from './errors.js';
import { RESULT_COLUMNS, type NumberColumn, type ResultColumn } from './result-columns.js';
import { calendarDate, slug } from './run-spec.fields.js';
import type { ResolvedRunSpec } from './run-spec.schema.js';

/**
 * The ingest payloads a machine (`clino run --post`, `clino work`) sends with its bearer token:
 * create a run, post its results, or post its failure. Rates and returns are decimals.
 */

export const sha256Schema = z.string().regex(/^[0-9a-f]{64}$/, 'a sha256 digest: 64 lowercase hex digits');

/** One input file of a run, named as it was dropped (a file name, never a path). */
export const runInputSchema = z.strictObject({
  name: z
    .string()
    .min(1)
    .max(255)
    .regex(/^[^/\\\u0000-\u001f\u007f]+$/, 'a file name without / or control characters'),
  sha256: sha256Schema,
  size: z.number().int().min(0),
});

export const createRunRequestSchema = z.strictObject({
  specSha256: sha256Schema.describe('sha256 of the spec revision\'s text; the server refuses one it does not hold (SPEC_UNKNOWN).'),
  specName: slug,
  asOf: calendarDate.describe('The resolved as-of date (latest already replaced by the market\'s last date).'),
  inputs: z
    .array(runInputSchema)
    .min(1)
    .max(100)
    .refine((inputs) => new Set(inputs.map((input) => input.name)).size === inputs.length, 'each input name once'),
});

/** The server's answer: the run in state `received` and the inputs it lacks (upload those by checksum). */
export const createRunResponseSchema = z.strictObject({
  runId: z.string().min(1).describe('Opaque run id, as text.'),
  attempt: z.number().int().min(1),
  state: z.literal('received'),
  missingInputs: z.array(sha256Schema),
});

type Columns = (typeof RESULT_COLUMNS)[number];
type RecordShape = {
  [C in Columns as C['name']]: C extends NumberColumn ? z.ZodNullable<z.ZodNumber> : z.ZodNullable<z.ZodString>;
};

function recordShape(): RecordShape {
  const shape: Record<string, z.ZodNullable<z.ZodNumber> | z.ZodNullable<z.ZodString>> = {};
  for (const column of RESULT_COLUMNS as readonly ResultColumn[]) {
    shape[column.name] = column.type === 'number' ? z.number().nullable() : z.string().nullable();
  }
  return shape as RecordShape;
}

/** One result row as data: every result column, numbers as numbers, null for an empty cell. */
export const resultRecordSchema = z.strictObject(recordShape());

/** How long a security's compact series may be: the window for the scatter, the rolling count for rolling betas. */
export interface SeriesLimits {
  readonly scatterPoints: number;
  readonly rollingPoints: number;
}

/** Cap for `rolling.count: all` and for validation without a spec at hand. */
export const MAX_SERIES_POINTS = 10_000;

export function seriesLimits(spec: ResolvedRunSpec): SeriesLimits {
  const count = spec.estimation.rolling.count;
  return { scatterPoints: spec.sampling.window, rollingPoints: count === 'all' ? MAX_SERIES_POINTS : count };
}

function sameLength(a: readonly unknown[], b: readonly unknown[]): boolean {
  return a.length === b.length;
}

/** Per security, compact arrays rather than one row per point. */
export function securitySeriesSchema(limits: SeriesLimits) {
  return z.strictObject({
    security: z.string().min(1),
    scatter: z
      .strictObject({
        market: z.array(z.number()).max(limits.scatterPoints).describe('Market excess returns of the window\'s observations.'),
        security: z.array(z.number()).max(limits.scatterPoints).describe('The security\'s excess returns, same observations.'),
      })
      .refine((s) => sameLength(s.market, s.security), { message: 'market and security hold the same number of points', path: ['security'] }),
    rolling: z
      .strictObject({
        periods: z.array(z.string()).max(limits.rollingPoints).describe('Period label of each rolling window\'s end, oldest first.'),
        betas: z.array(z.number().nullable()).max(limits.rollingPoints).describe('Rolling beta per end; null when that window is insufficient.'),
      })
      .refine((r) => sameLength(r.periods, r.betas), { message: 'periods and betas hold the same number of points', path: ['betas'] }),
  });
}

function uniqueSecurities(items: readonly { readonly security: string | null }[]): boolean {
  return new Set(items.map((item) => item.security)).size === items.length;
}

export function postResultsRequestSchemaFor(limits: SeriesLimits) {
  return z
    .strictObject({
      rows: z.array(resultRecordSchema).refine(uniqueSecurities, 'one row per security'),
      series: z.array(securitySeriesSchema(limits)).refine(uniqueSecurities, 'one series per security'),
    })
    .refine((body) => {
      const rows = new Set(body.rows.map((row) => row.security));
      return body.series.every((entry) => rows.has(entry.security));
    }, { message: 'every series belongs to a security of rows', path: ['series'] });
}

/** The results body checked against the hard caps only; the server checks against the spec with postResultsRequestSchemaFor. */
export const postResultsRequestSchema = postResultsRequestSchemaFor({ scatterPoints: MAX_SERIES_POINTS, rollingPoints: MAX_SERIES_POINTS });

export const postFailureRequestSchema = z.strictObject({
  code: errorCodeSchema,
  message: z.string().min(1).max(2000),
  details: z.unknown().optional(),
});

export type RunInput = z.infer<typeof runInputSchema>;
export type CreateRunRequest = z.infer<typeof createRunRequestSchema>;
export type CreateRunResponse = z.infer<typeof createRunResponseSchema>;
export type ResultRecordPayload = z.infer<typeof resultRecordSchema>;
export type SecuritySeries = z.infer<ReturnType<typeof securitySeriesSchema>>;
export type PostResultsRequest = z.infer<typeof postResultsRequestSchema>;
export type PostFailureRequest = z.infer<typeof postFailureRequestSchema>;
