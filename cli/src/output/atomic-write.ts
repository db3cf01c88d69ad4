// New files appear whole or not at all: written beside their final name, flushed, then renamed
// (a rename within one filesystem is atomic).
import { open, rename } from 'node:fs/promises';
import path from 'node:path';

let counter = 0;

export async function writeFileAtomic(file: string, data: string | Uint8Array, mode = 0o644): Promise<void> {
  counter += 1;
  const temporary = path.join(path.dirname(file), `.${path.basename(file)}.${process.pid}.${counter}.tmp`);
  const handle = await open(temporary, 'w', mode);
  try {
    await handle.writeFile(data);
    await handle.sync();
  } finally {
    await handle.close();
  }
  await rename(temporary, file);
}
