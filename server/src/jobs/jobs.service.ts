import { QueryTypes, type Sequelize, type Transaction, type WhereOptions } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { actorLabel, type Actor } from '../runs/actor.js';
import { AppError, NotFoundError } from '../shared/errors.js';
import { Job, type JobKind, type JobState } from './job.model.js';
import type { ClaimRequest, ListJobsQuery } from './jobs.schemas.js';

export interface JobView {
  id: string;
  kind: JobKind;
  state: JobState;
  payload: Record<string, unknown>;
  claimedBy: string | null;
  claimedAt: string | null;
  leaseUntil: string | null;
  claimCount: number;
  outcome: string | null;
  createdBy: string;
  createdAt: string;
  finishedAt: string | null;
}

const iso = (d: Date | null | undefined): string | null => (d ? d.toISOString() : null);

export function jobView(job: Job): JobView {
  return {
    id: String(job.id),
    kind: job.kind,
    state: job.state,
    payload: job.payload,
    claimedBy: job.claimedBy ?? null,
    claimedAt: iso(job.claimedAt),
    leaseUntil: iso(job.leaseUntil),
    claimCount: job.claimCount,
    outcome: job.outcome ?? null,
    createdBy: job.createdBy,
    createdAt: job.createdAt.toISOString(),
    finishedAt: iso(job.finishedAt),
  };
}

/** Queues a job inside the caller's transaction (a rerun or an upload), audited there too. */
export async function enqueueJob(transaction: Transaction, actor: Actor, kind: JobKind, payload: Record<string, unknown>, requestId: string | null): Promise<Job> {
  const job = await Job.create({ kind, payload, createdBy: actorLabel(actor) }, { transaction });
  await recordAudit(transaction, { actor: actor.principal, action: 'job.enqueue', entityType: 'job', entityId: job.id, after: { kind, payload }, requestId });
  return job;
}

function claimantOf(actor: Actor, worker: string): string {
  return `${actorLabel(actor)}/${worker}`.slice(0, 200);
}

/**
 * Claims the oldest queued job (or one whose lease ran out) for this worker. `FOR UPDATE SKIP
 * LOCKED` lets workers on many hosts claim at once without waiting on, or taking, each other's job.
 */
export async function claimJob(sequelize: Sequelize, actor: Actor, request: ClaimRequest, requestId: string | null): Promise<JobView | null> {
  return sequelize.transaction(async (transaction) => {
    const now = new Date();
    const rows = await sequelize.query<{ id: number }>(
      "SELECT id FROM jobs WHERE kind IN (:kinds) AND (state = 'queued' OR (state = 'claimed' AND lease_until < :now)) ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED",
      { replacements: { kinds: request.kinds, now }, type: QueryTypes.SELECT, transaction },
    );
    const id = rows[0]?.id;
    if (id === undefined) return null;
    const job = (await Job.findByPk(id, { transaction })) as Job;
    const before = { state: job.state, claimedBy: job.claimedBy ?? null };
    await job.update(
      { state: 'claimed', claimedBy: claimantOf(actor, request.worker), claimedAt: now, leaseUntil: new Date(now.getTime() + request.leaseSeconds * 1000), claimCount: job.claimCount + 1 },
      { transaction },
    );
    await recordAudit(transaction, { actor: actor.principal, action: 'job.claim', entityType: 'job', entityId: job.id, before, after: { state: job.state, claimedBy: job.claimedBy }, requestId });
    return jobView(job);
  });
}

/** The job, locked, held by this worker; finishing it twice answers the same. */
export async function lockHeldJob(transaction: Transaction, id: number, actor: Actor, worker: string, finalState: JobState): Promise<Job> {
  const job = await Job.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!job) throw new NotFoundError(`No job ${id}`);
  const claimant = claimantOf(actor, worker);
  if (job.claimedBy !== claimant || (job.state !== 'claimed' && job.state !== finalState)) {
    throw new AppError(409, 'JOB_STATE_CONFLICT', `Job ${id} is ${job.state}${job.claimedBy ? ` and held by ${job.claimedBy}` : ''}, not claimed by ${claimant}`);
  }
  return job;
}

export async function finishJob(
  sequelize: Sequelize,
  actor: Actor,
  id: number,
  worker: string,
  state: 'done' | 'failed',
  outcome: string | null,
  requestId: string | null,
  alsoInTransaction?: (transaction: Transaction, job: Job) => Promise<void>,
): Promise<JobView> {
  return sequelize.transaction(async (transaction) => {
    const job = await lockHeldJob(transaction, id, actor, worker, state);
    if (job.state === state) return jobView(job);
    await job.update({ state, outcome, finishedAt: new Date(), leaseUntil: null }, { transaction });
    if (alsoInTransaction) await alsoInTransaction(transaction, job);
    await recordAudit(transaction, { actor: actor.principal, action: `job.${state}`, entityType: 'job', entityId: job.id, before: { state: 'claimed' }, after: { state, outcome }, requestId });
    return jobView(job);
  });
}

export async function listJobs(query: ListJobsQuery): Promise<{ items: JobView[]; page: number; pageSize: number; total: number }> {
  const where: Record<string, unknown> = {};
  if (query.state) where['state'] = query.state;
  if (query.kind) where['kind'] = query.kind;
  const { rows, count } = await Job.findAndCountAll({
    where: where as WhereOptions<Job>,
    order: [['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(jobView), page: query.page, pageSize: query.pageSize, total: count };
}

export async function findJob(id: number): Promise<Job> {
  const job = await Job.findByPk(id);
  if (!job) throw new NotFoundError(`No job ${id}`);
  return job;
}
