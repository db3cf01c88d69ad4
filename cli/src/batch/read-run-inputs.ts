// Reads a run's input files the way its spec describes them: the price file (wide or long, the market
// possibly inside it), the market's own file, the risk-free file or constant. Every problem is an
// InputError naming the file, line, column and reason.
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import type { RiskFreeSource } from '../engine/risk-free.js';
import { readMarketFile } from '../inputs/market-series.js';
import { readPriceFile } from '../inputs/price-file.js';
import type { DatedSeries, PriceFileOptions } from '../inputs/price-file-options.js';
import { constantRiskFree, readRiskFreeFile, riskFreeFromFile } from '../inputs/risk-free-file.js';
import type { RunInputPaths } from './input-roles.js';

export interface RunInputData {
  readonly securities: readonly DatedSeries[];
  readonly market: DatedSeries;
  readonly riskFree: RiskFreeSource;
}

function priceOptions(spec: ResolvedRunSpec): PriceFileOptions {
  const prices = spec.inputs.prices;
  const columns = prices.layout === 'wide'
    ? { layout: 'wide' as const, dateColumn: prices.dateColumn }
    : { layout: 'long' as const, dateColumn: prices.dateColumn, securityColumn: prices.securityColumn, closeColumn: prices.closeColumn };
  const market = spec.inputs.market;
  return {
    delimiter: prices.delimiter,
    dateFormat: prices.dateFormat,
    columns,
    ...(market.source === 'price-file' ? { marketId: market.column } : {}),
  };
}

async function readMarket(spec: ResolvedRunSpec, paths: RunInputPaths, inPriceFile: DatedSeries | null): Promise<DatedSeries> {
  const market = spec.inputs.market;
  if (market.source === 'price-file') return inPriceFile!;
  return readMarketFile(paths.market!, {
    delimiter: market.delimiter,
    dateFormat: market.dateFormat,
    dateColumn: market.dateColumn,
    valueColumn: market.column,
  });
}

async function readRiskFree(spec: ResolvedRunSpec, paths: RunInputPaths): Promise<RiskFreeSource> {
  const riskFree = spec.inputs.riskFree;
  if (riskFree.source === 'constant') return constantRiskFree(riskFree.annualYield);
  const series = await readRiskFreeFile(paths.riskFree!, {
    delimiter: riskFree.delimiter,
    dateFormat: riskFree.dateFormat,
    dateColumn: riskFree.dateColumn,
    valueColumn: riskFree.column,
    unit: riskFree.unit,
  });
  return riskFreeFromFile(series);
}

export async function readRunInputs(spec: ResolvedRunSpec, paths: RunInputPaths): Promise<RunInputData> {
  const priceFile = await readPriceFile(paths.prices, priceOptions(spec));
  const market = await readMarket(spec, paths, priceFile.market);
  const riskFree = await readRiskFree(spec, paths);
  return { securities: priceFile.securities, market, riskFree };
}
