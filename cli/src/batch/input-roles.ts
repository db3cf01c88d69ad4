// Which given file is the price file, the market file and the risk-free file of a run. Explicit
// choices win; then each file goes to the role whose spec pattern its name matches; files that
// match no pattern fill the roles still open in the order prices, market, risk-free; files left
// over are not read (the command says so on stderr).
import path from 'node:path';
import picomatch from 'picomatch';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import { CliError } from '../errors/cli-error.js';

export type InputRole = 'prices' | 'market' | 'riskFree';

export interface RunInputPaths {
  readonly prices: string;
  /** Only when the spec's market has its own file. */
  readonly market?: string;
  /** Only when the spec's risk-free rate comes from a file. */
  readonly riskFree?: string;
}

export interface AssignedInputs {
  readonly paths: RunInputPaths;
  /** Files given that the spec does not read (every role was already filled). */
  readonly ignored: readonly string[];
}

const ROLE_NAMES: Readonly<Record<InputRole, string>> = { prices: 'price file', market: 'market file', riskFree: 'risk-free file' };

/** The roles a spec needs files for, each with its file-name pattern. */
export function neededRoles(spec: ResolvedRunSpec): { role: InputRole; pattern: string }[] {
  const roles: { role: InputRole; pattern: string }[] = [{ role: 'prices', pattern: spec.inputs.prices.pattern }];
  if (spec.inputs.market.source === 'own-file') roles.push({ role: 'market', pattern: spec.inputs.market.pattern });
  if (spec.inputs.riskFree.source === 'file') roles.push({ role: 'riskFree', pattern: spec.inputs.riskFree.pattern });
  return roles;
}

/** True when a file name (never a path) matches a spec's pattern; dot files match too. */
export function matchesPattern(fileName: string, pattern: string): boolean {
  return picomatch.isMatch(fileName, pattern, { dot: true });
}

export function assignInputRoles(
  spec: ResolvedRunSpec,
  files: readonly string[],
  explicit: Partial<Record<InputRole, string>> = {},
): AssignedInputs {
  const roles = neededRoles(spec);
  const chosen = new Map<InputRole, string>();
  for (const { role } of roles) if (explicit[role] !== undefined) chosen.set(role, explicit[role]);
  const rest: string[] = [];
  for (const file of files) {
    const match = roles.find(({ role, pattern }) => !chosen.has(role) && matchesPattern(path.basename(file), pattern));
    if (match === undefined) rest.push(file);
    else chosen.set(match.role, file);
  }
  for (const { role } of roles) if (!chosen.has(role) && rest.length > 0) chosen.set(role, rest.shift()!);
  const missing = roles.filter(({ role }) => !chosen.has(role));
  if (missing.length > 0) {
    const list = missing.map(({ role, pattern }) => `the ${ROLE_NAMES[role]} (pattern ${pattern})`).join(', ');
    throw new CliError('INPUT_MISSING', `the spec needs ${list}`, { hint: 'name the files after the spec, e.g. clino run spec.yaml prices.csv index.csv rates.csv' });
  }
  return { paths: { prices: chosen.get('prices')!, market: chosen.get('market'), riskFree: chosen.get('riskFree') }, ignored: rest };
}
