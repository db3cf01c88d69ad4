// The tokeniser against RFC 4180 (section 2: quoted fields, doubled quotes, line breaks inside
// quotes) and against csv-parse 7.0.3, the general-purpose reference library the product used
// before, run with the options it had (bom, delimiter, relax_column_count): same records, same
// line breaks inside them, same error kind and field, whatever the text and however it is cut.
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { CsvQuoteError, CsvTokeniser } from './csv-tokeniser.js';

type Outcome = { records: [string[], number][] } | { error: 'unclosed' | 'misplaced'; field: number };

function tokenise(pieces: readonly string[], delimiter = ','): Outcome {
  const records: [string[], number][] = [];
  const tokeniser = new CsvTokeniser(delimiter, (fields, breaks) => records.push([fields, breaks]));
  try {
    for (const piece of pieces) tokeniser.push(piece);
    tokeniser.end();
  } catch (error) {
    if (error instanceof CsvQuoteError) return { error: error.kind, field: error.field };
    throw error;
  }
  return { records };
}

function reference(text: string, delimiter = ','): Outcome {
  try {
    const rows = parse(text, { bom: true, delimiter, relax_column_count: true }) as string[][];
    return { records: rows.map((fields) => [fields, fields.join('').split('\n').length - 1]) };
  } catch (error) {
    const { code, column } = error as { code: string; column: number };
    return { error: code === 'CSV_QUOTE_NOT_CLOSED' ? 'unclosed' : 'misplaced', field: column };
  }
}

/** Deterministic generator (mulberry32, common practice for reproducible tests). */
function random(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function cut(text: string, next: () => number): string[] {
  const pieces: string[] = [];
  let from = 0;
  while (from < text.length) {
    const to = Math.min(text.length, from + 1 + Math.floor(next() * 6));
    pieces.push(text.slice(from, to));
    from = to;
  }
  return pieces;
}

describe('CSV tokeniser', () => {
  it('splits plain lines with LF or CRLF record breaks (RFC 4180 2.1, 2.4)', () => {
    expect(tokenise(['date,a\n2026-01-30,1.5\n'])).toEqual({ records: [[['date', 'a'], 0], [['2026-01-30', '1.5'], 0]] });
    expect(tokenise(['date,a\r\n2026-01-30,1.5\r\n'])).toEqual({ records: [[['date', 'a'], 0], [['2026-01-30', '1.5'], 0]] });
  });

  it('keeps CRLF inside a quoted field and counts it as one line break (RFC 4180 2.6)', () => {
    expect(tokenise(['a,"x\r\ny"\r\nb,c\r\n'])).toEqual({ records: [[['a', 'x\r\ny'], 1], [['b', 'c'], 0]] });
  });

  it('turns a doubled quote inside quotes into one quote (RFC 4180 2.7)', () => {
    expect(tokenise(['"say ""1,5""",b\n'])).toEqual({ records: [[['say "1,5"', 'b'], 0]] });
  });

  it('refuses a quote inside an unquoted field, naming its field', () => {
    expect(tokenise(['a,b\n1,5"6\n'])).toEqual({ error: 'misplaced', field: 1 });
  });

  it('refuses text after a closing quote, and a space before an opening one', () => {
    expect(tokenise(['a,"b"c\n'])).toEqual({ error: 'misplaced', field: 1 });
    expect(tokenise(['a, "b"\n'])).toEqual({ error: 'misplaced', field: 1 });
  });

  it('refuses a quote never closed, naming the field it opens', () => {
    expect(tokenise(['a,b,"c\nd,e\n'])).toEqual({ error: 'unclosed', field: 2 });
  });

  it('emits a last line without a final break, and no empty record after a final break', () => {
    expect(tokenise(['a\nb'])).toEqual({ records: [[['a'], 0], [['b'], 0]] });
    expect(tokenise(['a\n\n'])).toEqual({ records: [[['a'], 0], [[''], 0]] });
  });

  it('gives the same records whether the text comes whole or one character at a time', () => {
    const text = 'date,"n\r\no""te"\r\n2026-01-30,"x"\r\n\r\n';
    expect(tokenise([...text])).toEqual(tokenise([text]));
    expect(tokenise([...text])).toEqual(reference(text));
  });

  it('agrees with csv-parse on 3,000 generated texts of quotes, delimiters and line breaks, cut anywhere', () => {
    const next = random(20260130);
    const alphabet = ['a', 'b', ',', ';', '"', '""', '\n', '\r\n', '\r', ' '];
    let disagreements = 0;
    let errors = 0;
    for (let n = 0; n < 3000; n++) {
      const length = 1 + Math.floor(next() * 24);
      let text = '';
      for (let k = 0; k < length; k++) text += alphabet[Math.floor(next() * alphabet.length)];
      const delimiter = n % 4 === 0 ? ';' : ',';
      const expected = reference(text, delimiter);
      if ('error' in expected) errors++;
      const whole = tokenise([text], delimiter);
      const pieces = tokenise(cut(text, next), delimiter);
      if (JSON.stringify(whole) !== JSON.stringify(expected) || JSON.stringify(pieces) !== JSON.stringify(expected)) {
        disagreements++;
        if (disagreements === 1) expect({ text, whole, pieces }).toEqual({ text, whole: expected, pieces: expected });
      }
    }
    expect(disagreements).toBe(0);
    expect(errors).toBeGreaterThan(300);
    expect(errors).toBeLessThan(2700);
  });
});
