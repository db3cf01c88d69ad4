// The body limit (config/default.yaml server.bodyLimit) against the size of the results post clino
// really sends: a small invented daily run computed by the CLI's engine, its payload measured, and the
// bytes per security scaled to the 5,000 securities DESIGN.md says a run must fit.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { computeRun } from '../../../cli/src/batch/compute-run.js';
import { resultsPayload } from '../../../cli/src/batch/delivery-of.js';
import { dayNumberOf, isoOfDayNumber, weekdayIndexOf } from '../../../cli/src/engine/calendar-date.js';
import { seededRandom } from '../../../cli/src/engine/test-support/seeded-random.js';
import { loadSettings } from '../config.js';
import { loadRunSpec } from '../contracts/run-spec.load.js';

const SECURITIES = 40;
const WEEKDAYS = 300; // 252 returns for the window and 23 more for 24 rolling ends, with room to spare

const SPEC = `schema: 1
name: body-size-probe
inputs:
  prices:
    pattern: "prices-*.csv"
  market:
    source: price-file
    column: MKT
  riskFree:
    source: constant
    annualYield: 0.03
sampling:
  frequency: daily
`;

/** Invented prices: a one-factor model, every cell filled, so every security has a full window. */
function widePrices(): string {
  const random = seededRandom(20260630);
  const lines = [`date,MKT,${Array.from({ length: SECURITIES }, (_, k) => `QB${String(k).padStart(3, '0')}`).join(',')}`];
  const prices = new Float64Array(SECURITIES).fill(50);
  let level = 1000;
  for (let day = dayNumberOf(2025, 1, 1), row = 0; row < WEEKDAYS; day++) {
    if (weekdayIndexOf(day) >= 5) continue;
    const market = row === 0 ? 0 : 0.0003 + 0.01 * random.normal();
    level *= 1 + market;
    for (let k = 0; k < SECURITIES; k++) if (row > 0) prices[k]! *= 1 + (0.5 + k / SECURITIES) * market + 0.015 * random.normal();
    lines.push(`${isoOfDayNumber(day)},${level.toFixed(4)},${Array.from(prices, (p) => p.toFixed(4)).join(',')}`);
    row += 1;
  }
  return `${lines.join('\n')}\n`;
}

/** A body-parser limit such as `128mb` in bytes (the `bytes` convention: kb, mb, gb are powers of 1024) [memory]. */
function limitBytes(limit: string): number {
  const match = /^(\d+(?:\.\d+)?)\s*(b|kb|mb|gb)?$/i.exec(limit.trim());
  if (!match) throw new Error(`unreadable body limit ${limit}`);
  const unit = { b: 1, kb: 2 ** 10, mb: 2 ** 20, gb: 2 ** 30 }[(match[2] ?? 'b').toLowerCase() as 'b' | 'kb' | 'mb' | 'gb'];
  return Number(match[1]) * unit;
}

describe('the API body limit', () => {
  const dirs: string[] = [];
  afterAll(async () => {
    for (const dir of dirs) await rm(dir, { recursive: true, force: true });
  });

  it('reads 128mb as 134,217,728 bytes', () => {
    expect(limitBytes('128mb')).toBe(134_217_728);
    expect(limitBytes('64kb')).toBe(65_536);
  });

  it('holds a 5,000-security daily results post at full precision with room to spare (at least 1.5x)', async () => {
    const dir = await mkdtemp(path.join(tmpdir(), 'clino-body-'));
    dirs.push(dir);
    const prices = path.join(dir, 'prices-probe.csv');
    await writeFile(prices, widePrices());
    const { spec } = loadRunSpec(SPEC, 'body-size-probe.yaml');
    const run = await computeRun(spec, { prices });
    const payload = resultsPayload(run);
    expect(payload.series.every((s) => s.scatter.market.length === 252 && s.rolling.betas.length === 24)).toBe(true);
    const perSecurity = Buffer.byteLength(JSON.stringify(payload)) / SECURITIES;
    const fiveThousand = perSecurity * 5000;
    // Measured once for the config comment on 5,000 invented securities: 64,062,327 bytes.
    expect(fiveThousand).toBeGreaterThan(50e6);
    expect(limitBytes(loadSettings().server.bodyLimit)).toBeGreaterThanOrEqual(1.5 * fiveThousand);
  });
});
