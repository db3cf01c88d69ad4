// The two ways a file leaves incoming/: into archive/<YYYY-MM-DD>/ beside `<name>.sha256` (the
// sha256sum format), or into rejected/ beside `<name>.error.txt` naming file, line, column and
// reason. The companion file is written first (write-then-rename), then the input is renamed.
import path from 'node:path';
import { writeFileAtomic } from '../output/atomic-write.js';
import { InputError } from '../inputs/input-error.js';
import { freePath, moveTo } from './safe-move.js';
import type { DropLayout } from './layout.js';

export async function archiveInput(layout: DropLayout, file: string, sha256: string, day: string): Promise<string> {
  const target = await freePath(path.join(layout.archive, day), path.basename(file), ['.sha256']);
  await writeFileAtomic(`${target}.sha256`, `${sha256}  ${path.basename(target)}\n`);
  return moveTo(file, target);
}

export interface Rejection {
  readonly code: string;
  readonly line: number | null;
  readonly column: number | null;
  readonly reason: string;
}

export function rejectionOf(error: unknown): Rejection {
  if (error instanceof InputError) {
    const reason = error.columnName === null ? error.reason : `${error.reason} (column ${JSON.stringify(error.columnName)})`;
    return { code: error.code, line: error.line, column: error.column, reason };
  }
  return { code: 'INTERNAL', line: null, column: null, reason: error instanceof Error ? error.message : String(error) };
}

export function errorText(name: string, rejection: Rejection, spec: string | null): string {
  return [
    `file: ${name}`,
    `line: ${rejection.line ?? ''}`,
    `column: ${rejection.column ?? ''}`,
    `code: ${rejection.code}`,
    `reason: ${rejection.reason}`,
    ...(spec === null ? [] : [`spec: ${spec}`]),
    `at: ${[name, rejection.line, rejection.line === null ? null : rejection.column].filter((part) => part !== null).join(':')} ${rejection.reason}`,
    '',
  ].join('\n');
}

export async function rejectInput(layout: DropLayout, file: string, rejection: Rejection, spec: string | null): Promise<string> {
  const target = await freePath(layout.rejected, path.basename(file), ['.error.txt']);
  await writeFileAtomic(`${target}.error.txt`, errorText(path.basename(file), rejection, spec));
  return moveTo(file, target);
}
