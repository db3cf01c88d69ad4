import { Op, type Sequelize, type Transaction, type WhereOptions } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import type { ResolvedRunSpec } from '../contracts/run-spec.schema.js';
import type { Actor } from '../runs/actor.js';
import { runCsv } from '../runs/run-csv.js';
import { lockRun, runAuditView } from '../runs/run-states.js';
import { Run } from '../runs/run.model.js';
import { AppError, ValidationError } from '../shared/errors.js';
import { personAuthorsOfText } from '../specs/spec-authorship.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { Spec } from '../specs/spec.model.js';
import type { ContentStore } from '../store/content-store.js';
import { DistributionList } from './distribution-list.model.js';
import { deliverRelease } from './release-delivery.js';
import type { SendRelease } from './release-mailer.js';
import { releaseViews, type ReleaseView } from './release-view.js';
import { Release } from './release.model.js';
import type { ListReleasesQuery, ReleaseRequest } from './releases.schemas.js';

export interface ReleaseContext {
  sequelize: Sequelize;
  store: ContentStore;
  send: SendRelease;
  actor: Actor;
  requestId: string | null;
}

/**
 * Four eyes: nobody releases a run whose spec text they authored. The authors of a revision's text
 * are the people who pushed that exact text to the spec (directly, or through a machine token they
 * own). A text that only ownerless machine tokens pushed has no author person, so nobody may release
 * it until a person pushes the same text.
 */
async function requireSecondPerson(actor: Actor, revision: SpecRevision, transaction: Transaction): Promise<void> {
  const authors = await personAuthorsOfText(revision, transaction);
  if (authors.length === 0) {
    throw new AppError(403, 'FOUR_EYES', `Revision ${revision.number} of this spec was pushed by the machine token ${revision.authorName}, which acts for no person: a person must push the same spec text (the console, or clino spec push with a token that has an owner) before anyone can release it`);
  }
  const own = authors.find((author) => actor.kind === 'person' && author.authorId === actor.id);
  if (own) throw new AppError(403, 'FOUR_EYES', `You authored revision ${own.number} of this spec, with this text: another supervisor must release this run`);
}

async function distributionListFor(spec: ResolvedRunSpec, requested: string | undefined, transaction: Transaction): Promise<DistributionList> {
  const name = requested ?? spec.report.distributionList;
  if (name === undefined) throw new ValidationError('Name a distribution list: the spec names none (report.distributionList)');
  const list = await DistributionList.findOne({ where: { name }, transaction });
  if (!list) throw new ValidationError(`No distribution list named ${name}`);
  return list;
}

/** Marks earlier releases of the same spec and as-of (and their runs) superseded by this one. */
async function supersedeEarlier(ctx: ReleaseContext, release: Release, transaction: Transaction): Promise<void> {
  const earlier = await Release.findAll({
    where: { specId: release.specId, asOf: release.asOf, supersededById: null, id: { [Op.ne]: release.id } },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  for (const old of earlier) {
    await old.update({ supersededById: release.id }, { transaction });
    await Run.update({ state: 'superseded' }, { where: { id: old.runId }, transaction });
    await recordAudit(transaction, { actor: ctx.actor.principal, action: 'run.supersede', entityType: 'run', entityId: old.runId, before: { state: 'released' }, after: { state: 'superseded', supersededByRelease: release.id }, requestId: ctx.requestId });
  }
}

async function recordRelease(ctx: ReleaseContext, runId: number, request: ReleaseRequest): Promise<number> {
  return ctx.sequelize.transaction(async (transaction) => {
    const run = await lockRun(runId, transaction);
    // One release per spec at a time, so two releases of one spec and as-of always see each other.
    await Spec.findByPk(run.specId, { transaction, lock: transaction.LOCK.UPDATE });
    if (run.state !== 'in-review') throw new AppError(409, 'RUN_NOT_RELEASABLE', `Run ${run.id} is ${run.state}: only a run in review can be released`);
    const revision = (await SpecRevision.findByPk(run.specRevisionId, { transaction })) as SpecRevision;
    await requireSecondPerson(ctx.actor, revision, transaction);
    const list = await distributionListFor(revision.parsed as unknown as ResolvedRunSpec, request.distributionList, transaction);
    const csv = await runCsv(run, transaction);
    const stored = await ctx.store.put(csv.csv);
    const before = runAuditView(run);
    const now = new Date();
    const release = await Release.create(
      {
        runId: run.id,
        specId: run.specId,
        asOf: run.asOf,
        distributionListId: list.id,
        releasedById: ctx.actor.id,
        releasedByName: ctx.actor.name,
        note: request.note,
        csvSha256: stored.sha256,
        csvSize: stored.size,
        csvName: csv.fileName,
        fingerprint: run.fingerprint,
        releasedAt: now,
      },
      { transaction },
    );
    await supersedeEarlier(ctx, release, transaction);
    await run.update({ state: 'released', releasedAt: now }, { transaction });
    await recordAudit(transaction, { actor: ctx.actor.principal, action: 'run.release', entityType: 'run', entityId: run.id, before, after: { ...runAuditView(run), releaseId: release.id, csvSha256: stored.sha256, distributionList: list.name }, requestId: ctx.requestId });
    return release.id;
  });
}

/**
 * Releases an in-review run (else RUN_NOT_RELEASABLE; FOUR_EYES for the spec revision's author):
 * stores the CSV, supersedes the earlier release of the same spec and as-of, commits, then mails
 * the distribution list. A mail that fails leaves the release standing with mailState `failed`.
 */
export async function releaseRun(ctx: ReleaseContext, runId: number, request: ReleaseRequest): Promise<ReleaseView> {
  const releaseId = await recordRelease(ctx, runId, request);
  return deliverRelease(ctx, releaseId);
}

export async function listReleases(query: ListReleasesQuery): Promise<{ items: ReleaseView[]; page: number; pageSize: number; total: number }> {
  const where: Record<string, unknown> = {};
  if (query.spec !== undefined) {
    const spec = await Spec.findOne({ where: { name: query.spec }, attributes: ['id'] });
    where['specId'] = spec ? spec.id : 0;
  }
  if (query.asOfFrom || query.asOfTo) {
    where['asOf'] = { ...(query.asOfFrom ? { [Op.gte]: query.asOfFrom } : {}), ...(query.asOfTo ? { [Op.lte]: query.asOfTo } : {}) };
  }
  if (query.current === true) where['supersededById'] = null;
  if (query.current === false) where['supersededById'] = { [Op.ne]: null };
  const { rows, count } = await Release.findAndCountAll({
    where: where as WhereOptions<Release>,
    order: [['releasedAt', 'DESC'], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: await releaseViews(rows), page: query.page, pageSize: query.pageSize, total: count };
}
