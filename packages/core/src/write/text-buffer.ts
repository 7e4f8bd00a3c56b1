import { formatDecimal, formatIsoTime } from './format-decimal.js';

const encoder = new TextEncoder();
const decoder = new TextDecoder();

const ZERO = 48;
const COLON = 58;
const POINT = 46;
/** 10^k for k = 0…22, each exact in a double. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);
/** Below this, an integer has at most 15 digits: every such decimal maps to its own double. */
const FIFTEEN_DIGITS = 1e15;
/**
 * Room that one number written by a digit fast path can take: a sign, then at most 15 digits and a
 * point, or `0.` and up to 22 decimals (25), or 17 digits and a point (19). Each such write makes
 * this much room once instead of checking the capacity per character.
 */
const NUMBER_ROOM = 32;

/** In `separatedNumbers`' decimals: the value's shortest round-trip digits instead of fixed decimals. */
export const SHORTEST_DIGITS = -1;

// The ASCII digits of 0…99 and of 0…9999 (zeros in front), packed little-endian (first digit in
// the low byte): integers are written two or four digits per division and per store.
const DIGIT_PAIRS = new Uint16Array(100);
const DIGIT_QUADS = new Uint32Array(10_000);
for (let i = 0; i < 100; i++) DIGIT_PAIRS[i] = (ZERO + Math.floor(i / 10)) | ((ZERO + (i % 10)) << 8);
for (let i = 0; i < 10_000; i++)
  DIGIT_QUADS[i] = ((DIGIT_PAIRS[Math.floor(i / 100)] as number) | ((DIGIT_PAIRS[i % 100] as number) << 16)) >>> 0;

// The bits of a double, to read its binary exponent; HIGH_WORD is the index of the word that
// holds sign and exponent (1 on little-endian machines).
const BITS_VIEW = new Float64Array(1);
const BITS_WORDS = new Uint32Array(BITS_VIEW.buffer);
BITS_VIEW[0] = 1;
const HIGH_WORD = BITS_WORDS[1] === 0x3ff00000 ? 1 : 0;
/** Half an ulp of a double in [2^e, 2^(e+1)) is 2^(e-53), for e = 0…49 (values below 10^15). */
const HALF_ULP = Array.from({ length: 50 }, (_, e) => 2 ** (e - 53));

/** How close to a rounding decision's edge the long-digit path gives way to the general one. */
const EDGE = 1e-9;

// The rounding error of the double product p = a·b, so that a·b = p + error exactly (Dekker's
// product with Veltkamp's split; no overflow for the magnitudes used here).
function productError(a: number, b: number, p: number): number {
  const SPLIT = 134_217_729; // 2^27 + 1
  let t = SPLIT * a;
  const aHigh = t - (t - a);
  const aLow = a - aHigh;
  t = SPLIT * b;
  const bHigh = t - (t - b);
  const bLow = b - bHigh;
  return aHigh * bHigh - p + aHigh * bLow + aLow * bHigh + aLow * bLow;
}

/**
 * Output text built as UTF-8 bytes, for writers that emit millions of numbers: each number goes
 * straight in as digits instead of through a string of its own (no per-field strings, no long
 * concatenations to flatten). Every method writes exactly the text its string counterpart in
 * `format-decimal.ts` gives; the digit fast paths are taken only where they are provably the same
 * and fall back to those functions otherwise.
 */
export class TextBuffer {
  #bytes: Uint8Array = new Uint8Array(1 << 16);
  // The same bytes, for the digit writers' two- and four-byte stores.
  #view: DataView = new DataView(this.#bytes.buffer);
  #length = 0;
  // The UTC day of the last ISO time written: its start in ms and its `YYYY-MM-DDT` (and the
  // next character, overwritten) packed little-endian in three words.
  #dayStartMs = Number.NaN;
  #dayWords = new Uint32Array(3);

  /** Encodes text once, to be written many times with `bytes`. */
  static encode(text: string): Uint8Array {
    return encoder.encode(text);
  }

  /** Appends any text (UTF-8). */
  text(text: string): void {
    this.bytes(encoder.encode(text));
  }

  /** Appends text known to be ASCII (digits, signs, our own punctuation). */
  ascii(text: string): void {
    this.#reserve(text.length);
    const b = this.#bytes;
    let at = this.#length;
    for (let i = 0; i < text.length; i++) b[at++] = text.charCodeAt(i);
    this.#length = at;
  }

  /** Appends bytes (from `TextBuffer.encode`). */
  bytes(bytes: Uint8Array): void {
    this.#reserve(bytes.length);
    const b = this.#bytes;
    // TypedArray#set has a fixed cost (tens of ns): a loop is quicker up to about 16 bytes.
    if (bytes.length > 16) b.set(bytes, this.#length);
    else for (let i = 0, at = this.#length; i < bytes.length; i++) b[at++] = bytes[i] as number;
    this.#length += bytes.length;
  }

  /** Appends one ASCII character by its code. */
  char(code: number): void {
    this.#reserve(1);
    this.#bytes[this.#length++] = code;
  }

  /** Appends `formatDecimal(value, decimals)`: rounded to `decimals` places, trailing zeros dropped. */
  fixed(value: number, decimals: number): void {
    this.#reserve(NUMBER_ROOM);
    const end = putFixed(this.#view, this.#length, value, decimals);
    if (end >= 0) this.#length = end;
    else this.ascii(formatDecimal(value, decimals));
  }

  /**
   * Appends `formatDecimal(value)`: the shortest digits that read back to the same double.
   * `likelyDecimals` (a guess, never changes the text) is tried first: a value
   * with at most that many decimals is then found in one step.
   */
  shortest(value: number, likelyDecimals = 0): void {
    // formatDecimal gives no text for NaN and infinities.
    if (!Number.isFinite(value)) return;
    if (!this.#shortestDigits(value, likelyDecimals)) this.ascii(formatDecimal(value));
  }

  /** Appends `String(value)`, which is also JSON's text for a finite number; `likelyDecimals` as for `shortest`. */
  number(value: number, likelyDecimals = 0): void {
    // The likely decimals first, in line (the usual case for rounded coordinates and logged depths).
    const abs = Math.abs(value);
    if (likelyDecimals > 0 && abs >= 1e-6 && abs < FIFTEEN_DIGITS) {
      this.#reserve(NUMBER_ROOM);
      const end = putWithDecimals(this.#view, this.#length, value, abs, likelyDecimals);
      if (end >= 0) {
        this.#length = end;
        return;
      }
    }
    if (!this.#shortestDigits(value, likelyDecimals)) this.ascii(String(value));
  }

  /**
   * Appends, for each column k, `separator` then `columns[k][row]`: as `fixed` writes it with
   * `decimals[k]` places, or as `shortest` writes it (with `likelyDecimals`) where `decimals[k]`
   * is `SHORTEST_DIGITS`. Built for table rows: the digit fast paths run in one loop over the
   * row with one room check, the general paths as those methods take them.
   */
  separatedNumbers(
    separator: number,
    columns: readonly Float64Array[],
    decimals: readonly number[],
    row: number,
    likelyDecimals: number,
  ): void {
    this.#reserve(columns.length * (NUMBER_ROOM + 1));
    let view = this.#view;
    let at = this.#length;
    for (let k = 0; k < columns.length; k++) {
      view.setUint8(at++, separator);
      const value = (columns[k] as Float64Array)[row] as number;
      const places = decimals[k] as number;
      let end: number;
      if (places !== SHORTEST_DIGITS) end = putFixed(view, at, value, places);
      else {
        const abs = Math.abs(value);
        // As shortest does: no text for NaN and infinities, `0` for either zero, the likely
        // decimals first; anything else (end -1) takes the general path.
        if (!(abs < Number.POSITIVE_INFINITY)) end = at;
        else if (abs === 0) {
          view.setUint8(at, ZERO);
          end = at + 1;
        } else if (abs >= 1e-6 && abs < FIFTEEN_DIGITS && likelyDecimals > 0)
          end = putWithDecimals(view, at, value, abs, likelyDecimals);
        else end = -1;
      }
      if (end >= 0) {
        at = end;
        continue;
      }
      this.#length = at;
      if (places !== SHORTEST_DIGITS) this.ascii(formatDecimal(value, places));
      else this.shortest(value, likelyDecimals);
      // The general path may have used the room made above (or moved the buffer): make it again.
      this.#reserve((columns.length - k) * (NUMBER_ROOM + 1));
      view = this.#view;
      at = this.#length;
    }
    this.#length = at;
  }

  /** Appends `formatIsoTime(timeMs)` (nothing for `NaN`). */
  isoTime(timeMs: number): void {
    // Fixes come in time order, mostly within one day: the date part is reused (as formatIsoTime does).
    const intoDay = timeMs - this.#dayStartMs;
    if (intoDay >= 0 && intoDay < 86_400_000 && Number.isInteger(timeMs)) {
      this.#reserve(24);
      const view = this.#view;
      const at = this.#length;
      // `YYYY-MM-DDT` in three four-byte stores (the last byte is overwritten just after).
      view.setUint32(at, this.#dayWords[0] as number, true);
      view.setUint32(at + 4, this.#dayWords[1] as number, true);
      view.setUint32(at + 8, this.#dayWords[2] as number, true);
      // Below 86 400 000: 32-bit integer arithmetic (floating-point % is a slow call).
      const ms = intoDay | 0;
      const seconds = (ms / 1000) | 0;
      const minutes = (seconds / 60) | 0;
      const hours = (minutes / 60) | 0;
      view.setUint32(at + 11, (DIGIT_PAIRS[hours] as number) | (COLON << 16), true);
      view.setUint32(at + 14, (DIGIT_PAIRS[minutes - hours * 60] as number) | (COLON << 16), true);
      view.setUint16(at + 17, DIGIT_PAIRS[seconds - minutes * 60] as number, true);
      // `.mmm`: the milliseconds' four digits (`0mmm`) with the point in place of the leading zero.
      view.setUint32(at + 19, ((DIGIT_QUADS[ms - seconds * 1000] as number) & ~0xff) | POINT, true);
      view.setUint8(at + 23, 90);
      this.#length = at + 24;
      return;
    }
    const iso = formatIsoTime(timeMs);
    if (iso.length === 24 && Number.isInteger(timeMs)) {
      this.#dayStartMs = timeMs - (((timeMs % 86_400_000) + 86_400_000) % 86_400_000);
      for (let word = 0; word < 3; word++) {
        let packed = 0;
        for (let i = 3; i >= 0; i--) packed = packed * 256 + (iso.charCodeAt(4 * word + i) & 0xff);
        this.#dayWords[word] = packed;
      }
    }
    this.ascii(iso);
  }

  /**
   * Makes room for at least `byteCount` more bytes in one step: a writer that can guess its size
   * saves the buffer doubling (and copying everything) several times over. Writes nothing.
   */
  makeRoom(byteCount: number): void {
    const needed = this.#length + Math.max(0, Math.ceil(byteCount));
    if (needed <= this.#bytes.length) return;
    this.#moveTo(new Uint8Array(needed));
  }

  /** Bytes written so far. */
  get byteLength(): number {
    return this.#length;
  }

  /** Drops what was written after the first `byteLength` bytes. */
  truncate(byteLength: number): void {
    this.#length = Math.min(this.#length, byteLength);
  }

  /**
   * The UTF-8 bytes written so far: a view of the buffer, not a copy (a season's outputs are
   * hundreds of megabytes), so nothing may be written to this buffer afterwards.
   */
  toBytes(): Uint8Array {
    return this.#bytes.subarray(0, this.#length);
  }

  /** The text written so far. */
  toString(): string {
    return decoder.decode(this.#bytes.subarray(0, this.#length));
  }

  // Writes the shortest round-trip digits of a value in plain notation (as String does for
  // 1e-6 <= |value| < 1e21) when it is zero or in [1e-6, 1e15) and the digits are found exactly
  // below; returns false (nothing written) otherwise.
  //
  // With k decimals, the only integer n that can give back the value as n / 10^k (a correctly
  // rounded division, as reading "n·10^-k" is) is the nearest to value·10^k, as long as n has at
  // most 15 digits; and distinct decimals of at most 15 significant digits are distinct doubles.
  // So when that n gives the value back, n without its trailing zeros is the shortest form; and
  // when it does not at 15 significant digits, no form of 15 or fewer digits exists.
  #shortestDigits(value: number, likelyDecimals: number): boolean {
    const abs = Math.abs(value);
    if (abs === 0) {
      this.char(ZERO);
      return true;
    }
    if (!(abs >= 1e-6 && abs < FIFTEEN_DIGITS)) return false;
    if (likelyDecimals > 0 && this.#digitsWith(value, abs, likelyDecimals)) return true;
    // Decimals for 15 significant digits: value·10^k in [1e14, 1e15).
    let wholeDigits = 0;
    let k = 15;
    if (abs >= 1) {
      wholeDigits = 1;
      while ((POWERS_OF_TEN[wholeDigits] as number) <= abs) wholeDigits++;
      k = 15 - wholeDigits;
    } else while (k < 22 && abs * (POWERS_OF_TEN[k] as number) < 1e14) k++;
    const scale = POWERS_OF_TEN[k] as number;
    const scaled = abs * scale;
    // Rounded onto a decade's edge: left to the general path.
    if (!(scaled >= 1e14 && scaled < 1e15)) return false;
    if (this.#digitsWith(value, abs, k)) return true;
    return wholeDigits > 0 && this.#longDigits(value, abs, wholeDigits);
  }

  // Writes the value with k decimals (trailing zeros dropped) when the nearest such decimal, of
  // at most 15 digits, gives it back exactly; false (nothing written) otherwise.
  #digitsWith(value: number, abs: number, k: number): boolean {
    this.#reserve(NUMBER_ROOM);
    const end = putWithDecimals(this.#view, this.#length, value, abs, k);
    if (end < 0) return false;
    this.#length = end;
    return true;
  }

  // Writes the 16- or 17-digit shortest form of a value in [1, 1e15) known to have none of 15 or
  // fewer digits, as ECMAScript's Number::toString picks it: 16 digits when the nearest 16-digit
  // decimal reads back to the value (it lies within half an ulp), else the nearest 17-digit one.
  // The scaled value is taken exactly (Dekker's product, a double plus its rounding error);
  // anything within 1e-9 of a decision's edge (a tie, the interval's end) and powers of two (whose
  // interval is lopsided) are left to the general path (returns false, nothing written).
  #longDigits(value: number, abs: number, wholeDigits: number): boolean {
    // The binary exponent from the double's bits (abs >= 1, so normal); with a zero mantissa abs
    // is a power of two.
    BITS_VIEW[0] = abs;
    const high = BITS_WORDS[HIGH_WORD] as number;
    if ((high & 0xfffff) === 0 && BITS_WORDS[1 - HIGH_WORD] === 0) return false;
    const halfUlp = HALF_ULP[(high >>> 20) - 1023];
    if (halfUlp === undefined) return false;
    for (let digits = 16; digits <= 17; digits++) {
      const decimals = digits - wholeDigits;
      const scale = POWERS_OF_TEN[decimals] as number;
      const product = abs * scale;
      const error = productError(abs, scale, product);
      // The exact abs·scale is whole + fraction (fraction in about (-1, 2), good to 1e-16).
      const whole = Math.floor(product);
      const fraction = product - whole + error;
      const step = Math.round(fraction);
      const offset = Math.abs(fraction - step);
      const half = halfUlp * scale;
      if (Math.abs(offset - 0.5) < EDGE || Math.abs(offset - half) < EDGE) return false;
      if (offset > half) continue;
      const mark = this.#length;
      if (value < 0) this.char(45);
      if (!this.#longInteger(whole, step, digits)) {
        this.#length = mark;
        return false;
      }
      // Digits written; put the point after the whole part and drop trailing zeros.
      this.#reserve(1);
      const b = this.#bytes;
      const point = this.#length - decimals;
      for (let i = this.#length; i > point; i--) b[i] = b[i - 1] as number;
      b[point] = 46;
      this.#length++;
      while (b[this.#length - 1] === ZERO) this.#length--;
      if (b[this.#length - 1] === 46) this.#length--;
      return true;
    }
    return false;
  }

  // Writes whole + step (whole an integer below 10^17, step a small integer) as exactly `digits`
  // digits; false (nothing written) when it has another number of digits.
  #longInteger(whole: number, step: number, digits: number): boolean {
    // Split at 10^9 so each part is exact (whole - high·10^9 is an exact small integer).
    let high = Math.floor(whole / 1e9);
    let rest = whole - high * 1e9 + step;
    while (rest < 0) {
      high--;
      rest += 1e9;
    }
    while (rest >= 1e9) {
      high++;
      rest -= 1e9;
    }
    const highDigits = digits - 9;
    if (high < (POWERS_OF_TEN[highDigits - 1] as number) || high >= (POWERS_OF_TEN[highDigits] as number)) return false;
    this.#reserve(digits);
    this.#length = putPadded(this.#view, this.#length, high, highDigits);
    this.#length = putPadded(this.#view, this.#length, rest, 9);
    return true;
  }

  #reserve(extra: number): void {
    if (this.#length + extra <= this.#bytes.length) return;
    let size = this.#bytes.length * 2;
    while (size < this.#length + extra) size *= 2;
    this.#moveTo(new Uint8Array(size));
  }

  // Carries what was written over to a larger buffer.
  #moveTo(bytes: Uint8Array): void {
    bytes.set(this.#bytes.subarray(0, this.#length));
    this.#bytes = bytes;
    this.#view = new DataView(bytes.buffer);
  }
}

// The digit writers below put bytes at `at` with no capacity check (their callers make room
// first) and return where the text ends.

// Writes the `count` digits of n (an integer in [0, 10^count), count <= 9, so 32-bit arithmetic
// is exact) ending just before `end`, zeros in front: four digits per division by 10^4 and per
// store, then a pair and a single digit.
function putDigits(view: DataView, end: number, n: number, count: number): void {
  let at = end;
  let rest = n | 0;
  let left = count;
  while (left >= 4) {
    const q = (rest / 10_000) | 0;
    at -= 4;
    view.setUint32(at, DIGIT_QUADS[rest - q * 10_000] as number, true);
    rest = q;
    left -= 4;
  }
  if (left >= 2) {
    const q = (rest / 100) | 0;
    at -= 2;
    view.setUint16(at, DIGIT_PAIRS[rest - q * 100] as number, true);
    rest = q;
    left -= 2;
  }
  if (left === 1) view.setUint8(at - 1, ZERO + rest);
}

// How many digits an integer in [0, 10^9) has (1 for zero): a few comparisons, fewest for the
// short whole parts of degrees and depths.
function digitCount(n: number): number {
  if (n < 1e4) return n < 100 ? (n < 10 ? 1 : 2) : n < 1e3 ? 3 : 4;
  if (n < 1e6) return n < 1e5 ? 5 : 6;
  return n < 1e7 ? 7 : n < 1e8 ? 8 : 9;
}

// Writes a non-negative integer below 10^15.
function putInteger(view: DataView, at: number, n: number): number {
  if (n < 1e9) {
    const count = digitCount(n);
    putDigits(view, at + count, n, count);
    return at + count;
  }
  // Two parts, the low one of exactly 9 digits, each below 10^9 (32-bit integer arithmetic).
  const high = Math.floor(n / 1e9);
  const end = putInteger(view, at, high);
  putDigits(view, end + 9, n - high * 1e9, 9);
  return end + 9;
}

// Writes an integer in [0, 10^width) as exactly `width` digits (zeros in front).
function putPadded(view: DataView, at: number, n: number, width: number): number {
  if (width <= 9) {
    putDigits(view, at + width, n, width);
    return at + width;
  }
  const high = Math.floor(n / 1e9);
  const end = putPadded(view, at, high, width - 9);
  putDigits(view, end + 9, n - high * 1e9, 9);
  return end + 9;
}

// Writes formatDecimal(value, decimals) (nothing for NaN and infinities) and returns the end,
// or -1 (nothing written) where the general path is needed.
function putFixed(view: DataView, at: number, value: number, decimals: number): number {
  const abs = Math.abs(value);
  const scale = POWERS_OF_TEN[decimals];
  if (scale === undefined) return -1;
  const scaled = abs * scale;
  if (!(scaled < FIFTEEN_DIGITS)) return abs < Number.POSITIVE_INFINITY ? -1 : at;
  // The product has at most one rounding error (scale is exact); away from a half, rounding it
  // gives the same integer as toFixed's exact decimal rounding. Ties take the general path.
  if (!(Math.abs(scaled - Math.floor(scaled) - 0.5) > scaled * 1e-15 + 1e-300)) return -1;
  // Rounding half up (as Math.round, but quicker): the same integer away from a half.
  const n = Math.floor(scaled + 0.5);
  // Rounded to zero, a negative value is written `0` (formatDecimal drops the sign of -0).
  if (n === 0) {
    view.setUint8(at, ZERO);
    return at + 1;
  }
  if (value < 0) view.setUint8(at++, 45);
  return putDecimal(view, at, abs, n, decimals, scale);
}

// Writes the value (abs its magnitude, in [1e-6, 1e15)) with k decimals, trailing zeros dropped,
// when the nearest such decimal of at most 15 digits gives it back exactly (it is then the shortest
// form, see #shortestDigits); returns the end, or -1 (nothing written).
function putWithDecimals(view: DataView, at: number, value: number, abs: number, k: number): number {
  const scale = POWERS_OF_TEN[k] as number;
  // Math.round, but quicker; rounding differently near a half at worst fails the check below
  // (which only the right n passes), sending the value to the general path.
  const n = Math.floor(abs * scale + 0.5);
  if (!(n < FIFTEEN_DIGITS) || n / scale !== abs) return -1;
  if (value < 0) view.setUint8(at++, 45);
  return putDecimal(view, at, abs, n, k, scale);
}

// Writes abs rounded to `decimals` places, given n, its digits (abs·10^decimals rounded to an
// integer below 10^15, so that n·10^-decimals lies within half a unit of the last place, and
// scale = 10^decimals), with trailing zeros dropped.
function putDecimal(view: DataView, at: number, abs: number, n: number, decimals: number, scale: number): number {
  // The whole part without a division: n lies in [whole·scale, (whole + 1)·scale] (all exact
  // integers below 2^53), the top end when rounding carried into the next whole number.
  let whole = Math.floor(abs);
  let fraction = n - whole * scale;
  if (fraction >= scale) {
    whole++;
    fraction -= scale;
  }
  const end = putInteger(view, at, whole);
  if (fraction === 0) return end;
  view.setUint8(end, POINT);
  // All the decimals are written, then the trailing zeros taken back (the fraction is not zero, so
  // this stops at a digit after the point).
  let last = putPadded(view, end + 1, fraction, decimals);
  while (view.getUint8(last - 1) === ZERO) last--;
  return last;
}
