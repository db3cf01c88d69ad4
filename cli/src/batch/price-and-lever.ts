// From each security's result to its result row: the group label, the CAPM expected return and its
// band, unlevering at the security's own D/E, the peer groups' relevered betas, the after-tax cost of
// debt and WACC. Every number comes from an engine function; NaN where the spec gives no input.
import { resultRowOf } from '../../../server/src/contracts/result-columns.js';
import type { ResultRow } from '../../../server/src/contracts/result-columns.js';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import { afterTaxCostOfDebt, peerGroupBeta, unlever, waccFromDebtToEquity, type PeerGroupBeta } from '../engine/leverage.js';
import { capmBand, capmExpectedReturn, type MarketAssumptions } from '../engine/pricing.js';
import type { SecurityResult } from '../engine/types.js';

type Pricing = NonNullable<ResolvedRunSpec['pricing']>;
type Structure = NonNullable<ResolvedRunSpec['capitalStructure']>;

export function pricingBetaOf(spec: ResolvedRunSpec, result: SecurityResult): number {
  return spec.pricing?.beta === 'base' ? result.beta : result.adjustedBeta;
}

function assumptionsOf(pricing: Pricing): MarketAssumptions {
  return pricing.marketPremium !== undefined
    ? { riskFree: pricing.riskFreeRate, marketPremium: pricing.marketPremium }
    : { riskFree: pricing.riskFreeRate, expectedMarketReturn: pricing.marketReturn ?? Number.NaN };
}

function priced(spec: ResolvedRunSpec, result: SecurityResult): Pick<ResultRow, 'expectedReturn' | 'expectedReturnLow' | 'expectedReturnHigh'> {
  const pricing = spec.pricing;
  if (pricing === undefined) return { expectedReturn: NaN, expectedReturnLow: NaN, expectedReturnHigh: NaN };
  const assumptions = assumptionsOf(pricing);
  const premia = Object.values(pricing.addOnPremia);
  const band = capmBand(result.betaLow95, result.betaHigh95, assumptions, premia);
  return { expectedReturn: capmExpectedReturn(pricingBetaOf(spec, result), assumptions, premia), expectedReturnLow: band.low, expectedReturnHigh: band.high };
}

/** Each peer group's average unlevered beta and its relevering at the target, by group name. */
export function peerGroups(spec: ResolvedRunSpec, results: readonly SecurityResult[]): Map<string, PeerGroupBeta> {
  const structure = spec.capitalStructure;
  const groups = new Map<string, PeerGroupBeta>();
  if (structure === undefined) return groups;
  const byId = new Map(results.map((r) => [r.id, r]));
  for (const group of structure.peerGroups) {
    const peers = group.members.map((member) => {
      const own = structure.securities[member]!;
      const result = byId.get(member);
      return { leveredBeta: result === undefined ? NaN : pricingBetaOf(spec, result), debtToEquity: own.debtToEquity, taxRate: own.taxRate, debtBeta: own.debtBeta };
    });
    const target = { debtToEquity: group.targetDebtToEquity, taxRate: group.taxRate };
    groups.set(group.name, peerGroupBeta(peers, target, structure.unlevering, group.average));
  }
  return groups;
}

function levered(structure: Structure | undefined, id: string, pricingBeta: number, expectedReturn: number) {
  const own = structure?.securities[id];
  if (structure === undefined || own === undefined) {
    return { debtToEquity: NaN, taxRate: NaN, unleveredBeta: NaN, costOfDebtAfterTax: NaN, wacc: NaN };
  }
  const costOfDebt = own.costOfDebt;
  return {
    debtToEquity: own.debtToEquity,
    taxRate: own.taxRate,
    unleveredBeta: unlever(structure.unlevering, pricingBeta, own),
    costOfDebtAfterTax: costOfDebt === undefined ? NaN : afterTaxCostOfDebt(costOfDebt, own.taxRate),
    wacc: costOfDebt === undefined || !Number.isFinite(expectedReturn) ? NaN : waccFromDebtToEquity(own.debtToEquity, expectedReturn, costOfDebt, own.taxRate),
  };
}

export function resultRows(spec: ResolvedRunSpec, results: readonly SecurityResult[]): ResultRow[] {
  const groups = peerGroups(spec, results);
  const peerGroupOf = new Map<string, string>();
  for (const group of spec.capitalStructure?.peerGroups ?? []) for (const member of group.members) peerGroupOf.set(member, group.name);
  return results.map((result): ResultRow => {
    const pricing = priced(spec, result);
    const peerGroup = peerGroupOf.get(result.id) ?? null;
    const peer = peerGroup === null ? undefined : groups.get(peerGroup);
    return resultRowOf(result, {
      group: spec.groups?.[result.id] ?? null,
      ...pricing,
      ...levered(spec.capitalStructure, result.id, pricingBetaOf(spec, result), pricing.expectedReturn),
      peerGroup,
      peerUnleveredBeta: peer?.unleveredBeta ?? NaN,
      releveredBeta: peer?.releveredBeta ?? NaN,
    });
  });
}
