import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { fingerprintFileName, fingerprintSha256, renderFingerprint, sha256Hex } from './result-fingerprint.js';

const A = 'a'.repeat(64);
const B = 'b'.repeat(64);
const C = 'c'.repeat(64);

describe('sha256Hex', () => {
  it('matches the FIPS 180-2 example digests', () => {
    // FIPS 180-2, Appendix B.1: SHA-256("abc").
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    // SHA-256 of the empty message [memory], cross-checked below with node:crypto.
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });
});

describe('renderFingerprint', () => {
  const fingerprint = {
    specSha256: A,
    inputs: [
      { name: 'vendor-prices-2026-06.csv', sha256: B },
      { name: 'bill yields 2026-06.csv', sha256: C },
    ],
  };

  it('writes a header, the spec line and one line per input sorted by name', () => {
    expect(renderFingerprint(fingerprint)).toBe(
      ['clinometer-fingerprint 1', `spec ${A}`, `input ${C} bill yields 2026-06.csv`, `input ${B} vendor-prices-2026-06.csv`, ''].join('\n'),
    );
  });

  it('gives the same text whatever the order of the inputs', () => {
    const reversed = { ...fingerprint, inputs: [...fingerprint.inputs].reverse() };
    expect(renderFingerprint(reversed)).toBe(renderFingerprint(fingerprint));
  });

  it('has a checksum of its own: the sha256 of its text', () => {
    const expected = createHash('sha256').update(renderFingerprint(fingerprint), 'utf8').digest('hex');
    expect(fingerprintSha256(fingerprint)).toBe(expected);
    expect(fingerprintSha256({ ...fingerprint, specSha256: C })).not.toBe(expected);
  });

  it('refuses a checksum that is not lowercase hex sha256', () => {
    expect(() => renderFingerprint({ specSha256: A.toUpperCase(), inputs: [] })).toThrow(/spec sha256/);
    expect(() => renderFingerprint({ specSha256: A, inputs: [{ name: 'x.csv', sha256: 'abc' }] })).toThrow(/x\.csv/);
  });

  it('refuses an input name that would break the line format', () => {
    expect(() => renderFingerprint({ specSha256: A, inputs: [{ name: 'a\nspec x', sha256: B }] })).toThrow(/control character/);
    expect(() => renderFingerprint({ specSha256: A, inputs: [{ name: '', sha256: B }] })).toThrow(/empty/);
  });
});

describe('fingerprintFileName', () => {
  it('appends .fingerprint to the CSV\'s name or path, keeping .csv, as clino run --out and the release mail both name it', () => {
    expect(fingerprintFileName('worked-example-2026-10-30.csv')).toBe('worked-example-2026-10-30.csv.fingerprint');
    expect(fingerprintFileName('/srv/out/results.csv')).toBe('/srv/out/results.csv.fingerprint');
    expect(fingerprintFileName('report')).toBe('report.fingerprint');
  });
});
