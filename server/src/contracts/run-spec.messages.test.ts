import { describe, expect, it } from 'vitest';
import { SpecError, loadRunSpec, type SpecProblem } from './run-spec.load.js';
import { showValue } from './run-spec.messages.js';
import { MINIMAL_SPEC, specWith } from './run-spec.test-support.js';

function firstProblem(text: string): SpecProblem | undefined {
  try {
    loadRunSpec(text, 'specs/core.yaml');
  } catch (error) {
    if (error instanceof SpecError) return error.problems[0];
    throw error;
  }
  return undefined;
}

describe('spec problem messages', () => {
  it('say what kind of value a key takes when given another kind', () => {
    expect(firstProblem(specWith('sampling:', '  window: sixty'))?.message).toBe('"sixty" is not allowed; allowed: a whole number from 3 to 10000');
    expect(firstProblem(specWith('sampling:', '  window: 60.5'))?.message).toBe('60.5 is not allowed; allowed: a whole number from 3 to 10000');
    expect(firstProblem(specWith('sampling: monthly'))?.message).toBe('"monthly" is not allowed; allowed: a mapping of keys');
  });

  it('give the bounds of a list', () => {
    const text = specWith(
      'capitalStructure:',
      '  peerGroups:',
      '    - { name: empty, members: [], targetDebtToEquity: 0.4, taxRate: 0.25 }',
    );
    expect(firstProblem(text)).toMatchObject({
      path: 'capitalStructure.peerGroups[0].members',
      message: 'a list of 0 item(s) is not allowed; allowed: at least 1 item(s)',
    });
  });

  it('list the sources when the source key is missing', () => {
    const text = MINIMAL_SPEC.replace('    source: price-file\n', '');
    expect(firstProblem(text)).toMatchObject({ path: 'inputs.market.source', message: 'is required; allowed: price-file, own-file' });
  });

  it('list the allowed top-level keys for an unknown one', () => {
    expect(firstProblem(specWith('pricng: {}'))?.message).toBe(
      'unknown key; allowed: schema, name, description, inputs, sampling, estimation, pricing, capitalStructure, flags, report, groups',
    );
  });
});

describe('showValue', () => {
  it('quotes text and cuts it after 40 characters', () => {
    expect(showValue('x'.repeat(50))).toBe(`"${'x'.repeat(40)}…"`);
    expect([showValue(null), showValue([1]), showValue({ a: 1 }), showValue(true)]).toEqual(['an empty value', 'a list', 'a mapping', 'true']);
  });
});
