// The answers the new-spec wizard collects, each prompt's validation (the contracts' own field
// schemas, so the wizard accepts exactly what the spec loader accepts) and its default.
import type { z } from 'zod';
import { columnName, dateFormat, filePattern, rate, slug, wholeNumber } from '../../../server/src/contracts/run-spec.fields.js';
import { WINDOW_DEFAULTS } from '../../../server/src/contracts/run-spec.schema.js';
import type { BaseEstimator, Frequency } from '../engine/types.js';

export interface SpecAnswers {
  readonly name: string;
  readonly description: string;
  readonly layout: 'wide' | 'long';
  readonly pricesPattern: string;
  readonly dateFormat: string;
  readonly marketSource: 'price-file' | 'own-file';
  readonly marketPattern: string; // own-file only
  readonly marketColumn: string;
  readonly riskFreeSource: 'file' | 'constant';
  readonly riskFreePattern: string; // file only
  readonly riskFreeColumn: string; // file only
  readonly riskFreeUnit: 'percent' | 'decimal';
  readonly riskFreeConstant: number; // constant only, decimal
  readonly frequency: Frequency;
  readonly window: number;
  readonly minimum: number;
  readonly estimator: BaseEstimator;
  readonly dimsonLags: number;
  readonly adjustment: 'none' | 'blume' | 'vasicek';
  readonly pricing: boolean;
  readonly pricingRiskFreeRate: number;
  readonly pricingMarketPremium: number;
}

/** inquirer's convention: true, or the message to show. */
export type Validation = true | string;

function check(schema: z.ZodType, value: unknown): Validation {
  const parsed = schema.safeParse(value);
  return parsed.success ? true : parsed.error.issues[0]?.message ?? 'not allowed';
}

export const validateAnswer = {
  name: (value: string): Validation => check(slug, value),
  pattern: (value: string): Validation => check(filePattern, value),
  column: (value: string): Validation => check(columnName, value),
  dateFormat: (value: string): Validation => check(dateFormat, value),
  /** Rates are typed as decimals: 0.03 is 3%. */
  rate: (value: string): Validation => (value.trim() === '' ? 'is required: a decimal number, e.g. 0.03 for 3%' : check(rate, Number(value))),
  periods: (value: string): Validation => check(wholeNumber(3, 10_000), Number(value)),
  lags: (value: string): Validation => check(wholeNumber(1, 12), Number(value)),
  minimum: (value: string, window: number): Validation => {
    const basic = check(wholeNumber(3, 10_000), Number(value));
    if (basic !== true) return basic;
    return Number(value) <= window ? true : `${value} is more than the window (${window}); allowed: at most the window`;
  },
};

/** The window and minimum the wizard offers for a frequency: the spec's own defaults. */
export function defaultWindow(frequency: Frequency): { window: number; minimum: number } {
  return { ...WINDOW_DEFAULTS[frequency] };
}

/** A starting point: the demo vendor's file names, monthly OLS with Blume. */
export const STARTER_ANSWERS: SpecAnswers = {
  name: 'core-monthly',
  description: 'Monthly betas of the core universe.',
  layout: 'wide',
  pricesPattern: 'prices-*.csv',
  dateFormat: 'YYYY-MM-DD',
  marketSource: 'own-file',
  marketPattern: 'index-*.csv',
  marketColumn: 'level',
  riskFreeSource: 'file',
  riskFreePattern: 'riskfree-*.csv',
  riskFreeColumn: 'yield_pct',
  riskFreeUnit: 'percent',
  riskFreeConstant: 0.03,
  frequency: 'monthly',
  window: 60,
  minimum: 36,
  estimator: 'ols',
  dimsonLags: 1,
  adjustment: 'blume',
  pricing: true,
  pricingRiskFreeRate: 0.03,
  pricingMarketPremium: 0.055,
};
