// `clino run <spec> [inputs…]`: computes a run from a local spec and local files. Writes the result
// CSV (stdout, or --out with its `.fingerprint` companion), or the same content as JSON (--json);
// with --post it also sends the run to the server, which must hold the spec (SPEC_UNKNOWN otherwise);
// a server out of reach leaves the run in --outbox / CLINO_OUTBOX for clino watch to deliver.
import { Command } from 'commander';
import { computeRun } from '../batch/compute-run.js';
import { deliveryOf } from '../batch/delivery-of.js';
import { assignInputRoles } from '../batch/input-roles.js';
import { readSpecFile } from '../batch/spec-file.js';
import { openContext, type CommandDeps } from '../command-context.js';
import { resultCsvText, resultJson, writeResultFiles, fingerprintFileOf } from '../output/result-files.js';
import { checkOutboxFolder, postOrSpool, type PostOutcome } from '../drop-folder/post-or-spool.js';
import { asOfOption } from './option-parsers.js';

interface RunOptions {
  readonly asOf?: string;
  readonly out?: string;
  readonly json?: boolean;
  readonly post?: boolean;
  readonly outbox?: string;
  readonly prices?: string;
  readonly market?: string;
  readonly riskFree?: string;
}

export function runCommand(deps: CommandDeps): Command {
  return new Command('run')
    .description('compute betas, expected returns and WACC inputs from a spec and its input files')
    .argument('<spec>', 'the run spec (YAML)')
    .argument('[inputs...]', 'input files: assigned by the spec\'s patterns, else in the order prices, market, risk-free')
    .option('--as-of <date>', 'as-of date YYYY-MM-DD, or latest (overrides the spec)', asOfOption)
    .option('--out <file>', 'write the result CSV here, and the fingerprint to <file>.fingerprint')
    .option('--json', 'print the results as JSON on stdout instead of CSV')
    .option('--post', 'also send the run to the server (needs clino login or CLINO_TOKEN)')
    .option('--outbox <folder>', 'with --post: when the server is unreachable, leave the run here for clino watch to deliver (the outbox/ of its drop folder; or CLINO_OUTBOX)')
    .option('--prices <file>', 'the price file, whatever its name')
    .option('--market <file>', 'the market file, whatever its name')
    .option('--risk-free <file>', 'the risk-free file, whatever its name')
    .action(async (specFile: string, inputs: string[], options: RunOptions, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      if (options.post === true) await checkOutboxFolder(context.settings.outbox);
      const { spec, sha256 } = await readSpecFile(specFile);
      const { paths, ignored } = assignInputRoles(spec, inputs, { prices: options.prices, market: options.market, riskFree: options.riskFree });
      if (ignored.length > 0) context.logger.warn({ ignored }, 'files the spec does not read were ignored');
      context.logger.debug({ spec: spec.name, paths }, 'inputs assigned');
      const run = await computeRun(spec, paths, {
        asOf: options.asOf,
        onProgress: (done, total) => (done === 0 ? context.progress.start('securities', total) : context.progress.update(done)),
      });
      context.progress.stop();
      context.logger.info({ spec: spec.name, asOf: run.asOf, securities: run.rows.length }, 'run computed');
      // Written before posting, so a refused post still leaves the local results.
      if (options.out !== undefined) {
        await writeResultFiles(options.out, spec, sha256, run);
        context.logger.info({ out: options.out, fingerprint: fingerprintFileOf(options.out) }, 'results written');
      }
      let posted: PostOutcome | undefined;
      if (options.post === true) {
        posted = await postOrSpool(context.authorisedClient(), deliveryOf(spec.name, sha256, run), context.settings.outbox);
        if (posted.kind === 'posted') context.logger.info({ runId: posted.runId }, 'run posted to the server');
        else context.logger.warn({ outbox: posted.file }, 'the server is unreachable: the run waits in the outbox for clino watch to deliver it');
      }
      const postJson = posted === undefined ? {} : posted.kind === 'posted' ? { runId: posted.runId } : { outbox: posted.file };
      if (options.json === true) deps.stdout(resultJson(spec, sha256, run, postJson));
      else if (options.out === undefined) deps.stdout(resultCsvText(spec, run));
    });
}
