// The delivery of a computed run: what the server receives, and its idempotency key derived from
// the fingerprint (spec sha256, as-of date, input names and checksums), so the same run posted twice
// is one, and the same content under other file names (another fingerprint) is another run.
import { createHash } from 'node:crypto';
import { resultRecords } from '../../../server/src/contracts/result-csv.js';
import type { PostResultsRequest } from '../../../server/src/contracts/ingest.schemas.js';
import type { Delivery } from '../transport/ingest.js';
import type { ComputedRun } from './compute-run.js';

export function deliveryKey(specSha256: string, run: Pick<ComputedRun, 'asOf' | 'inputs'>): string {
  const inputs = run.inputs.map((input) => `${input.sha256} ${input.name}`).sort();
  return createHash('sha256').update([specSha256, run.asOf, ...inputs].join('\n')).digest('hex');
}

export function resultsPayload(run: ComputedRun): PostResultsRequest {
  return { rows: resultRecords(run.rows) as PostResultsRequest['rows'], series: run.series.map((entry) => ({ ...entry })) };
}

export function deliveryOf(specName: string, specSha256: string, run: ComputedRun): Delivery {
  return {
    key: deliveryKey(specSha256, run),
    specName,
    specSha256,
    asOf: run.asOf,
    inputs: run.inputs.map(({ name, sha256, size, path }) => ({ name, sha256, size, path })),
    results: resultsPayload(run),
  };
}
