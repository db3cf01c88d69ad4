import { createTwoFilesPatch } from 'diff';
import { Op, type Sequelize, type Transaction, UniqueConstraintError } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { loadRunSpec, SpecError } from '../contracts/run-spec.load.js';
import type { Actor } from '../runs/actor.js';
import { AppError, NotFoundError } from '../shared/errors.js';
import { specAuthorOf } from './spec-authorship.js';
import { SpecRevision, type PrincipalKind } from './spec-revision.model.js';
import { Spec } from './spec.model.js';

export interface SpecRevisionSummary {
  number: number;
  sha256: string;
  authorKind: PrincipalKind;
  authorName: string;
  createdAt: string;
}

export interface SpecRevisionDetail extends SpecRevisionSummary {
  specName: string;
  text: string;
  /** The validated spec with every default filled in. */
  spec: Record<string, unknown>;
}

export interface SpecSummary {
  name: string;
  description: string | null;
  revisionCount: number;
  latest: SpecRevisionSummary;
  createdAt: string;
  updatedAt: string;
}

export interface PushSpecResult {
  name: string;
  /** False when the text equals the current revision's: then no revision was made. */
  created: boolean;
  revision: SpecRevisionSummary;
}

export function revisionSummary(revision: SpecRevision): SpecRevisionSummary {
  return {
    number: revision.number,
    sha256: revision.sha256,
    authorKind: revision.authorKind,
    authorName: revision.authorName,
    createdAt: revision.createdAt.toISOString(),
  };
}

function revisionDetail(spec: Spec, revision: SpecRevision): SpecRevisionDetail {
  return { ...revisionSummary(revision), specName: spec.name, text: revision.yamlText, spec: revision.parsed };
}

async function specByName(name: string, transaction?: Transaction): Promise<Spec> {
  const spec = await Spec.findOne({ where: { name }, transaction });
  if (!spec) throw new NotFoundError(`No spec named ${JSON.stringify(name)}`);
  return spec;
}

async function revisionOf(spec: Spec, number: number): Promise<SpecRevision> {
  const revision = await SpecRevision.findOne({ where: { specId: spec.id, number } });
  if (!revision) throw new NotFoundError(`Spec ${spec.name} has no revision ${number}`);
  return revision;
}

export async function listSpecs(): Promise<SpecSummary[]> {
  const specs = await Spec.findAll({ where: { latestNumber: { [Op.gt]: 0 } }, order: [['name', 'ASC']] });
  if (specs.length === 0) return [];
  const latest = await SpecRevision.findAll({
    where: { [Op.or]: specs.map((s) => ({ specId: s.id, number: s.latestNumber })) },
  });
  const bySpec = new Map(latest.map((r) => [r.specId, r]));
  return specs.flatMap((spec) => {
    const revision = bySpec.get(spec.id);
    return revision ? [specSummary(spec, revision)] : [];
  });
}

function specSummary(spec: Spec, latest: SpecRevision): SpecSummary {
  const description = typeof latest.parsed['description'] === 'string' ? latest.parsed['description'] : null;
  return {
    name: spec.name,
    description,
    revisionCount: spec.latestNumber,
    latest: revisionSummary(latest),
    createdAt: spec.createdAt.toISOString(),
    updatedAt: spec.updatedAt.toISOString(),
  };
}

export async function getSpec(name: string): Promise<SpecSummary & { current: SpecRevisionDetail }> {
  const spec = await specByName(name);
  const revision = await revisionOf(spec, spec.latestNumber);
  return { ...specSummary(spec, revision), current: revisionDetail(spec, revision) };
}

export async function listRevisions(name: string): Promise<SpecRevisionSummary[]> {
  const spec = await specByName(name);
  const revisions = await SpecRevision.findAll({
    where: { specId: spec.id },
    attributes: ['id', 'number', 'sha256', 'authorKind', 'authorName', 'createdAt'],
    order: [['number', 'DESC']],
  });
  return revisions.map(revisionSummary);
}

export async function getRevision(name: string, number: number): Promise<SpecRevisionDetail> {
  const spec = await specByName(name);
  return revisionDetail(spec, await revisionOf(spec, number));
}

export interface SpecDiff {
  name: string;
  from: number | null;
  to: number;
  /** Unified diff of the two texts; empty hunks when they are equal. */
  diff: string;
}

/** Unified diff from `against` (default: the revision before; none before revision 1) to `number`. */
export async function diffRevisions(name: string, number: number, against?: number): Promise<SpecDiff> {
  const spec = await specByName(name);
  const to = await revisionOf(spec, number);
  const fromNumber = against ?? (number > 1 ? number - 1 : null);
  const from = fromNumber === null ? null : await revisionOf(spec, fromNumber);
  const diff = createTwoFilesPatch(
    from ? `${spec.name}@${from.number}` : '/dev/null',
    `${spec.name}@${to.number}`,
    from ? from.yamlText : '',
    to.yamlText,
    from ? from.sha256 : undefined,
    to.sha256,
  );
  return { name: spec.name, from: fromNumber, to: number, diff };
}

/** The spec revision whose text has this sha256 (the newest if pushed more than once), or SPEC_UNKNOWN. */
export async function revisionBySha256(sha256: string, transaction?: Transaction): Promise<SpecRevision> {
  const revision = await SpecRevision.findOne({ where: { sha256 }, order: [['id', 'DESC']], transaction });
  if (!revision) throw new AppError(404, 'SPEC_UNKNOWN', `The server holds no spec with sha256 ${sha256}: push it first (clino spec push)`);
  return revision;
}

/** A spec problem list as the API answers it: SPEC_INVALID with file, line, column, path and reason. */
function specInvalid(error: SpecError): AppError {
  const first = error.problems[0];
  const message = first ? `${first.file}:${first.line}:${first.column} ${first.path ? `${first.path}: ` : ''}${first.message}` : error.message;
  return new AppError(400, 'SPEC_INVALID', message, { problems: error.problems });
}

/**
 * Pushes a spec text: validated by the contracts' loader; a new revision when the text differs from
 * the current one, none when it is the same, except that a person (or a token acting for one) pushing
 * the text an ownerless machine token pushed makes a new revision of the same text with the person
 * as author: that is how such a spec becomes releasable (four eyes). Audited in the same transaction,
 * naming the caller (person or token) and the author.
 */
export async function pushSpec(sequelize: Sequelize, actor: Actor, text: string, file: string, requestId: string | null): Promise<PushSpecResult> {
  let loaded;
  try {
    loaded = loadRunSpec(text, file);
  } catch (error) {
    if (error instanceof SpecError) throw specInvalid(error);
    throw error;
  }
  const { spec: parsed, sha256 } = loaded;
  const author = specAuthorOf(actor);
  const attempt = (): Promise<PushSpecResult> =>
    sequelize.transaction(async (transaction) => {
      const [spec] = await Spec.findOrCreate({ where: { name: parsed.name }, defaults: { name: parsed.name }, transaction, lock: transaction.LOCK.UPDATE });
      const current = spec.latestNumber > 0 ? await SpecRevision.findOne({ where: { specId: spec.id, number: spec.latestNumber }, transaction }) : null;
      const attests = current !== null && current.sha256 === sha256 && current.authorKind === 'machine' && author.kind === 'person';
      if (current && current.sha256 === sha256 && !attests) return { name: spec.name, created: false, revision: revisionSummary(current) };
      const revision = await SpecRevision.create(
        {
          specId: spec.id,
          number: spec.latestNumber + 1,
          sha256,
          yamlText: text,
          parsed: parsed as unknown as Record<string, unknown>,
          authorKind: author.kind,
          authorId: author.id,
          authorName: author.name,
        },
        { transaction },
      );
      await spec.update({ latestNumber: revision.number }, { transaction });
      const after = { name: spec.name, number: revision.number, sha256, author: { kind: author.kind, id: author.id, name: author.name } };
      await recordAudit(transaction, { actor: actor.principal, action: 'spec.push', entityType: 'spec-revision', entityId: revision.id, before: current ? { number: current.number, sha256: current.sha256 } : null, after, requestId });
      return { name: spec.name, created: true, revision: revisionSummary(revision) };
    });
  try {
    return await attempt();
  } catch (error) {
    // Two first pushes of one name at once: the loser retries and finds the spec the winner made.
    if (error instanceof UniqueConstraintError) return attempt();
    throw error;
  }
}
