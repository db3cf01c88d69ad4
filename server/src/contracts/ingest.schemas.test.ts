import { describe, expect, it } from 'vitest';
import {
  MAX_SERIES_POINTS,
  createRunRequestSchema,
  postFailureRequestSchema,
  postResultsRequestSchema,
  postResultsRequestSchemaFor,
  seriesLimits,
} from './ingest.schemas.js';
import { toResultRecord } from './result-columns.js';
import { resultRow } from './result-rows.test-support.js';
import { loadRunSpec } from './run-spec.load.js';
import { specWith } from './run-spec.test-support.js';

const SHA = 'd'.repeat(64);

describe('createRunRequestSchema', () => {
  const body = {
    specSha256: SHA,
    specName: 'core-holdings',
    asOf: '2026-06-30',
    inputs: [{ name: 'vendor-prices-2026-06.csv', sha256: 'e'.repeat(64), size: 18234 }],
  };

  it('accepts the spec checksum, name, as-of date and the inputs', () => {
    expect(createRunRequestSchema.parse(body)).toEqual(body);
  });

  it('rejects an unresolved as-of, a path as input name, a repeated input and an unknown key', () => {
    expect(createRunRequestSchema.safeParse({ ...body, asOf: 'latest' }).success).toBe(false);
    expect(createRunRequestSchema.safeParse({ ...body, inputs: [{ ...body.inputs[0], name: '../prices.csv' }] }).success).toBe(false);
    expect(createRunRequestSchema.safeParse({ ...body, inputs: [body.inputs[0], body.inputs[0]] }).success).toBe(false);
    expect(createRunRequestSchema.safeParse({ ...body, attempt: 2 }).success).toBe(false);
  });
});

describe('post results', () => {
  const rows = [toResultRecord(resultRow('QZ1')), toResultRecord(resultRow('QZ2', { vasicekBeta: Number.NaN }))];
  const series = (security: string, points: number, rolling: number) => ({
    security,
    scatter: { market: Array.from({ length: points }, (_, i) => i / 100), security: Array.from({ length: points }, (_, i) => i / 90) },
    rolling: { periods: Array.from({ length: rolling }, (_, i) => `2026-${String(i + 1).padStart(2, '0')}`), betas: Array.from({ length: rolling }, (_, i) => (i === 0 ? null : 1 + i / 10)) },
  });

  it('accepts rows as result records and compact series per security', () => {
    const parsed = postResultsRequestSchema.parse({ rows, series: [series('QZ1', 60, 12)] });
    expect(parsed.rows[1]?.vasicek_beta).toBeNull();
  });

  it('limits the scatter to the spec\'s window and the rolling betas to its rolling count', () => {
    const { spec } = loadRunSpec(specWith('sampling:', '  window: 48', 'estimation:', '  rolling: { count: 6 }'), 'specs/core.yaml');
    const schema = postResultsRequestSchemaFor(seriesLimits(spec));
    expect(schema.safeParse({ rows, series: [series('QZ1', 48, 6)] }).success).toBe(true);
    expect(schema.safeParse({ rows, series: [series('QZ1', 49, 6)] }).success).toBe(false);
    expect(schema.safeParse({ rows, series: [series('QZ1', 48, 7)] }).success).toBe(false);
  });

  it('caps rolling count all at the hard limit', () => {
    const { spec } = loadRunSpec(specWith('estimation:', '  rolling: { count: all }'), 'specs/core.yaml');
    expect(seriesLimits(spec)).toEqual({ scatterPoints: 60, rollingPoints: MAX_SERIES_POINTS });
  });

  it('rejects arrays of different lengths, a row missing a column, and a series of an unknown security', () => {
    const uneven = series('QZ1', 10, 3);
    expect(postResultsRequestSchema.safeParse({ rows, series: [{ ...uneven, scatter: { ...uneven.scatter, security: [0.1] } }] }).success).toBe(false);
    expect(postResultsRequestSchema.safeParse({ rows, series: [{ ...uneven, rolling: { ...uneven.rolling, betas: [1] } }] }).success).toBe(false);
    const { beta: _dropped, ...withoutBeta } = rows[0] ?? toResultRecord(resultRow('QZ1'));
    expect(postResultsRequestSchema.safeParse({ rows: [withoutBeta], series: [] }).success).toBe(false);
    expect(postResultsRequestSchema.safeParse({ rows, series: [series('QZ9', 10, 3)] }).success).toBe(false);
  });

  it('rejects two rows for one security', () => {
    expect(postResultsRequestSchema.safeParse({ rows: [rows[0], rows[0]], series: [] }).success).toBe(false);
  });
});

describe('postFailureRequestSchema', () => {
  it('accepts a shared error code with message and details, and rejects an unknown code', () => {
    const failure = { code: 'INPUT_BAD_PRICE', message: 'vendor-prices.csv:14:3 price is negative', details: { line: 14, column: 3 } };
    expect(postFailureRequestSchema.parse(failure)).toEqual(failure);
    expect(postFailureRequestSchema.safeParse({ ...failure, code: 'BAD_PRICE' }).success).toBe(false);
    expect(postFailureRequestSchema.safeParse({ ...failure, message: '' }).success).toBe(false);
  });
});
