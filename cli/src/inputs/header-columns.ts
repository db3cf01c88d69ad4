// Finding named columns in a header (names trimmed, matched exactly, case-sensitive).
import { excerpt, InputError } from './input-error.js';
import type { InputErrorCode } from './input-error.js';

export function requireColumn(
  file: string, names: readonly string[], wanted: string, code: InputErrorCode, what: string,
): number {
  const index = names.indexOf(wanted);
  if (index === -1) {
    throw new InputError({ code, file, line: 1, column: null, reason: `the header has no ${what} column ${excerpt(wanted)}` });
  }
  if (names.indexOf(wanted, index + 1) !== -1) {
    const column = names.indexOf(wanted, index + 1) + 1;
    throw new InputError({ code, file, line: 1, column, columnName: wanted, reason: `the ${what} column appears twice in the header` });
  }
  return index;
}

/** Security codes in a wide header: none empty, none twice. */
export function checkSecurityCodes(file: string, names: readonly string[], codeColumns: readonly number[]): void {
  const seen = new Map<string, number>();
  for (const index of codeColumns) {
    const name = names[index]!;
    if (name === '') {
      throw new InputError({ code: 'INPUT_EMPTY_SECURITY', file, line: 1, column: index + 1, reason: 'the header has an empty security code' });
    }
    const earlier = seen.get(name);
    if (earlier !== undefined) {
      throw new InputError({
        code: 'INPUT_DUPLICATE_SECURITY', file, line: 1, column: index + 1, columnName: name,
        reason: `security code ${excerpt(name)} already heads column ${earlier + 1}`,
      });
    }
    seen.set(name, index);
  }
}
