// Delivers the outbox, one item at a time. A server that cannot be reached (or answers 5xx) leaves
// the item in place and retries after a backoff that doubles up to a ceiling; any other refusal
// (SPEC_UNKNOWN, a validation error) moves the item to outbox/refused/. Stopping cancels the timer:
// items stay on disk for the next start.
import { access } from 'node:fs/promises';
import type { Logger } from 'pino';
import { CliError } from '../errors/cli-error.js';
import { deliverRun, type Delivery } from '../transport/ingest.js';
import type { ServerClient } from '../transport/server-client.js';
import { findArchivedBySha256 } from './input-finder.js';
import type { DropLayout } from './layout.js';
import { markDelivered, markRefused, pendingOutboxItems, readOutboxItem, writeOutboxItem, type OutboxItem } from './outbox.js';

export interface Backoff {
  readonly initialMs: number;
  readonly maxMs: number;
}

export interface Courier {
  /** Writes the delivery to the outbox and delivers it (now, or after the current backoff). */
  spool(delivery: Delivery): Promise<void>;
  /** Delivers every pending item now; resolves when the pass is over. */
  flush(): Promise<void>;
  /**
   * Delivers items another process left in the outbox (`clino run --post --outbox`), unless a retry
   * is already scheduled: that retry delivers them, and the backoff stands.
   */
  rescan(): Promise<void>;
  stop(): Promise<void>;
}

function retryable(error: unknown): boolean {
  return error instanceof CliError ? error.code === 'SERVER_UNREACHABLE' || error.code === 'INTERNAL' : true;
}

async function withFoundInputs(layout: DropLayout, delivery: Delivery): Promise<Delivery> {
  const inputs = [];
  for (const input of delivery.inputs) {
    const present = await access(input.path).then(() => true, () => false);
    inputs.push(present ? input : { ...input, path: (await findArchivedBySha256(layout, input.sha256)) ?? input.path });
  }
  return { ...delivery, inputs };
}

export function createCourier(layout: DropLayout, client: ServerClient, logger: Logger, backoff: Backoff): Courier {
  let delayMs = backoff.initialMs;
  let timer: NodeJS.Timeout | null = null;
  let stopped = false;
  let pass: Promise<void> = Promise.resolve();

  async function deliver(item: OutboxItem): Promise<boolean> {
    const delivery = await withFoundInputs(layout, item.delivery);
    let current = item;
    try {
      const runId = await deliverRun(client, delivery, {
        runCreated: async (id) => {
          current = await writeOutboxItem(layout, { ...item.delivery, runId: id }, item.attempts + 1);
        },
      });
      await markDelivered(layout, current, runId);
      logger.info({ spec: delivery.specName, asOf: delivery.asOf, runId }, 'run delivered to the server');
      return true;
    } catch (error) {
      const code = error instanceof CliError ? error.code : 'INTERNAL';
      const message = error instanceof Error ? error.message : String(error);
      if (retryable(error)) {
        await writeOutboxItem(layout, current.delivery, current.attempts + 1);
        logger.warn({ spec: delivery.specName, code, retryInMs: delayMs }, `delivery postponed: ${message}`);
        return false;
      }
      await markRefused(layout, current, code, message);
      logger.error({ spec: delivery.specName, code }, `the server refused the run: ${message}`);
      return true;
    }
  }

  async function deliverAll(): Promise<void> {
    for (const file of await pendingOutboxItems(layout)) {
      if (stopped) return;
      if (!(await deliver(await readOutboxItem(file)))) {
        schedule();
        return;
      }
      delayMs = backoff.initialMs;
    }
  }

  function schedule(): void {
    if (stopped || timer !== null) return;
    const wait = delayMs;
    delayMs = Math.min(backoff.maxMs, delayMs * 2);
    timer = setTimeout(() => {
      timer = null;
      void flush();
    }, wait);
  }

  function flush(): Promise<void> {
    pass = pass.then(deliverAll, deliverAll).catch((error: unknown) => {
      logger.error({ err: error }, 'outbox pass failed');
      schedule();
    });
    return pass;
  }

  return {
    async spool(delivery) {
      await writeOutboxItem(layout, delivery);
      if (timer === null) await flush();
    },
    flush,
    rescan() {
      return stopped || timer !== null ? pass : flush();
    },
    async stop() {
      stopped = true;
      if (timer !== null) clearTimeout(timer);
      timer = null;
      await pass;
    },
  };
}
