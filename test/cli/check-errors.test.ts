// `clino check` and `clino run` on broken specs and input files: each problem is one stderr line
// `file:line:column reason (CODE)` and the exit code tells its kind (3 spec, 4 input, 2 usage).
// Positions are counted by hand on the small files written here (1-based lines and fields).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { clino } from './support/clino.js';

const dir = mkdtempSync(path.join(tmpdir(), 'clino-errors-'));
const SPEC = `schema: 1
name: error-cases
inputs:
  prices:
    pattern: "p*.csv"
  market:
    source: price-file
    column: MKT
  riskFree:
    source: constant
    annualYield: 0.03
sampling:
  frequency: monthly
  window: 12
  minimum: 6
`;
const FILES: Record<string, string | Buffer> = {
  'spec.yaml': SPEC,
  'bad-schema.yaml': 'schema: 1\nname: x\nsampling:\n  frequency: montly\n',
  'bad-yaml.yaml': 'schema: 1\nname: x\ninputs: [\n',
  'p-date.csv': 'date,A,MKT\n2026-01-30,10,100\n2026-02-27,11,101\n2026-13-31,12,103\n',
  'p-price.csv': 'date,A,MKT\n2026-01-30,10,100\n2026-02-27,abc,101\n',
  'p-dup.csv': 'date,A,MKT\n2026-01-30,10,100\n2026-01-30,11,101\n',
  'p-fields.csv': 'date,A,MKT\n2026-01-30,10,100\n2026-02-27,11\n',
  'p-utf8.csv': Buffer.concat([Buffer.from('date,A,MKT\n2026-01-30,10,100\n2026-02-27,1'), Buffer.from([0xff]), Buffer.from('1,101\n')]),
  'p-nodate.csv': 'day,A,MKT\n2026-01-30,10,100\n',
  'p-empty.csv': '',
};

beforeAll(() => {
  for (const [name, content] of Object.entries(FILES)) writeFileSync(path.join(dir, name), content);
});

const check = (...args: string[]) => clino(['check', ...args], { cwd: dir });

describe('clino check on a broken spec', { timeout: 180_000 }, () => {
  it('names line 4, column 14 for a misspelt frequency, and exits 3', async () => {
    const result = await check('bad-schema.yaml');
    expect(result.exitCode).toBe(3);
    expect(result.stderr).toContain('bad-schema.yaml:4:14 sampling.frequency: "montly" is not allowed; allowed: daily, weekly, monthly\n');
    expect(result.stdout).toBe('');
  });

  it('names the position of a YAML syntax error', async () => {
    const result = await check('bad-yaml.yaml');
    expect(result.exitCode).toBe(3);
    expect(result.stderr.split('\n')[0]).toMatch(/^bad-yaml\.yaml:4:1 inputs: YAML syntax: /);
  });
});

describe('clino check on broken input files', { timeout: 180_000 }, () => {
  it.each([
    ['p-date.csv', 'p-date.csv:4:1 (column date): date "2026-13-31" is not a calendar date (INPUT_BAD_DATE)'],
    ['p-price.csv', 'p-price.csv:3:2 (column A): price "abc" is not a number (INPUT_BAD_PRICE)'],
    ['p-dup.csv', 'p-dup.csv:3:1 (column date): date 2026-01-30 already appears on line 2 (INPUT_DUPLICATE_DATE)'],
    ['p-fields.csv', 'p-fields.csv:3:3: row has 2 fields, the header has 3 (INPUT_FIELD_COUNT)'],
    // Byte 42 is the 0xFF: 11 header bytes + 18 of row 2 + 12 of row 3 ("2026-02-27,1") before it.
    ['p-utf8.csv', 'p-utf8.csv:3:2: byte 42 is not valid UTF-8 text (INPUT_NOT_UTF8)'],
    ['p-nodate.csv', 'p-nodate.csv:1: the header has no date column "date" (INPUT_NO_DATE_COLUMN)'],
    ['p-empty.csv', 'p-empty.csv:1: the file is empty (INPUT_EMPTY)'],
  ])('reports %s as one line with file, line, column and reason, and exits 4', async (file, line) => {
    const result = await check('spec.yaml', file);
    expect(result.exitCode).toBe(4);
    expect(result.stderr).toBe(`${line}\n`);
  });

  it('accepts good files and prints what it found on stdout', async () => {
    writeFileSync(path.join(dir, 'p-good.csv'), 'date,A,MKT\n2026-01-30,10,100\n2026-02-27,11,101\n2026-03-31,12,103\n');
    const result = await check('spec.yaml', 'p-good.csv');
    expect(result.exitCode).toBe(0);
    expect(result.stdout).toContain('prices p-good.csv: ok (1 securities, 2026-01-30 to 2026-03-31)\n');
  });
});

describe('clino run usage mistakes', { timeout: 180_000 }, () => {
  it('names the missing price file with its pattern and exits 4', async () => {
    const result = await clino(['run', 'spec.yaml'], { cwd: dir });
    expect(result.exitCode).toBe(4);
    expect(result.stderr.split('\n')[0]).toBe('clino: the spec needs the price file (pattern p*.csv) (INPUT_MISSING)');
  });

  it('prints the CLI\'s own code in the --json error envelope on stdout (INPUT_MISSING, not a stand-in)', async () => {
    const result = await clino(['run', 'spec.yaml', '--json'], { cwd: dir });
    expect(result.exitCode).toBe(4);
    expect(JSON.parse(result.stdout)).toEqual({ error: { code: 'INPUT_MISSING', message: 'the spec needs the price file (pattern p*.csv)' } });
  });

  it('refuses an unknown option with exit 2', async () => {
    const result = await clino(['run', 'spec.yaml', '--bogus'], { cwd: dir });
    expect(result.exitCode).toBe(2);
    expect(result.stderr).toContain("error: unknown option '--bogus'");
  });
});
