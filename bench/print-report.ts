// Prints the benchmark's table (markdown, stdout): wall time per phase of Clinometer and of the
// pandas reference in each side's fastest repetition, the ratio pandas / Clinometer, the spread over
// the repetitions, the peak memory of each, whether the outputs agree, and the targets (Clinometer
// at least 1.5× faster, peak memory no higher than pandas).
// Usage: node --import tsx bench/print-report.ts <out-dir>  (reads clinometer-<n>/ and reference-<n>/)
import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { cpus, loadavg } from 'node:os';
import type { TimingReport } from './phase-clock.js';

const SPEED_TARGET = 1.5;

interface Agreement {
  readonly agree: boolean;
  readonly files: Readonly<Record<string, { readonly compared: number; readonly worstRelative: number; readonly mismatches: object }>>;
}

interface Repetition {
  readonly timing: TimingReport;
  readonly processSeconds: number;
}

async function json<T>(path: string): Promise<T> {
  return JSON.parse(await readFile(path, 'utf8')) as T;
}

function seconds(value: number | undefined): string {
  return value === undefined ? '—' : value.toFixed(2);
}

function ratio(pandas: number | undefined, ours: number | undefined): string {
  return pandas === undefined || ours === undefined || ours === 0 ? '—' : `${(pandas / ours).toFixed(2)}×`;
}

/** Every repetition of one side, fastest (total of the phases) first. */
async function repetitions(outDir: string, side: 'clinometer' | 'reference'): Promise<Repetition[]> {
  const folders = (await readdir(outDir)).filter((name) => name.startsWith(`${side}-`));
  const runs = await Promise.all(folders.map(async (folder) => ({
    timing: await json<TimingReport>(join(outDir, folder, `${side}-timing.json`)),
    processSeconds: Number(await readFile(join(outDir, folder, 'process-seconds'), 'utf8')),
  })));
  if (runs.length === 0) throw new Error(`no ${side}-<n> folder in ${outDir}`);
  return runs.sort((a, b) => a.timing.totalSeconds - b.timing.totalSeconds);
}

function spread(runs: readonly Repetition[]): string {
  return runs.map((run) => run.timing.totalSeconds.toFixed(2)).join(', ');
}

const [outDir] = process.argv.slice(2);
if (outDir === undefined) throw new Error('usage: print-report.ts <out-dir>');
const oursRuns = await repetitions(outDir, 'clinometer');
const pandasRuns = await repetitions(outDir, 'reference');
const ours = oursRuns[0]!.timing;
const pandas = pandasRuns[0]!.timing;
const agreement = await json<Agreement>(join(outDir, 'agreement.json'));

const names = [...new Set([...ours.phases, ...pandas.phases].map((phase) => phase.name))];
const timeOf = (report: TimingReport, name: string) => report.phases.find((phase) => phase.name === name)?.seconds;
const rows = names.map((name) => {
  const a = timeOf(ours, name), b = timeOf(pandas, name);
  return `| ${name} | ${seconds(a)} | ${seconds(b)} | ${ratio(b, a)} |`;
});
rows.push(`| **total of the phases** | **${seconds(ours.totalSeconds)}** | **${seconds(pandas.totalSeconds)}** | **${ratio(pandas.totalSeconds, ours.totalSeconds)}** |`);
const oursProcess = oursRuns[0]!.processSeconds, pandasProcess = pandasRuns[0]!.processSeconds;
rows.push(`| whole process (with start-up) | ${seconds(oursProcess)} | ${seconds(pandasProcess)} | ${ratio(pandasProcess, oursProcess)} |`);
const speed = pandas.totalSeconds / ours.totalSeconds;
const memory = ours.peakRssMb / pandas.peakRssMb;
const worst = Object.entries(agreement.files).map(([name, part]) => `${name} ${part.worstRelative.toExponential(1)}`).join(', ');
process.stdout.write([
  `Benchmark: ${String(ours['securities'])} securities × ${String(ours['days'])} days, ${cpus().length} cores, Clinometer threads: ${String(ours['threads'])}`,
  `Fastest of ${oursRuns.length} repetitions per side (totals: Clinometer ${spread(oursRuns)} s; pandas ${spread(pandasRuns)} s); load average now ${loadavg().map((l) => l.toFixed(2)).join(' ')}`,
  '',
  '| phase | Clinometer (s) | pandas (s) | pandas / Clinometer |',
  '| --- | ---: | ---: | ---: |',
  ...rows,
  '',
  `Peak RSS: Clinometer ${ours.peakRssMb.toFixed(0)} MB, pandas ${pandas.peakRssMb.toFixed(0)} MB (Clinometer / pandas ${memory.toFixed(2)})`,
  `Outputs agree to 1e-9: ${agreement.agree ? 'yes' : 'NO'} (worst relative difference: ${worst})`,
  `Speed target (at least ${SPEED_TARGET}× faster): ${speed >= SPEED_TARGET ? 'met' : 'missed'} (${speed.toFixed(2)}×)`,
  `Memory target (no higher than pandas): ${memory <= 1 ? 'met' : 'missed'}`,
  '',
].join('\n'));
