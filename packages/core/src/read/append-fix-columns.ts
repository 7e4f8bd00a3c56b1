import {
  createFixColumns,
  FIX_COLUMN_NAMES,
  type Fix,
  type FixColumns,
  type Provenance,
  type Track,
  type TrackRole,
} from '../model/track.js';
import type { FixBatch } from './read-event.js';

/** Grows a track's columns by single fixes or whole batches (amortised doubling), then hands out a right-sized `Track`. */
export class FixColumnAppender {
  #capacity: number;
  #length = 0;
  #columns: FixColumns;
  #lines: Uint32Array;
  #segmentStarts: number[] = [];
  #segmentPending = true;

  constructor(initialCapacity = 1024) {
    this.#capacity = Math.max(1, initialCapacity);
    this.#columns = createFixColumns(this.#capacity);
    this.#lines = new Uint32Array(this.#capacity);
  }

  /** Fixes appended so far. */
  get length(): number {
    return this.#length;
  }

  /** The next fix starts a new segment. */
  startSegment(): void {
    this.#segmentPending = true;
  }

  /** Appends one fix; optional values left out become `NaN`. */
  push(fix: Fix, line: number): void {
    this.#reserve(1);
    const i = this.#length;
    this.#markSegment(i);
    for (const name of FIX_COLUMN_NAMES) {
      const value = fix[name];
      this.#columns[name][i] = value === undefined ? Number.NaN : value;
    }
    this.#lines[i] = line;
    this.#length = i + 1;
  }

  /** Appends the first `batch.count` fixes of a batch, copying them. */
  pushBatch(batch: FixBatch): void {
    const n = batch.count;
    if (n === 0) return;
    this.#reserve(n);
    const at = this.#length;
    this.#markSegment(at);
    for (const name of FIX_COLUMN_NAMES) {
      const source = batch.columns[name];
      // the target is already NaN where no column is given (columns are created NaN-filled)
      if (source !== undefined) this.#columns[name].set(source.subarray(0, n), at);
    }
    this.#lines.set(batch.lines.subarray(0, n), at);
    this.#length = at + n;
  }

  /** The finished track. */
  build(meta: { id: string; role: TrackRole; name?: string; provenance: Provenance }): Track {
    const n = this.#length;
    const columns = {} as FixColumns;
    // Nearly right-sized (a good capacity hint): hand the arrays over as views instead of copying
    // them, at most 10 % of the buffer unused; otherwise copy to the exact length.
    const keep = n >= 0.9 * this.#capacity;
    for (const name of FIX_COLUMN_NAMES)
      columns[name] = keep ? this.#columns[name].subarray(0, n) : this.#columns[name].slice(0, n);
    return {
      ...meta,
      length: n,
      columns,
      segmentStarts: n === 0 ? [] : [...this.#segmentStarts],
      sourceLines: this.#lines.slice(0, n),
    };
  }

  #markSegment(i: number): void {
    if (this.#segmentPending) {
      this.#segmentStarts.push(i);
      this.#segmentPending = false;
    }
  }

  #reserve(extra: number): void {
    if (this.#length + extra <= this.#capacity) return;
    let capacity = this.#capacity * 2;
    while (capacity < this.#length + extra) capacity *= 2;
    const columns = createFixColumns(capacity);
    for (const name of FIX_COLUMN_NAMES) columns[name].set(this.#columns[name].subarray(0, this.#length));
    const lines = new Uint32Array(capacity);
    lines.set(this.#lines.subarray(0, this.#length));
    this.#columns = columns;
    this.#lines = lines;
    this.#capacity = capacity;
  }
}
