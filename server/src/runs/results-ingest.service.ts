import type { CreationAttributes } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { postResultsRequestSchemaFor, seriesLimits, type PostResultsRequest } from '../contracts/ingest.schemas.js';
import type { ResolvedRunSpec } from '../contracts/run-spec.schema.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { ValidationError } from '../shared/errors.js';
import { oncePerKey, type Answer } from './idempotency.js';
import type { IngestContext } from './ingest.service.js';
import { RunAttempt } from './run-attempt.model.js';
import { RunResult } from './run-result.model.js';
import { lockRun, requireState, runAuditView } from './run-states.js';
import type { Run } from './run.model.js';

/** Rows per INSERT: keeps each statement well under MariaDB's default 16 MB packet. */
const INSERT_BATCH = 500;

function numberOrNull(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

/** The series' lengths checked against the spec of the run: the window and the rolling count. */
function checkAgainstSpec(spec: ResolvedRunSpec, body: PostResultsRequest): void {
  const result = postResultsRequestSchemaFor(seriesLimits(spec)).safeParse(body);
  if (!result.success) {
    const issues = result.error.issues.slice(0, 50).map((issue) => ({ in: 'body', path: issue.path.join('.'), message: issue.message }));
    throw new ValidationError(`Invalid results at ${issues[0]?.path ?? ''}: ${issues[0]?.message ?? ''}`, { issues });
  }
}

function resultRows(run: Run, body: PostResultsRequest): CreationAttributes<RunResult>[] {
  const series = new Map(body.series.map((entry) => [entry.security, entry]));
  return body.rows.map((row) => {
    const security = row.security ?? '';
    const entry = series.get(security);
    return {
      runId: run.id,
      attempt: run.attempt,
      security,
      status: row.status ?? '',
      beta: numberOrNull(row.beta),
      adjustedBeta: numberOrNull(row.adjusted_beta),
      rSquared: numberOrNull(row.r_squared),
      expectedReturn: numberOrNull(row.expected_return),
      flags: row.flags ?? '',
      record: row,
      scatter: entry ? entry.scatter : null,
      rolling: entry ? entry.rolling : null,
    };
  });
}

/**
 * computing → in-review with every security's row and series, in one transaction: all rows or
 * none. The same Idempotency-Key again answers the first answer and stores nothing.
 */
export async function postResults(ctx: IngestContext, runId: number, body: PostResultsRequest, key: string): Promise<Answer> {
  return ctx.sequelize.transaction(async (transaction) => {
    const run = await lockRun(runId, transaction);
    return oncePerKey(transaction, `results:${run.id}`, key, body, async () => {
      requireState(run, ['computing'], 'results');
      const revision = await SpecRevision.findByPk(run.specRevisionId, { transaction });
      if (revision) checkAgainstSpec(revision.parsed as unknown as ResolvedRunSpec, body);
      if (body.rows.some((row) => !row.security)) throw new ValidationError('Every result row needs its security code');
      const rows = resultRows(run, body);
      for (let i = 0; i < rows.length; i += INSERT_BATCH) {
        await RunResult.bulkCreate(rows.slice(i, i + INSERT_BATCH), { transaction, validate: false, hooks: false });
      }
      const before = runAuditView(run);
      const now = new Date();
      await run.update({ state: 'in-review', securityCount: rows.length, finishedAt: now, failureCode: null, failureMessage: null }, { transaction });
      await RunAttempt.update({ state: 'in-review', securityCount: rows.length, finishedAt: now }, { where: { runId: run.id, number: run.attempt }, transaction });
      await recordAudit(transaction, { actor: ctx.actor.principal, action: 'run.results', entityType: 'run', entityId: run.id, before, after: { ...runAuditView(run), securityCount: rows.length }, requestId: ctx.requestId });
      return { status: 200, body: { runId: String(run.id), attempt: run.attempt, state: 'in-review', securityCount: rows.length } };
    });
  });
}
