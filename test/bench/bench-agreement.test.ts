// `npm run bench` on a small universe, end to end: the esbuild build, the worker thread with its
// shared format slots (several blocks of rolling rows), the result and rolling-beta CSVs, and the
// check against the numpy/pandas program (bench/reference_batch.py, Debian's pandas) to relative
// 1e-9 or absolute 1e-12. Times are printed by the bench but not asserted here: speed targets live in
// the benchmark itself (docs/performance.md), never in tests.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { execa } from 'execa';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
// Inside the project: the built bench resolves its packages from the project's node_modules.
const work = mkdtempSync(path.join(ROOT, '.data', 'test-bench-'));

afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

describe('npm run bench on 40 securities × 400 days', { timeout: 300_000 }, () => {
  it('gives the same numbers as the pandas program and writes every output', async () => {
    const result = await execa('bash', ['scripts/bench.sh'], {
      cwd: ROOT,
      reject: false,
      env: { BENCH_NO_INSTALL: '1', BENCH_WORK: work, BENCH_SECURITIES: '40', BENCH_DAYS: '400', BENCH_REPEAT: '1' },
    });
    expect(result.stdout + result.stderr).toContain('Outputs agree to 1e-9: yes');
    expect(result.exitCode).toBe(0);
    const agreement = JSON.parse(readFileSync(path.join(work, 'out', 'agreement.json'), 'utf8')) as {
      agree: boolean; files: Record<string, { compared: number; worstRelative: number }>;
    };
    expect(agreement.agree).toBe(true);
    expect(Object.keys(agreement.files).sort()).toEqual([
      'daily-dimson.csv', 'daily-ols.csv', 'monthly-dimson.csv', 'monthly-ols.csv', 'rolling-betas-daily.csv',
    ]);
    for (const file of Object.values(agreement.files)) expect(file.compared).toBeGreaterThan(0);

    const rolling = readFileSync(path.join(work, 'out', 'clinometer-1', 'rolling-betas-daily.csv'), 'utf8').trimEnd().split('\n');
    expect(rolling[0]!.split(',')).toHaveLength(41); // date and 40 securities
    expect(rolling.length - 1).toBeGreaterThan(128); // more rows than two blocks of 64: the slots are reused
    expect(rolling.every((line) => line.split(',').length === 41)).toBe(true);
    const daily = readFileSync(path.join(work, 'out', 'clinometer-1', 'daily-ols.csv'), 'utf8').trimEnd().split('\n');
    expect(daily).toHaveLength(41); // header and 40 securities
  });
});
