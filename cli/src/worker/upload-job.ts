// An upload job: a file an ops user uploaded through the console. It is fetched by checksum into the
// worker's drop folder (incoming/) and processed there exactly as a dropped file: the specs whose
// price pattern it matches run once their other inputs are in the folder, results go through the
// outbox, the file is archived or rejected.
import path from 'node:path';
import type { Logger } from 'pino';
import { matchesPattern, neededRoles } from '../batch/input-roles.js';
import type { DropProcessor } from '../drop-folder/drop-processor.js';
import { isIgnoredName, type DropLayout } from '../drop-folder/layout.js';
import { freePath } from '../drop-folder/safe-move.js';
import type { SpecSource } from '../drop-folder/spec-source.js';
import type { ServerClient } from '../transport/server-client.js';
import { fetchInput, safeFileName } from './fetch-input.js';
import type { ClaimedJob, UploadPayload } from './job-answers.js';
import type { JobOutcome } from './rerun-job.js';
import { readdir } from 'node:fs/promises';

export interface UploadJobDeps {
  readonly client: ServerClient;
  readonly layout: DropLayout;
  readonly processor: DropProcessor;
  readonly specs: SpecSource;
  readonly logger: Logger;
}

async function incomingFiles(layout: DropLayout): Promise<string[]> {
  const names = await readdir(layout.incoming);
  return names.filter((name) => !isIgnoredName(name)).map((name) => path.join(layout.incoming, name));
}

async function isOtherInput(specs: SpecSource, name: string): Promise<boolean> {
  return (await specs.current()).some(({ spec }) => neededRoles(spec).some((role) => role.role !== 'prices' && matchesPattern(name, role.pattern)));
}

export async function runUploadJob(deps: UploadJobDeps, job: ClaimedJob, payload: UploadPayload): Promise<JobOutcome> {
  const name = safeFileName(payload.fileName);
  // The temporary name is ignored by the processor until the rename makes the file whole.
  const target = await freePath(deps.layout.incoming, name);
  await fetchInput(deps.client, payload.sha256, target);
  deps.logger.info({ job: job.id, file: path.basename(target) }, 'uploaded file placed in incoming/');
  const results = await deps.processor.process(await incomingFiles(deps.layout));
  const result = results.get(target);
  if (result?.outcome === 'rejected') {
    return { state: 'failed', code: result.rejection?.code ?? 'INPUT_UNREADABLE', message: `${path.basename(target)} rejected: ${result.rejection?.reason ?? ''}` };
  }
  if (result?.outcome === 'archived') return { state: 'done', message: `${path.basename(target)} processed and archived` };
  if (result?.outcome === 'waiting') return { state: 'done', message: `${path.basename(target)} waits in incoming/ for its other inputs` };
  if (await isOtherInput(deps.specs, path.basename(target))) {
    return { state: 'done', message: `${path.basename(target)} kept as a market or risk-free input for the runs that need it` };
  }
  return { state: 'failed', code: 'VALIDATION_FAILED', message: `${path.basename(target)} matches no spec's file patterns; it stays in incoming/` };
}
