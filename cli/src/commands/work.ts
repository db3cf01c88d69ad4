// `clino work`: a worker that claims rerun jobs (and, with --drop, upload jobs) from the server's
// job queue and runs them. Many workers on many hosts may claim from the same queue.
import { hostname, tmpdir } from 'node:os';
import path from 'node:path';
import { Command } from 'commander';
import { computeRun } from '../batch/compute-run.js';
import { openContext, type CommandDeps } from '../command-context.js';
import { createCourier } from '../drop-folder/courier.js';
import { createDropProcessor } from '../drop-folder/drop-processor.js';
import { dropLayout, ensureDropLayout } from '../drop-folder/layout.js';
import { openLedger } from '../drop-folder/ledger.js';
import { serverSpecSource } from '../drop-folder/spec-source.js';
import type { ServerClient } from '../transport/server-client.js';
import { lastReleasedBetas } from '../transport/prior-betas.js';
import type { CommandContext } from '../command-context.js';
import { workLoop, type WorkerOptions } from '../worker/worker-loop.js';
import { positiveIntegerOption } from './option-parsers.js';

interface WorkOptions {
  readonly drop?: string;
  readonly workDir?: string;
  readonly pollSeconds: number;
  readonly once?: boolean;
  readonly worker?: string;
}

async function uploadsSetUp(context: CommandContext, client: ServerClient, folder: string | undefined): Promise<WorkerOptions['uploads']> {
  if (folder === undefined) return null;
  const layout = dropLayout(path.resolve(folder));
  await ensureDropLayout(layout);
  const specs = serverSpecSource(client, layout.specCache, context.logger);
  const courier = createCourier(layout, client, context.logger, { initialMs: 2000, maxMs: 300_000 });
  await courier.flush();
  const processor = createDropProcessor({
    layout, ledger: await openLedger(layout.ledgerFile), courier, specs, logger: context.logger, compute: computeRun,
    priorBetas: (specName) => lastReleasedBetas(client, specName),
  });
  return { layout, processor, specs };
}

export function workCommand(deps: CommandDeps): Command {
  return new Command('work')
    .description('claim rerun jobs (and, with --drop, upload jobs) from the server and run them')
    .option('--drop <folder>', 'a drop folder of this worker\'s own where uploaded files are processed')
    .option('--work-dir <folder>', 'where rerun inputs are fetched to (default: the system temp folder)')
    .option('--poll-seconds <s>', 'wait this long when the queue is empty', positiveIntegerOption, 10)
    .option('--once', 'run the jobs queued now, then end')
    .option('--worker <name>', 'this worker\'s name in the queue (default host:pid)')
    .action(async (options: WorkOptions, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const client = context.authorisedClient();
      const worker = options.worker ?? `${hostname()}:${process.pid}`;
      const workDir = path.resolve(options.workDir ?? path.join(tmpdir(), 'clino-work'));
      const uploads = await uploadsSetUp(context, client, options.drop);
      const stop = options.once === true ? new Promise<never>(() => {}) : deps.stopRequested();
      context.logger.info({ worker, uploads: uploads !== null }, 'worker started');
      const count = await workLoop(client, { worker, workDir, pollMs: options.pollSeconds * 1000, once: options.once === true, uploads }, context.logger, stop);
      context.logger.info({ jobs: count }, 'worker stopped');
    });
}
