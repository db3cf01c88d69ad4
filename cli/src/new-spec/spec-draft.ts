// Turns the wizard's answers into a commented YAML run spec. Comments say what each key means and
// its unit, so the analyst can edit the file later without the docs at hand. The text is checked
// with the contracts' loader before anyone writes it.
import { Document, YAMLMap, isMap, isPair, isScalar, type Pair } from 'yaml';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import type { SpecAnswers } from './spec-answers.js';

function inputsOf(a: SpecAnswers): Record<string, unknown> {
  const prices = a.layout === 'wide'
    ? { pattern: a.pricesPattern, layout: 'wide', dateColumn: 'date', dateFormat: a.dateFormat }
    : { pattern: a.pricesPattern, layout: 'long', dateColumn: 'date', securityColumn: 'security', closeColumn: 'close', dateFormat: a.dateFormat };
  const market = a.marketSource === 'price-file'
    ? { source: 'price-file', column: a.marketColumn }
    : { source: 'own-file', pattern: a.marketPattern, column: a.marketColumn, dateFormat: a.dateFormat };
  const riskFree = a.riskFreeSource === 'file'
    ? { source: 'file', pattern: a.riskFreePattern, column: a.riskFreeColumn, unit: a.riskFreeUnit, dateFormat: a.dateFormat }
    : { source: 'constant', annualYield: a.riskFreeConstant };
  return { prices, market, riskFree };
}

export function specObjectOf(a: SpecAnswers): Record<string, unknown> {
  const estimation: Record<string, unknown> = { estimator: a.estimator };
  if (a.estimator === 'dimson') estimation['dimson'] = { lags: a.dimsonLags };
  estimation['adjustment'] = a.adjustment;
  const spec: Record<string, unknown> = {
    schema: 1,
    name: a.name,
    description: a.description,
    inputs: inputsOf(a),
    sampling: { frequency: a.frequency, window: a.window, minimum: a.minimum, asOf: 'latest' },
    estimation,
  };
  if (a.pricing) spec['pricing'] = { riskFreeRate: a.pricingRiskFreeRate, marketPremium: a.pricingMarketPremium };
  return spec;
}

const COMMENTS: Readonly<Record<string, string>> = {
  schema: ' Format version of the run spec; always 1.',
  name: ' Lowercase letters, digits and hyphens; the spec\'s name on the server.',
  inputs: ' The files of a run: a price file whose name matches prices.pattern triggers it.',
  prices: ' Total-return adjusted closes; wide = date,<code>,<code>,…; long = date,security,close.',
  market: ' The market index: a column (or code) of the price file, or a file of its own.',
  riskFree: ' Annual yield: from a file (percent by default) or a constant decimal.',
  sampling: ' Returns on a grid: window and minimum count return periods; asOf latest = the market\'s last date.',
  estimation: ' Base estimator (ols, dimson, scholes-williams) and adjustment (none, blume, vasicek).',
  pricing: ' CAPM: expected return = r_f + β·premium. Decimals: 0.03 is 3%.',
};

function comment(map: YAMLMap): void {
  for (const item of map.items) {
    if (!isPair(item)) continue;
    const pair = item as Pair;
    const key = isScalar(pair.key) ? String(pair.key.value) : '';
    if (COMMENTS[key] !== undefined && isScalar(pair.key)) pair.key.commentBefore = COMMENTS[key];
    if (isMap(pair.value)) comment(pair.value);
  }
}

/** The commented YAML; throws SpecError if the answers do not make a valid spec. */
export function renderSpecDraft(answers: SpecAnswers): string {
  const document = new Document(specObjectOf(answers));
  document.commentBefore = ' Clinometer run spec, written by clino new-spec. Check it with: clino check <this file> [inputs…]';
  if (isMap(document.contents)) comment(document.contents);
  const text = document.toString({ lineWidth: 0 });
  loadRunSpec(text, `${answers.name}.yaml`);
  return text;
}
