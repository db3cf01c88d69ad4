import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { enqueueJob } from '../jobs/jobs.service.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { Spec } from '../specs/spec.model.js';
import { actorLabel, type Actor } from './actor.js';
import { RunAttempt } from './run-attempt.model.js';
import { RunInput } from './run-input.model.js';
import { lockRun, RERUNNABLE, requireState, runAuditView } from './run-states.js';

export interface RerunAnswer {
  runId: string;
  attempt: number;
  jobId: string;
  state: 'received';
}

/**
 * A new attempt of an in-review or failed run, as a rerun job any worker may claim: the same spec
 * revision and the same inputs by checksum, so a worker on any host computes the same thing.
 */
export async function rerunRun(sequelize: Sequelize, actor: Actor, runId: number, reason: string | undefined, requestId: string | null): Promise<RerunAnswer> {
  return sequelize.transaction(async (transaction) => {
    const run = await lockRun(runId, transaction);
    requireState(run, RERUNNABLE, 'a rerun');
    const before = runAuditView(run);
    const revision = (await SpecRevision.findByPk(run.specRevisionId, { transaction })) as SpecRevision;
    const spec = (await Spec.findByPk(run.specId, { transaction })) as Spec;
    const inputs = await RunInput.findAll({ where: { runId }, order: [['name', 'ASC']], transaction });
    const attempt = run.attempt + 1;
    const job = await enqueueJob(
      transaction,
      actor,
      'rerun',
      {
        runId: String(run.id),
        attempt,
        specName: spec.name,
        specSha256: revision.sha256,
        asOf: run.asOf,
        inputs: inputs.map((i) => ({ name: i.name, sha256: i.sha256, size: i.size })),
        ...(reason ? { reason } : {}),
      },
      requestId,
    );
    await RunAttempt.create({ runId, number: attempt, state: 'received', jobId: job.id, actorName: actorLabel(actor), startedAt: new Date() }, { transaction });
    await run.update(
      { state: 'received', attempt, failureCode: null, failureMessage: null, securityCount: null, computingAt: null, finishedAt: null },
      { transaction },
    );
    await recordAudit(transaction, { actor: actor.principal, action: 'run.rerun', entityType: 'run', entityId: run.id, before, after: { ...runAuditView(run), jobId: job.id, reason: reason ?? null }, requestId });
    return { runId: String(run.id), attempt, jobId: String(job.id), state: 'received' };
  });
}
