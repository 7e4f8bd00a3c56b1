/** What the scanner calls, in document order, as an XML parser's start-tag, text and end-tag events would. */
export interface XmlElementHandlers {
  open: (name: string, attributes: Record<string, string>, line: number, column: number) => void;
  text: (t: string) => void;
  close: (name: string) => void;
  /**
   * Optional: takes a plain point element (see `PlainPointScanner`; `line` and `column` as `open` would
   * get them) in one call instead of its open, text and close calls. Returns `false` to decline it,
   * having changed nothing; the scanner then hands on the point's elements one by one.
   */
  point?: (s: string, found: PlainPointScanner, line: number, column: number) => boolean;
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
 * With a `point` handler, a track or route point in the plain form (`PlainPointScanner`) goes to it
 * in one call instead of its element calls; a point it declines is handed on element by element.
 */
export function scanGpxFast(s: string, handlers: XmlElementHandlers): boolean {
  // whole-text checks first: anything here goes the general way (`<!` and `<?` after the declaration
  // need no search: a tag must start with a name, so the scan below declines them where they are)
  if (s.indexOf('&') >= 0 || s.indexOf(']]>') >= 0) return false;
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
  const takePoint = handlers.point;
  const points = new PlainPointScanner();
  for (;;) {
    const lt = s.indexOf('<', pos);
    if (lt < 0) break;
    if (stack.length === 0 ? !isWhiteSpace(s, pos, lt) : !isXmlText(s, pos, lt)) return false;
    // a track or route point in the plain form goes to `point` whole (the line is its start tag's)
    const parent = stack.length > 0 ? stack[stack.length - 1] : undefined;
    const pointName = parent === 'trkseg' ? 'trkpt' : parent === 'rte' ? 'rtept' : undefined;
    if (takePoint !== undefined && pointName !== undefined) {
      const end = points.scan(s, lt, pointName);
      if (end >= 0) {
        while (nextNewline >= 0 && nextNewline < points.tagEnd) {
          line++;
          lineStart = nextNewline + 1;
          nextNewline = s.indexOf('\n', lineStart);
        }
        if (takePoint(s, points, line, points.tagEnd + 1 - lineStart)) {
          pos = end;
          textStart = pos;
          continue;
        }
      }
    }
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

/** Most leaf elements a point may hold on the point path (more go tag by tag). */
const MAX_POINT_LEAVES = 16;
/** Longest leaf text the point path reads (numbers and times are short; the reader caps text at 4096). */
const MAX_LEAF_TEXT = 256;
/**
 * 1 for the characters of a plain attribute value or leaf text: printable ASCII but space, quotes,
 * `<`, `>`, `&` and `]` (a general parser hands such text on as written: no reference, CDATA end,
 * normalisation or error can come of it).
 */
const PLAIN_CHARS = new Uint8Array(128);
for (let c = 33; c < 127; c++) PLAIN_CHARS[c] = 1;
for (const c of `"'<>&]`) PLAIN_CHARS[c.charCodeAt(0)] = 0;

/**
 * The markup of a point (everything but its values), kept from the last point parsed: the next point
 * of the same shape is matched against it in one pass instead of being parsed tag by tag.
 */
interface PointShape {
  kind: 'trkpt' | 'rtept';
  /**
   * The markup before the first attribute value, between each value and the next (the two
   * attribute values, then each leaf's text with the white space around it), and after the last.
   */
  runs: string[];
  latFirst: boolean;
  /** Where the start tag's `>` lies in `runs[2]` (the markup after the second attribute value). */
  tagEndInRun: number;
  leafNames: string[];
}

/**
 * Reads track and route points in the plain form loggers write (`scan`); its fields say where the
 * parts of the last point read lie in the text (indices; an end is the index after the last
 * character).
 */
export class PlainPointScanner {
  kind: 'trkpt' | 'rtept' = 'trkpt';
  /** The start tag's `>`. */
  tagEnd = 0;
  latStart = 0;
  latEnd = 0;
  lonStart = 0;
  lonEnd = 0;
  leafCount = 0;
  /** Each leaf's name in document order (the same array while the points keep one shape). */
  leafNames: readonly string[] = [];
  /** Leaf `k`'s text without the white space around it: its start at `2k`, its end at `2k + 1`. */
  readonly leafText = new Int32Array(2 * MAX_POINT_LEAVES);
  #shape: PointShape | undefined;

  /**
   * Reads the point element starting at `<` (`lt`) when it has the plain form: `<trkpt` (or
   * `<rtept`, as `name` says) with exactly the attributes `lat` and `lon`, then only leaf elements (a
   * name, text, the same name's end tag; no attributes) and `extensions` elements holding leaf
   * elements, with white space between them; values of `PLAIN_CHARS`. Fills the fields and returns
   * the index after the point's end tag, or -1 for anything else (the caller then scans the point
   * tag by tag, which also judges what is malformed).
   */
  scan(s: string, lt: number, name: 'trkpt' | 'rtept'): number {
    const shape = this.#shape;
    if (shape !== undefined && shape.kind === name) {
      const end = this.#matchShape(s, lt, shape);
      if (end >= 0) return end;
    }
    return this.#parse(s, lt, name);
  }

  /** Reads a point with the same markup as `shape`, character for character; -1 when it differs. */
  #matchShape(s: string, lt: number, shape: PointShape): number {
    const { runs } = shape;
    const last = runs.length - 1;
    let at = lt;
    for (let r = 0; r < last; r++) {
      at = matchRun(s, at, runs[r] as string);
      if (at < 0) return -1;
      if (r >= 2) {
        at = this.#leafText(s, at, r - 2);
        if (at < 0) return -1;
        continue;
      }
      const end = plainEnd(s, at);
      if ((r === 0) === shape.latFirst) {
        this.latStart = at;
        this.latEnd = end;
      } else {
        this.lonStart = at;
        this.lonEnd = end;
      }
      at = end;
      if (r === 1) this.tagEnd = at + shape.tagEndInRun;
    }
    at = matchRun(s, at, runs[last] as string);
    if (at < 0) return -1;
    this.kind = shape.kind;
    this.leafNames = shape.leafNames;
    this.leafCount = shape.leafNames.length;
    return at;
  }

  /** Reads a point tag by tag and keeps its markup as the shape to match next; -1 when it is not plain. */
  #parse(s: string, lt: number, name: 'trkpt' | 'rtept'): number {
    if (!s.startsWith(name, lt + 1)) return -1;
    // where each value's characters start and end: the two attribute values, then each leaf's text
    const bounds: number[] = [];
    let latFirst = false;
    let hasLat = false;
    let hasLon = false;
    let at = lt + 1 + name.length;
    for (;;) {
      const before = at;
      while (isSpace(s.charCodeAt(at))) at++;
      if (s.charCodeAt(at) === 62 /* > */) break;
      if (at === before || s.charCodeAt(at) !== 108 /* l */) return -1;
      const second = s.charCodeAt(at + 1);
      const third = s.charCodeAt(at + 2);
      const isLat = second === 97 /* a */ && third === 116; /* t */
      if (!isLat && !(second === 111 /* o */ && third === 110) /* n */) return -1;
      if (s.charCodeAt(at + 3) !== 61 /* = */) return -1;
      const quote = s.charCodeAt(at + 4);
      if (quote !== 34 && quote !== 39) return -1;
      const valueStart = at + 5;
      const valueEnd = plainEnd(s, valueStart);
      if (s.charCodeAt(valueEnd) !== quote || (isLat ? hasLat : hasLon)) return -1;
      if (isLat) {
        hasLat = true;
        latFirst = !hasLon;
        this.latStart = valueStart;
        this.latEnd = valueEnd;
      } else {
        hasLon = true;
        this.lonStart = valueStart;
        this.lonEnd = valueEnd;
      }
      bounds.push(valueStart, valueEnd);
      at = valueEnd + 1;
    }
    if (!hasLat || !hasLon) return -1;
    const tagEnd = at;
    at++;
    const leafNames: string[] = [];
    let inExtensions = false;
    for (;;) {
      while (isSpace(s.charCodeAt(at))) at++;
      if (s.charCodeAt(at) !== 60 /* < */) return -1;
      if (s.charCodeAt(at + 1) === 47 /* / */) {
        if (inExtensions) {
          if (!s.startsWith('extensions>', at + 2)) return -1;
          inExtensions = false;
          at += 13;
          continue;
        }
        if (!s.startsWith(name, at + 2) || s.charCodeAt(at + 2 + name.length) !== 62) return -1;
        at += 3 + name.length;
        break;
      }
      const nameStart = at + 1;
      const nameEnd = nameEndAt(s, nameStart);
      if (nameEnd < 0 || s.charCodeAt(nameEnd) !== 62 /* > */) return -1;
      const nameLength = nameEnd - nameStart;
      if (!inExtensions && nameLength === 10 && s.startsWith('extensions', nameStart)) {
        inExtensions = true;
        at = nameEnd + 1;
        continue;
      }
      // a leaf: its text, then its end tag
      if (leafNames.length === MAX_POINT_LEAVES) return -1;
      const textEnd = this.#leafText(s, nameEnd + 1, leafNames.length);
      if (textEnd < 0 || s.charCodeAt(textEnd + 1) !== 47 /* / */) return -1;
      if (!sameName(s, nameStart, textEnd + 2, nameLength) || s.charCodeAt(textEnd + 2 + nameLength) !== 62) return -1;
      bounds.push(nameEnd + 1, textEnd);
      leafNames.push(s.slice(nameStart, nameEnd));
      at = textEnd + 3 + nameLength;
    }
    this.#shape = {
      kind: name,
      runs: markupRuns(s, lt, bounds, at),
      latFirst,
      tagEndInRun: tagEnd - (bounds[3] as number),
      leafNames,
    };
    this.kind = name;
    this.tagEnd = tagEnd;
    this.leafNames = leafNames;
    this.leafCount = leafNames.length;
    return at;
  }

  /**
   * Leaf `k`'s text from `at`: white space, one run of `PLAIN_CHARS`, white space, up to a `<`.
   * Notes where the run lies and returns the index of the `<`; -1 for other text.
   */
  #leafText(s: string, at: number, k: number): number {
    let i = at;
    while (isSpace(s.charCodeAt(i))) i++;
    const start = i;
    const end = plainEnd(s, i);
    i = end;
    while (isSpace(s.charCodeAt(i))) i++;
    if (s.charCodeAt(i) !== 60 /* < */ || i - at > MAX_LEAF_TEXT) return -1;
    this.leafText[2 * k] = start;
    this.leafText[2 * k + 1] = end;
    return i;
  }
}

/** The end of the run of `PLAIN_CHARS` starting at `start`. */
function plainEnd(s: string, start: number): number {
  let i = start;
  for (;;) {
    const c = s.charCodeAt(i);
    // `+` to `:` (digits, signs, decimal points, time separators) are all plain: one test for most
    if ((c >= 43 && c <= 58) || (c < 128 && PLAIN_CHARS[c] === 1)) i++;
    else return i;
  }
}

/**
 * The markup of `s` from `start` to `end` around the values at `bounds` (start and end of each),
 * as `PointShape` keeps it.
 */
function markupRuns(s: string, start: number, bounds: readonly number[], end: number): string[] {
  const edges = [start, ...bounds, end];
  const runs: string[] = [];
  for (let i = 0; i < edges.length; i += 2) runs.push(s.slice(edges[i], edges[i + 1]));
  return runs;
}

/**
 * The index after `run` when `s` holds it at `at`, else -1. (A slice compared whole: the engine
 * compares the characters in bulk, about twice as fast as a loop over them.)
 */
function matchRun(s: string, at: number, run: string): number {
  const end = at + run.length;
  return s.slice(at, end) === run ? end : -1;
}
