// The Node-side TypeScript (cli, server, bench, scripts, tests) type-checks with the project's
// strict settings. Vitest runs the code without checking its types, and the benchmark is not run by
// the tests at full size, so this is where a type error there would show.
import path from 'node:path';
import { execa } from 'execa';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '..');

describe('tsc -p tsconfig.node.json --noEmit', { timeout: 300_000 }, () => {
  it('finds no type error', async () => {
    const result = await execa('npx', ['tsc', '-p', 'tsconfig.node.json', '--noEmit'], { cwd: ROOT, reject: false });
    expect(result.stdout).toBe('');
    expect(result.exitCode).toBe(0);
  });
});
