// Number cells per DESIGN.md "Input rules": decimal text with optional exponent, only an empty cell
// is missing. The fast path must agree bit for bit with ECMAScript Number() (ECMA-262
// StringToNumber), the reference used here.
import { describe, expect, it } from 'vitest';
import { fastPrice, readNumberCell, trimPadding } from './number-cell.js';

describe('number cells', () => {
  it('reads decimal and exponent forms, trimming spaces and tabs', () => {
    expect(readNumberCell(' 101.5\t')).toEqual({ kind: 'value', value: 101.5 });
    expect(readNumberCell('1.015E+2')).toEqual({ kind: 'value', value: 101.5 });
    expect(readNumberCell('-2.5e-3')).toEqual({ kind: 'value', value: -0.0025 });
    expect(readNumberCell('.5')).toEqual({ kind: 'value', value: 0.5 });
  });

  it('treats only an empty (or all-space) cell as missing', () => {
    expect(readNumberCell('')).toEqual({ kind: 'missing' });
    expect(readNumberCell('   ')).toEqual({ kind: 'missing' });
    expect(fastPrice('')).toBeNaN();
  });

  it('refuses text, NaN, radix prefixes, separators and Unicode spaces', () => {
    for (const text of ['abc', 'NaN', '0x1A', '0b11', '0o17', '1,5', '1 000', '1_000', '\u00a012', '12\u00a0', '--1', '.', 'e5']) {
      expect(readNumberCell(text)).toEqual({ kind: 'not-number' });
      expect(fastPrice(text)).toBe(-1);
    }
  });

  it('refuses infinities and overflow as not finite', () => {
    expect(readNumberCell('Infinity')).toEqual({ kind: 'not-finite' });
    expect(readNumberCell('-Infinity')).toEqual({ kind: 'not-finite' });
    expect(readNumberCell('1e999')).toEqual({ kind: 'not-finite' });
  });

  it('refuses zero and negative prices on the fast path', () => {
    expect(fastPrice('0')).toBe(-1);
    expect(fastPrice('0.000')).toBe(-1);
    expect(fastPrice('-3')).toBe(-1);
  });

  it('gives exactly what Number() gives for 20,000 generated decimal prices', () => {
    let seed = 12345;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let i = 0; i < 20_000; i++) {
      const text = (next() * 10 ** Math.floor(next() * 8)).toFixed(Math.floor(next() * 10));
      if (Number(text) > 0) expect(fastPrice(text)).toBe(Number(text));
    }
    expect(fastPrice('123456789012345.6')).toBe(123456789012345.6);
    expect(fastPrice('0.1')).toBe(0.1);
  });

  it('trims only spaces and tabs', () => {
    expect(trimPadding(' \tQZ1 \t')).toBe('QZ1');
    expect(trimPadding('\u00a0QZ1')).toBe('\u00a0QZ1');
  });
});
