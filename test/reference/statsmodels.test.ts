// Live comparison with a general-purpose reference library (shared/reference/FORMULAS.md, "A
// general-purpose reference library on the same synthetic data"): statsmodels OLS on pandas, run
// afresh from Debian's python3-statsmodels (0.13.5 here) and python3-pandas (1.5.3 here) — the exact
// versions come back in the script's JSON and are printed with the results. The script implements
// DESIGN.md's sampling, returns, risk-free and window conventions on its own, in pandas; our side is
// computeRun (readers, engine, batch glue) on the same files. Every statistic of every security must
// agree to relative 1e-9 or absolute 1e-12, whichever is looser; p-values to absolute 1e-10. The 95%
// intervals use statsmodels' standard errors with scipy's t quantile refined by one Newton step, as
// scipy 1.10's t.ppf alone is good to about 1e-9 only (see the script).
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { execa } from 'execa';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Frequency } from '../../cli/src/engine/types.js';
import { compareSecurity, emptyTally, RELATIVE_TOLERANCE, P_VALUE_TOLERANCE } from './compare-statistics.js';
import type { ComparisonTally, ReferenceCase, ReferenceDocument } from './compare-statistics.js';
import { runEngineCase } from './engine-side.js';
import { writeSyntheticInputs } from './make-synthetic.js';
import type { SyntheticFiles } from './make-synthetic.js';

const SCRIPT = fileURLToPath(new URL('./statsmodels_reference.py', import.meta.url));
const CONSTANT_YIELD = 0.025;
/** "latest" is the market's last date (a Friday, a month end); 2023-06-14 is a Wednesday mid-month. */
const AS_OF_DATES = ['latest', '2023-06-14'] as const;
const FREQUENCIES: readonly Frequency[] = ['daily', 'weekly', 'monthly'];
const CASES = AS_OF_DATES.flatMap((asOf) => FREQUENCIES.flatMap((frequency) =>
  (['file', 'constant'] as const).map((riskFree) => ({ asOf, frequency, riskFree }))));

let folder = '';
let reference: ReferenceDocument;
let files: SyntheticFiles;
const tallies = new Map<Frequency, ComparisonTally>(FREQUENCIES.map((frequency) => [frequency, emptyTally()]));

beforeAll(async () => {
  folder = await mkdtemp(join(tmpdir(), 'clino-reference-'));
  files = await writeSyntheticInputs(folder);
  const asOfArguments = AS_OF_DATES.flatMap((asOf) => ['--as-of', asOf]);
  const python = await execa('/usr/bin/python3', [
    SCRIPT, files.prices, files.market, files.riskFree, '--constant-yield', String(CONSTANT_YIELD), ...asOfArguments,
  ], { timeout: 120_000 });
  reference = JSON.parse(python.stdout) as ReferenceDocument;
});

afterAll(async () => {
  if (folder !== '') await rm(folder, { recursive: true, force: true });
});

function referenceCase(frequency: Frequency, asOf: string, riskFree: string): ReferenceCase {
  const found = reference.cases.find((c) => c.frequency === frequency && c.as_of === asOf && c.risk_free === riskFree);
  if (found === undefined) throw new Error(`the reference has no case ${frequency} ${asOf} ${riskFree}`);
  return found;
}

describe('live comparison with statsmodels OLS on pandas (synthetic data with gaps, holidays, listings, stale prices)', () => {
  it('records the versions of the reference libraries it ran', () => {
    expect(reference.versions['statsmodels']).toMatch(/^\d+\.\d+/);
    expect(reference.versions['pandas']).toMatch(/^\d+\.\d+/);
    process.stdout.write(`reference libraries: ${JSON.stringify(reference.versions)}\n`);
  });

  it.each(CASES)('$frequency, as of $asOf, risk-free from $riskFree: every statistic of every security agrees', async ({ frequency, asOf, riskFree }) => {
    const expected = referenceCase(frequency, asOf, riskFree);
    const ours = await runEngineCase(files, { frequency, asOf, riskFree, window: expected.window, minimum: expected.minimum }, CONSTANT_YIELD);
    const tally = tallies.get(frequency)!;
    const mismatchesBefore = tally.mismatches.length;
    expect(ours.asOf).toBe(expected.as_of_date);
    expect([...ours.securities.keys()].sort()).toEqual(Object.keys(expected.securities).sort());
    for (const [id, security] of ours.securities) {
      compareSecurity(tally, `${frequency} ${asOf} ${riskFree} ${id}`, security, expected.securities[id]!);
    }
    const estimated = Object.values(expected.securities).filter((s) => s.status === 'ok').length;
    expect(estimated).toBeGreaterThanOrEqual(7); // the case compares real estimates, not only statuses
    expect(tally.mismatches.slice(mismatchesBefore)).toEqual([]);
  });

  it('reports the worst differences per frequency, each within the tolerance', () => {
    const lines = FREQUENCIES.map((frequency) => {
      const t = tallies.get(frequency)!;
      return `${frequency}: ${t.compared} values compared; worst relative ${t.worstRelative.value.toExponential(2)} (${t.worstRelative.where}); `
        + `worst p-value difference ${t.worstPValue.value.toExponential(2)} (${t.worstPValue.where})`;
    });
    process.stdout.write(`statsmodels ${reference.versions['statsmodels']} comparison\n${lines.join('\n')}\n`);
    for (const frequency of FREQUENCIES) {
      const t = tallies.get(frequency)!;
      expect(t.compared).toBeGreaterThan(1000);
      expect(t.worstRelative.value).toBeLessThanOrEqual(RELATIVE_TOLERANCE);
      expect(t.worstPValue.value).toBeLessThanOrEqual(P_VALUE_TOLERANCE);
    }
  });
});
