/** Longest line a line-based reader accepts; a longer one is rejected (`line-too-long`) without being copied. */
export const MAX_LINE_CHARS = 65_536;

/** One physical or (for quoted CSV fields with line breaks) logical line of a text log. */
export interface LogLine {
  /** The line without its terminator (`\n`, `\r\n` or `\r`). */
  text: string;
  /** 1-based number of the line's first physical line. */
  line: number;
  /** Set when the line exceeded `MAX_LINE_CHARS`; `text` is then empty. */
  tooLongChars?: number;
}

/**
 * Where the current line is, without copying it: characters `start` to `end` of `source`. The
 * iterator hands out the same cursor for every line, so a consumer reads it before asking for
 * the next one (or keeps `text`, which copies).
 */
export class LogLineCursor {
  source = '';
  start = 0;
  end = 0;
  /** 1-based number of the line's first physical line. */
  line = 0;
  /** Length of a line longer than the limit (then `source` is empty), else -1. */
  tooLongChars = -1;
  /** Number of `"` in the line when quotes are counted, else -1. */
  quoteCount = -1;

  /** The line's text (a copy). */
  get text(): string {
    return this.source.slice(this.start, this.end);
  }
}

/**
 * Walks text, given in one or more chunks, line by line in bounded memory: CRLF, LF and lone CR
 * end a line; a line longer than `maxChars` is reported by length (`tooLongChars`) and skipped,
 * never copied. With `joinQuoted`, a line with an odd number of `"` continues on the next (RFC 4180
 * fields with line breaks) within the same limit. Yields one reused `LogLineCursor`.
 */
export function* iterateLogLines(
  chunks: Iterable<string>,
  options: { joinQuoted?: boolean; maxChars?: number } = {},
): Generator<LogLineCursor> {
  const maxChars = options.maxChars ?? MAX_LINE_CHARS;
  const joinQuoted = options.joinQuoted ?? false;
  const cursor = new LogLineCursor();
  let carry = '';
  let carryLength = 0; // length of the current line so far, also when it is too long and dropped
  let tooLong = false;
  let lineNo = 1;
  let pending: string | undefined; // an open quoted record
  let pendingStart = 0;
  let pendingQuotes = 0;
  let pendingCr = false; // the previous chunk ended with CR: a following LF belongs to it
  let chunk = '';
  let nextQuote = -2;

  const countQuotes = (src: string, s: number, e: number): number => {
    let count = 0;
    if (src === chunk) {
      // a cached position keeps the scan linear over a chunk without quotes
      if (nextQuote !== -1 && nextQuote < s) nextQuote = chunk.indexOf('"', s);
      let q = nextQuote;
      while (q >= 0 && q < e) {
        count++;
        q = chunk.indexOf('"', q + 1);
      }
      nextQuote = q;
      return count;
    }
    for (let q = src.indexOf('"', s); q >= 0 && q < e; q = src.indexOf('"', q + 1)) count++;
    return count;
  };
  const setTooLong = (line: number, length: number): true => {
    cursor.source = '';
    cursor.start = 0;
    cursor.end = 0;
    cursor.line = line;
    cursor.tooLongChars = length;
    cursor.quoteCount = -1;
    return true;
  };
  const setLine = (src: string, s: number, e: number, line: number, quotes: number): true => {
    cursor.source = src;
    cursor.start = s;
    cursor.end = e;
    cursor.line = line;
    cursor.tooLongChars = -1;
    cursor.quoteCount = quotes;
    return true;
  };
  /** Takes one physical line; whether the cursor now holds a line to hand out. */
  const take = (src: string, s: number, e: number, length: number, dropped: boolean): boolean => {
    const line = lineNo++;
    if (dropped) {
      if (pending !== undefined) {
        const total = pending.length + 1 + length;
        pending = undefined;
        return setTooLong(pendingStart, total);
      }
      return setTooLong(line, length);
    }
    if (!joinQuoted) return setLine(src, s, e, line, -1);
    const quotes = countQuotes(src, s, e);
    if (pending !== undefined) {
      const whole = `${pending}\n${src.slice(s, e)}`;
      const total = pendingQuotes + quotes;
      if (total % 2 === 1) {
        if (whole.length > maxChars) {
          pending = undefined;
          return setTooLong(pendingStart, whole.length);
        }
        pending = whole;
        pendingQuotes = total;
        return false;
      }
      pending = undefined;
      return setLine(whole, 0, whole.length, pendingStart, total);
    }
    if (quotes % 2 === 1) {
      pending = src.slice(s, e);
      pendingStart = line;
      pendingQuotes = quotes;
      return false;
    }
    return setLine(src, s, e, line, quotes);
  };

  for (const next of chunks) {
    chunk = next;
    nextQuote = -2;
    let i = 0;
    const n = chunk.length;
    if (pendingCr && n > 0) {
      if (chunk.charCodeAt(0) === 10) i = 1;
      pendingCr = false;
    }
    let nextLf = -2;
    let nextCr = -2;
    while (i < n) {
      // cached positions keep the scan linear when a file has only LF (or only CR) terminators
      if (nextLf !== -1 && nextLf < i) nextLf = chunk.indexOf('\n', i);
      if (nextCr !== -1 && nextCr < i) nextCr = chunk.indexOf('\r', i);
      const end = nextCr >= 0 && (nextLf < 0 || nextCr < nextLf) ? nextCr : nextLf;
      if (end < 0) {
        carryLength += n - i;
        if (!tooLong) {
          if (carryLength > maxChars) {
            tooLong = true;
            carry = '';
          } else carry += chunk.slice(i);
        }
        break;
      }
      const length = carryLength + (end - i);
      const dropped = tooLong || length > maxChars;
      let ready: boolean;
      if (dropped) ready = take('', 0, 0, length, true);
      else if (carry.length > 0) {
        const whole = carry + chunk.slice(i, end);
        ready = take(whole, 0, whole.length, length, false);
      } else ready = take(chunk, i, end, length, false);
      carry = '';
      carryLength = 0;
      tooLong = false;
      if (chunk.charCodeAt(end) === 13) {
        if (end + 1 < n) i = chunk.charCodeAt(end + 1) === 10 ? end + 2 : end + 1;
        else {
          pendingCr = true;
          i = n;
        }
      } else i = end + 1;
      if (ready) yield cursor;
    }
  }
  chunk = '';
  if (carryLength > 0) {
    const ready =
      tooLong || carryLength > maxChars
        ? take('', 0, 0, carryLength, true)
        : take(carry, 0, carry.length, carryLength, false);
    if (ready) yield cursor;
  }
  if (pending !== undefined) {
    // an unterminated quoted field at the end of the file: give it back as it is
    const text = pending;
    pending = undefined;
    setLine(text, 0, text.length, pendingStart, pendingQuotes);
    yield cursor;
  }
}

/**
 * `iterateLogLines` over one whole string, without a generator step per line: `next()` moves
 * `cursor` to the next line (the same lines, line numbers and too-long reports) and is `false` at
 * the end. It does not join quoted fields over line breaks; `quoteCount` is the value every line
 * gets (0 for a text known to hold no `"`, so joining would change nothing; -1 when not counted).
 */
export class LogLineScanner {
  readonly cursor = new LogLineCursor();
  readonly #text: string;
  readonly #quoteCount: number;
  readonly #maxChars: number;
  #at = 0;
  #line = 1;
  // cached positions keep the scan linear when a text has only LF (or only CR) terminators
  #nextLf = -2;
  #nextCr = -2;

  constructor(text: string, quoteCount: number, maxChars = MAX_LINE_CHARS) {
    this.#text = text;
    this.#quoteCount = quoteCount;
    this.#maxChars = maxChars;
  }

  next(): boolean {
    const s = this.#text;
    const n = s.length;
    const i = this.#at;
    if (i >= n) return false;
    if (this.#nextLf !== -1 && this.#nextLf < i) this.#nextLf = s.indexOf('\n', i);
    if (this.#nextCr !== -1 && this.#nextCr < i) this.#nextCr = s.indexOf('\r', i);
    const lf = this.#nextLf;
    const cr = this.#nextCr;
    let end = cr >= 0 && (lf < 0 || cr < lf) ? cr : lf;
    if (end < 0) {
      end = n;
      this.#at = n;
    } else if (s.charCodeAt(end) === 13) this.#at = end + 1 < n && s.charCodeAt(end + 1) === 10 ? end + 2 : end + 1;
    else this.#at = end + 1;
    const c = this.cursor;
    c.line = this.#line++;
    const length = end - i;
    if (length > this.#maxChars) {
      c.source = '';
      c.start = 0;
      c.end = 0;
      c.tooLongChars = length;
      c.quoteCount = -1;
    } else {
      c.source = s;
      c.start = i;
      c.end = end;
      c.tooLongChars = -1;
      c.quoteCount = this.#quoteCount;
    }
    return true;
  }
}

/**
 * The lines of a text given in chunks as a plain function returning the cursor (`undefined` at the
 * end): a `LogLineScanner` for one whole string (without `"` when quoted fields are joined), else
 * `iterateLogLines`.
 */
export function pullLogLines(
  chunks: Iterable<string>,
  options: { joinQuoted?: boolean } = {},
): () => LogLineCursor | undefined {
  const whole = Array.isArray(chunks) && chunks.length === 1 ? (chunks[0] as unknown) : undefined;
  if (typeof whole === 'string') {
    if (!options.joinQuoted) {
      const scanner = new LogLineScanner(whole, -1);
      return () => (scanner.next() ? scanner.cursor : undefined);
    }
    if (whole.indexOf('"') < 0) {
      const scanner = new LogLineScanner(whole, 0);
      return () => (scanner.next() ? scanner.cursor : undefined);
    }
  }
  const lines = iterateLogLines(chunks, options);
  return () => {
    const next = lines.next();
    return next.done ? undefined : next.value;
  };
}

/** `iterateLogLines` with a fresh `LogLine` per line (the text copied), for consumers that keep lines. */
export function* splitLogLines(
  chunks: Iterable<string>,
  options: { joinQuoted?: boolean; maxChars?: number } = {},
): Generator<LogLine> {
  for (const c of iterateLogLines(chunks, options)) {
    yield c.tooLongChars >= 0
      ? { text: '', line: c.line, tooLongChars: c.tooLongChars }
      : { text: c.text, line: c.line };
  }
}
