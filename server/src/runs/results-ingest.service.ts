import { recordAudit } from '../audit/audit.service.js';
import { seriesLimits, type PostResultsRequest } from '../contracts/ingest.schemas.js';
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
/** The width of run_results.security. */
const MAX_SECURITY_CODE = 200;

function numberOrNull(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

/**
 * The series' lengths against the spec of the run: at most the window's points per scatter and the
 * rolling count per rolling series (seriesLimits of the ingest contract). The body's shape was
 * checked already against the contract's hard caps; this loop avoids parsing 5,000 rows twice.
 */
function checkAgainstSpec(spec: ResolvedRunSpec, body: PostResultsRequest): void {
  const limits = seriesLimits(spec);
  const issues: { in: 'body'; path: string; message: string }[] = [];
  body.series.forEach((entry, i) => {
    if (entry.scatter.market.length > limits.scatterPoints) issues.push({ in: 'body', path: `series.${i}.scatter.market`, message: `${entry.scatter.market.length} points: at most the window (${limits.scatterPoints})` });
    if (entry.rolling.betas.length > limits.rollingPoints) issues.push({ in: 'body', path: `series.${i}.rolling.betas`, message: `${entry.rolling.betas.length} points: at most the rolling count (${limits.rollingPoints})` });
  });
  if (issues.length > 0) throw new ValidationError(`Invalid results at ${issues[0]?.path}: ${issues[0]?.message}`, { issues: issues.slice(0, 50) });
}

/** Table rows for one INSERT each batch: JSON columns as text, no model instances (5,000 rows stay quick). */
function resultRows(run: Run, body: PostResultsRequest): Record<string, string | number | null>[] {
  const series = new Map(body.series.map((entry) => [entry.security, entry]));
  return body.rows.map((row) => {
    const security = row.security ?? '';
    const entry = series.get(security);
    return {
      run_id: run.id,
      attempt: run.attempt,
      security,
      status: row.status ?? '',
      beta: numberOrNull(row.beta),
      adjusted_beta: numberOrNull(row.adjusted_beta),
      r_squared: numberOrNull(row.r_squared),
      expected_return: numberOrNull(row.expected_return),
      flags: row.flags ?? '',
      record: JSON.stringify(row),
      scatter: entry ? JSON.stringify(entry.scatter) : null,
      rolling: entry ? JSON.stringify(entry.rolling) : null,
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
      const badCode = body.rows.findIndex((row) => !row.security || row.security.length > MAX_SECURITY_CODE);
      if (badCode >= 0) throw new ValidationError(`rows.${badCode}.security: a security code of 1 to ${MAX_SECURITY_CODE} characters is needed`);
      const rows = resultRows(run, body);
      for (let i = 0; i < rows.length; i += INSERT_BATCH) {
        await ctx.sequelize.getQueryInterface().bulkInsert(RunResult.getTableName() as string, rows.slice(i, i + INSERT_BATCH), { transaction });
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
