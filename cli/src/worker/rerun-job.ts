// A rerun job: the run's own spec revision and inputs (fetched by checksum), the run's as-of date,
// the prior betas of the last released run; the run is marked computing, computed, and its results
// posted with an idempotency key of the attempt — or its failure posted with the error's code.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Logger } from 'pino';
import { isErrorCode, type ErrorCode } from '../../../server/src/contracts/errors.js';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { computeRun } from '../batch/compute-run.js';
import { resultsPayload } from '../batch/delivery-of.js';
import { assignInputRoles } from '../batch/input-roles.js';
import { CliError } from '../errors/cli-error.js';
import { InputError } from '../inputs/input-error.js';
import { postFailure } from '../transport/ingest.js';
import { lastReleasedBetas } from '../transport/prior-betas.js';
import type { ServerClient } from '../transport/server-client.js';
import { parseAnswer } from '../transport/spec-answers.js';
import { fetchInput, safeFileName } from './fetch-input.js';
import { jobSpecSchema, type ClaimedJob, type RerunPayload } from './job-answers.js';

export interface JobOutcome {
  readonly state: 'done' | 'failed';
  readonly code?: string;
  readonly message: string;
}

/** Errors that belong to the run (bad spec or inputs): posted as the run's failure, not retried. */
function runFailure(error: unknown): { code: ErrorCode; message: string } | null {
  if (error instanceof InputError) return { code: isErrorCode(error.code) ? error.code : 'INPUT_UNREADABLE', message: error.message };
  if (error instanceof CliError && (error.code.startsWith('INPUT_') || error.code.startsWith('SPEC_'))) {
    return { code: isErrorCode(error.code) ? error.code : 'INPUT_UNREADABLE', message: error.message };
  }
  if (error instanceof Error && error.name === 'SpecError') return { code: 'SPEC_INVALID', message: error.message };
  return null;
}

export async function runRerunJob(client: ServerClient, job: ClaimedJob, payload: RerunPayload, workDir: string, logger: Logger): Promise<JobOutcome> {
  const runPath = `/api/runs/${encodeURIComponent(payload.runId)}`;
  const key = `rerun-${payload.runId}-attempt-${payload.attempt}`;
  try {
    const revision = parseAnswer(jobSpecSchema, (await client.request('GET', `/api/jobs/${job.id}/spec`)).json(), 'GET /api/jobs/:id/spec');
    const { spec, sha256 } = loadRunSpec(revision.text, `spec ${revision.specName} revision ${revision.revision}`);
    if (sha256 !== payload.specSha256) throw new CliError('SPEC_UNKNOWN', `job ${job.id} carries spec ${payload.specSha256} but the server sent ${sha256}`);
    const folder = path.join(workDir, `job-${job.id}`);
    await mkdir(folder, { recursive: true });
    const files = [];
    for (const input of payload.inputs) files.push(await fetchInput(client, input.sha256, path.join(folder, safeFileName(input.name))));
    await client.request('POST', `${runPath}/computing`, { json: {} });
    const run = await computeRun(spec, assignInputRoles(spec, files).paths, { asOf: payload.asOf, priorBetas: await lastReleasedBetas(client, spec.name) });
    await client.request('POST', `${runPath}/results`, { json: resultsPayload(run), idempotencyKey: key });
    logger.info({ job: job.id, runId: payload.runId, attempt: payload.attempt, securities: run.rows.length }, 'rerun computed and posted');
    return { state: 'done', message: `run ${payload.runId} attempt ${payload.attempt}: ${run.rows.length} securities` };
  } catch (error) {
    const failure = runFailure(error);
    if (failure === null) throw error;
    try {
      await postFailure(client, payload.runId, { code: failure.code, message: failure.message.slice(0, 2000) }, `${key}-failure`);
    } catch (postError) {
      logger.warn({ job: job.id, err: postError }, 'the run\'s failure could not be posted; the job is reported failed');
    }
    logger.error({ job: job.id, runId: payload.runId, code: failure.code }, `rerun failed: ${failure.message}`);
    return { state: 'failed', code: failure.code, message: failure.message };
  }
}
