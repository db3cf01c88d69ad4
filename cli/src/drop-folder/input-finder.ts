// The market and risk-free inputs of a run in the drop folder: the newest file matching the spec's
// pattern among the settled files of incoming/ and everything in archive/<day>/. Newest means the
// latest modification time (kept by the archive's rename), then the greater name.
import { readFile, readdir, stat } from 'node:fs/promises';
import path from 'node:path';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import { matchesPattern, neededRoles, type InputRole } from '../batch/input-roles.js';
import { isIgnoredName, type DropLayout } from './layout.js';

interface Candidate {
  readonly file: string;
  readonly mtimeMs: number;
}

async function archivedFiles(layout: DropLayout): Promise<string[]> {
  const days = await readdir(layout.archive, { withFileTypes: true }).catch(() => []);
  const files: string[] = [];
  for (const day of days.filter((entry) => entry.isDirectory()).map((entry) => entry.name).sort()) {
    const names = await readdir(path.join(layout.archive, day));
    files.push(...names.filter((name) => !isIgnoredName(name)).map((name) => path.join(layout.archive, day, name)));
  }
  return files;
}

async function newest(files: readonly string[], pattern: string): Promise<string | undefined> {
  const candidates: Candidate[] = [];
  for (const file of files) {
    if (!matchesPattern(path.basename(file), pattern)) continue;
    const info = await stat(file).catch(() => null);
    if (info?.isFile() === true) candidates.push({ file, mtimeMs: info.mtimeMs });
  }
  candidates.sort((a, b) => b.mtimeMs - a.mtimeMs || (path.basename(b.file) < path.basename(a.file) ? -1 : 1));
  return candidates[0]?.file;
}

export interface FoundInputs {
  readonly found: Partial<Record<InputRole, string>>;
  /** Roles with no matching file yet (the run waits). */
  readonly missing: readonly { readonly role: InputRole; readonly pattern: string }[];
}

/** The other inputs for a price file; `settledIncoming` are full paths of incoming files known to be complete. */
export async function findOtherInputs(layout: DropLayout, spec: ResolvedRunSpec, settledIncoming: readonly string[]): Promise<FoundInputs> {
  const pool = [...settledIncoming, ...(await archivedFiles(layout))];
  const found: Partial<Record<InputRole, string>> = {};
  const missing: { role: InputRole; pattern: string }[] = [];
  for (const { role, pattern } of neededRoles(spec)) {
    if (role === 'prices') continue;
    const file = await newest(pool, pattern);
    if (file === undefined) missing.push({ role, pattern });
    else found[role] = file;
  }
  return { found, missing };
}

/** Finds an archived input by its checksum file, for an outbox upload whose recorded path moved. */
export async function findArchivedBySha256(layout: DropLayout, sha256: string): Promise<string | undefined> {
  for (const file of await archivedFiles(layout)) {
    const recorded = await readFile(`${file}.sha256`, 'utf8').catch(() => '');
    if (recorded.startsWith(`${sha256} `)) return file;
  }
  return undefined;
}
