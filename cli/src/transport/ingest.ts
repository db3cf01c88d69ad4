// Sends a computed run to the server (every call with the bearer token): create the run with the spec
// sha256 and the input checksums, upload the inputs the server lacks into its content-addressed
// store, mark the run computing, post the results with an Idempotency-Key (the same key twice stores
// once). A delivery can resume: once the run id is known it is kept and the create step skipped.
import { readFile } from 'node:fs/promises';
import {
  createRunResponseSchema,
  type CreateRunRequest,
  type PostFailureRequest,
  type PostResultsRequest,
} from '../../../server/src/contracts/ingest.schemas.js';
import { CliError } from '../errors/cli-error.js';
import type { ServerClient } from './server-client.js';

export interface DeliveryInput {
  readonly name: string;
  readonly sha256: string;
  readonly size: number;
  /** Where the file lies now (its archive place in a drop folder). */
  readonly path: string;
}

export interface Delivery {
  /** Idempotency key of the results post; the create call uses `<key>:create`. */
  readonly key: string;
  readonly specName: string;
  readonly specSha256: string;
  readonly asOf: string;
  readonly inputs: readonly DeliveryInput[];
  readonly results: PostResultsRequest;
  /** Set once the server has created the run. */
  readonly runId?: string;
}

export interface DeliveryHooks {
  /** Called as soon as the run id is known, so a resumed delivery never creates a second run. */
  runCreated?(runId: string): Promise<void>;
}

async function createRun(client: ServerClient, delivery: Delivery): Promise<{ runId: string; missing: readonly string[] }> {
  const request: CreateRunRequest = {
    specSha256: delivery.specSha256,
    specName: delivery.specName,
    asOf: delivery.asOf,
    inputs: delivery.inputs.map(({ name, sha256, size }) => ({ name, sha256, size })),
  };
  const answer = await client.request('POST', '/api/runs', { json: request, idempotencyKey: `${delivery.key}:create` });
  const parsed = createRunResponseSchema.safeParse(answer.json());
  if (!parsed.success) throw new CliError('INTERNAL', 'POST /api/runs: the server\'s answer does not match the ingest contract');
  return { runId: parsed.data.runId, missing: parsed.data.missingInputs };
}

async function uploadInputs(client: ServerClient, inputs: readonly DeliveryInput[], missing: ReadonlySet<string>): Promise<void> {
  for (const input of inputs) {
    if (!missing.has(input.sha256)) continue;
    let body: Buffer;
    try {
      body = await readFile(input.path);
    } catch (error) {
      throw new CliError('INPUT_UNREADABLE', `cannot read ${input.path} to upload it (${(error as NodeJS.ErrnoException).code ?? 'error'})`);
    }
    await client.request('PUT', `/api/inputs/${input.sha256}`, { body, contentType: 'application/octet-stream' });
  }
}

async function markComputing(client: ServerClient, runId: string): Promise<void> {
  try {
    await client.request('POST', `/api/runs/${encodeURIComponent(runId)}/computing`, { json: {} });
  } catch (error) {
    // A repeated delivery (a resumed outbox item, the same run posted twice) finds the run computing
    // or further: that step is done, and the results post with the same key answers as the first.
    if (!(error instanceof CliError && error.code === 'RUN_STATE_CONFLICT')) throw error;
  }
}

export async function deliverRun(client: ServerClient, delivery: Delivery, hooks: DeliveryHooks = {}): Promise<string> {
  let runId = delivery.runId;
  let missing = new Set(delivery.inputs.map((input) => input.sha256));
  if (runId === undefined) {
    const created = await createRun(client, delivery);
    runId = created.runId;
    missing = new Set(created.missing);
    await hooks.runCreated?.(runId);
  }
  await uploadInputs(client, delivery.inputs, missing);
  await markComputing(client, runId);
  await client.request('POST', `/api/runs/${encodeURIComponent(runId)}/results`, { json: delivery.results, idempotencyKey: delivery.key });
  return runId;
}

export async function postFailure(client: ServerClient, runId: string, failure: PostFailureRequest, key: string): Promise<void> {
  await client.request('POST', `/api/runs/${encodeURIComponent(runId)}/failure`, { json: failure, idempotencyKey: key });
}
