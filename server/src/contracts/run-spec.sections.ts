import { z } from 'zod';
import type { Frequency } from '../../../cli/src/engine/types.js';
import { RESULT_COLUMN_NAMES } from './result-columns.js';
import {
  allowedError,
  debtToEquity,
  isCalendarDate,
  label,
  rate,
  securityCode,
  share,
  taxRate,
  wholeNumber,
} from './run-spec.fields.js';

/** The run spec's sections after `inputs`. Rates, returns and premia are decimals: 0.02 is 2%. */

/** Window and minimum (return periods) when the spec gives none. Our own defaults, documented. */
export const WINDOW_DEFAULTS: Readonly<Record<Frequency, { readonly window: number; readonly minimum: number }>> = {
  monthly: { window: 60, minimum: 36 },
  weekly: { window: 156, minimum: 104 },
  daily: { window: 252, minimum: 200 },
};

const MAX_PERIODS = 10_000;
const AS_OF_ALLOWED = 'a calendar date YYYY-MM-DD, or latest';

export const samplingSchema = z
  .strictObject({
    frequency: z.enum(['daily', 'weekly', 'monthly']).default('monthly').describe('Return period: daily (market dates), weekly or monthly (calendar months).'),
    weekday: z
      .enum(['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'])
      .default('friday')
      .describe('Weekly: the day each week ends on; the week runs from the day after the previous one.'),
    window: wholeNumber(3, MAX_PERIODS)
      .optional()
      .describe('Return periods in the estimation window, ending at the as-of period. Default by frequency: monthly 60, weekly 156, daily 252.'),
    minimum: wholeNumber(3, MAX_PERIODS)
      .optional()
      .describe('Fewest observations for an estimate; below it a security is insufficient. Default by frequency: monthly 36, weekly 104, daily 200, never more than the window.'),
    asOf: z
      .string(allowedError(AS_OF_ALLOWED))
      .refine((text) => text === 'latest' || isCalendarDate(text), allowedError(AS_OF_ALLOWED))
      .default('latest')
      .describe('The as-of date (YYYY-MM-DD): the window ends in the period containing it; latest means the market\'s last date.'),
    returns: z.enum(['simple', 'log']).default('simple').describe('simple returns, or log returns (then excess = ln(1 + r) − ln(1 + r_f)).'),
  });

export const estimationSchema = z
  .strictObject({
    estimator: z.enum(['ols', 'dimson', 'scholes-williams']).default('ols').describe('The base estimator of beta: ols, dimson or scholes-williams.'),
    dimson: z
      .strictObject({
        lags: wholeNumber(1, 12).default(1).describe('Dimson: k, the market lags and leads in the regression (t − k … t + k).'),
      })
      .prefault({})
      .describe('Settings of the Dimson estimator.'),
    adjustment: z.enum(['none', 'blume', 'vasicek']).default('none').describe('Adjustment of the base beta: none, blume or vasicek.'),
    blume: z
      .strictObject({
        weight: share.default(2 / 3).describe('Blume: weight w of the estimated beta in w·β + (1 − w)·1; default exactly 2/3.'),
      })
      .prefault({})
      .describe('Settings of the Blume adjustment.'),
    vasicek: z
      .strictObject({
        priorScope: z
          .enum(['run', 'group'])
          .default('run')
          .describe('Vasicek: the prior is formed from the ok base betas of the whole run, or of the security\'s group (needs groups).'),
        priorVariance: z
          .enum(['cross-section', 'cross-section-less-noise'])
          .default('cross-section')
          .describe('Vasicek prior variance: the sample variance of the betas, or that less their mean squared standard error.'),
      })
      .prefault({})
      .describe('Settings of the Vasicek adjustment.'),
    rolling: z
      .strictObject({
        length: wholeNumber(3, MAX_PERIODS).optional().describe('Return periods in each rolling window; default the window.'),
        step: wholeNumber(1, MAX_PERIODS).default(1).describe('Periods between the ends of consecutive rolling windows.'),
        count: z
          .union([wholeNumber(1, MAX_PERIODS), z.literal('all')], allowedError(`a whole number from 1 to ${MAX_PERIODS}, or all`))
          .default(24)
          .describe('How many rolling windows, most recent first; all goes back as far as the data allows.'),
      })
      .prefault({})
      .describe('Rolling betas, ending at the as-of period and every step periods before it.'),
  });

export const pricingSchema = z
  .strictObject({
    riskFreeRate: rate.describe('Forward-looking annual risk-free rate for the CAPM, a decimal.'),
    marketReturn: rate.optional().describe('Expected annual market return E[R_m]; give this or marketPremium, not both.'),
    marketPremium: rate.optional().describe('Market risk premium E[R_m] − r_f per year; give this or marketReturn, not both.'),
    addOnPremia: z
      .record(z.string(), rate)
      .default(() => ({}))
      .describe('Named premia added to every expected return, e.g. size: 0.01.'),
    beta: z
      .enum(['adjusted', 'base'])
      .default('adjusted')
      .describe('The beta that prices: adjusted (after the spec\'s adjustment) or base (the estimator\'s own).'),
  });

const securityStructure = z.strictObject({
  debtToEquity: debtToEquity.describe('The security\'s debt-to-equity ratio D/E.'),
  taxRate: taxRate.describe('The security\'s marginal tax rate.'),
  costOfDebt: rate.optional().describe('Pre-tax annual cost of debt; needed for WACC.'),
  debtBeta: z
    .number(allowedError('a number from -2 to 5'))
    .min(-2, allowedError('a number from -2 to 5'))
    .max(5, allowedError('a number from -2 to 5'))
    .default(0)
    .describe('Beta of the debt, used by Harris–Pringle; 0 treats debt as riskless.'),
});

const peerGroup = z.strictObject({
  name: label.describe('Name of the peer group.'),
  members: z.array(securityCode).min(1).describe('Security codes in the group; each needs an entry under securities, and may sit in one group only.'),
  average: z.enum(['median', 'mean']).default('median').describe('How the members\' unlevered betas are averaged.'),
  targetDebtToEquity: debtToEquity.describe('The D/E at which the average unlevered beta is relevered.'),
  taxRate: taxRate.describe('The tax rate used to relever.'),
});

export const capitalStructureSchema = z
  .strictObject({
    unlevering: z.enum(['hamada', 'harris-pringle']).default('hamada').describe('hamada: β_L = β_U·(1 + (1 − T)·D/E); harris-pringle: β_L = β_U + (β_U − β_D)·D/E.'),
    securities: z
      .record(z.string(), securityStructure)
      .default(() => ({}))
      .describe('Capital structure per security code.'),
    peerGroups: z.array(peerGroup).default(() => []).describe('Peer groups whose average unlevered beta is relevered at a target D/E.'),
  });

export const flagsSchema = z
  .strictObject({
    thinDataShare: share.default(0.8).describe('thin-data when n is below this share of the window.'),
    lowFitRSquared: share.default(0.1).describe('low-fit when R² is below this.'),
    stalePricesShare: share.default(0.2).describe('stale-prices when the share of zero security returns in the window is above this.'),
    unstableRange: z.number(allowedError('a number of 0 or more')).min(0, allowedError('a number of 0 or more')).default(0.5).describe('unstable when the rolling betas\' highest minus lowest exceeds this.'),
    bigMoveChange: z.number(allowedError('a number of 0 or more')).min(0, allowedError('a number of 0 or more')).default(0.25).describe('big-move when the pricing beta moved by more than this since the last released run of the spec.'),
  });

export const reportSchema = z
  .strictObject({
    columns: z
      .array(z.enum(RESULT_COLUMN_NAMES))
      .min(1)
      .optional()
      .describe('Result columns to write, a subset of the result CSV\'s columns (kept in their standard order; security always). Default: all.'),
    distributionList: label.optional().describe('Name of the distribution list that receives the released CSV.'),
  });

export const groupsSchema = z.record(z.string(), label);
