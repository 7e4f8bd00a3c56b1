import { formatDecimal, formatIsoTime } from './format-decimal.js';

const encoder = new TextEncoder();
const decoder = new TextDecoder();

const ZERO = 48;
/** 10^k for k = 0…22, each exact in a double. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);
/** Below this, an integer has at most 15 digits: every such decimal maps to its own double. */
const FIFTEEN_DIGITS = 1e15;

/**
 * Output text built as UTF-8 bytes, for writers that emit millions of numbers: each number goes
 * straight in as digits instead of through a string of its own (no per-field strings, no long
 * concatenations to flatten). Every method writes exactly the text its string counterpart in
 * `format-decimal.ts` gives; the digit fast paths are taken only where they are provably the same
 * and fall back to those functions otherwise.
 */
export class TextBuffer {
  #bytes = new Uint8Array(1 << 16);
  #length = 0;
  // The UTC day of the last ISO time written (its start in ms and its `YYYY-MM-DDT` bytes).
  #dayStartMs = Number.NaN;
  #dayPrefix = new Uint8Array(0);

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
    // A loop beats TypedArray#set's fixed cost for the short runs written per row.
    if (bytes.length > 64) b.set(bytes, this.#length);
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
    const abs = Math.abs(value);
    const scale = POWERS_OF_TEN[decimals];
    const scaled = scale === undefined ? Number.NaN : abs * scale;
    // The product has at most one rounding error (scale is exact); away from a half, rounding it
    // gives the same integer as toFixed's exact decimal rounding. Ties, huge values and NaN take
    // the general path.
    if (scaled < FIFTEEN_DIGITS && Math.abs(scaled - Math.floor(scaled) - 0.5) > scaled * 1e-15 + 1e-300) {
      const n = Math.round(scaled);
      if (n === 0) {
        this.char(ZERO);
        return;
      }
      if (value < 0) this.char(45);
      this.#decimal(n, decimals, scale as number);
      return;
    }
    this.ascii(formatDecimal(value, decimals));
  }

  /** Appends `formatDecimal(value)`: the shortest digits that read back to the same double. */
  shortest(value: number): void {
    if (!this.#shortestDigits(value)) this.ascii(formatDecimal(value));
  }

  /** Appends `String(value)`, which is also JSON's text for a finite number. */
  number(value: number): void {
    if (!this.#shortestDigits(value)) this.ascii(String(value));
  }

  /** Appends `formatIsoTime(timeMs)` (nothing for `NaN`). */
  isoTime(timeMs: number): void {
    // Fixes come in time order, mostly within one day: the date part is reused (as formatIsoTime does).
    const intoDay = timeMs - this.#dayStartMs;
    if (intoDay >= 0 && intoDay < 86_400_000 && Number.isInteger(timeMs)) {
      this.bytes(this.#dayPrefix);
      // Below 86 400 000: 32-bit integer arithmetic (floating-point % is a slow call).
      const ms = intoDay | 0;
      const h = (ms / 3_600_000) | 0;
      const m = ((ms / 60_000) | 0) % 60;
      const s = ((ms / 1000) | 0) % 60;
      const milli = ms % 1000;
      this.#reserve(13);
      const b = this.#bytes;
      let at = this.#length;
      b[at++] = ZERO + ((h / 10) | 0);
      b[at++] = ZERO + (h % 10);
      b[at++] = 58;
      b[at++] = ZERO + ((m / 10) | 0);
      b[at++] = ZERO + (m % 10);
      b[at++] = 58;
      b[at++] = ZERO + ((s / 10) | 0);
      b[at++] = ZERO + (s % 10);
      b[at++] = 46;
      b[at++] = ZERO + ((milli / 100) | 0);
      b[at++] = ZERO + (((milli / 10) | 0) % 10);
      b[at++] = ZERO + (milli % 10);
      b[at++] = 90;
      this.#length = at;
      return;
    }
    const iso = formatIsoTime(timeMs);
    if (iso.length === 24 && Number.isInteger(timeMs)) {
      this.#dayStartMs = timeMs - (((timeMs % 86_400_000) + 86_400_000) % 86_400_000);
      this.#dayPrefix = encoder.encode(iso.slice(0, 11));
    }
    this.ascii(iso);
  }

  /** Bytes written so far. */
  get byteLength(): number {
    return this.#length;
  }

  /** Drops what was written after the first `byteLength` bytes. */
  truncate(byteLength: number): void {
    this.#length = Math.min(this.#length, byteLength);
  }

  /** The text written so far. */
  toString(): string {
    return decoder.decode(this.#bytes.subarray(0, this.#length));
  }

  // Writes the shortest round-trip digits of a value in plain notation when it has at most 15
  // significant digits and lies in [1e-6, 1e15) or is zero; returns false (nothing written) otherwise.
  #shortestDigits(value: number): boolean {
    const abs = Math.abs(value);
    if (abs === 0) {
      this.char(ZERO);
      return true;
    }
    if (!(abs >= 1e-6 && abs < FIFTEEN_DIGITS)) return false;
    // The fewest decimals k whose nearest integer n gives back the value exactly (n / 10^k is
    // correctly rounded, as reading "n·10^-k" is). With n below 10^15 that n is the only
    // candidate for each k, so the first k found is the shortest form String(value) writes.
    for (let k = 0; k < POWERS_OF_TEN.length; k++) {
      const scale = POWERS_OF_TEN[k] as number;
      const scaled = abs * scale;
      if (scaled >= FIFTEEN_DIGITS) return false;
      const n = Math.round(scaled);
      if (n / scale === abs) {
        if (value < 0) this.char(45);
        this.#decimal(n, k, scale);
        return true;
      }
    }
    return false;
  }

  // Writes n·10^-decimals (n a non-negative integer below 10^15) with trailing zeros dropped.
  #decimal(n: number, decimals: number, scale: number): void {
    const whole = Math.floor(n / scale);
    const fraction = n - whole * scale;
    this.#padded(whole, 1);
    if (fraction === 0) return;
    this.char(46);
    this.#padded(fraction, decimals);
    // The fraction is not zero, so this stops at a digit before the point.
    while (this.#bytes[this.#length - 1] === ZERO) this.#length--;
  }

  // Writes a non-negative integer below 10^15 with at least `width` digits (zeros in front).
  #padded(n: number, width: number): void {
    let count = 1;
    while (count < 16 && (POWERS_OF_TEN[count] as number) <= n) count++;
    if (count < width) count = width;
    this.#reserve(count);
    const b = this.#bytes;
    let at = this.#length + count;
    this.#length = at;
    if (n < 2 ** 31) {
      // Small integers (nearly every field) divide in 32-bit integer arithmetic.
      let rest = n | 0;
      for (let i = 0; i < count; i++) {
        const q = (rest / 10) | 0;
        b[--at] = ZERO + rest - q * 10;
        rest = q;
      }
      return;
    }
    let rest = n;
    for (let i = 0; i < count; i++) {
      const q = Math.floor(rest / 10);
      b[--at] = ZERO + (rest - q * 10);
      rest = q;
    }
  }

  #reserve(extra: number): void {
    if (this.#length + extra <= this.#bytes.length) return;
    let size = this.#bytes.length * 2;
    while (size < this.#length + extra) size *= 2;
    const bytes = new Uint8Array(size);
    bytes.set(this.#bytes.subarray(0, this.#length));
    this.#bytes = bytes;
  }
}
