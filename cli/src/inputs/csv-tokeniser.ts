// RFC 4180 records from decoded text handed over in pieces. Replaces csv-parse in csv-records.ts
// for speed: on the 3,000 × 2,520 wide benchmark file csv-parse took 2.9–3.0 s for the records
// alone (docs/performance.md), because it walks the bytes one at a time in JavaScript. Here a line
// without a quote, the common case, is cut with indexOf and split (native string search); any other
// record goes through a small state machine that follows csv-parse 7 (options bom, delimiter,
// relax_column_count) exactly, so the records, the errors and the field they name do not change:
// - the record break is the first line break met outside quotes (CRLF, else LF, else a lone CR);
//   after that only that break ends a record, other CR or LF characters are field text;
// - a quote opens a field only as its first character; inside quotes `""` is one quote and a
//   closing quote must be followed by the delimiter, the record break or the end of the text;
// - a line break at the very end does not start an empty record.
// The caller strips a byte order mark; the tokeniser sees text only. Between pieces, a caller may read
// whole records itself straight from bytes (record-sink.ts) while idleBreak() says no record is open.

/** A quote problem; `field` is the 0-based field of the record being read. */
export class CsvQuoteError extends Error {
  constructor(readonly kind: 'unclosed' | 'misplaced', readonly field: number) {
    super(kind === 'unclosed' ? 'a quoted field is never closed' : 'a quote is misplaced');
    this.name = 'CsvQuoteError';
  }
}

/** Receives each record and the number of LF characters inside its fields (not its record break). */
export type RecordSink = (fields: string[], breaksInside: number) => void;

type RecordBreak = '' | '\n' | '\r\n' | '\r';

const LF = 10;
const CR = 13;
const QUOTE = 34;
/** Where the state machine is within the current field. */
const FIELD_START = 0;
const UNQUOTED = 1;
const QUOTED = 2;
const CLOSED = 3;
/** breakAt(): not a record break; the text ends before it can tell. */
const NO_BREAK = 0;
const NEED_MORE = -1;
const NO_QUOTE = -1;
const STALE = -2;

export class CsvTokeniser {
  private text = '';
  private pos = 0;
  /** Index of the next quote at or after `pos`; NO_QUOTE when none is left; stale when below `pos`. */
  private quoteAt = STALE;
  private recordBreak: RecordBreak = '';
  private fields: string[] = [];
  private field = '';
  private mode = FIELD_START;
  private breaks = 0;
  private readonly delimiterCode: number;

  constructor(private readonly delimiter: string, private readonly sink: RecordSink) {
    this.delimiterCode = delimiter.charCodeAt(0);
  }

  /** Hands over the next piece of text; complete records go to the sink, the rest waits. */
  push(text: string): void {
    this.text = this.text.slice(this.pos) + text;
    this.pos = 0;
    this.quoteAt = STALE;
    this.run(false);
  }

  /**
   * The record break ('\n' or '\r\n') when every piece handed over so far has been tokenised into
   * whole records (none is half read); null otherwise, or while the break is not known yet.
   */
  idleBreak(): '\n' | '\r\n' | null {
    if (this.pos !== this.text.length || !this.atRecordStart()) return null;
    return this.recordBreak === '\n' || this.recordBreak === '\r\n' ? this.recordBreak : null;
  }

  /** The text has ended: emits the last record or throws if a quote is left open. */
  end(): void {
    this.run(true);
    if (this.mode === QUOTED) throw new CsvQuoteError('unclosed', this.fields.length);
    if (this.mode !== FIELD_START || this.fields.length > 0) this.emit();
    this.text = '';
    this.pos = 0;
  }

  private run(final: boolean): void {
    while (this.pos < this.text.length) {
      const fast = this.atRecordStart() ? this.splitLine(final) : false;
      if (fast === null) return;
      if (!fast && !this.scan(final)) return;
    }
  }

  private atRecordStart(): boolean {
    return this.mode === FIELD_START && this.fields.length === 0 && this.field === '';
  }

  /** The fast path: one line with no quote, LF or CRLF breaks. false: not such a line; null: wait. */
  private splitLine(final: boolean): boolean | null {
    const crlf = this.recordBreak === '\r\n';
    if (!crlf && this.recordBreak !== '\n') return false;
    const { text, pos } = this;
    const lf = text.indexOf('\n', pos);
    if (lf === -1) return final ? false : null;
    if (this.quoteAt !== NO_QUOTE && this.quoteAt < pos) this.quoteAt = text.indexOf('"', pos);
    if (this.quoteAt !== NO_QUOTE && this.quoteAt < lf) return false;
    let end = lf;
    if (crlf) {
      if (lf === pos || text.charCodeAt(lf - 1) !== CR) return false;
      end = lf - 1;
    }
    this.pos = lf + 1;
    this.sink(text.slice(pos, end).split(this.delimiter), 0);
    return true;
  }

  /** Length of the record break at `at` (a CR or LF outside quotes), discovering it on first use. */
  private breakAt(at: number, code: number, final: boolean): number {
    const { text } = this;
    const next = at + 1 < text.length ? text.charCodeAt(at + 1) : -1;
    if (code === CR && next === -1 && !final && this.recordBreak !== '\n' && this.recordBreak !== '\r') return NEED_MORE;
    if (this.recordBreak === '') {
      this.recordBreak = code === LF ? '\n' : next === LF ? '\r\n' : '\r';
    }
    if (this.recordBreak === '\r\n') return code === CR && next === LF ? 2 : NO_BREAK;
    return code === this.recordBreak.charCodeAt(0) ? 1 : NO_BREAK;
  }

  /** The state machine from `pos`: true once a record is emitted, false when the text runs out. */
  private scan(final: boolean): boolean {
    const { text, delimiterCode } = this;
    let at = this.pos;
    let from = at;
    while (at < text.length) {
      const code = text.charCodeAt(at);
      if (this.mode === QUOTED) {
        if (code === LF) this.breaks++;
        if (code !== QUOTE) {
          at++;
          continue;
        }
        if (at + 1 === text.length && !final) break;
        this.field += text.slice(from, at);
        if (text.charCodeAt(at + 1) === QUOTE) {
          this.field += '"';
          at += 2;
        } else {
          this.mode = CLOSED;
          at++;
        }
        from = at;
        continue;
      }
      if (code === delimiterCode) {
        this.fields.push(this.field + text.slice(from, at));
        this.field = '';
        this.mode = FIELD_START;
        from = ++at;
        continue;
      }
      if (code === CR || code === LF) {
        const length = this.breakAt(at, code, final);
        if (length === NEED_MORE) break;
        if (length !== NO_BREAK) {
          this.field += text.slice(from, at);
          this.pos = at + length;
          this.emit();
          return true;
        }
      }
      if (this.mode === CLOSED || (code === QUOTE && this.mode === UNQUOTED)) {
        throw new CsvQuoteError('misplaced', this.fields.length);
      }
      if (code === QUOTE) {
        this.mode = QUOTED;
        from = at + 1;
      } else {
        this.mode = UNQUOTED;
        if (code === LF) this.breaks++;
      }
      at++;
    }
    this.field += text.slice(from, at);
    this.pos = at;
    return false;
  }

  private emit(): void {
    this.fields.push(this.field);
    const { fields, breaks } = this;
    this.fields = [];
    this.field = '';
    this.mode = FIELD_START;
    this.breaks = 0;
    this.sink(fields, breaks);
  }
}
