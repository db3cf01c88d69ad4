import { Op, type Order, type WhereOptions } from 'sequelize';
import type { ResolvedRunSpec } from '../contracts/run-spec.schema.js';
import { NotFoundError } from '../shared/errors.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { fitLine, type FittedLine } from './fitted-line.js';
import { RunResult, type RollingSeries, type ScatterSeries } from './run-result.model.js';
import { findRun } from './run-states.js';
import type { Page } from './runs-query.service.js';
import type { ListResultsQuery } from './runs.schemas.js';

export interface ResultItem {
  security: string;
  status: string;
  flags: string[];
  /** Every result column by its CSV name: numbers as numbers, null for an empty cell. */
  record: Record<string, string | number | null>;
}

const SORT_FIELDS: Record<string, string> = {
  security: 'security',
  beta: 'beta',
  adjustedBeta: 'adjustedBeta',
  rSquared: 'rSquared',
  expectedReturn: 'expectedReturn',
};

function resultsOrder(sort: string): Order {
  const direction = sort.startsWith('-') ? 'DESC' : 'ASC';
  return [[SORT_FIELDS[sort.replace(/^-/, '')] ?? 'security', direction], ['security', 'ASC']];
}

function flagsOf(text: string): string[] {
  return text.split(' ').filter((f) => f !== '');
}

export async function listResults(runId: number, query: ListResultsQuery): Promise<Page<ResultItem> & { attempt: number }> {
  const run = await findRun(runId);
  const attempt = query.attempt ?? run.attempt;
  const where: Record<string | symbol, unknown> = { runId, attempt };
  if (query.status) where['status'] = query.status;
  // Flags are stored space-separated in a fixed order; match a whole word.
  if (query.flag) where['flags'] = { [Op.regexp]: `(^| )${query.flag}( |$)` };
  const { rows, count } = await RunResult.findAndCountAll({
    where: where as WhereOptions<RunResult>,
    attributes: ['security', 'status', 'flags', 'record'],
    order: resultsOrder(query.sort),
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const items = rows.map((r) => ({ security: r.security, status: r.status, flags: flagsOf(r.flags), record: r.record }));
  return { items, page: query.page, pageSize: query.pageSize, total: count, attempt };
}

export interface SecuritySeriesView {
  security: string;
  status: string;
  /** The base estimator's beta and the plain OLS beta from the results. */
  beta: number | null;
  olsBeta: number | null;
  scatter: ScatterSeries | null;
  /** The least-squares line through the scatter points, and its ends over the points' market range. */
  fit: (FittedLine & { from: { x: number; y: number }; to: { x: number; y: number } }) | null;
  rolling: RollingSeries | null;
}

function numberOf(value: unknown): number | null {
  return typeof value === 'number' ? value : null;
}

export async function securitySeries(runId: number, security: string): Promise<SecuritySeriesView> {
  const run = await findRun(runId);
  const row = await RunResult.findOne({ where: { runId, attempt: run.attempt, security } });
  if (!row) throw new NotFoundError(`Run ${runId} has no result for security ${JSON.stringify(security)}`);
  const scatter = row.scatter;
  const line = scatter ? fitLine(scatter.market, scatter.security) : null;
  let fit: SecuritySeriesView['fit'] = null;
  if (line && scatter) {
    const low = Math.min(...scatter.market);
    const high = Math.max(...scatter.market);
    fit = { ...line, from: { x: low, y: line.alpha + line.beta * low }, to: { x: high, y: line.alpha + line.beta * high } };
  }
  return {
    security: row.security,
    status: row.status,
    beta: numberOf(row.record['beta']),
    olsBeta: numberOf(row.record['ols_beta']),
    scatter,
    fit,
    rolling: row.rolling,
  };
}

export interface SmlView {
  /** Null when the spec has no pricing section: then there is no line and no expected returns. */
  line: { riskFreeRate: number; premium: number; addOnPremia: number; intercept: number; slope: number } | null;
  beta: 'adjusted' | 'base';
  points: { security: string; beta: number; expectedReturn: number; expectedReturnLow: number | null; expectedReturnHigh: number | null }[];
}

/** The security market line E[R] = r_f + add-ons + β·(E[R_m] − r_f) from the spec, and each security on it. */
export async function securityMarketLine(runId: number): Promise<SmlView> {
  const run = await findRun(runId);
  const revision = await SpecRevision.findByPk(run.specRevisionId, { attributes: ['parsed'] });
  const pricing = (revision?.parsed as unknown as ResolvedRunSpec | undefined)?.pricing;
  const beta = pricing?.beta === 'base' ? 'base' : 'adjusted';
  let line: SmlView['line'] = null;
  if (pricing) {
    const premium = pricing.marketPremium ?? (pricing.marketReturn ?? pricing.riskFreeRate) - pricing.riskFreeRate;
    const addOnPremia = Object.values(pricing.addOnPremia).reduce((sum, p) => sum + p, 0);
    line = { riskFreeRate: pricing.riskFreeRate, premium, addOnPremia, intercept: pricing.riskFreeRate + addOnPremia, slope: premium };
  }
  const rows = await RunResult.findAll({ where: { runId, attempt: run.attempt }, attributes: ['security', 'beta', 'adjustedBeta', 'expectedReturn', 'record'], order: [['security', 'ASC']] });
  const points = rows.flatMap((r) => {
    const b = beta === 'base' ? r.beta : r.adjustedBeta;
    if (b === null || r.expectedReturn === null) return [];
    return [{ security: r.security, beta: b, expectedReturn: r.expectedReturn, expectedReturnLow: numberOf(r.record['expected_return_low']), expectedReturnHigh: numberOf(r.record['expected_return_high']) }];
  });
  return { line, beta, points };
}
