// Wall time per phase of a benchmark run and the process's peak resident set size (all threads).
import { performance } from 'node:perf_hooks';

export interface PhaseTime {
  readonly name: string;
  readonly seconds: number;
  /** Resident set size at the end of the phase (all threads), MB. */
  readonly rssMb: number;
}

export interface TimingReport {
  readonly phases: readonly PhaseTime[];
  readonly totalSeconds: number;
  readonly peakRssMb: number;
  readonly [detail: string]: unknown;
}

export class PhaseClock {
  private readonly phases: PhaseTime[] = [];

  async time<T>(name: string, work: () => T | Promise<T>): Promise<T> {
    const start = performance.now();
    const result = await work();
    this.phases.push({ name, seconds: (performance.now() - start) / 1000, rssMb: process.memoryUsage.rss() / 2 ** 20 });
    return result;
  }

  report(details: Readonly<Record<string, unknown>>): TimingReport {
    const totalSeconds = this.phases.reduce((sum, phase) => sum + phase.seconds, 0);
    // resourceUsage().maxRSS is in kilobytes (getrusage ru_maxrss on Linux).
    return { ...details, phases: [...this.phases], totalSeconds, peakRssMb: process.resourceUsage().maxRSS / 1024 };
  }

  table(title: string): string {
    const lines = this.phases.map((phase) => `  ${phase.name.padEnd(20)} ${phase.seconds.toFixed(2).padStart(8)} s  (RSS after: ${phase.rssMb.toFixed(0)} MB)`);
    const report = this.report({});
    return `${title}\n${lines.join('\n')}\n  ${'total'.padEnd(20)} ${report.totalSeconds.toFixed(2).padStart(8)} s\n  peak RSS ${report.peakRssMb.toFixed(0)} MB\n`;
  }
}
