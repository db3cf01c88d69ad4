import { Op, type WhereOptions } from 'sequelize';
import { Release } from '../releases/release.model.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { Spec } from '../specs/spec.model.js';
import type { ContentStore } from '../store/content-store.js';
import { compareWithLastRelease, type RunComparison } from './run-comparison.js';
import { RunAttempt } from './run-attempt.model.js';
import { RunInput } from './run-input.model.js';
import { findRun } from './run-states.js';
import { Run, type RunState } from './run.model.js';
import type { ListRunsQuery } from './runs.schemas.js';

export interface RunSummary {
  id: string;
  specName: string;
  specRevision: number;
  specSha256: string;
  asOf: string;
  state: RunState;
  attempt: number;
  actorName: string;
  securityCount: number | null;
  failureCode: string | null;
  failureMessage: string | null;
  createdAt: string;
  computingAt: string | null;
  finishedAt: string | null;
  releasedAt: string | null;
}

export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

const iso = (d: Date | null | undefined): string | null => (d ? d.toISOString() : null);

/** Summaries of runs, with their specs' names and revision numbers looked up in two queries. */
export async function runSummaries(runs: readonly Run[]): Promise<RunSummary[]> {
  const specs = await Spec.findAll({ where: { id: [...new Set(runs.map((r) => r.specId))] }, attributes: ['id', 'name'] });
  const revisions = await SpecRevision.findAll({ where: { id: [...new Set(runs.map((r) => r.specRevisionId))] }, attributes: ['id', 'number', 'sha256'] });
  const specName = new Map(specs.map((s) => [s.id, s.name]));
  const revision = new Map(revisions.map((r) => [r.id, r]));
  return runs.map((run) => ({
    id: String(run.id),
    specName: specName.get(run.specId) ?? '',
    specRevision: revision.get(run.specRevisionId)?.number ?? 0,
    specSha256: revision.get(run.specRevisionId)?.sha256 ?? '',
    asOf: run.asOf,
    state: run.state,
    attempt: run.attempt,
    actorName: run.actorName,
    securityCount: run.securityCount ?? null,
    failureCode: run.failureCode ?? null,
    failureMessage: run.failureMessage ?? null,
    createdAt: run.createdAt.toISOString(),
    computingAt: iso(run.computingAt),
    finishedAt: iso(run.finishedAt),
    releasedAt: iso(run.releasedAt),
  }));
}

async function listWhere(query: ListRunsQuery): Promise<WhereOptions<Run> | null> {
  const where: Record<string | symbol, unknown> = {};
  if (query.state) where['state'] = query.state;
  if (query.spec !== undefined) {
    const spec = await Spec.findOne({ where: { name: query.spec }, attributes: ['id'] });
    if (!spec) return null;
    where['specId'] = spec.id;
  }
  const asOf: Record<symbol, string> = {};
  if (query.asOfFrom) asOf[Op.gte] = query.asOfFrom;
  if (query.asOfTo) asOf[Op.lte] = query.asOfTo;
  if (query.asOfFrom || query.asOfTo) where['asOf'] = asOf;
  return where as WhereOptions<Run>;
}

export async function listRuns(query: ListRunsQuery): Promise<Page<RunSummary>> {
  const where = await listWhere(query);
  if (where === null) return { items: [], page: query.page, pageSize: query.pageSize, total: 0 };
  const descending = query.sort.startsWith('-');
  const field = query.sort.replace(/^-/, '');
  const direction = descending ? 'DESC' : 'ASC';
  const { rows, count } = await Run.findAndCountAll({
    where,
    order: [[field, direction], ['id', direction]],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: await runSummaries(rows), page: query.page, pageSize: query.pageSize, total: count };
}

export interface RunDetail extends RunSummary {
  fingerprint: string;
  fingerprintSha256: string;
  inputs: { name: string; sha256: string; size: number; stored: boolean }[];
  attempts: {
    number: number;
    state: string;
    actorName: string;
    jobId: string | null;
    failureCode: string | null;
    failureMessage: string | null;
    securityCount: number | null;
    startedAt: string;
    computingAt: string | null;
    finishedAt: string | null;
  }[];
  release: { id: string; releasedAt: string; releasedByName: string; supersededBy: string | null } | null;
  comparison: RunComparison | null;
}

export async function getRunDetail(store: ContentStore, id: number): Promise<RunDetail> {
  const run = await findRun(id);
  const [summary] = await runSummaries([run]);
  const inputs = await RunInput.findAll({ where: { runId: id }, order: [['name', 'ASC']] });
  const attempts = await RunAttempt.findAll({ where: { runId: id }, order: [['number', 'ASC']] });
  const release = await Release.findOne({ where: { runId: id } });
  return {
    ...(summary as RunSummary),
    fingerprint: run.fingerprint,
    fingerprintSha256: run.fingerprintSha256,
    inputs: await Promise.all(inputs.map(async (i) => ({ name: i.name, sha256: i.sha256, size: i.size, stored: (await store.sizeOf(i.sha256)) === i.size }))),
    attempts: attempts.map((a) => ({
      number: a.number,
      state: a.state,
      actorName: a.actorName,
      jobId: a.jobId ? String(a.jobId) : null,
      failureCode: a.failureCode ?? null,
      failureMessage: a.failureMessage ?? null,
      securityCount: a.securityCount ?? null,
      startedAt: a.startedAt.toISOString(),
      computingAt: iso(a.computingAt),
      finishedAt: iso(a.finishedAt),
    })),
    release: release
      ? { id: String(release.id), releasedAt: release.releasedAt.toISOString(), releasedByName: release.releasedByName, supersededBy: release.supersededById ? String(release.supersededById) : null }
      : null,
    comparison: await compareWithLastRelease(run),
  };
}
