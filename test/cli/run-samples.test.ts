// The sample specs on the demo vendor's files, through the real `clino run`: the CSV equals what
// computeRun and the contracts' writer give in-process, a second run writes the same bytes, and
// --json carries the same content. Every sample spec is exercised, so the samples never go stale.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { renderResultCsv, resultRecords } from '../../server/src/contracts/result-csv.js';
import { renderFingerprint } from '../../server/src/contracts/result-fingerprint.js';
import { loadRunSpec } from '../../server/src/contracts/run-spec.load.js';
import { computeRun } from '../../cli/src/batch/compute-run.js';
import { assignInputRoles } from '../../cli/src/batch/input-roles.js';
import { writeDemoFiles } from '../../samples/scenario/generate.js';
import { ROOT, clino } from './support/clino.js';

const SPECS = ['core-monthly', 'weekly-long', 'thin-daily', 'unlisted-wacc'] as const;
const folder = mkdtempSync(path.join(tmpdir(), 'clino-samples-'));
let files: string[] = [];

beforeAll(() => {
  files = writeDemoFiles(folder).map((name) => path.join(folder, name));
});

async function inProcess(name: string) {
  const specFile = path.join(ROOT, 'samples/specs', `${name}.yaml`);
  const { spec, sha256 } = loadRunSpec(readFileSync(specFile, 'utf8'), specFile);
  const run = await computeRun(spec, assignInputRoles(spec, files).paths);
  return { spec, sha256, run, specFile };
}

describe.each(SPECS)('clino run samples/specs/%s.yaml on the demo files', { timeout: 180_000 }, (name) => {
  it('writes the CSV computeRun gives, with the fingerprint beside it', async () => {
    const expected = await inProcess(name);
    const out = path.join(folder, `${name}.csv`);
    const result = await clino(['run', expected.specFile, ...files, '--out', out]);
    expect(result.stderr).not.toContain('"level":50');
    expect(result.exitCode).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe(renderResultCsv(expected.run.rows, { columns: expected.spec.report.columns }));
    const fingerprint = { specSha256: expected.sha256, inputs: expected.run.inputs.map(({ name: n, sha256 }) => ({ name: n, sha256 })) };
    expect(readFileSync(`${out}.fingerprint`, 'utf8')).toBe(renderFingerprint(fingerprint));
    expect(expected.run.rows).toHaveLength(48);
  });
});

describe('repeatability and --json', { timeout: 180_000 }, () => {
  it('writes byte-identical CSV and fingerprint on a second run of the same spec and files', async () => {
    const specFile = path.join(ROOT, 'samples/specs/core-monthly.yaml');
    const first = path.join(folder, 'again-1.csv');
    const second = path.join(folder, 'again-2.csv');
    expect((await clino(['run', specFile, ...files, '--out', first])).exitCode).toBe(0);
    expect((await clino(['run', specFile, ...files, '--out', second])).exitCode).toBe(0);
    expect(readFileSync(second)).toEqual(readFileSync(first));
    expect(readFileSync(`${second}.fingerprint`)).toEqual(readFileSync(`${first}.fingerprint`));
  });

  it('prints the same rows as JSON with --json, and only data on stdout', async () => {
    const expected = await inProcess('unlisted-wacc');
    const result = await clino(['run', expected.specFile, ...files, '--json']);
    expect(result.exitCode).toBe(0);
    const document = JSON.parse(result.stdout) as { spec: string; asOf: string; rows: unknown[]; fingerprint: { specSha256: string } };
    expect(document.spec).toBe('unlisted-wacc');
    expect(document.asOf).toBe('2026-11-30');
    expect(document.fingerprint.specSha256).toBe(expected.sha256);
    expect(document.rows).toEqual(resultRecords(expected.run.rows));
  });
});
