// Reads a run spec from a local file: the exact text (its sha256 is the spec's identity on the
// server) validated by the contracts' loader, which names file, line and column of every problem.
import { readFile } from 'node:fs/promises';
import { loadRunSpec, type LoadedRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { CliError } from '../errors/cli-error.js';

export interface SpecFile extends LoadedRunSpec {
  readonly file: string;
  readonly text: string;
}

export async function readSpecText(file: string): Promise<string> {
  try {
    return await readFile(file, 'utf8');
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code ?? (error as Error).message;
    throw new CliError('SPEC_INVALID', `cannot read the spec file ${file} (${reason})`);
  }
}

export async function readSpecFile(file: string): Promise<SpecFile> {
  const text = await readSpecText(file);
  return { file, text, ...loadRunSpec(text, file) };
}
