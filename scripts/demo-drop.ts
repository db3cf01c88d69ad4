// The start script's part of the demo drop folder: when samples/drop/ is new (none of incoming/,
// archive/, rejected/, outbox/ exists yet), writes the demo vendor's files into samples/drop/incoming/
// so that `clino watch samples/drop` runs the sample specs on them. Files are generated in a staging
// folder and renamed into incoming/, so a watcher never sees half a file. Run again, it does nothing.
//
//   node --import tsx scripts/demo-drop.ts [drop-folder] [--through YYYY-MM-DD]
import { existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import path from 'node:path';
import { writeDemoFiles } from '../samples/scenario/generate.js';

const DROP_PARTS = ['incoming', 'archive', 'rejected', 'outbox'];

export function isNewDropFolder(folder: string): boolean {
  return !DROP_PARTS.some((part) => existsSync(path.join(folder, part)));
}

/** Writes the demo files into `<folder>/incoming/` when the folder is new; answers the names written. */
export function seedDemoDrop(folder: string, through?: string): string[] {
  if (!isNewDropFolder(folder)) return [];
  const staging = path.join(folder, '.staging');
  rmSync(staging, { recursive: true, force: true });
  const names = writeDemoFiles(staging, through);
  mkdirSync(path.join(folder, 'incoming'), { recursive: true });
  for (const name of names) renameSync(path.join(staging, name), path.join(folder, 'incoming', name));
  rmSync(staging, { recursive: true, force: true });
  return names;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const root = path.join(import.meta.dirname, '..');
  const args = process.argv.slice(2);
  const at = args.indexOf('--through');
  const through = at >= 0 ? args[at + 1] : undefined;
  const positional = args.filter((_, i) => at < 0 || (i !== at && i !== at + 1));
  const folder = path.resolve(positional[0] ?? path.join(root, 'samples/drop'));
  const names = seedDemoDrop(folder, through);
  process.stdout.write(names.length === 0 ? `${folder} is not new: left as it is\n` : `${names.map((n) => path.join(folder, 'incoming', n)).join('\n')}\n`);
}
