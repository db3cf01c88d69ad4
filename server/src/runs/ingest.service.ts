import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import type { CreateRunRequest, CreateRunResponse, PostFailureRequest } from '../contracts/ingest.schemas.js';
import { renderFingerprint, sha256Hex } from '../contracts/result-fingerprint.js';
import { revisionBySha256 } from '../specs/specs.service.js';
import { Spec } from '../specs/spec.model.js';
import { AppError } from '../shared/errors.js';
import type { ContentStore } from '../store/content-store.js';
import { actorLabel, type Actor } from './actor.js';
import { oncePerKey, type Answer } from './idempotency.js';
import { RunAttempt } from './run-attempt.model.js';
import { RunInput } from './run-input.model.js';
import { lockRun, requireState, runAuditView } from './run-states.js';
import { Run } from './run.model.js';

export interface IngestContext {
  sequelize: Sequelize;
  store: ContentStore;
  actor: Actor;
  requestId: string | null;
}

/** Inputs the store lacks, each checksum once, in the order given. */
async function missingInputs(store: ContentStore, inputs: readonly { sha256: string }[]): Promise<string[]> {
  const missing: string[] = [];
  for (const sha256 of new Set(inputs.map((input) => input.sha256))) {
    if (!(await store.has(sha256))) missing.push(sha256);
  }
  return missing;
}

/**
 * Creates a run in state `received` for a spec revision the server holds (else SPEC_UNKNOWN) and
 * answers the inputs the store lacks. With an Idempotency-Key, a retried create answers the same run.
 */
export async function createRun(ctx: IngestContext, request: CreateRunRequest, key: string | undefined): Promise<Answer> {
  return ctx.sequelize.transaction(async (transaction) => {
    const revision = await revisionBySha256(request.specSha256, transaction);
    const spec = await Spec.findByPk(revision.specId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!spec || spec.name !== request.specName) {
      throw new AppError(404, 'SPEC_UNKNOWN', `The spec with sha256 ${request.specSha256} is not named ${request.specName} on this server`);
    }
    return oncePerKey(transaction, `create-run:${spec.id}`, key, request, async () => {
      const fingerprint = renderFingerprint({ specSha256: request.specSha256, inputs: request.inputs });
      const run = await Run.create(
        {
          specId: spec.id,
          specRevisionId: revision.id,
          asOf: request.asOf,
          state: 'received',
          attempt: 1,
          actorKind: ctx.actor.kind,
          actorId: ctx.actor.id,
          actorName: ctx.actor.name,
          fingerprint,
          fingerprintSha256: sha256Hex(fingerprint),
        },
        { transaction },
      );
      await RunAttempt.create({ runId: run.id, number: 1, state: 'received', actorName: actorLabel(ctx.actor), startedAt: new Date() }, { transaction });
      await RunInput.bulkCreate(request.inputs.map((input) => ({ runId: run.id, ...input })), { transaction });
      await recordAudit(transaction, { actor: ctx.actor.principal, action: 'run.create', entityType: 'run', entityId: run.id, after: runAuditView(run), requestId: ctx.requestId });
      const body: CreateRunResponse = { runId: String(run.id), attempt: 1, state: 'received', missingInputs: await missingInputs(ctx.store, request.inputs) };
      return { status: 201, body };
    });
  });
}

/** Every input of the run is in the store with its declared size; else the computation could not be repeated. */
async function requireInputsStored(store: ContentStore, runId: number): Promise<void> {
  const inputs = await RunInput.findAll({ where: { runId } });
  const problems: string[] = [];
  for (const input of inputs) {
    const size = await store.sizeOf(input.sha256);
    if (size === undefined) problems.push(`${input.name} (${input.sha256}) is not uploaded`);
    else if (size !== input.size) problems.push(`${input.name} is ${size} bytes in the store, ${input.size} declared`);
  }
  if (problems.length > 0) {
    throw new AppError(409, 'RUN_STATE_CONFLICT', `Upload every input before computing: ${problems[0]}`, { problems });
  }
}

/** received → computing (again computing is a no-op, so a worker may retry). */
export async function markComputing(ctx: IngestContext, runId: number): Promise<Record<string, unknown>> {
  await requireInputsStored(ctx.store, runId);
  return ctx.sequelize.transaction(async (transaction) => {
    const run = await lockRun(runId, transaction);
    requireState(run, ['received', 'computing'], 'computing');
    if (run.state === 'received') {
      const before = runAuditView(run);
      const now = new Date();
      await run.update({ state: 'computing', computingAt: now }, { transaction });
      await RunAttempt.update({ state: 'computing', computingAt: now }, { where: { runId, number: run.attempt }, transaction });
      await recordAudit(transaction, { actor: ctx.actor.principal, action: 'run.computing', entityType: 'run', entityId: run.id, before, after: runAuditView(run), requestId: ctx.requestId });
    }
    return { runId: String(run.id), attempt: run.attempt, state: run.state };
  });
}

/** received or computing → failed, with the shared error code and message; a retry with the same Idempotency-Key answers the same. */
export async function markFailed(ctx: IngestContext, runId: number, failure: PostFailureRequest, key: string | undefined): Promise<Answer> {
  return ctx.sequelize.transaction(async (transaction) => {
    const run = await lockRun(runId, transaction);
    return oncePerKey(transaction, `failure:${run.id}`, key, failure, async () => {
      requireState(run, ['received', 'computing'], 'a failure');
      const before = runAuditView(run);
      const now = new Date();
      await run.update({ state: 'failed', failureCode: failure.code, failureMessage: failure.message, finishedAt: now }, { transaction });
      await RunAttempt.update(
        { state: 'failed', failureCode: failure.code, failureMessage: failure.message, finishedAt: now },
        { where: { runId, number: run.attempt }, transaction },
      );
      await recordAudit(transaction, { actor: ctx.actor.principal, action: 'run.fail', entityType: 'run', entityId: run.id, before, after: { ...runAuditView(run), failureMessage: failure.message }, requestId: ctx.requestId });
      return { status: 200, body: { runId: String(run.id), attempt: run.attempt, state: run.state } };
    });
  });
}
