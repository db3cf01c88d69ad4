// A minimal valid run spec for the contract tests: invented file patterns and an invented index code.
export const MINIMAL_SPEC = [
  'schema: 1',
  'name: core-holdings',
  'inputs:',
  '  prices:',
  '    pattern: prices-*.csv',
  '  market:',
  '    source: price-file',
  '    column: QZIDX',
  '  riskFree:',
  '    source: constant',
  '    annualYield: 0.03',
  '',
].join('\n');

/** The minimal spec with more YAML appended; line 12 is the first appended line. */
export function specWith(...lines: string[]): string {
  return `${MINIMAL_SPEC}${lines.join('\n')}\n`;
}
