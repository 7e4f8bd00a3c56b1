/** What the scanner calls, in document order, as an XML parser's start-tag, text and end-tag events would. */
export interface XmlElementHandlers {
  open: (name: string, attributes: Record<string, string>, line: number, column: number) => void;
  text: (t: string) => void;
  close: (name: string) => void;
}

/** Longest text between two tags the scanner hands on (the reader keeps at most 4096 characters). */
const MAX_TEXT_RUN = 4096;
/** The attributes of a tag without any (shared: handlers only read them). */
const NO_ATTRIBUTES: Record<string, string> = Object.freeze({}) as Record<string, string>;
/** 1 for the ASCII characters an XML name may hold (after its first), 2 for those it may start with. */
const NAME_CHARS = new Uint8Array(128);
for (let c = 0; c < 128; c++) {
  const letter = (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 95 || c === 58;
  if (letter) NAME_CHARS[c] = 2;
  else if ((c >= 48 && c <= 57) || c === 45 || c === 46) NAME_CHARS[c] = 1;
}
/** The XML declaration as the simulator and most loggers write it (version 1.0, optional encoding and standalone). */
const XML_DECLARATION =
  /<\?xml[ \t\r\n]+version[ \t\r\n]*=[ \t\r\n]*(["'])1\.0\1(?:[ \t\r\n]+encoding[ \t\r\n]*=[ \t\r\n]*(["'])[A-Za-z][A-Za-z0-9._-]*\2)?(?:[ \t\r\n]+standalone[ \t\r\n]*=[ \t\r\n]*(["'])(?:yes|no)\3)?[ \t\r\n]*\?>/y;

/**
 * A fast path for well-formed GPX in the plain form loggers write: elements, attributes and text
 * only (no comments, CDATA, processing instructions, DOCTYPE or entity and character references),
 * ASCII names, one XML 1.0 declaration at the start. A general XML parser spends most of its time on
 * what such files never hold. Calls `handlers` exactly as the general parser would (same names,
 * attribute values, text and start-tag line) and returns `true`; returns `false` as soon as it meets
 * anything outside that form, and the caller then reads the whole text with the general parser
 * (which also judges what is malformed). So this path never rejects and never changes a result.
 */
export function scanGpxFast(s: string, handlers: XmlElementHandlers): boolean {
  // whole-text checks first: anything here goes the general way
  if (s.indexOf('<!') >= 0 || s.indexOf('&') >= 0 || s.indexOf(']]>') >= 0 || s.indexOf('<?', 1) >= 0) return false;
  if (s.indexOf('\r') >= 0 && /\r(?!\n)/.test(s)) return false;
  const n = s.length;
  let pos = 0;
  if (s.startsWith('<?')) {
    XML_DECLARATION.lastIndex = 0;
    if (!XML_DECLARATION.test(s)) return false;
    pos = XML_DECLARATION.lastIndex;
  }
  const stack: string[] = [];
  /** Where each open element's name starts in `s` (end tags are compared there, in the flat text). */
  const stackAt: number[] = [];
  let rootSeen = false;
  // line counting (saxes: 1-based, `\r\n` is one line end; a lone `\r` was ruled out above)
  let line = 1;
  let lineStart = 0;
  let nextNewline = s.indexOf('\n');
  let textStart = pos;
  for (;;) {
    const lt = s.indexOf('<', pos);
    if (lt < 0) break;
    if (stack.length === 0 ? !isWhiteSpace(s, pos, lt) : !isXmlText(s, pos, lt)) return false;
    if (s.charCodeAt(lt + 1) === 47 /* / */) {
      // an end tag must repeat the open element's name: compared in place, then `>` (names hold no
      // white space or `>`, so this is the whole name)
      const name = stack.pop();
      const openedAt = stackAt.pop();
      if (name === undefined || openedAt === undefined || !sameName(s, openedAt, lt + 2, name.length)) return false;
      let gt = lt + 2 + name.length;
      while (isSpace(s.charCodeAt(gt))) gt++;
      if (s.charCodeAt(gt) !== 62 /* > */) return false;
      if (lt > textStart && !emitText(s, textStart, lt, handlers)) return false;
      handlers.close(name);
      pos = gt + 1;
      textStart = pos;
      continue;
    }
    if (stack.length === 0 && rootSeen) return false; // a second root element
    const nameEnd = nameEndAt(s, lt + 1);
    if (nameEnd < 0) return false;
    const name = s.slice(lt + 1, nameEnd);
    let attributes = NO_ATTRIBUTES;
    let at = nameEnd;
    let selfClosing = false;
    for (;;) {
      const before = at;
      while (isSpace(s.charCodeAt(at))) at++;
      const c = s.charCodeAt(at);
      if (c === 62 /* > */) break;
      if (c === 47 /* / */) {
        if (s.charCodeAt(at + 1) !== 62) return false;
        selfClosing = true;
        at++;
        break;
      }
      if (at === before) return false; // attributes are separated by white space
      const attributeEnd = nameEndAt(s, at);
      if (attributeEnd < 0) return false;
      const attribute = s.slice(at, attributeEnd);
      at = attributeEnd;
      while (isSpace(s.charCodeAt(at))) at++;
      if (s.charCodeAt(at) !== 61 /* = */) return false;
      at++;
      while (isSpace(s.charCodeAt(at))) at++;
      const quote = s.charCodeAt(at);
      if (quote !== 34 && quote !== 39) return false;
      const close = s.indexOf(quote === 34 ? '"' : "'", at + 1);
      if (close < 0) return false;
      const value = s.slice(at + 1, close);
      if (!isPlainAttributeValue(s, at + 1, close) || Object.hasOwn(attributes, attribute)) return false;
      if (attributes === NO_ATTRIBUTES) attributes = {};
      attributes[attribute] = value;
      at = close + 1;
    }
    // `at` is the tag's `>`: the general parser reports the line and column after it
    while (nextNewline >= 0 && nextNewline < at) {
      line++;
      lineStart = nextNewline + 1;
      nextNewline = s.indexOf('\n', lineStart);
    }
    rootSeen = true;
    handlers.open(name, attributes, line, at + 1 - lineStart);
    pos = at + 1;
    textStart = pos;
    if (selfClosing) handlers.close(name);
    else {
      stack.push(name);
      stackAt.push(lt + 1);
    }
  }
  if (stack.length > 0 || !rootSeen || !isWhiteSpace(s, pos, n)) return false;
  return true;
}

/**
 * Whether `start` to `end` holds only characters XML 1.0 allows (§2.2 Char). Every surrogate is
 * refused too: characters outside the Basic Multilingual Plane are rare in logs and left to the
 * general parser, which checks their pairing.
 */
function isXmlText(s: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) {
    const c = s.charCodeAt(i);
    if (c < 32 ? c !== 9 && c !== 10 && c !== 13 : c >= 0xd800 && (c <= 0xdfff || c >= 0xfffe)) return false;
  }
  return true;
}

/**
 * An attribute value of allowed characters without `<` (not allowed) and without white space other
 * than spaces (the general parser would normalise it).
 */
function isPlainAttributeValue(s: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) {
    const c = s.charCodeAt(i);
    if (c < 32 || c === 60 || (c >= 0xd800 && (c <= 0xdfff || c >= 0xfffe))) return false;
  }
  return true;
}

/** Whether the `length` characters at `at` of `s` are those at `openedAt` (a start tag's name). */
function sameName(s: string, openedAt: number, at: number, length: number): boolean {
  for (let i = 0; i < length; i++) if (s.charCodeAt(at + i) !== s.charCodeAt(openedAt + i)) return false;
  return true;
}

function emitText(s: string, start: number, end: number, handlers: XmlElementHandlers): boolean {
  if (end - start > MAX_TEXT_RUN) return false;
  const raw = s.slice(start, end);
  // the general parser hands on `\r\n` as `\n` (XML 1.0 §2.11)
  handlers.text(raw.indexOf('\r') < 0 ? raw : raw.replace(/\r\n/g, '\n'));
  return true;
}

/** The end of an ASCII XML name starting at `start`, or -1 when none starts there or it runs into a non-ASCII character. */
function nameEndAt(s: string, start: number): number {
  const first = s.charCodeAt(start);
  if (!(first < 128 && NAME_CHARS[first] === 2)) return -1;
  let i = start + 1;
  for (;;) {
    const c = s.charCodeAt(i);
    if (c < 128 && (NAME_CHARS[c] as number) > 0) i++;
    else return c >= 128 ? -1 : i;
  }
}

function isSpace(c: number): boolean {
  return c === 32 || c === 10 || c === 13 || c === 9;
}

function isWhiteSpace(s: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) if (!isSpace(s.charCodeAt(i))) return false;
  return true;
}
