// `clino run --post`: the run goes to the server now through the same delivery code as the drop
// folder's courier. When the server cannot be reached, the delivery is written into an outbox folder
// (when one is configured) in the format `clino watch` delivers from its drop folder's outbox/, so the
// watcher serving that folder posts it once the server is back; without one the command fails (exit
// 5) and says how to spool. Any other refusal (SPEC_UNKNOWN, a validation error) fails as it is.
import { stat } from 'node:fs/promises';
import path from 'node:path';
import { CliError } from '../errors/cli-error.js';
import { deliverRun, type Delivery } from '../transport/ingest.js';
import type { ServerClient } from '../transport/server-client.js';
import { writeOutboxItem } from './outbox.js';

export type PostOutcome = { readonly kind: 'posted'; readonly runId: string } | { readonly kind: 'spooled'; readonly file: string };

const SPOOL_HINT = 'to keep the run for later, add --outbox <folder> (or set CLINO_OUTBOX) naming the outbox/ of a drop folder that clino watch serves: the watcher posts it when the server is back';

/** Refuses an outbox folder that is not there, before anything is computed (a typo would lose the run later). */
export async function checkOutboxFolder(outbox: string | undefined): Promise<void> {
  if (outbox === undefined) return;
  const found = await stat(outbox).then((s) => s.isDirectory(), () => false);
  if (!found) {
    throw new CliError('USAGE', `the outbox folder ${outbox} does not exist`, { hint: 'name the outbox/ of a drop folder (clino watch creates it), or create the folder' });
  }
}

export async function postOrSpool(client: ServerClient, delivery: Delivery, outbox: string | undefined): Promise<PostOutcome> {
  let runId: string | undefined;
  try {
    return { kind: 'posted', runId: await deliverRun(client, delivery, { runCreated: async (id) => void (runId = id) }) };
  } catch (error) {
    if (!(error instanceof CliError && error.code === 'SERVER_UNREACHABLE')) throw error;
    if (outbox === undefined) throw new CliError('SERVER_UNREACHABLE', error.message, { hint: SPOOL_HINT });
    // The watcher that delivers the item runs elsewhere: it needs absolute paths to upload the inputs.
    const inputs = delivery.inputs.map((input) => ({ ...input, path: path.resolve(input.path) }));
    const item = await writeOutboxItem({ outbox }, { ...delivery, inputs, ...(runId === undefined ? {} : { runId }) });
    return { kind: 'spooled', file: item.file };
  }
}
