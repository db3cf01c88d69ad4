// What happens to a settled price file in incoming/: every spec whose prices pattern matches it runs
// once its other inputs exist (else it waits); the same spec on the same content (by sha256) never
// runs twice; results go to the outbox; the inputs then move to archive/<day>/. A file the readers
// refuse moves to rejected/ beside its .error.txt.
import { access } from 'node:fs/promises';
import path from 'node:path';
import type { Logger } from 'pino';
import type { computeRun } from '../batch/compute-run.js';
import { deliveryOf } from '../batch/delivery-of.js';
import { fileChecksum, type InputChecksum } from '../batch/input-checksums.js';
import { matchesPattern, type RunInputPaths } from '../batch/input-roles.js';
import { InputError } from '../inputs/input-error.js';
import { archiveInput, rejectInput, rejectionOf, type Rejection } from './archive-and-reject.js';
import type { Courier } from './courier.js';
import { findOtherInputs } from './input-finder.js';
import { runKeyOf, type Ledger } from './ledger.js';
import { utcDay, type DropLayout } from './layout.js';
import type { SpecSource, WatchedSpec } from './spec-source.js';

export interface ProcessorDeps {
  readonly layout: DropLayout;
  readonly ledger: Ledger;
  readonly courier: Courier;
  readonly specs: SpecSource;
  readonly logger: Logger;
  readonly compute: typeof computeRun;
  /** The last released run's betas of a spec, for `big-move`; none when the server cannot say. */
  readonly priorBetas?: (specName: string) => Promise<ReadonlyMap<string, number>>;
  readonly now?: () => Date;
}

type SpecOutcome = 'ran' | 'ran-before' | 'waiting' | 'rejected';

/** What became of a file: archived (every matching spec ran or had run), rejected, waiting, or no spec matches it. */
export type FileOutcome = 'archived' | 'rejected' | 'waiting' | 'unmatched';

export interface FileResult {
  readonly outcome: FileOutcome;
  /** Why the file was rejected (rejected only). */
  readonly rejection?: Rejection;
}

export interface DropProcessor {
  /** Processes the settled files of incoming/ (full paths), price files in name order. */
  process(settled: readonly string[]): Promise<Map<string, FileResult>>;
  /** Lets the current file finish, then processes no more. */
  stop(): void;
}

const exists = (file: string): Promise<boolean> => access(file).then(() => true, () => false);

export function createDropProcessor(deps: ProcessorDeps): DropProcessor {
  const { layout, ledger, logger } = deps;
  const day = (): string => utcDay(deps.now?.());
  const told = new Set<string>();
  const rejections = new Map<string, Rejection>();
  let stopping = false;

  function tellOnce(key: string, log: () => void): void {
    if (told.has(key)) return;
    told.add(key);
    log();
  }

  async function reject(file: string, sha256: string, error: unknown, spec: string | null): Promise<void> {
    const rejection = rejectionOf(error);
    rejections.set(file, rejection);
    const target = await rejectInput(layout, file, rejection, spec);
    await ledger.append({ kind: 'rejected', name: path.basename(file), sha256, code: rejection.code, spec, at: new Date().toISOString() });
    logger.error({ file: path.basename(file), code: rejection.code, movedTo: path.relative(layout.root, target) }, `input rejected: ${rejection.reason}`);
  }

  async function priorBetasOf(specName: string): Promise<ReadonlyMap<string, number>> {
    if (deps.priorBetas === undefined) return new Map();
    try {
      return await deps.priorBetas(specName);
    } catch (error) {
      logger.warn({ spec: specName, err: error }, 'no prior betas from the server: big-move is not checked for this run');
      return new Map();
    }
  }

  async function runSpec(price: InputChecksum, watched: WatchedSpec, settled: readonly string[], used: Map<string, string>): Promise<SpecOutcome> {
    const others = await findOtherInputs(layout, watched.spec, settled.filter((file) => file !== price.path));
    if (others.missing.length > 0) {
      const waitingFor = others.missing.map((m) => m.pattern).join(', ');
      tellOnce(`${price.path}|${watched.sha256}|${waitingFor}`, () => logger.info({ file: price.name, spec: watched.name, waitingFor }, 'run waits for its inputs'));
      return 'waiting';
    }
    const paths: RunInputPaths = { prices: price.path, ...others.found };
    const otherChecksums = await Promise.all(Object.values(others.found).map(fileChecksum));
    const runKey = runKeyOf(watched.sha256, [price.sha256, ...otherChecksums.map((c) => c.sha256)]);
    if (ledger.hasRun(runKey)) {
      logger.info({ file: price.name, spec: watched.name }, 'same spec and same content ran before: not run again');
      return 'ran-before';
    }
    let run;
    try {
      run = await deps.compute(watched.spec, paths, { priorBetas: await priorBetasOf(watched.name) });
    } catch (error) {
      const culprit = error instanceof InputError ? path.resolve(error.file) : path.resolve(price.path);
      if (culprit === path.resolve(price.path)) {
        await reject(price.path, price.sha256, error, watched.name);
        return 'rejected';
      }
      if (await exists(culprit)) await reject(culprit, otherChecksums.find((c) => path.resolve(c.path) === culprit)?.sha256 ?? '', error, watched.name);
      return 'waiting';
    }
    logger.info({ file: price.name, spec: watched.name, asOf: run.asOf, securities: run.rows.length }, 'run computed');
    const delivery = deliveryOf(watched.name, watched.sha256, run);
    await deps.courier.spool(delivery);
    await ledger.append({
      kind: 'run', runKey, spec: watched.name, specSha256: watched.sha256, asOf: run.asOf, deliveryKey: delivery.key,
      inputs: run.inputs.map(({ name, sha256 }) => ({ name, sha256 })), at: new Date().toISOString(),
    });
    for (const checksum of otherChecksums) if (path.dirname(path.resolve(checksum.path)) === path.resolve(layout.incoming)) used.set(checksum.path, checksum.sha256);
    return 'ran';
  }

  async function processPriceFile(file: string, matching: readonly WatchedSpec[], settled: readonly string[]): Promise<FileOutcome> {
    const price = await fileChecksum(file);
    const used = new Map<string, string>();
    const outcomes: SpecOutcome[] = [];
    for (const watched of matching) {
      const outcome = await runSpec(price, watched, settled, used);
      outcomes.push(outcome);
      if (outcome === 'rejected') break;
    }
    for (const [other, sha256] of used) if (await exists(other)) await archiveInput(layout, other, sha256, day());
    if (outcomes.includes('rejected')) return 'rejected';
    if (outcomes.includes('waiting')) return 'waiting';
    if (!outcomes.includes('ran')) {
      await ledger.append({ kind: 'duplicate', name: price.name, sha256: price.sha256, at: new Date().toISOString() });
    }
    const target = await archiveInput(layout, file, price.sha256, day());
    logger.info({ file: price.name, archivedTo: path.relative(layout.root, target) }, 'input archived');
    return 'archived';
  }

  return {
    async process(settled) {
      const outcomes = new Map<string, FileResult>();
      const specs = await deps.specs.current();
      for (const file of [...settled].sort()) {
        if (stopping) break;
        if (!(await exists(file))) continue;
        const name = path.basename(file);
        const matching = specs.filter((s) => matchesPattern(name, s.spec.inputs.prices.pattern));
        const outcome = matching.length === 0 ? 'unmatched' : await processPriceFile(file, matching, settled);
        const rejection = rejections.get(file);
        outcomes.set(file, outcome === 'rejected' && rejection !== undefined ? { outcome, rejection } : { outcome });
      }
      return outcomes;
    },
    stop() {
      stopping = true;
    },
  };
}
