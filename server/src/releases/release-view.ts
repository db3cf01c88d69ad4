import { DistributionList } from './distribution-list.model.js';
import { Spec } from '../specs/spec.model.js';
import type { Release } from './release.model.js';

export interface ReleaseView {
  id: string;
  runId: string;
  specName: string;
  asOf: string;
  distributionList: string;
  releasedByName: string;
  releasedAt: string;
  note: string;
  csvName: string;
  csvSha256: string;
  csvSize: number;
  fingerprint: string;
  supersededBy: string | null;
  mailState: string;
  mailMessageId: string | null;
  mailError: string | null;
}

/** Release views with their specs' and lists' names looked up in two queries. */
export async function releaseViews(releases: readonly Release[]): Promise<ReleaseView[]> {
  const specs = await Spec.findAll({ where: { id: [...new Set(releases.map((r) => r.specId))] }, attributes: ['id', 'name'] });
  const lists = await DistributionList.findAll({ where: { id: [...new Set(releases.map((r) => r.distributionListId))] }, attributes: ['id', 'name'] });
  const specName = new Map(specs.map((s) => [s.id, s.name]));
  const listName = new Map(lists.map((l) => [l.id, l.name]));
  return releases.map((r) => ({
    id: String(r.id),
    runId: String(r.runId),
    specName: specName.get(r.specId) ?? '',
    asOf: r.asOf,
    distributionList: listName.get(r.distributionListId) ?? '',
    releasedByName: r.releasedByName,
    releasedAt: r.releasedAt.toISOString(),
    note: r.note,
    csvName: r.csvName,
    csvSha256: r.csvSha256,
    csvSize: r.csvSize,
    fingerprint: r.fingerprint,
    supersededBy: r.supersededById ? String(r.supersededById) : null,
    mailState: r.mailState,
    mailMessageId: r.mailMessageId ?? null,
    mailError: r.mailError ?? null,
  }));
}
