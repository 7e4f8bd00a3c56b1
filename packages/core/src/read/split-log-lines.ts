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
 * Splits text, given in one or more chunks, into lines in bounded memory: CRLF, LF and lone CR
 * end a line; a line longer than `maxChars` is reported by length and skipped, never copied.
 * With `joinQuoted`, a line with an odd number of `"` continues on the next (RFC 4180 fields
 * with line breaks) within the same limit.
 */
export function* splitLogLines(
  chunks: Iterable<string>,
  options: { joinQuoted?: boolean; maxChars?: number } = {},
): Generator<LogLine> {
  const maxChars = options.maxChars ?? MAX_LINE_CHARS;
  const joinQuoted = options.joinQuoted ?? false;
  let carry = '';
  let carryLength = 0; // length of the current line so far, also when it is too long and dropped
  let tooLong = false;
  let lineNo = 1;
  let pendingStart = 0; // line number where a quoted record began
  let pending: string | undefined;
  let pendingCr = false; // the previous chunk ended with CR: a following LF belongs to it
  const emit = function* (text: string, length: number, dropped: boolean): Generator<LogLine> {
    const line = lineNo++;
    if (dropped) {
      if (pending !== undefined) {
        yield { text: '', line: pendingStart, tooLongChars: pending.length + length };
        pending = undefined;
      } else yield { text: '', line, tooLongChars: length };
      return;
    }
    if (joinQuoted) {
      const whole = pending === undefined ? text : `${pending}\n${text}`;
      const start = pending === undefined ? line : pendingStart;
      if (countQuotes(whole) % 2 === 1) {
        if (whole.length > maxChars) {
          pending = undefined;
          yield { text: '', line: start, tooLongChars: whole.length };
          return;
        }
        pending = whole;
        pendingStart = start;
        return;
      }
      pending = undefined;
      yield { text: whole, line: start };
      return;
    }
    yield { text, line };
  };
  for (const chunk of chunks) {
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
      let end: number;
      if (nextCr >= 0 && (nextLf < 0 || nextCr < nextLf)) end = nextCr;
      else end = nextLf;
      if (end < 0) {
        const rest = n - i;
        carryLength += rest;
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
      const text = dropped ? '' : carry.length > 0 ? carry + chunk.slice(i, end) : chunk.slice(i, end);
      yield* emit(text, length, dropped);
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
    }
  }
  if (carryLength > 0 || pending !== undefined) {
    if (carryLength > 0 || tooLong) yield* emit(carry, carryLength, tooLong || carryLength > maxChars);
    else if (pending !== undefined) {
      // an unterminated quoted field at the end of the file: give it back as it is
      const start = pendingStart;
      const text = pending;
      pending = undefined;
      yield { text, line: start };
    }
  }
}

function countQuotes(text: string): number {
  let count = 0;
  let at = text.indexOf('"');
  while (at >= 0) {
    count++;
    at = text.indexOf('"', at + 1);
  }
  return count;
}
