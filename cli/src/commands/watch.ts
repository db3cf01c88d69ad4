// `clino watch <drop-folder>`: runs every spec on the price files dropped into incoming/, posts the
// results (through outbox/ when the server is unreachable), archives or rejects the inputs. Runs
// until SIGTERM or Ctrl-C, finishing the current file first; --once processes what is there and ends.
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { Command } from 'commander';
import { computeRun } from '../batch/compute-run.js';
import { openContext, type CommandContext, type CommandDeps } from '../command-context.js';
import { createCourier, type Courier } from '../drop-folder/courier.js';
import { createDropProcessor, type DropProcessor } from '../drop-folder/drop-processor.js';
import { startDropWatcher } from '../drop-folder/drop-watcher.js';
import { openLedger } from '../drop-folder/ledger.js';
import { dropLayout, ensureDropLayout, isIgnoredName, type DropLayout } from '../drop-folder/layout.js';
import { localSpecSource, serverSpecSource } from '../drop-folder/spec-source.js';
import { lastReleasedBetas } from '../transport/prior-betas.js';
import { positiveIntegerOption } from './option-parsers.js';

interface WatchOptions {
  readonly spec?: string[];
  readonly settleMs: number;
  readonly retryMs: number;
  readonly retryMaxMs: number;
  readonly rescanSeconds: number;
  readonly once?: boolean;
}

async function incomingFiles(layout: DropLayout): Promise<string[]> {
  const entries = await readdir(layout.incoming, { withFileTypes: true });
  return entries.filter((e) => e.isFile() && !isIgnoredName(e.name)).map((e) => path.join(layout.incoming, e.name));
}

async function setUp(context: CommandContext, folder: string, options: WatchOptions): Promise<{ layout: DropLayout; courier: Courier; processor: DropProcessor }> {
  const layout = dropLayout(path.resolve(folder));
  await ensureDropLayout(layout);
  const client = context.authorisedClient();
  const courier = createCourier(layout, client, context.logger, { initialMs: options.retryMs, maxMs: options.retryMaxMs });
  const specs = options.spec !== undefined && options.spec.length > 0
    ? localSpecSource(options.spec)
    : serverSpecSource(client, layout.specCache, context.logger);
  const processor = createDropProcessor({
    layout, ledger: await openLedger(layout.ledgerFile), courier, specs, logger: context.logger, compute: computeRun,
    priorBetas: (specName) => lastReleasedBetas(client, specName),
  });
  return { layout, courier, processor };
}

export function watchCommand(deps: CommandDeps): Command {
  return new Command('watch')
    .description('watch a drop folder (incoming/ archive/ rejected/ outbox/) and run the specs on what arrives')
    .argument('<drop-folder>', 'the drop folder; its subfolders are created when missing')
    .option('--spec <files...>', 'run these local spec files instead of the server\'s current revisions')
    .option('--settle-ms <ms>', 'a file counts as written once its size is stable this long', positiveIntegerOption, 2000)
    .option('--retry-ms <ms>', 'first wait before posting again to an unreachable server (doubles)', positiveIntegerOption, 2000)
    .option('--retry-max-ms <ms>', 'longest wait between posting attempts', positiveIntegerOption, 300_000)
    .option('--rescan-seconds <s>', 'look at waiting files, refresh the specs and deliver runs left in outbox/ this often', positiveIntegerOption, 60)
    .option('--once', 'process the files in incoming/ and the outbox once, then end')
    .action(async (folder: string, options: WatchOptions, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const { layout, courier, processor } = await setUp(context, folder, options);
      context.logger.info({ folder: layout.root }, options.once === true ? 'processing the drop folder once' : 'watching the drop folder');
      await courier.flush();
      if (options.once === true) {
        await processor.process(await incomingFiles(layout));
        await courier.stop();
        return;
      }
      const watcher = startDropWatcher(layout, processor, context.logger, { settleMs: options.settleMs, rescanMs: options.rescanSeconds * 1000 });
      // Runs spooled into outbox/ by `clino run --post --outbox` are delivered on the same rhythm.
      const outboxRescan = setInterval(() => void courier.rescan(), options.rescanSeconds * 1000);
      await watcher.ready;
      context.logger.info('watcher ready');
      const signal = await deps.stopRequested();
      context.logger.info({ signal }, 'stopping: finishing the current file; queued files stay in incoming/');
      clearInterval(outboxRescan);
      await watcher.close();
      await courier.stop();
      context.logger.info('stopped');
    });
}
