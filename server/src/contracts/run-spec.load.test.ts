import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { SpecError, formatKeyPath, loadRunSpec, type SpecProblem } from './run-spec.load.js';
import { MINIMAL_SPEC, specWith } from './run-spec.test-support.js';

// Positions are 1-based lines and columns as an editor shows them, counted by hand from the text.
// MINIMAL_SPEC is 11 lines; specWith(...) appends from line 12.

function problemsOf(text: string): readonly SpecProblem[] {
  try {
    loadRunSpec(text, 'specs/core.yaml');
  } catch (error) {
    if (error instanceof SpecError) return error.problems;
    throw error;
  }
  throw new Error('expected the spec to be rejected');
}

describe('loadRunSpec', () => {
  it('accepts the minimal spec and fills the defaults', () => {
    const { spec } = loadRunSpec(MINIMAL_SPEC, 'specs/core.yaml');
    expect(spec.sampling.window).toBe(60);
    expect(spec.inputs.market).toEqual({ source: 'price-file', column: 'QZIDX' });
  });

  it('names file, line, column, key path and the allowed values for a wrong value', () => {
    // Line 13 is "  frequency: montly": the value starts after 13 characters, at column 14.
    const problems = problemsOf(specWith('sampling:', '  frequency: montly'));
    expect(problems).toEqual([
      {
        file: 'specs/core.yaml',
        line: 13,
        column: 14,
        path: 'sampling.frequency',
        message: '"montly" is not allowed; allowed: daily, weekly, monthly',
      },
    ]);
  });

  it('formats a problem as file:line:column key.path: message', () => {
    expect(() => loadRunSpec(specWith('sampling:', '  frequency: montly'), 'specs/core.yaml')).toThrow(
      'specs/core.yaml:13:14 sampling.frequency: "montly" is not allowed; allowed: daily, weekly, monthly',
    );
  });

  it('points at an unknown key and lists the keys allowed beside it', () => {
    // Line 13 is "  windw: 3": the key starts at column 3.
    const [problem] = problemsOf(specWith('sampling:', '  windw: 3'));
    expect(problem).toEqual({
      file: 'specs/core.yaml',
      line: 13,
      column: 3,
      path: 'sampling.windw',
      message: 'unknown key; allowed: frequency, weekday, window, minimum, asOf, returns',
    });
  });

  it('lists the keys of the chosen source for an unknown key under inputs.market', () => {
    // Line 9 is "    extra: 1" inside the price-file market.
    const text = MINIMAL_SPEC.replace('    column: QZIDX\n', '    column: QZIDX\n    extra: 1\n');
    const [problem] = problemsOf(text);
    expect(problem).toMatchObject({ line: 9, column: 5, path: 'inputs.market.extra', message: 'unknown key; allowed: source, column' });
  });

  it('reports a YAML syntax error with its position and the key path it sits in', () => {
    // A repeated key is a YAML error (keys must be unique); the second "frequency" is at 14:3.
    const problems = problemsOf(specWith('sampling:', '  frequency: monthly', '  frequency: weekly'));
    expect(problems).toEqual([
      { file: 'specs/core.yaml', line: 14, column: 3, path: 'sampling.frequency', message: 'YAML syntax: Map keys must be unique' },
    ]);
  });

  it('reports an unclosed quote as a YAML syntax error in the key it opened', () => {
    const [problem] = problemsOf(specWith('sampling:', '  asOf: "2026-06-30'));
    expect(problem).toMatchObject({ file: 'specs/core.yaml', path: 'sampling.asOf' });
    expect(problem?.message).toMatch(/^YAML syntax: Missing closing "quote/);
  });

  it('points a missing key at the key of the mapping that should hold it', () => {
    // "  prices:" is line 4, column 3; its pattern is removed.
    const text = MINIMAL_SPEC.replace('    pattern: prices-*.csv\n', '    layout: wide\n');
    const [problem] = problemsOf(text);
    expect(problem).toMatchObject({ line: 4, column: 3, path: 'inputs.prices.pattern' });
    expect(problem?.message).toMatch(/^is required: a file-name pattern/);
  });

  it('points into lists by index', () => {
    const text = specWith(
      'capitalStructure:',
      '  securities:',
      '    QZ1: { debtToEquity: 0.5, taxRate: 0.2 }',
      '  peerGroups:',
      '    - name: light-industry',
      '      members: [QZ1, QZ9]',
      '      targetDebtToEquity: 0.4',
      '      taxRate: 0.25',
    );
    // Line 17 is "      members: [QZ1, QZ9]": 6 spaces, "members:" ends at 14, "[" at 16, QZ9 at 22.
    const [problem] = problemsOf(text);
    expect(problem).toMatchObject({ line: 17, column: 22, path: 'capitalStructure.peerGroups[0].members[1]' });
  });

  it('reports every problem at once, in the order of the file', () => {
    const problems = problemsOf(specWith('sampling:', '  returns: logarithmic', 'estimation:', '  estimator: kalman'));
    expect(problems.map((p) => [p.line, p.path])).toEqual([
      [13, 'sampling.returns'],
      [15, 'estimation.estimator'],
    ]);
  });

  it('explains that rates are decimals', () => {
    const [problem] = problemsOf(specWith('pricing:', '  riskFreeRate: 3', '  marketPremium: 0.05'));
    expect(problem).toMatchObject({ line: 13, column: 17, path: 'pricing.riskFreeRate' });
    expect(problem?.message).toBe('3 is not allowed; allowed: a decimal from -1 to 1 (0.03 is 3%)');
  });

  it('rejects an empty file as a whole', () => {
    expect(problemsOf('')).toEqual([
      { file: 'specs/core.yaml', line: 1, column: 1, path: '', message: 'an empty value is not allowed; allowed: a mapping of keys' },
    ]);
  });

  it('throws a SpecError with code SPEC_INVALID', () => {
    const error = (() => {
      try {
        loadRunSpec('schema: 2\n', 'a.yaml');
      } catch (caught) {
        return caught;
      }
      return undefined;
    })();
    expect(error).toBeInstanceOf(SpecError);
    expect((error as SpecError).code).toBe('SPEC_INVALID');
    expect((error as SpecError).file).toBe('a.yaml');
  });

  it('returns the sha256 of the exact text, as node:crypto computes it', () => {
    const { sha256 } = loadRunSpec(MINIMAL_SPEC, 'specs/core.yaml');
    expect(sha256).toBe(createHash('sha256').update(Buffer.from(MINIMAL_SPEC, 'utf8')).digest('hex'));
    expect(loadRunSpec(`${MINIMAL_SPEC}\n`, 'specs/core.yaml').sha256).not.toBe(sha256);
  });

  it('counts columns after a byte-order mark, which still counts in the sha256', () => {
    const text = `\uFEFF${specWith('sampling:', '  frequency: montly')}`;
    expect(problemsOf(text)[0]).toMatchObject({ line: 13, column: 14 });
    const withBom = loadRunSpec(`\uFEFF${MINIMAL_SPEC}`, 'specs/core.yaml').sha256;
    expect(withBom).toBe(createHash('sha256').update(`\uFEFF${MINIMAL_SPEC}`, 'utf8').digest('hex'));
    expect(withBom).not.toBe(loadRunSpec(MINIMAL_SPEC, 'specs/core.yaml').sha256);
  });
});

describe('formatKeyPath', () => {
  it('writes names with dots, list items by index, and odd names quoted', () => {
    expect(formatKeyPath(['capitalStructure', 'securities', 'QZ.1 B', 'taxRate'])).toBe('capitalStructure.securities["QZ.1 B"].taxRate');
    expect(formatKeyPath(['capitalStructure', 'peerGroups', 0, 'members', 2])).toBe('capitalStructure.peerGroups[0].members[2]');
  });
});
