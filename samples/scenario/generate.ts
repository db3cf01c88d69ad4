// Writes the demo scenario's vendor files into a folder: daily prices of the fictional securities
// (wide layout), the fictional index (its own file), a risk-free yield series in percent on its own
// calendar, and the same universe in the long layout for the weekly run. Deterministic: a seeded
// generator, so the same call writes the same bytes.
//
//   node --import tsx samples/scenario/generate.ts <folder> [--through YYYY-MM-DD]
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { dayNumberOfIso, isoOfDayNumber, weekdayIndexOf } from '../../cli/src/engine/calendar-date.js';
import { DEMO_INDEX, demoSecurities, type DemoSecurity } from './fund.js';

/** mulberry32: a small, well-known 32-bit seeded generator (public domain). */
function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function seededNormal(seed: number): () => number {
  const uniform = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** Fictional market holidays: New Year's Day, 1 May and 24–26 December (weekdays only matter). */
function isHoliday(iso: string): boolean {
  const md = iso.slice(5);
  return md === '01-01' || md === '05-01' || md === '12-24' || md === '12-25' || md === '12-26';
}

export function marketDates(from: string, through: string): string[] {
  const dates: string[] = [];
  for (let d = dayNumberOfIso(from); d <= dayNumberOfIso(through); d += 1) {
    const iso = isoOfDayNumber(d);
    if (weekdayIndexOf(d) < 5 && !isHoliday(iso)) dates.push(iso);
  }
  return dates;
}

export interface DemoFiles {
  prices: string;
  pricesLong: string;
  market: string;
  riskFree: string;
}

function priceText(x: number): string {
  return x.toFixed(4);
}

/** Prices drawn from the market model r_i = r_f + β (r_m − r_f) + ε, stale on a share of days. */
export function generateDemoFiles(through = '2026-11-30', from = '2019-01-02'): DemoFiles {
  const dates = marketDates(from, through);
  const securities = demoSecurities();
  const normal = seededNormal(20261130);
  const dailyRiskFree = 0.03 / 252;
  let level = 1000;
  const marketLevels: number[] = [];
  const marketReturns: number[] = [];
  for (let t = 0; t < dates.length; t += 1) {
    const r = t === 0 ? 0 : dailyRiskFree + 0.0002 + 0.01 * normal();
    level *= 1 + r;
    marketReturns.push(r);
    marketLevels.push(level);
  }
  const columns = securities.map((s, k) => securityPrices(s, dates, marketReturns, dailyRiskFree, seededNormal(1000 + k), seededUniform(5000 + k)));
  const header = ['date', ...securities.map((s) => s.code)].join(',');
  const wide = dates.map((d, t) => [d, ...columns.map((c) => c[t] ?? '')].join(','));
  const long = dates.flatMap((d, t) => securities.flatMap((s, k) => (columns[k]![t] ? [`${d},${s.code},${columns[k]![t]}`] : [])));
  return {
    prices: `${header}\n${wide.join('\n')}\n`,
    pricesLong: `date,security,close\n${long.join('\n')}\n`,
    market: `date,${DEMO_INDEX}\n${dates.map((d, t) => `${d},${marketLevels[t]!.toFixed(2)}`).join('\n')}\n`,
    riskFree: riskFreeText(dates, seededNormal(77)),
  };
}

function securityPrices(
  s: DemoSecurity,
  dates: string[],
  marketReturns: number[],
  rf: number,
  normal: () => number,
  uniform: () => number,
): (string | undefined)[] {
  let price = 20 + 80 * uniform();
  let pending = 1;
  return dates.map((d, t) => {
    const r = rf + s.trueBeta * (marketReturns[t]! - rf) + s.residualVol * normal();
    pending *= 1 + r;
    if ((s.listed && d < s.listed) || (s.delisted && d > s.delisted)) return undefined;
    if (t > 0 && uniform() < s.staleShare) return priceText(price);
    price *= pending;
    pending = 1;
    return priceText(price);
  });
}

/** An annual yield in percent, published on the last weekday of each week (its own calendar). */
function riskFreeText(dates: string[], normal: () => number): string {
  let y = 2.4;
  const rows: string[] = [];
  for (let t = 0; t < dates.length; t += 1) {
    const next = dates[t + 1];
    const weekEnds = !next || weekdayIndexOf(dayNumberOfIso(next)) <= weekdayIndexOf(dayNumberOfIso(dates[t]!));
    if (!weekEnds) continue;
    y = Math.min(5.5, Math.max(0.25, y + 0.04 * normal()));
    rows.push(`${dates[t]},${y.toFixed(3)}`);
  }
  return `date,yield_pct\n${rows.join('\n')}\n`;
}

/** The file names the sample specs' patterns match. */
export function writeDemoFiles(folder: string, through = '2026-11-30'): string[] {
  const files = generateDemoFiles(through);
  const stamp = through.replaceAll('-', '');
  const named: Record<string, string> = {
    [`tarn-equities-${stamp}.csv`]: files.prices,
    [`tarn-equities-long-${stamp}.csv`]: files.pricesLong,
    [`tarn-index-${stamp}.csv`]: files.market,
    [`tarn-riskfree-${stamp}.csv`]: files.riskFree,
  };
  mkdirSync(folder, { recursive: true });
  for (const [name, text] of Object.entries(named)) writeFileSync(path.join(folder, name), text);
  return Object.keys(named);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const folder = process.argv[2];
  if (!folder) throw new Error('usage: generate.ts <folder> [--through YYYY-MM-DD]');
  const at = process.argv.indexOf('--through');
  const names = writeDemoFiles(folder, at > 0 ? process.argv[at + 1] : undefined);
  process.stdout.write(`${names.join('\n')}\n`);
}
