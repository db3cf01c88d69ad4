// Small invented input files for drop-folder tests: month-end closes of two securities and the market
// (a column of the price file), and a risk-free file in percent. `variant` changes the content.
import { lastDayOfMonthIndex, isoOfDayNumber } from '../../../cli/src/engine/calendar-date.js';

export const DROP_SPEC = `schema: 1
name: drop-test
inputs:
  prices:
    pattern: "px-*.csv"
  market:
    source: price-file
    column: MKT
  riskFree:
    source: file
    pattern: "rf-*.csv"
    column: rate_pct
sampling:
  frequency: monthly
  window: 12
  minimum: 6
`;

const FIRST_MONTH = 2025 * 12; // January 2025 as a month index

export function priceFile(months: number, variant = 0): string {
  const lines = ['date,QZ-A,QZ-B,MKT'];
  for (let t = 0; t < months; t += 1) {
    const day = isoOfDayNumber(lastDayOfMonthIndex(FIRST_MONTH + t));
    const market = 1000 * (1 + 0.004 * t + 0.03 * Math.sin(1.7 * t));
    const a = 50 * (1 + 0.003 * t + 0.04 * Math.sin(1.7 * t + 0.2) + 0.001 * variant);
    const b = 20 * (1 + 0.002 * t + 0.01 * Math.cos(0.9 * t));
    lines.push(`${day},${a.toFixed(4)},${b.toFixed(4)},${market.toFixed(2)}`);
  }
  return `${lines.join('\n')}\n`;
}

export function riskFreeFile(months: number): string {
  const lines = ['date,rate_pct'];
  for (let t = -1; t < months; t += 1) lines.push(`${isoOfDayNumber(lastDayOfMonthIndex(FIRST_MONTH + t))},${(3 + 0.01 * t).toFixed(2)}`);
  return `${lines.join('\n')}\n`;
}
