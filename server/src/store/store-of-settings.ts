import { resolveFromRoot, type Settings } from '../config.js';
import { ContentStore } from './content-store.js';

const UNITS: Record<string, number> = { '': 1, kb: 1024, mb: 1024 ** 2, gb: 1024 ** 3 };

/** `256mb` → bytes (binary units, as Express writes its body limits). */
export function parseByteSize(text: string): number {
  const match = /^(\d+)(kb|mb|gb)?$/i.exec(text.trim());
  if (!match) throw new Error(`not a size: ${JSON.stringify(text)} (write e.g. 256mb)`);
  return Number(match[1]) * (UNITS[(match[2] ?? '').toLowerCase()] ?? 1);
}

/** The content store under the settings' data folder (relative paths resolve against the project root). */
export function contentStoreOf(settings: Settings): ContentStore {
  return new ContentStore(resolveFromRoot(settings.server.dataDir));
}
