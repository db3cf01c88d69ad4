import type { Transaction } from 'sequelize';
import { AppError } from '../shared/errors.js';
import { Run, type RunState } from './run.model.js';

/**
 * The run life cycle: received → computing → in-review → released (→ superseded by a later release
 * of the same spec and as-of); received or computing → failed; in-review or failed → received again
 * as a new attempt (rerun).
 */
export const RERUNNABLE: readonly RunState[] = ['in-review', 'failed'];

export function requireState(run: Run, allowed: readonly RunState[], action: string): void {
  if (!allowed.includes(run.state)) {
    throw new AppError(409, 'RUN_STATE_CONFLICT', `Run ${run.id} is ${run.state}; ${action} needs ${allowed.join(' or ')}`, {
      state: run.state,
      allowed,
    });
  }
}

/** The run, locked for update in the caller's transaction, or RUN_NOT_FOUND. */
export async function lockRun(id: number, transaction: Transaction): Promise<Run> {
  const run = await Run.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!run) throw new AppError(404, 'RUN_NOT_FOUND', `No run ${id}`);
  return run;
}

export async function findRun(id: number): Promise<Run> {
  const run = await Run.findByPk(id);
  if (!run) throw new AppError(404, 'RUN_NOT_FOUND', `No run ${id}`);
  return run;
}

/** A run as its state changes are audited: no bulky fields. */
export function runAuditView(run: Run): Record<string, unknown> {
  return { id: run.id, state: run.state, attempt: run.attempt, asOf: run.asOf, failureCode: run.failureCode ?? null };
}
