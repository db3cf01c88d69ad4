// Record reading per RFC 4180 (quoted fields may span lines) with physical line numbers.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkDelimiter, visitCsv } from './csv-records.js';
import { InputError } from './input-error.js';

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'clino-csv-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

async function records(text: string | Buffer): Promise<{ header: readonly string[]; rows: [readonly string[], number][] }> {
  const file = join(dir, `f${Math.random().toString(36).slice(2)}.csv`);
  await writeFile(file, text);
  const seen: { header: readonly string[]; rows: [readonly string[], number][] } = { header: [], rows: [] };
  await visitCsv(file, { delimiter: ',' }, {
    header(names) { seen.header = names; },
    row(fields, line) { seen.rows.push([fields, line]); },
  });
  return seen;
}

describe('CSV records', () => {
  it('numbers rows by the physical line they start on, after a quoted field spanning lines', async () => {
    const seen = await records('date,"note\nsecond line"\r\n2026-01-30,"a\r\nb"\r\n2026-02-27,c\r\n');
    expect(seen.header).toEqual(['date', 'note\nsecond line']);
    expect(seen.rows).toEqual([[['2026-01-30', 'a\r\nb'], 3], [['2026-02-27', 'c'], 5]]);
  });

  it('unescapes doubled quotes and keeps delimiters inside quotes', async () => {
    const seen = await records('date,x\n2026-01-30,"say ""1,5"""\n');
    expect(seen.rows[0]![0]).toEqual(['2026-01-30', 'say "1,5"']);
  });

  it('names the line after a multi-line record when a later row has the wrong field count', async () => {
    const error = await records('date,x\n"2026-01-30","a\nb"\n2026-02-27\n').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(InputError);
    expect([(error as InputError).line, (error as InputError).column]).toEqual([4, 2]);
  });

  it('reads a file larger than the 1 MiB stream chunk, records and multi-byte text straddling chunk ends', async () => {
    // RFC 4180 2.6 (CRLF inside quotes); a BOM first (RFC 3629 section 6); line numbers counted here.
    const lines = ['\uFEFFdate,a,note'];
    const expected: [string[], number][] = [];
    let line = 2;
    for (let i = 0; i < 90_000; i++) {
      const quoted = i % 7 === 3;
      const note = quoted ? `é "${i}"\r\nsuite` : `é${i}`;
      lines.push(`d${i},${i}.5,${quoted ? `"${note.replaceAll('"', '""')}"` : note}`);
      expected.push([[`d${i}`, `${i}.5`, note], line]);
      line += quoted ? 2 : 1;
    }
    const text = `${lines.join('\r\n')}\r\n`;
    expect(Buffer.byteLength(text)).toBeGreaterThan(2 * (1 << 20));
    const seen = await records(text);
    expect(seen.header).toEqual(['date', 'a', 'note']);
    expect(seen.rows.length).toBe(expected.length);
    expect(seen.rows).toEqual(expected);
  });

  it('names the line and field of a misplaced quote past the first 1 MiB chunk', async () => {
    const rows = Array.from({ length: 80_000 }, (_, i) => `d${i},${i}.25,${i === 70_000 ? '5"6' : '7'}`);
    const error = await records(`date,a,b\n${rows.join('\n')}\n`).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(InputError);
    expect([(error as InputError).code, (error as InputError).line, (error as InputError).column]).toEqual(['INPUT_NOT_CSV', 70_002, 3]);
  });

  it('names the line a quote never closed opens on, after quoted records spanning lines', async () => {
    const error = await records('date,a\r\n"d1","x\r\ny"\r\nd2,"open\r\nd3,1\r\n').catch((e: unknown) => e);
    expect([(error as InputError).code, (error as InputError).line, (error as InputError).column]).toEqual(['INPUT_NOT_CSV', 4, 2]);
    expect((error as InputError).reason).toBe('a quoted field is never closed');
  });

  it('refuses a delimiter that is a quote, a line break, a letter, a digit or longer than one character', () => {
    for (const delimiter of ['"', '\n', 'a', '1', ',,', '']) expect(() => checkDelimiter(delimiter)).toThrow(RangeError);
    for (const delimiter of [',', ';', '|', '\t']) expect(() => checkDelimiter(delimiter)).not.toThrow();
  });
});
