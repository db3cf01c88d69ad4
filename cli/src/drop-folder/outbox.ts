// The outbox: every post to the server is first written here (write-then-rename), then delivered.
// A post the server did not take because it was unreachable stays and is retried with backoff until
// delivered; the Idempotency-Key makes a repeat harmless, so it is stored once. Delivered items move
// to outbox/delivered/, refused ones to outbox/refused/ beside an .error.txt; none is deleted.
import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';
import { writeFileAtomic } from '../output/atomic-write.js';
import type { Delivery } from '../transport/ingest.js';
import { freePath, moveTo } from './safe-move.js';
import type { DropLayout } from './layout.js';

export interface OutboxItem {
  readonly file: string;
  readonly delivery: Delivery;
  readonly attempts: number;
}

const itemSchema = z.object({
  version: z.literal(1),
  attempts: z.number().int().min(0),
  delivery: z.object({
    key: z.string(),
    specName: z.string(),
    specSha256: z.string(),
    asOf: z.string(),
    runId: z.string().optional(),
    inputs: z.array(z.object({ name: z.string(), sha256: z.string(), size: z.number(), path: z.string() })),
    results: z.object({ rows: z.array(z.record(z.string(), z.unknown())), series: z.array(z.record(z.string(), z.unknown())) }),
  }),
});

function itemPath(layout: Pick<DropLayout, 'outbox'>, key: string): string {
  return path.join(layout.outbox, `${key}.json`);
}

/** Writes (or rewrites) the item of a delivery; only the outbox folder is needed (`clino run --post` spools there too). */
export async function writeOutboxItem(layout: Pick<DropLayout, 'outbox'>, delivery: Delivery, attempts = 0): Promise<OutboxItem> {
  const file = itemPath(layout, delivery.key);
  await writeFileAtomic(file, `${JSON.stringify({ version: 1, attempts, delivery })}\n`);
  return { file, delivery, attempts };
}

export async function readOutboxItem(file: string): Promise<OutboxItem> {
  const parsed = itemSchema.parse(JSON.parse(await readFile(file, 'utf8')));
  return { file, delivery: parsed.delivery as unknown as Delivery, attempts: parsed.attempts };
}

/** Items waiting for delivery, oldest key first (keys are hashes: the order is only stable). */
export async function pendingOutboxItems(layout: DropLayout): Promise<string[]> {
  const names = await readdir(layout.outbox).catch(() => [] as string[]);
  return names.filter((name) => name.endsWith('.json') && !name.startsWith('.')).sort().map((name) => path.join(layout.outbox, name));
}

export async function markDelivered(layout: DropLayout, item: OutboxItem, runId: string): Promise<void> {
  await writeOutboxItem(layout, { ...item.delivery, runId }, item.attempts);
  await moveTo(item.file, await freePath(layout.outboxDelivered, path.basename(item.file)));
}

export async function markRefused(layout: DropLayout, item: OutboxItem, code: string, message: string): Promise<void> {
  const target = await freePath(layout.outboxRefused, path.basename(item.file), ['.error.txt']);
  await writeFileAtomic(`${target}.error.txt`, `code: ${code}\nreason: ${message}\nspec: ${item.delivery.specName}\nasOf: ${item.delivery.asOf}\n`);
  await moveTo(item.file, target);
}
