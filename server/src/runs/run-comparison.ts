import { Op } from 'sequelize';
import type { ResolvedRunSpec } from '../contracts/run-spec.schema.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { RunResult } from './run-result.model.js';
import { Run } from './run.model.js';

export interface BetaChange {
  security: string;
  before: number;
  after: number;
  change: number;
}

/** What changed since the last released run of the same spec: securities in and out, pricing betas that moved. */
export interface RunComparison {
  releasedRunId: string;
  releasedAsOf: string;
  releasedAt: string | null;
  /** `adjusted` or `base`: the beta that prices, per the spec. */
  beta: 'adjusted' | 'base';
  common: number;
  addedCount: number;
  removedCount: number;
  /** Securities new since the release, and gone since it (at most 20 each, by code). */
  added: string[];
  removed: string[];
  /** The spec's big-move threshold on |change| of the pricing beta. */
  bigMoveThreshold: number;
  bigMoves: number;
  /** The largest absolute changes, largest first (at most 20). */
  largestChanges: BetaChange[];
}

const MAX_LISTED = 20;

async function pricingBetas(run: Run, which: 'adjusted' | 'base'): Promise<Map<string, number | null>> {
  const rows = await RunResult.findAll({ where: { runId: run.id, attempt: run.attempt }, attributes: ['security', 'beta', 'adjustedBeta'] });
  return new Map(rows.map((r) => [r.security, which === 'base' ? r.beta : r.adjustedBeta]));
}

function changes(before: Map<string, number | null>, after: Map<string, number | null>): BetaChange[] {
  const list: BetaChange[] = [];
  for (const [security, now] of after) {
    const then = before.get(security);
    if (typeof now === 'number' && typeof then === 'number') list.push({ security, before: then, after: now, change: now - then });
  }
  return list.sort((a, b) => Math.abs(b.change) - Math.abs(a.change) || (a.security < b.security ? -1 : 1));
}

/** Null when the spec has no released run other than this one. */
export async function compareWithLastRelease(run: Run): Promise<RunComparison | null> {
  const released = await Run.findOne({
    where: { specId: run.specId, state: 'released', id: { [Op.ne]: run.id } },
    order: [['asOf', 'DESC'], ['releasedAt', 'DESC']],
  });
  if (!released) return null;
  const revision = await SpecRevision.findByPk(run.specRevisionId, { attributes: ['parsed'] });
  const spec = revision?.parsed as unknown as ResolvedRunSpec | undefined;
  const which = spec?.pricing?.beta === 'base' ? 'base' : 'adjusted';
  const threshold = spec?.flags.bigMoveChange ?? 0.25;
  const before = await pricingBetas(released, which);
  const after = await pricingBetas(run, which);
  const moved = changes(before, after);
  const added = [...after.keys()].filter((s) => !before.has(s)).sort();
  const removed = [...before.keys()].filter((s) => !after.has(s)).sort();
  return {
    releasedRunId: String(released.id),
    releasedAsOf: released.asOf,
    releasedAt: released.releasedAt ? released.releasedAt.toISOString() : null,
    beta: which,
    common: [...after.keys()].filter((s) => before.has(s)).length,
    addedCount: added.length,
    removedCount: removed.length,
    added: added.slice(0, MAX_LISTED),
    removed: removed.slice(0, MAX_LISTED),
    bigMoveThreshold: threshold,
    bigMoves: moved.filter((c) => Math.abs(c.change) > threshold).length,
    largestChanges: moved.slice(0, MAX_LISTED),
  };
}
