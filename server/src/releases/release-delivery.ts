import { recordAudit } from '../audit/audit.service.js';
import { Run } from '../runs/run.model.js';
import { NotFoundError } from '../shared/errors.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { Spec } from '../specs/spec.model.js';
import { DistributionList, DistributionRecipient } from './distribution-list.model.js';
import { composeReleaseMessage } from './release-message.js';
import { releaseViews, type ReleaseView } from './release-view.js';
import { Release } from './release.model.js';
import type { ReleaseContext } from './releases.service.js';

async function releaseById(id: number): Promise<Release> {
  const release = await Release.findByPk(id);
  if (!release) throw new NotFoundError(`No release ${id}`);
  return release;
}

/** The released CSV's exact bytes, as mailed. */
export async function releaseCsv(ctx: Pick<ReleaseContext, 'store'>, id: number): Promise<{ name: string; bytes: Buffer; sha256: string }> {
  const release = await releaseById(id);
  return { name: release.csvName, bytes: await ctx.store.read(release.csvSha256), sha256: release.csvSha256 };
}

/**
 * Mails a release to its distribution list: the stored CSV attached byte for byte, the fingerprint
 * and the cautions in the body. Records the outcome (sent or failed) with an audit event. Used at
 * release and to send again.
 */
export async function deliverRelease(ctx: ReleaseContext, id: number): Promise<ReleaseView> {
  const release = await releaseById(id);
  const run = (await Run.findByPk(release.runId)) as Run;
  const spec = (await Spec.findByPk(release.specId)) as Spec;
  const revision = (await SpecRevision.findByPk(run.specRevisionId)) as SpecRevision;
  const list = (await DistributionList.findByPk(release.distributionListId)) as DistributionList;
  const recipients = await DistributionRecipient.findAll({ where: { listId: list.id }, order: [['address', 'ASC']] });
  const superseded = await Release.findAll({ where: { supersededById: release.id }, attributes: ['id'], order: [['id', 'ASC']] });
  const message = composeReleaseMessage({
    releaseId: release.id,
    runId: run.id,
    attempt: run.attempt,
    specName: spec.name,
    specRevision: revision.number,
    asOf: release.asOf,
    securityCount: run.securityCount ?? 0,
    releasedByName: release.releasedByName,
    releasedAt: release.releasedAt,
    note: release.note,
    csvName: release.csvName,
    csvSha256: release.csvSha256,
    fingerprint: release.fingerprint,
    supersedes: superseded.map((r) => r.id),
  });
  let outcome: { mailState: 'sent' | 'failed'; mailMessageId: string | null; mailError: string | null };
  try {
    const csv = await ctx.store.read(release.csvSha256);
    const { messageId } = await ctx.send({
      to: recipients.map((r) => ({ address: r.address, name: r.displayName })),
      subject: message.subject,
      text: message.text,
      csvName: release.csvName,
      csv,
      fingerprintName: message.fingerprintName,
      fingerprint: release.fingerprint,
    });
    outcome = { mailState: 'sent', mailMessageId: messageId, mailError: null };
  } catch (err) {
    outcome = { mailState: 'failed', mailMessageId: null, mailError: (err as Error).message.slice(0, 2000) };
  }
  await ctx.sequelize.transaction(async (transaction) => {
    await release.update(outcome, { transaction });
    await recordAudit(transaction, { actor: ctx.actor.principal, action: 'release.mail', entityType: 'release', entityId: release.id, after: { ...outcome, to: recipients.map((r) => r.address) }, requestId: ctx.requestId });
  });
  const [view] = await releaseViews([release]);
  return view as ReleaseView;
}
