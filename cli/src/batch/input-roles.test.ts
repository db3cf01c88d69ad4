import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { CliError } from '../errors/cli-error.js';
import { assignInputRoles, matchesPattern } from './input-roles.js';

const specFile = path.join(import.meta.dirname, '../../../samples/specs/core-monthly.yaml');
const { spec } = loadRunSpec(readFileSync(specFile, 'utf8'), specFile);

describe('assigning input files to a spec\'s roles', () => {
  it('assigns the demo vendor\'s files by the sample spec\'s patterns, whatever their order', () => {
    const assigned = assignInputRoles(spec, ['in/tarn-riskfree-20261130.csv', 'in/tarn-index-20261130.csv', 'in/tarn-equities-20261130.csv']);
    expect(assigned.paths).toEqual({ prices: 'in/tarn-equities-20261130.csv', market: 'in/tarn-index-20261130.csv', riskFree: 'in/tarn-riskfree-20261130.csv' });
  });

  it('keeps the long-layout file out of a pattern meant for the wide file, and reports it unread', () => {
    expect(matchesPattern('tarn-equities-long-20261130.csv', spec.inputs.prices.pattern)).toBe(false);
    const assigned = assignInputRoles(spec, ['tarn-equities-long-20261130.csv', 'tarn-equities-20261130.csv', 'tarn-index-1.csv', 'tarn-riskfree-1.csv']);
    expect(assigned.ignored).toEqual(['tarn-equities-long-20261130.csv']);
  });

  it('fills roles by position with files that match no pattern: prices, market, risk-free', () => {
    const assigned = assignInputRoles(spec, ['a.csv', 'b.csv', 'c.csv']);
    expect(assigned.paths).toEqual({ prices: 'a.csv', market: 'b.csv', riskFree: 'c.csv' });
  });

  it('lets an explicit choice win over a pattern', () => {
    const assigned = assignInputRoles(spec, ['tarn-index-1.csv', 'tarn-riskfree-1.csv'], { prices: 'mine.csv' });
    expect(assigned.paths.prices).toBe('mine.csv');
  });

  it('names each missing role with its pattern', () => {
    const attempt = () => assignInputRoles(spec, ['tarn-equities-20261130.csv']);
    expect(attempt).toThrow(CliError);
    expect(attempt).toThrow('the spec needs the market file (pattern tarn-index-*.csv), the risk-free file (pattern tarn-riskfree-*.csv)');
  });
});
