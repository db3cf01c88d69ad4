import { describe, expect, it } from 'vitest';
import { MAX_NUMBER_CELL_BYTES, writeNumberCell } from './number-bytes.js';
import { formatNumberCell } from './result-csv.js';
import { seededRandom } from '../../../cli/src/engine/test-support/seeded-random.js';

// The reference is ECMA-262's Number::toString as Node's V8 implements it (String(x), through
// formatNumberCell): the fewest digits that read back as the same double, the closest such decimal
// when several have that many digits. writeNumberCell must write the same bytes for every double.

/** Seeded uniform draws (mulberry32), so a failure can be replayed. */
const uniformFrom = (seed: number): (() => number) => seededRandom(seed).uniform;

const decoder = new TextDecoder();
const buffer = new Uint8Array(64);

function written(x: number): string {
  const end = writeNumberCell(buffer, 0, x);
  return decoder.decode(buffer.subarray(0, end));
}

function mismatches(values: Iterable<number>): { x: number; written: string; expected: string }[] {
  const found: { x: number; written: string; expected: string }[] = [];
  for (const x of values) {
    const expected = formatNumberCell(x);
    const text = written(x);
    if (text !== expected && found.length < 10) found.push({ x, written: text, expected });
  }
  return found;
}

function* sample(count: number, draw: () => number): Generator<number> {
  for (let i = 0; i < count; i++) yield draw();
}

describe('writeNumberCell', () => {
  it('writes what formatNumberCell writes for betas drawn between -3 and 3', () => {
    const random = uniformFrom(1);
    expect(mismatches(sample(400_000, () => (random() - 0.5) * 6))).toEqual([]);
  });

  it('writes what formatNumberCell writes across twenty-five decades, both signs', () => {
    const random = uniformFrom(2);
    expect(mismatches(sample(300_000, () => (random() < 0.5 ? -1 : 1) * 10 ** (random() * 25 - 10)))).toEqual([]);
  });

  it('writes what formatNumberCell writes for random bit patterns (subnormals, huge values, NaN)', () => {
    const random = uniformFrom(3);
    const bits = new Float64Array(1);
    const words = new Uint32Array(bits.buffer);
    expect(mismatches(sample(200_000, () => {
      words[0] = Math.floor(random() * 2 ** 32);
      words[1] = Math.floor(random() * 2 ** 32);
      return bits[0]!;
    }))).toEqual([]);
  });

  it('writes what formatNumberCell writes for short decimals (prices, rates, round figures)', () => {
    const random = uniformFrom(4);
    expect(mismatches(sample(200_000, () => Math.round(random() * 1e6) / 10 ** Math.floor(random() * 8)))).toEqual([]);
  });

  it('writes what formatNumberCell writes for whole numbers and halves up to 1e15 (no point, or one place)', () => {
    const random = uniformFrom(5);
    expect(mismatches(sample(200_000, () => Math.floor(random() * 10 ** (9 + random() * 6)) / (random() < 0.5 ? 1 : 2)))).toEqual([]);
  });

  it('writes what formatNumberCell writes next to powers of ten and of two, and at 2^53', () => {
    const edges: number[] = [];
    for (let e = -8; e <= 17; e++) {
      for (const base of [10 ** e, 2 ** Math.round(e * 3.3219)]) {
        let below = base;
        let above = base;
        for (let step = 0; step < 40; step++) {
          edges.push(below, above, -below);
          below -= Number.EPSILON * below;
          above += Number.EPSILON * above;
        }
      }
    }
    edges.push(2 ** 53, 2 ** 53 - 1, 2 ** 53 + 2, 9007199254740991 / 1e15, 9.007199254740993, 999999999999999.9, 1e15 - 1);
    expect(mismatches(edges)).toEqual([]);
  });

  it('writes the cells formatNumberCell writes for zero, missing and non-finite values', () => {
    expect([0, -0, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 1e-7, 0.1 + 0.2].map(written))
      .toEqual(['0', '0', '', '', '', '1e-7', '0.30000000000000004']);
  });

  it('never needs more than MAX_NUMBER_CELL_BYTES, the longest shortest form of a double', () => {
    expect(written(-1.2345678901234567e-6)).toBe('-0.0000012345678901234567');
    expect(written(-1.2345678901234567e-6)).toHaveLength(MAX_NUMBER_CELL_BYTES);
    expect(written(-1.2345678901234567e-308).length).toBeLessThanOrEqual(MAX_NUMBER_CELL_BYTES);
  });

  it('writes at the offset it is given and answers the end', () => {
    const bytes = new Uint8Array(40).fill(35); // '#'
    const end = writeNumberCell(bytes, 3, 1.25);
    expect(end).toBe(7);
    expect(decoder.decode(bytes.subarray(0, 9))).toBe('###1.25##');
  });
});
