import { describe, expect, it } from 'vitest';
import { iterateLogLines, splitLogLines } from './split-log-lines.js';

const lines = (chunks: string[], joinQuoted = false, maxChars?: number) =>
  [...splitLogLines(chunks, maxChars === undefined ? { joinQuoted } : { joinQuoted, maxChars })].map((l) =>
    l.tooLongChars === undefined ? [l.line, l.text] : [l.line, `<${l.tooLongChars}>`],
  );

describe('splitLogLines', () => {
  it('ends lines at LF, CRLF and lone CR, also when a terminator is split across chunks', () => {
    expect(lines(['a\r\nb\rc\nd'])).toEqual([
      [1, 'a'],
      [2, 'b'],
      [3, 'c'],
      [4, 'd'],
    ]);
    expect(lines(['a\r', '\nb\r', 'c', '\n', 'd\n'])).toEqual([
      [1, 'a'],
      [2, 'b'],
      [3, 'c'],
      [4, 'd'],
    ]);
    expect(lines(['ab', 'cd\n', 'e'])).toEqual([
      [1, 'abcd'],
      [2, 'e'],
    ]);
  });

  it('reports a line over the limit by length and keeps counting lines', () => {
    expect(lines(['ok\n', 'x'.repeat(7), 'y'.repeat(7), '\nok\n'], false, 10)).toEqual([
      [1, 'ok'],
      [2, '<14>'],
      [3, 'ok'],
    ]);
    expect(lines(['ok\n', 'x'.repeat(30)], false, 10)).toEqual([
      [1, 'ok'],
      [2, '<30>'],
    ]);
  });

  it('joins a quoted field across line breaks (RFC 4180)', () => {
    expect(lines(['a,"x\n', 'y",b\nc\n'], true)).toEqual([
      [1, 'a,"x\ny",b'],
      [3, 'c'],
    ]);
    expect(lines(['a,"never closed\nb\n'], true)).toEqual([[1, 'a,"never closed\nb']]);
  });
});

describe('iterateLogLines', () => {
  it('hands out one cursor pointing into the text without copying it', () => {
    const text = 'one\ntwo\n';
    const seen: Array<[string, number, number]> = [];
    let cursor: unknown;
    for (const c of iterateLogLines([text], { joinQuoted: true })) {
      cursor ??= c;
      expect(c).toBe(cursor);
      expect(c.source).toBe(text);
      seen.push([c.text, c.start, c.quoteCount]);
    }
    expect(seen).toEqual([
      ['one', 0, 0],
      ['two', 4, 0],
    ]);
  });
});
