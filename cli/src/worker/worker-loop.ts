// The worker: claims a job (the server hands each to one worker, with a lease), runs it, reports it
// done or failed; when the queue is empty it waits and asks again. A server out of reach is waited
// out with backoff; the lease of a job left unfinished lets another worker claim it later.
import type { Logger } from 'pino';
import { CliError } from '../errors/cli-error.js';
import type { ServerClient } from '../transport/server-client.js';
import { parseAnswer } from '../transport/spec-answers.js';
import { claimedJobSchema, rerunPayloadSchema, uploadPayloadSchema, type ClaimedJob } from './job-answers.js';
import { runRerunJob, type JobOutcome } from './rerun-job.js';
import { runUploadJob, type UploadJobDeps } from './upload-job.js';

export interface WorkerOptions {
  readonly worker: string;
  readonly workDir: string;
  readonly pollMs: number;
  /** Drain the queue, then end. */
  readonly once: boolean;
  /** Where upload jobs are processed; without it only rerun jobs are claimed. */
  readonly uploads: Omit<UploadJobDeps, 'client' | 'logger'> | null;
}

async function claim(client: ServerClient, options: WorkerOptions): Promise<ClaimedJob | null> {
  const kinds = options.uploads === null ? ['rerun'] : ['rerun', 'upload'];
  const answer = await client.request('POST', '/api/jobs/claim', { json: { worker: options.worker, kinds } });
  return answer.status === 204 ? null : parseAnswer(claimedJobSchema, answer.json(), 'POST /api/jobs/claim');
}

async function runJob(client: ServerClient, job: ClaimedJob, options: WorkerOptions, logger: Logger): Promise<JobOutcome> {
  if (job.kind === 'rerun') return runRerunJob(client, job, rerunPayloadSchema.parse(job.payload), options.workDir, logger);
  if (options.uploads === null) return { state: 'failed', code: 'INTERNAL', message: 'this worker has no drop folder for uploads' };
  return runUploadJob({ ...options.uploads, client, logger }, job, uploadPayloadSchema.parse(job.payload));
}

async function report(client: ServerClient, job: ClaimedJob, outcome: JobOutcome, worker: string): Promise<void> {
  if (outcome.state === 'done') {
    await client.request('POST', `/api/jobs/${job.id}/done`, { json: { worker, outcome: outcome.message.slice(0, 2000) } });
  } else {
    const code = outcome.code !== undefined && /^[A-Z_]+$/.test(outcome.code) ? outcome.code : 'INTERNAL';
    await client.request('POST', `/api/jobs/${job.id}/failed`, { json: { worker, code, message: outcome.message.slice(0, 2000) } });
  }
}

function pause(ms: number, stop: Promise<unknown>): Promise<unknown> {
  let timer: NodeJS.Timeout | undefined;
  return Promise.race([new Promise((resolve) => (timer = setTimeout(resolve, ms))), stop]).finally(() => clearTimeout(timer));
}

/** Runs until `stop` resolves (the current job is finished first) or, with once, the queue is empty. Answers the jobs run. */
export async function workLoop(client: ServerClient, options: WorkerOptions, logger: Logger, stop: Promise<unknown>): Promise<number> {
  let stopped = false;
  void stop.then(() => (stopped = true));
  let count = 0;
  let backoffMs = options.pollMs;
  while (!stopped) {
    let job: ClaimedJob | null;
    try {
      job = await claim(client, options);
      backoffMs = options.pollMs;
    } catch (error) {
      if (!(error instanceof CliError && error.code === 'SERVER_UNREACHABLE') || options.once) throw error;
      logger.warn({ retryInMs: backoffMs }, error.message);
      await pause(backoffMs, stop);
      backoffMs = Math.min(backoffMs * 2, 300_000);
      continue;
    }
    if (job === null) {
      if (options.once) break;
      await pause(options.pollMs, stop);
      continue;
    }
    logger.info({ job: job.id, kind: job.kind }, 'job claimed');
    const outcome = await runJob(client, job, options, logger);
    await report(client, job, outcome, options.worker);
    logger.info({ job: job.id, state: outcome.state }, outcome.message);
    count += 1;
  }
  return count;
}
