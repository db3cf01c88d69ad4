// The start script's demo drop folder: written once into incoming/, with the file names the sample
// specs' patterns match, and never again once the folder is in use.
import { mkdirSync, mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { execa } from 'execa';
import { describe, expect, it } from 'vitest';
import { loadRunSpec } from '../../server/src/contracts/run-spec.load.js';
import { matchesPattern, neededRoles } from '../../cli/src/batch/input-roles.js';
import { seedDemoDrop } from '../../scripts/demo-drop.js';
import { ROOT } from './support/clino.js';

describe('scripts/demo-drop.ts', { timeout: 180_000 }, () => {
  it('fills incoming/ of a new drop folder with files every sample spec can run on', () => {
    const folder = path.join(mkdtempSync(path.join(tmpdir(), 'clino-demo-drop-')), 'drop');
    const names = seedDemoDrop(folder);
    expect(readdirSync(path.join(folder, 'incoming')).sort()).toEqual([...names].sort());
    expect(readdirSync(folder)).toEqual(['incoming']);
    for (const name of ['core-monthly', 'weekly-long', 'thin-daily', 'unlisted-wacc']) {
      const file = path.join(ROOT, 'samples/specs', `${name}.yaml`);
      const { spec } = loadRunSpec(readFileSync(file, 'utf8'), file);
      for (const { pattern } of neededRoles(spec)) expect(names.filter((n) => matchesPattern(n, pattern))).toHaveLength(1);
    }
  });

  it('writes into the folder named on its command line', async () => {
    const folder = path.join(mkdtempSync(path.join(tmpdir(), 'clino-demo-drop-')), 'named');
    const result = await execa('node', ['--import', 'tsx', path.join(ROOT, 'scripts/demo-drop.ts'), folder], { cwd: ROOT });
    expect(result.stdout.split('\n')[0]).toBe(path.join(folder, 'incoming', 'tarn-equities-20261130.csv'));
    expect(readdirSync(path.join(folder, 'incoming'))).toHaveLength(4);
  });

  it('leaves a drop folder that is already in use as it is', () => {
    const folder = mkdtempSync(path.join(tmpdir(), 'clino-demo-drop-'));
    mkdirSync(path.join(folder, 'archive'));
    expect(seedDemoDrop(folder)).toEqual([]);
    expect(readdirSync(folder)).toEqual(['archive']);
  });
});
