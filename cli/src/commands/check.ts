// `clino check <spec> [inputs…]`: validates a spec and, when given, its input files, without
// computing. Prints what it found; every problem is reported as file:line:column with its reason.
import path from 'node:path';
import { Command } from 'commander';
import { assignInputRoles, type RunInputPaths } from '../batch/input-roles.js';
import { readRunInputs, type RunInputData } from '../batch/read-run-inputs.js';
import { readSpecFile } from '../batch/spec-file.js';
import { openContext, type CommandDeps } from '../command-context.js';
import type { DatedSeries } from '../inputs/price-file-options.js';

interface CheckOptions {
  readonly json?: boolean;
  readonly prices?: string;
  readonly market?: string;
  readonly riskFree?: string;
}

export interface CheckReport {
  readonly spec: { readonly file: string; readonly name: string; readonly sha256: string };
  readonly inputs: {
    readonly prices: { readonly file: string; readonly securities: number; readonly firstDate: string | null; readonly lastDate: string | null };
    readonly market: { readonly file: string | null; readonly id: string; readonly levels: number; readonly firstDate: string | null; readonly lastDate: string | null };
    readonly riskFree: { readonly file: string | null; readonly observations: number | null; readonly constantYield: number | null };
  } | null;
}

function dateRange(series: readonly DatedSeries[]): { firstDate: string | null; lastDate: string | null } {
  const firsts = series.map((s) => s.dates[0]).filter((d): d is string => d !== undefined).sort();
  const lasts = series.map((s) => s.dates.at(-1)).filter((d): d is string => d !== undefined).sort();
  return { firstDate: firsts[0] ?? null, lastDate: lasts.at(-1) ?? null };
}

function inputReport(paths: RunInputPaths, data: RunInputData): NonNullable<CheckReport['inputs']> {
  const base = (file: string | undefined): string | null => (file === undefined ? null : path.basename(file));
  return {
    prices: { file: path.basename(paths.prices), securities: data.securities.length, ...dateRange(data.securities) },
    market: { file: base(paths.market), id: data.market.id, levels: data.market.dates.length, ...dateRange([data.market]) },
    riskFree: data.riskFree.kind === 'series'
      ? { file: base(paths.riskFree), observations: data.riskFree.series.days.length, constantYield: null }
      : { file: null, observations: null, constantYield: data.riskFree.annualYield },
  };
}

export function renderCheckReport(report: CheckReport): string {
  const lines = [`spec ${report.spec.file}: ok (name ${report.spec.name}, sha256 ${report.spec.sha256})`];
  const inputs = report.inputs;
  if (inputs !== null) {
    const p = inputs.prices;
    lines.push(`prices ${p.file}: ok (${p.securities} securities, ${p.firstDate} to ${p.lastDate})`);
    const m = inputs.market;
    lines.push(`market ${m.file ?? '(in the price file)'}: ok (${m.id}, ${m.levels} levels, ${m.firstDate} to ${m.lastDate})`);
    const r = inputs.riskFree;
    lines.push(r.file === null ? `risk-free: constant annual yield ${r.constantYield}` : `risk-free ${r.file}: ok (${r.observations} observations)`);
  }
  return `${lines.join('\n')}\n`;
}

export function checkCommand(deps: CommandDeps): Command {
  return new Command('check')
    .description('validate a spec and, when given, its input files, without computing')
    .argument('<spec>', 'the run spec (YAML)')
    .argument('[inputs...]', 'input files, assigned as for clino run')
    .option('--json', 'print the findings as JSON')
    .option('--prices <file>', 'the price file, whatever its name')
    .option('--market <file>', 'the market file, whatever its name')
    .option('--risk-free <file>', 'the risk-free file, whatever its name')
    .action(async (specFile: string, inputs: string[], options: CheckOptions, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const { spec, sha256 } = await readSpecFile(specFile);
      let report: CheckReport = { spec: { file: specFile, name: spec.name, sha256 }, inputs: null };
      const explicit = { prices: options.prices, market: options.market, riskFree: options.riskFree };
      if (inputs.length > 0 || Object.values(explicit).some((value) => value !== undefined)) {
        const { paths, ignored } = assignInputRoles(spec, inputs, explicit);
        if (ignored.length > 0) context.logger.warn({ ignored }, 'files the spec does not read were ignored');
        report = { ...report, inputs: inputReport(paths, await readRunInputs(spec, paths)) };
      }
      context.logger.debug({ spec: spec.name }, 'check passed');
      deps.stdout(options.json === true ? `${JSON.stringify(report, null, 2)}\n` : renderCheckReport(report));
    });
}
