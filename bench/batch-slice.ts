// The benchmark's work on one slice of the securities, the same in the main thread or in a worker:
// align on the grid, full-window statistics with the OLS and the Dimson (k = 1) base estimators,
// rolling OLS betas ending at every period, and the rolling betas formatted as CSV cells. Glue only:
// every number comes from cli/src/engine/; every cell from the contracts' number format (written as bytes).
import { MAX_NUMBER_CELL_BYTES, writeNumberCell } from '../server/src/contracts/number-bytes.js';
import { alignReturns } from '../cli/src/engine/align.js';
import type { AlignedSample } from '../cli/src/engine/align.js';
import type { RiskFreeSource, YieldSeries } from '../cli/src/engine/risk-free.js';
import { rollingBetas } from '../cli/src/engine/rolling.js';
import { estimateSecurity } from '../cli/src/engine/statistics.js';
import type { EstimationSettings } from '../cli/src/engine/statistics.js';
import { PERIODS_PER_YEAR } from '../cli/src/engine/types.js';
import type { BaseEstimator, Frequency, SecurityResult } from '../cli/src/engine/types.js';
import { windowBounds } from '../cli/src/engine/window.js';

/** What a slice needs: the price file's dates, its share of the securities, the market, the yields. */
export interface SliceData {
  readonly days: Int32Array;
  readonly ids: readonly string[];
  readonly prices: readonly Float64Array[];
  readonly marketDays: Int32Array;
  readonly marketPrices: Float64Array;
  readonly yields: YieldSeries;
}

export interface WindowSetting {
  readonly length: number;
  readonly minimum: number;
}

export interface SliceStatistics {
  readonly ols: SecurityResult[];
  readonly dimson: SecurityResult[];
}

/**
 * One row of cells per rolling end (oldest first), the slice's securities in order, as ASCII in a
 * slot of the slice's shared format memory (the slot is reused once its rows are written out).
 */
export interface FormattedRows {
  /** Securities in the slice (a slice of none adds no cells). */
  readonly columns: number;
  /** Row r is the slot's bytes[offsets[r] .. offsets[r + 1]). */
  readonly offsets: Int32Array;
}

/** A cell and its comma. */
export const MAX_CELL_BYTES = MAX_NUMBER_CELL_BYTES + 1;
/** Rolling-beta rows formatted per request: small enough to keep memory flat, large enough to keep the slices busy. */
export const ROWS_PER_BLOCK = 64;
/** Blocks requested before the first is written: each slice always has rows to format. */
export const BLOCKS_AHEAD = 4;
/** Format slots per slice: the blocks ahead and the one being written out. */
export const FORMAT_SLOTS = BLOCKS_AHEAD + 1;

export interface RollingSummary {
  /** Period label of each rolling end, oldest first. */
  readonly labels: string[];
}

export interface SliceWork {
  statistics(frequency: Frequency, window: WindowSetting): SliceStatistics;
  /** Rolling betas ending at every period; the daily returns are let go afterwards. */
  rolling(window: WindowSetting): RollingSummary;
  /** Rolling-beta rows [from, to) formatted as CSV cells (oldest end first) into `slot`. */
  formatRolling(from: number, to: number, slot: Uint8Array): FormattedRows;
}

function settingsOf(estimator: BaseEstimator, frequency: Frequency, window: WindowSetting): EstimationSettings {
  return {
    estimator, dimsonLags: 1, minimum: window.minimum, periodsPerYear: PERIODS_PER_YEAR[frequency],
    adjustment: 'blume', blumeWeight: 2 / 3,
  };
}

function align(data: SliceData, frequency: Frequency): AlignedSample {
  const riskFree: RiskFreeSource = { kind: 'series', series: data.yields };
  return alignReturns({
    frequency, asOf: 'latest', returnKind: 'simple', riskFree,
    market: { id: 'market', days: data.marketDays, prices: data.marketPrices },
    securities: data.ids.map((id, k) => ({ id, days: data.days, prices: data.prices[k]! })),
  });
}

function statisticsOf(aligned: AlignedSample, frequency: Frequency, window: WindowSetting): SliceStatistics {
  const bounds = windowBounds(aligned.asOfIndex, window.length);
  const range = { start: bounds.first, end: bounds.last };
  const labels = aligned.grid.labels;
  const ols = settingsOf('ols', frequency, window);
  const dimson = settingsOf('dimson', frequency, window);
  return {
    ols: aligned.securities.map((s) => estimateSecurity(s, aligned.marketExcess, range, labels, ols)),
    dimson: aligned.securities.map((s) => estimateSecurity(s, aligned.marketExcess, range, labels, dimson)),
  };
}

/** Views of the `slotBytes`-byte slots of a slice's format memory. */
export function formatSlots(memory: SharedArrayBuffer, slotBytes: number): Uint8Array[] {
  return Array.from({ length: Math.floor(memory.byteLength / slotBytes) }, (_, k) => new Uint8Array(memory, k * slotBytes, slotBytes));
}

function formatColumns(columns: readonly Float64Array[], from: number, to: number, bytes: Uint8Array): FormattedRows {
  const rows = Math.max(0, to - from);
  if (bytes.length < rows * columns.length * MAX_CELL_BYTES) throw new RangeError('the format slot is too small for the rows asked');
  const offsets = new Int32Array(rows + 1);
  let position = 0;
  for (let r = 0; r < rows; r++) {
    for (let k = 0; k < columns.length; k++) {
      if (k > 0) bytes[position++] = 0x2c; // ','
      position = writeNumberCell(bytes, position, columns[k]![from + r]!);
    }
    offsets[r + 1] = position;
  }
  return { columns: columns.length, offsets };
}

/**
 * Memory: the daily returns are aligned once and kept for the rolling betas, then let go; the prices
 * are let go once the daily returns exist (run the monthly statistics first).
 */
export function sliceWork(data: SliceData): SliceWork {
  let prices: SliceData | null = data;
  let daily: AlignedSample | null = null;
  let betas: Float64Array[] = [];
  const pricesData = (): SliceData => {
    if (prices === null) throw new Error('the prices were let go after the daily alignment: run the monthly statistics first');
    return prices;
  };
  const dailyAligned = (): AlignedSample => {
    daily ??= align(pricesData(), 'daily');
    prices = null;
    return daily;
  };
  return {
    statistics(frequency, window) {
      return statisticsOf(frequency === 'daily' ? dailyAligned() : align(pricesData(), frequency), frequency, window);
    },
    rolling(window) {
      const aligned = dailyAligned();
      const settings = { length: window.length, step: 1, count: 'all' as const, minimum: window.minimum };
      let ends: Int32Array = new Int32Array(0);
      betas = aligned.securities.map((s) => {
        const rolled = rollingBetas(s.excess, aligned.marketExcess, aligned.asOfIndex, settings);
        ends = rolled.ends;
        return rolled.beta;
      });
      daily = null;
      return { labels: Array.from(ends, (end) => aligned.grid.labels[end]!) };
    },
    formatRolling(from, to, slot) {
      return formatColumns(betas, from, to, slot);
    },
  };
}
