// Moves that never lose or overwrite a file: a rename within the drop folder (one filesystem, so the
// move is atomic) to a name not yet taken (`name~2.ext`, `name~3.ext`, … when the name exists). One
// watcher owns a drop folder, so nothing else creates names there between the check and the rename.
import { lstat, mkdir, rename } from 'node:fs/promises';
import path from 'node:path';

function candidate(folder: string, name: string, attempt: number): string {
  if (attempt === 1) return path.join(folder, name);
  const extension = path.extname(name);
  return path.join(folder, `${name.slice(0, name.length - extension.length)}~${attempt}${extension}`);
}

async function taken(file: string): Promise<boolean> {
  return lstat(file).then(() => true, (error: NodeJS.ErrnoException) => {
    if (error.code === 'ENOENT') return false;
    throw error;
  });
}

/** A free path for `name` in `folder` (the folder is created when missing). */
export async function freePath(folder: string, name: string, extraSuffixes: readonly string[] = []): Promise<string> {
  await mkdir(folder, { recursive: true });
  for (let attempt = 1; ; attempt += 1) {
    const target = candidate(folder, name, attempt);
    const clashes = await Promise.all([target, ...extraSuffixes.map((suffix) => `${target}${suffix}`)].map(taken));
    if (!clashes.some(Boolean)) return target;
  }
}

/** Renames `file` to `target` (from freePath) and answers the target. */
export async function moveTo(file: string, target: string): Promise<string> {
  await rename(file, target);
  return target;
}
