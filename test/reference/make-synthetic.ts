// Seeded synthetic inputs for the live comparison with the reference libraries: six years of
// invented daily data in the wide layout with the awkward cases a back office meets — empty cells,
// market holidays (dates missing from every file), dates on which only the securities traded (one of
// them the last day of a month), an empty market cell, a late listing, a delisting and a
// stale-priced security — plus the market's own file and a risk-free file (annual yield in percent,
// published weekly on its own calendar, with one empty cell).
// Usage: node --import tsx test/reference/make-synthetic.ts --out <dir> [--seed 20240607]
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { pathToFileURL } from 'node:url';
import { dayNumberOf, isoOfDayNumber, weekdayIndexOf } from '../../cli/src/engine/calendar-date.js';
import { seededRandom } from '../../cli/src/engine/test-support/seeded-random.js';
import type { SeededRandom } from '../../cli/src/engine/test-support/seeded-random.js';

export interface SyntheticFiles {
  readonly prices: string;
  readonly market: string;
  readonly riskFree: string;
  readonly securities: readonly string[];
  /** The market file's last date: the as-of date "latest" resolves to. */
  readonly lastMarketDate: string;
}

interface SecurityModel {
  readonly id: string;
  readonly beta: number;
  readonly noise: number; // daily idiosyncratic sd
  readonly gapShare: number; // share of empty cells while listed
  readonly staleShare: number; // share of days on which the price is not updated
  readonly firstDay: number; // listing (inclusive)
  readonly lastDay: number; // delisting (inclusive)
}

const FIRST_DAY = dayNumberOf(2018, 1, 1);
const LAST_DAY = dayNumberOf(2023, 12, 29);
/** Market holidays on which only the securities' file has a row (one of them closes a month). */
const SECURITY_ONLY_DAYS = [dayNumberOf(2019, 5, 31), dayNumberOf(2021, 11, 25), dayNumberOf(2023, 10, 9)];
/** A market date whose level is missing (an empty cell in the market file). */
const EMPTY_MARKET_DAY = dayNumberOf(2022, 3, 16);

function securityModels(): SecurityModel[] {
  const always = { firstDay: FIRST_DAY, lastDay: LAST_DAY };
  const plain = (id: string, beta: number, noise: number, gapShare: number): SecurityModel =>
    ({ id, beta, noise, gapShare, staleShare: 0, ...always });
  return [
    plain('QV01', 0.45, 0.012, 0.01),
    plain('QV02', 0.8, 0.015, 0.02),
    plain('QV03', 1.0, 0.01, 0),
    plain('QV04', 1.25, 0.02, 0.03),
    plain('QV05', 1.6, 0.018, 0.01),
    plain('QV06', -0.2, 0.014, 0.02),
    { ...plain('QV07', 0.95, 0.016, 0.15) }, // gappy: many empty cells
    { ...plain('QV08', 1.1, 0.012, 0.01), firstDay: dayNumberOf(2021, 3, 10) }, // late listing
    { ...plain('QV09', 0.7, 0.013, 0.01), lastDay: dayNumberOf(2023, 8, 18) }, // delisting
    { ...plain('QV10', 0.9, 0.011, 0), staleShare: 0.6 }, // stale prices: many repeated closes
    { ...plain('QV11', 1.35, 0.025, 0.005), lastDay: dayNumberOf(2019, 6, 28) }, // gone long before the as-of date
  ];
}

/** Weekdays minus a seeded set of holidays (about six a year, always 1 January and 25 December). */
function marketDays(random: SeededRandom): number[] {
  const days: number[] = [];
  for (let day = FIRST_DAY; day <= LAST_DAY; day++) {
    if (weekdayIndexOf(day) >= 5) continue;
    const iso = isoOfDayNumber(day);
    const fixedHoliday = iso.endsWith('-01-01') || iso.endsWith('-12-25');
    if (fixedHoliday || SECURITY_ONLY_DAYS.includes(day) || random.uniform() < 0.016) continue;
    days.push(day);
  }
  return days;
}

function marketLevels(random: SeededRandom, days: readonly number[]): Map<number, number> {
  const levels = new Map<number, number>();
  let level = 3150;
  for (const day of days) {
    level *= 1 + 0.0003 + 0.011 * random.normal();
    levels.set(day, level);
  }
  return levels;
}

/** Closes per day for one security; the market's return of the day drives it (none on a market holiday). */
function securityCloses(random: SeededRandom, model: SecurityModel, rowDays: readonly number[], market: Map<number, number>): Map<number, string> {
  const closes = new Map<number, string>();
  let value = 40 + 80 * random.uniform();
  let shown = value;
  let previousLevel = Number.NaN;
  for (const day of rowDays) {
    const level = market.get(day);
    const marketReturn = level === undefined || Number.isNaN(previousLevel) ? 0 : level / previousLevel - 1;
    if (level !== undefined) previousLevel = level;
    value *= 1 + 0.0001 + model.beta * marketReturn + model.noise * random.normal();
    const updated = random.uniform() >= model.staleShare;
    if (updated) shown = value;
    const listed = day >= model.firstDay && day <= model.lastDay;
    if (listed && random.uniform() >= model.gapShare) closes.set(day, shown.toFixed(4));
  }
  return closes;
}

function csv(lines: readonly string[]): string {
  return `${lines.join('\n')}\n`;
}

function pricesCsv(rowDays: readonly number[], models: readonly SecurityModel[], closes: readonly Map<number, string>[]): string {
  const lines = [`date,${models.map((m) => m.id).join(',')}`];
  for (const day of rowDays) lines.push([isoOfDayNumber(day), ...closes.map((c) => c.get(day) ?? '')].join(','));
  return csv(lines);
}

function marketCsv(days: readonly number[], levels: Map<number, number>): string {
  const lines = ['date,level'];
  for (const day of days) lines.push(`${isoOfDayNumber(day)},${day === EMPTY_MARKET_DAY ? '' : levels.get(day)!.toFixed(3)}`);
  return csv(lines);
}

/** Weekly yields (Thursdays, holidays included) from December 2017, in percent; one empty cell. */
function riskFreeCsv(random: SeededRandom): string {
  const lines = ['date,rate_pct'];
  let yieldPct = 1.4;
  const emptyAt = dayNumberOf(2020, 4, 16);
  for (let day = dayNumberOf(2017, 12, 7); day <= LAST_DAY; day += 7) {
    yieldPct = Math.max(0.05, yieldPct + 0.06 * random.normal());
    lines.push(`${isoOfDayNumber(day)},${day === emptyAt ? '' : yieldPct.toFixed(3)}`);
  }
  return csv(lines);
}

export async function writeSyntheticInputs(dir: string, seed = 20240607): Promise<SyntheticFiles> {
  await mkdir(dir, { recursive: true });
  const random = seededRandom(seed);
  const days = marketDays(random);
  const levels = marketLevels(random, days);
  const rowDays = [...days, ...SECURITY_ONLY_DAYS].sort((a, b) => a - b);
  const models = securityModels();
  const closes = models.map((model) => securityCloses(random, model, rowDays, levels));
  const files = { prices: join(dir, 'prices.csv'), market: join(dir, 'index.csv'), riskFree: join(dir, 'rates.csv') };
  await writeFile(files.prices, pricesCsv(rowDays, models, closes));
  await writeFile(files.market, marketCsv(days, levels));
  await writeFile(files.riskFree, riskFreeCsv(random));
  return { ...files, securities: models.map((m) => m.id), lastMarketDate: isoOfDayNumber(days[days.length - 1]!) };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { values } = parseArgs({ options: { out: { type: 'string' }, seed: { type: 'string', default: '20240607' } } });
  if (values.out === undefined) throw new Error('usage: make-synthetic.ts --out <dir> [--seed N]');
  const files = await writeSyntheticInputs(values.out, Number(values.seed));
  process.stdout.write(`${JSON.stringify(files)}\n`);
}
