// The byte sink of csv-records.ts: decodes the (already checked) UTF-8 for the tokeniser, and hands
// whole plain lines to a visitor that reads rows from bytes (CsvVisitor.rowBytes) while no record is
// half read. A row the visitor leaves goes to the tokeniser as text, so it is read, or its problem
// named, exactly as before.
import { Writable } from 'node:stream';
import { StringDecoder } from 'node:string_decoder';
import type { CsvVisitor, RecordTracker } from './csv-records.js';
import type { CsvTokeniser } from './csv-tokeniser.js';

const LF = 10;
const CR = 13;
const QUOTE = 34;
/**
 * The byte path is given up for the rest of a file once it has left more than this many rows to the
 * text path and taken fewer than four times as many (a file of padded or quoted cells, say).
 */
const GIVE_UP_AFTER_REFUSALS = 64;

/**
 * The visitor's byte path over the whole lines of `chunk` from `from`, while it takes them: answers
 * where it stopped (the start of the first line it left to the text path, or of an incomplete line).
 */
function rowsFromBytes(chunk: Buffer, from: number, recordBreak: '\n' | '\r\n', state: RecordTracker, visitor: CsvVisitor): number {
  const rowBytes = visitor.rowBytes!.bind(visitor);
  let start = from;
  let quote = chunk.indexOf(QUOTE, start);
  for (;;) {
    const lf = chunk.indexOf(LF, start);
    if (lf === -1 || (quote !== -1 && quote < lf)) return start;
    let end = lf;
    if (recordBreak === '\r\n') {
      if (lf === start || chunk[lf - 1] !== CR) return start;
      end = lf - 1;
    }
    const line = state.lastEndLine + 1;
    if (!rowBytes(chunk, start, end, line)) return start;
    state.lastEndLine = line;
    state.rows++;
    start = lf + 1;
    if (quote !== -1 && quote < start) quote = chunk.indexOf(QUOTE, start);
  }
}

/**
 * A byte sink that decodes the (already checked) UTF-8, skips a leading BOM and feeds the tokeniser.
 * With a visitor that reads rows from bytes, whole lines go to it instead while no record is half
 * read, once the header is in and no blank line is pending; the rest goes to the tokeniser as text.
 */
export function tokenisingSink(tokeniser: CsvTokeniser, state: RecordTracker, visitor: CsvVisitor): Writable {
  const decoder = new StringDecoder('utf8');
  let started = false;
  let refused = 0;
  let taken = 0;
  let bytesGivenUp = false;
  /** Whole lines to the byte path while it can take them, any other line to the tokeniser as text. */
  const feedLines = (chunk: Buffer): void => {
    let from = 0;
    while (from < chunk.length) {
      const recordBreak = state.headerLength > 0 && state.pendingBlankLine === 0 ? tokeniser.idleBreak() : null;
      if (recordBreak !== null && !bytesGivenUp) {
        const rowsBefore = state.rows;
        from = rowsFromBytes(chunk, from, recordBreak, state, visitor);
        taken += state.rows - rowsBefore;
        if (from === chunk.length) return;
        if (chunk.indexOf(LF, from) !== -1) { // a whole row left to the text path
          refused++;
          bytesGivenUp = refused > GIVE_UP_AFTER_REFUSALS && refused * 4 > taken;
        }
      }
      // The decoder holds no partial character after a LF. Once the byte path is given up, all the rest.
      const lf = bytesGivenUp ? -1 : chunk.indexOf(LF, from);
      const next = lf === -1 ? chunk.length : lf + 1;
      feed(decoder.write(chunk.subarray(from, next)));
      from = next;
    }
  };
  const feed = (text: string): void => {
    if (!started && text.length > 0) {
      started = true;
      tokeniser.push(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
    } else if (text.length > 0) tokeniser.push(text);
  };
  return new Writable({
    write(chunk: Buffer, _encoding, callback) {
      try {
        if (visitor.rowBytes === undefined || bytesGivenUp) feed(decoder.write(chunk));
        else feedLines(chunk);
        callback();
      } catch (error) {
        callback(error as Error);
      }
    },
    final(callback) {
      try {
        feed(decoder.end());
        tokeniser.end();
        callback();
      } catch (error) {
        callback(error as Error);
      }
    },
  });
}
