// The risk-free input: a file of annual yields (percent by default, or decimal) on its own calendar,
// or a constant annual yield from the spec. Values become decimals for the engine.
import type { RiskFreeSource, YieldSeries } from '../engine/risk-free.js';
import type { CellPlace } from './cell-problems.js';
import { readDatedValues } from './dated-value-file.js';
import type { DatedValueOptions } from './dated-value-file.js';
import { excerpt, InputError } from './input-error.js';
import { readNumberCell, trimPadding } from './number-cell.js';

export type YieldUnit = 'percent' | 'decimal';

export interface RiskFreeFileOptions extends DatedValueOptions {
  /** Default 'percent' (DESIGN.md "Units"). */
  readonly unit?: YieldUnit;
}

function badRate(place: CellPlace, cell: string, problem: string): InputError {
  return new InputError({
    code: 'INPUT_BAD_RATE', file: place.file, line: place.line, column: place.field + 1, columnName: place.columnName,
    reason: `yield ${excerpt(trimPadding(cell))} ${problem}`,
  });
}

/** A yield cell as a decimal: NaN when empty; refused when not a finite number or at or below −100%. */
export function parseYieldCell(cell: string, place: CellPlace, unit: YieldUnit): number {
  const reading = readNumberCell(cell);
  if (reading.kind === 'missing') return Number.NaN;
  if (reading.kind === 'not-number') throw badRate(place, cell, 'is not a number');
  if (reading.kind === 'not-finite') throw badRate(place, cell, 'is not finite');
  const decimal = unit === 'percent' ? reading.value / 100 : reading.value;
  if (decimal <= -1) throw badRate(place, cell, 'is at or below -100%');
  return decimal;
}

export async function readRiskFreeFile(file: string, options: RiskFreeFileOptions): Promise<YieldSeries> {
  const read = await readDatedValues(file, options, (cell, place) => parseYieldCell(cell, place, options.unit ?? 'percent'));
  return { days: read.days, yields: read.values };
}

export function riskFreeFromFile(series: YieldSeries): RiskFreeSource {
  return { kind: 'series', series };
}

/** A constant annual yield given as a decimal in the spec. */
export function constantRiskFree(annualYield: number): RiskFreeSource {
  if (!Number.isFinite(annualYield) || annualYield <= -1) {
    throw new RangeError(`a constant annual yield must be a finite decimal above -1, got ${annualYield}`);
  }
  return { kind: 'constant', annualYield };
}
