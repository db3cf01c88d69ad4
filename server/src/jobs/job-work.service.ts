import type { Sequelize, Transaction } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import type { Actor } from '../runs/actor.js';
import { RunAttempt } from '../runs/run-attempt.model.js';
import { runAuditView } from '../runs/run-states.js';
import { Run } from '../runs/run.model.js';
import { NotFoundError } from '../shared/errors.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { Spec } from '../specs/spec.model.js';
import type { Job } from './job.model.js';
import { finishJob, findJob, type JobView } from './jobs.service.js';
import type { FailedRequest } from './jobs.schemas.js';

export interface JobSpec {
  jobId: string;
  specName: string;
  revision: number;
  sha256: string;
  text: string;
}

/** The spec revision a job computes with: the run's own for a rerun, the named spec's current one for an upload. */
export async function jobSpec(id: number): Promise<JobSpec> {
  const job = await findJob(id);
  let revision: SpecRevision | null = null;
  if (job.kind === 'rerun') {
    const run = await Run.findByPk(Number(job.payload['runId']));
    revision = run ? await SpecRevision.findByPk(run.specRevisionId) : null;
  } else if (typeof job.payload['specName'] === 'string') {
    const spec = await Spec.findOne({ where: { name: job.payload['specName'] } });
    revision = spec ? await SpecRevision.findOne({ where: { specId: spec.id, number: spec.latestNumber } }) : null;
  }
  if (!revision) throw new NotFoundError(`Job ${id} names no spec: match its file against the specs (GET /api/specs)`);
  const spec = (await Spec.findByPk(revision.specId)) as Spec;
  return { jobId: String(job.id), specName: spec.name, revision: revision.number, sha256: revision.sha256, text: revision.yamlText };
}

/** A failed rerun job fails its attempt too, unless the worker already posted the run's result or failure. */
async function failRerunAttempt(transaction: Transaction, job: Job, actor: Actor, failure: FailedRequest, requestId: string | null): Promise<void> {
  if (job.kind !== 'rerun') return;
  const run = await Run.findByPk(Number(job.payload['runId']), { transaction, lock: transaction.LOCK.UPDATE });
  if (!run || run.attempt !== job.payload['attempt'] || (run.state !== 'received' && run.state !== 'computing')) return;
  const before = runAuditView(run);
  const now = new Date();
  await run.update({ state: 'failed', failureCode: failure.code, failureMessage: failure.message, finishedAt: now }, { transaction });
  await RunAttempt.update({ state: 'failed', failureCode: failure.code, failureMessage: failure.message, finishedAt: now }, { where: { runId: run.id, number: run.attempt }, transaction });
  await recordAudit(transaction, { actor: actor.principal, action: 'run.fail', entityType: 'run', entityId: run.id, before, after: runAuditView(run), requestId });
}

export async function failJob(sequelize: Sequelize, actor: Actor, id: number, failure: FailedRequest, requestId: string | null): Promise<JobView> {
  const outcome = `${failure.code}: ${failure.message}`;
  return finishJob(sequelize, actor, id, failure.worker, 'failed', outcome, requestId, (transaction, job) =>
    failRerunAttempt(transaction, job, actor, failure, requestId),
  );
}
