import { createHash } from 'node:crypto';
import { compareSecurityCodes } from './result-csv.js';

/**
 * The fingerprint travels beside a result CSV (file `<csv file name>.fingerprint`, see
 * fingerprintFileName: `clino run --out` writes it, a release mails it): the spec's sha256
 * and every input's name and sha256. It ties each released number to the spec revision and the
 * exact input files. Format, one entry per line, `\n` line ends, inputs sorted by name (UTF-8
 * byte order) then checksum:
 *
 *   clinometer-fingerprint 1
 *   spec <sha256 of the spec text>
 *   input <sha256> <file name>
 */

export interface FingerprintInput {
  readonly name: string;
  readonly sha256: string;
}

export interface Fingerprint {
  readonly specSha256: string;
  readonly inputs: readonly FingerprintInput[];
}

const SHA256_HEX = /^[0-9a-f]{64}$/;
// A name is the last field of its line, so it may hold spaces but no line break or control character.
const CONTROL = /[\u0000-\u001f\u007f]/;

export const FINGERPRINT_HEADER = 'clinometer-fingerprint 1';

/**
 * The name of the fingerprint file beside a result CSV: the CSV's own name (or path) with
 * `.fingerprint` appended, `report.csv` → `report.csv.fingerprint`. One rule for the file
 * `clino run --out` writes and the attachment of a release mail.
 */
export function fingerprintFileName(csvFile: string): string {
  return `${csvFile}.fingerprint`;
}

function checkSha256(value: string, what: string): void {
  if (!SHA256_HEX.test(value)) throw new Error(`${what} is not a lowercase sha256 hex digest: ${JSON.stringify(value.slice(0, 80))}`);
}

export function renderFingerprint(fingerprint: Fingerprint): string {
  checkSha256(fingerprint.specSha256, 'spec sha256');
  const inputs = [...fingerprint.inputs].sort(
    (a, b) => compareSecurityCodes(a.name, b.name) || compareSecurityCodes(a.sha256, b.sha256),
  );
  const lines = [FINGERPRINT_HEADER, `spec ${fingerprint.specSha256}`];
  for (const input of inputs) {
    checkSha256(input.sha256, `sha256 of input ${JSON.stringify(input.name)}`);
    if (input.name === '' || CONTROL.test(input.name)) {
      throw new Error(`Input name ${JSON.stringify(input.name.slice(0, 80))} is empty or holds a control character`);
    }
    lines.push(`input ${input.sha256} ${input.name}`);
  }
  return `${lines.join('\n')}\n`;
}

/** sha256 (lowercase hex) of a text's UTF-8 bytes. */
export function sha256Hex(text: string | Uint8Array): string {
  return createHash('sha256').update(text).digest('hex');
}

/** The fingerprint's own checksum: sha256 of its rendered text. */
export function fingerprintSha256(fingerprint: Fingerprint): string {
  return sha256Hex(renderFingerprint(fingerprint));
}
