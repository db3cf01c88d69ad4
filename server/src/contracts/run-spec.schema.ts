import { z } from 'zod';
import { slug } from './run-spec.fields.js';
import { inputsSchema } from './run-spec.inputs.js';
import {
  WINDOW_DEFAULTS,
  capitalStructureSchema,
  estimationSchema,
  flagsSchema,
  groupsSchema,
  pricingSchema,
  reportSchema,
  samplingSchema,
} from './run-spec.sections.js';

/**
 * The YAML run spec, format `schema: 1`. Every object is strict: an unknown key is an error that
 * lists the allowed keys. Rates, returns and premia are decimals (0.02 is 2%). docs/run-spec.md
 * documents every key; a test keeps the two in step.
 */

export { WINDOW_DEFAULTS };

const runSpecShape = z.strictObject({
  schema: z.literal(1).describe('Format version of the run spec; always 1.'),
  name: slug.describe('The spec\'s name: lowercase letters, digits and hyphens, e.g. core-holdings.'),
  description: z.string().max(2000).optional().describe('Free text for people: what the run is for.'),
  inputs: inputsSchema,
  sampling: samplingSchema.prefault({}).describe('How prices become returns: the grid, the window and the as-of date.'),
  estimation: estimationSchema.prefault({}).describe('How beta is estimated and adjusted.'),
  pricing: pricingSchema.optional().describe('CAPM pricing: expected return = r_f + β·(E[R_m] − r_f) + add-on premia; without it the expected-return columns are empty.'),
  capitalStructure: capitalStructureSchema.optional().describe('Unlevering, relevering and WACC inputs; without it the capital-structure columns are empty.'),
  flags: flagsSchema.prefault({}).describe('Thresholds of the review flags.'),
  report: reportSchema.prefault({}).describe('What the released report holds and who receives it.'),
  groups: groupsSchema.optional().describe('Security code → group label (e.g. a sector), for Vasicek priors by group and the report\'s group column.'),
});

type ParsedShape = z.output<typeof runSpecShape>;
type Issues = z.core.$RefinementCtx<ParsedShape>;

/** Window and minimum after the frequency's defaults; the default minimum never exceeds the window. */
export function resolveWindow(sampling: ParsedShape['sampling']): { window: number; minimum: number } {
  const defaults = WINDOW_DEFAULTS[sampling.frequency];
  const window = sampling.window ?? defaults.window;
  return { window, minimum: sampling.minimum ?? Math.min(defaults.minimum, window) };
}

function issue(ctx: Issues, path: (string | number)[], message: string, input: unknown): void {
  ctx.addIssue({ code: 'custom', path, message, input });
}

function checkWindows(spec: ParsedShape, ctx: Issues): void {
  const { window, minimum } = resolveWindow(spec.sampling);
  const length = spec.estimation.rolling.length ?? window;
  if (minimum > window) {
    issue(ctx, ['sampling', 'minimum'], `${minimum} is more than the window (${window}); allowed: at most the window`, minimum);
  } else if (length < minimum) {
    issue(ctx, ['estimation', 'rolling', 'length'], `${length} is less than the minimum (${minimum}); allowed: at least the minimum`, length);
  }
}

function checkGroups(spec: ParsedShape, ctx: Issues): void {
  if (spec.estimation.vasicek.priorScope === 'group' && spec.groups === undefined) {
    issue(ctx, ['estimation', 'vasicek', 'priorScope'], 'group needs the groups section; allowed: run, or add groups', 'group');
  }
}

function checkColumns(spec: ParsedShape, ctx: Issues): void {
  const prices = spec.inputs.prices;
  const used = prices.layout === 'long' ? ['dateColumn', 'securityColumn', 'closeColumn'] as const : ['dateColumn'] as const;
  const seen = new Map<string, string>();
  for (const key of used) {
    const other = seen.get(prices[key]);
    if (other !== undefined) issue(ctx, ['inputs', 'prices', key], `"${prices[key]}" is already the ${other}; allowed: a different column`, prices[key]);
    seen.set(prices[key], key);
  }
  const market = spec.inputs.market;
  if (market.source === 'price-file' && prices.layout === 'wide' && market.column === prices.dateColumn) {
    issue(ctx, ['inputs', 'market', 'column'], `"${market.column}" is the date column; allowed: the market's own column`, market.column);
  }
}

function checkPricing(spec: ParsedShape, ctx: Issues): void {
  const pricing = spec.pricing;
  if (pricing === undefined) return;
  if (pricing.marketReturn === undefined && pricing.marketPremium === undefined) {
    issue(ctx, ['pricing'], 'needs marketReturn or marketPremium; allowed: exactly one of them', pricing);
  } else if (pricing.marketReturn !== undefined && pricing.marketPremium !== undefined) {
    issue(ctx, ['pricing', 'marketPremium'], 'is given with marketReturn; allowed: exactly one of them', pricing.marketPremium);
  }
}

function checkPeerGroups(spec: ParsedShape, ctx: Issues): void {
  const structure = spec.capitalStructure;
  if (structure === undefined) return;
  const groupOf = new Map<string, string>();
  const names = new Set<string>();
  structure.peerGroups.forEach((group, g) => {
    if (names.has(group.name)) issue(ctx, ['capitalStructure', 'peerGroups', g, 'name'], `"${group.name}" names two peer groups; allowed: a unique name`, group.name);
    names.add(group.name);
    group.members.forEach((member, m) => {
      const path = ['capitalStructure', 'peerGroups', g, 'members', m];
      const earlier = groupOf.get(member);
      if (earlier !== undefined) issue(ctx, path, `"${member}" is already in peer group "${earlier}"; allowed: one peer group per security`, member);
      else if (!Object.hasOwn(structure.securities, member)) issue(ctx, path, `"${member}" has no entry under capitalStructure.securities; allowed: securities with a D/E and tax rate`, member);
      groupOf.set(member, group.name);
    });
  });
}

function checkReport(spec: ParsedShape, ctx: Issues): void {
  const seen = new Set<string>();
  spec.report.columns?.forEach((column, i) => {
    if (seen.has(column)) issue(ctx, ['report', 'columns', i], `"${column}" is listed twice; allowed: each column once`, column);
    seen.add(column);
  });
}

export const runSpecSchema = runSpecShape.superRefine((spec, ctx) => {
  checkWindows(spec, ctx);
  checkGroups(spec, ctx);
  checkColumns(spec, ctx);
  checkPricing(spec, ctx);
  checkPeerGroups(spec, ctx);
  checkReport(spec, ctx);
});

/** The spec as written, before defaults. */
export type RunSpecInput = z.input<typeof runSpecSchema>;
/** The spec after validation: every fixed default filled in. */
export type RunSpec = z.output<typeof runSpecSchema>;
/** The spec with the frequency's defaults filled in too: what the engine runs on. */
export type ResolvedRunSpec = Omit<RunSpec, 'sampling' | 'estimation'> & {
  readonly sampling: RunSpec['sampling'] & { readonly window: number; readonly minimum: number };
  readonly estimation: Omit<RunSpec['estimation'], 'rolling'> & {
    readonly rolling: RunSpec['estimation']['rolling'] & { readonly length: number };
  };
};

/** Fills the defaults that depend on the frequency: window, minimum, rolling length (= window). */
export function fillRunSpecDefaults(spec: RunSpec): ResolvedRunSpec {
  const { window, minimum } = resolveWindow(spec.sampling);
  const rolling = { ...spec.estimation.rolling, length: spec.estimation.rolling.length ?? window };
  return { ...spec, sampling: { ...spec.sampling, window, minimum }, estimation: { ...spec.estimation, rolling } };
}
