// The new-spec wizard's questions as plain data: message, choices, default, when it is asked and how
// an answer is validated and converted. The command asks them with inquirer; tests answer them with
// a script, so the logic is checked without a terminal.
import type { Frequency } from '../engine/types.js';
import { STARTER_ANSWERS, defaultWindow, validateAnswer, type SpecAnswers, type Validation } from './spec-answers.js';

/** The answers as typed: text for inputs, the value for choices, a boolean for confirms. */
export type RawAnswers = Partial<Record<keyof SpecAnswers, string | boolean>>;

export interface WizardQuestion {
  readonly name: keyof SpecAnswers;
  readonly type: 'input' | 'select' | 'confirm';
  readonly message: string;
  readonly choices?: readonly { readonly name: string; readonly value: string }[];
  readonly default: (answers: RawAnswers) => string | boolean;
  readonly when?: (answers: RawAnswers) => boolean;
  readonly validate?: (value: string, answers: RawAnswers) => Validation;
}

const text = (name: keyof SpecAnswers): ((answers: RawAnswers) => string) => () => String(STARTER_ANSWERS[name]);
const frequencyOf = (answers: RawAnswers): Frequency => (answers.frequency ?? 'monthly') as Frequency;

export const WIZARD_QUESTIONS: readonly WizardQuestion[] = [
  { name: 'name', type: 'input', message: 'Spec name (lowercase, digits, hyphens)', default: text('name'), validate: validateAnswer.name },
  { name: 'description', type: 'input', message: 'What is the run for?', default: text('description') },
  {
    name: 'layout', type: 'select', message: 'Price file layout',
    choices: [{ name: 'wide: date,<code>,<code>,…', value: 'wide' }, { name: 'long: date,security,close', value: 'long' }],
    default: text('layout'),
  },
  { name: 'pricesPattern', type: 'input', message: 'Price file name pattern (e.g. prices-*.csv)', default: text('pricesPattern'), validate: validateAnswer.pattern },
  { name: 'dateFormat', type: 'input', message: 'Date format of the files (YYYY, MM, DD)', default: text('dateFormat'), validate: validateAnswer.dateFormat },
  {
    name: 'marketSource', type: 'select', message: 'Where is the market index?',
    choices: [{ name: 'in a file of its own', value: 'own-file' }, { name: 'a column (or code) of the price file', value: 'price-file' }],
    default: text('marketSource'),
  },
  { name: 'marketPattern', type: 'input', message: 'Market file name pattern', default: text('marketPattern'), when: (a) => a.marketSource === 'own-file', validate: validateAnswer.pattern },
  { name: 'marketColumn', type: 'input', message: 'Market column (or security code in a long file)', default: text('marketColumn'), validate: validateAnswer.column },
  {
    name: 'riskFreeSource', type: 'select', message: 'Risk-free rate',
    choices: [{ name: 'a file of annual yields', value: 'file' }, { name: 'a constant annual yield', value: 'constant' }],
    default: text('riskFreeSource'),
  },
  { name: 'riskFreePattern', type: 'input', message: 'Risk-free file name pattern', default: text('riskFreePattern'), when: (a) => a.riskFreeSource === 'file', validate: validateAnswer.pattern },
  { name: 'riskFreeColumn', type: 'input', message: 'Yield column', default: text('riskFreeColumn'), when: (a) => a.riskFreeSource === 'file', validate: validateAnswer.column },
  {
    name: 'riskFreeUnit', type: 'select', message: 'The file writes yields in', when: (a) => a.riskFreeSource === 'file',
    choices: [{ name: 'percent (3.25 is 3.25%)', value: 'percent' }, { name: 'decimal (0.0325)', value: 'decimal' }],
    default: text('riskFreeUnit'),
  },
  { name: 'riskFreeConstant', type: 'input', message: 'Constant annual yield as a decimal (0.03 is 3%)', default: text('riskFreeConstant'), when: (a) => a.riskFreeSource === 'constant', validate: validateAnswer.rate },
  {
    name: 'frequency', type: 'select', message: 'Return frequency',
    choices: [{ name: 'monthly', value: 'monthly' }, { name: 'weekly (weeks ending Friday)', value: 'weekly' }, { name: 'daily (market dates)', value: 'daily' }],
    default: text('frequency'),
  },
  { name: 'window', type: 'input', message: 'Window (return periods)', default: (a) => String(defaultWindow(frequencyOf(a)).window), validate: validateAnswer.periods },
  {
    name: 'minimum', type: 'input', message: 'Minimum observations for an estimate',
    default: (a) => String(Math.min(defaultWindow(frequencyOf(a)).minimum, Number(a.window ?? 0) || Infinity)),
    validate: (value, a) => validateAnswer.minimum(value, Number(a.window)),
  },
  {
    name: 'estimator', type: 'select', message: 'Base estimator',
    choices: [{ name: 'ols', value: 'ols' }, { name: 'dimson (thinly traded)', value: 'dimson' }, { name: 'scholes-williams', value: 'scholes-williams' }],
    default: text('estimator'),
  },
  { name: 'dimsonLags', type: 'input', message: 'Dimson lags and leads (k)', default: text('dimsonLags'), when: (a) => a.estimator === 'dimson', validate: validateAnswer.lags },
  {
    name: 'adjustment', type: 'select', message: 'Adjustment of the beta',
    choices: [{ name: 'blume (2/3 β + 1/3)', value: 'blume' }, { name: 'vasicek (shrink to the cross-section)', value: 'vasicek' }, { name: 'none', value: 'none' }],
    default: text('adjustment'),
  },
  { name: 'pricing', type: 'confirm', message: 'Price with the CAPM (expected returns)?', default: () => STARTER_ANSWERS.pricing },
  { name: 'pricingRiskFreeRate', type: 'input', message: 'Forward-looking risk-free rate (decimal)', default: text('pricingRiskFreeRate'), when: (a) => a.pricing === true, validate: validateAnswer.rate },
  { name: 'pricingMarketPremium', type: 'input', message: 'Market risk premium (decimal)', default: text('pricingMarketPremium'), when: (a) => a.pricing === true, validate: validateAnswer.rate },
];

const NUMERIC = new Set<keyof SpecAnswers>(['riskFreeConstant', 'window', 'minimum', 'dimsonLags', 'pricingRiskFreeRate', 'pricingMarketPremium']);

/** The typed answers from the raw ones; questions not asked keep the starter's values. */
export function toSpecAnswers(raw: RawAnswers): SpecAnswers {
  const merged: Record<string, unknown> = { ...STARTER_ANSWERS };
  for (const [key, value] of Object.entries(raw)) {
    if (value === undefined) continue;
    merged[key] = NUMERIC.has(key as keyof SpecAnswers) ? Number(value) : typeof value === 'string' ? value.trim() : value;
  }
  return merged as unknown as SpecAnswers;
}

/** Asks each question in turn through `ask`, skipping those whose `when` says no. */
export async function runWizard(ask: (question: WizardQuestion, answers: RawAnswers) => Promise<string | boolean>): Promise<SpecAnswers> {
  const raw: RawAnswers = {};
  for (const question of WIZARD_QUESTIONS) {
    if (question.when !== undefined && !question.when(raw)) continue;
    raw[question.name] = await ask(question, raw);
  }
  return toSpecAnswers(raw);
}
