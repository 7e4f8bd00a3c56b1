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

/** Up to this many fixes of a batch are copied one by one (cheaper than a view per column). */
const SMALL_BATCH = 16;

/** Grows a track's columns by single fixes or whole batches (amortised doubling), then hands out a right-sized `Track`. */
export class FixColumnAppender {
  #capacity: number;
  #length = 0;
  #columns: FixColumns;
  #lines: Uint32Array;
  #segmentStarts: number[] = [];
  #segmentPending = true;
  /** The batch (and own columns) the column pairs below were found for. */
  #pairedBatch: FixBatch | undefined;
  #pairedColumns: FixColumns | undefined;
  #sources: Float64Array[] = [];
  #targets: Float64Array[] = [];

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
    // Readers hand on the same batch again and again, often with a fix or two (NMEA between other
    // sentences): the column pairs are found once per batch, and a few fixes are copied one by one
    // rather than through a view per column.
    if (batch !== this.#pairedBatch || this.#columns !== this.#pairedColumns) this.#pair(batch);
    const sources = this.#sources;
    const targets = this.#targets;
    if (n <= SMALL_BATCH) {
      for (let c = 0; c < sources.length; c++) {
        const source = sources[c] as Float64Array;
        const target = targets[c] as Float64Array;
        for (let i = 0; i < n; i++) target[at + i] = source[i] as number;
      }
      for (let i = 0; i < n; i++) this.#lines[at + i] = batch.lines[i] as number;
    } else {
      for (let c = 0; c < sources.length; c++)
        (targets[c] as Float64Array).set((sources[c] as Float64Array).subarray(0, n), at);
      this.#lines.set(batch.lines.subarray(0, n), at);
    }
    this.#length = at + n;
  }

  #pair(batch: FixBatch): void {
    this.#sources = [];
    this.#targets = [];
    for (const name of FIX_COLUMN_NAMES) {
      const source = batch.columns[name];
      // the target is already NaN where no column is given (columns are created NaN-filled)
      if (source === undefined) continue;
      this.#sources.push(source);
      this.#targets.push(this.#columns[name]);
    }
    this.#pairedBatch = batch;
    this.#pairedColumns = this.#columns;
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
