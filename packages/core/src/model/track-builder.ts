import {
  createFixColumns,
  FIX_COLUMN_NAMES,
  type Fix,
  type FixColumns,
  type Provenance,
  type Track,
  type TrackRole,
} from './track.js';

/** Grows a track's columns fix by fix (amortised doubling), then hands out a right-sized `Track`. */
export class TrackBuilder {
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

  /** Number of fixes pushed so far. */
  get length(): number {
    return this.#length;
  }

  /** Starts a new segment at the next pushed fix (a GPX `trkseg`, a gap the reader saw). */
  startSegment(): void {
    this.#segmentPending = true;
  }

  /** Appends one fix; optional values left out become `NaN`. `sourceLine` is 1-based, 0 when unknown. */
  push(fix: Fix, sourceLine = 0): void {
    if (this.#length === this.#capacity) this.#grow();
    const i = this.#length;
    if (this.#segmentPending) {
      this.#segmentStarts.push(i);
      this.#segmentPending = false;
    }
    for (const name of FIX_COLUMN_NAMES) {
      const value = fix[name];
      this.#columns[name][i] = value === undefined ? Number.NaN : value;
    }
    this.#lines[i] = sourceLine;
    this.#length = i + 1;
  }

  /** Returns the finished track; the builder should not be used afterwards. */
  build(meta: { id: string; role: TrackRole; name?: string; provenance: Provenance }): Track {
    const n = this.#length;
    const columns = {} as FixColumns;
    for (const name of FIX_COLUMN_NAMES) columns[name] = this.#columns[name].slice(0, n);
    return {
      ...meta,
      length: n,
      columns,
      segmentStarts: n === 0 ? [] : [...this.#segmentStarts],
      sourceLines: this.#lines.slice(0, n),
    };
  }

  #grow(): void {
    const capacity = this.#capacity * 2;
    const columns = createFixColumns(capacity);
    for (const name of FIX_COLUMN_NAMES) columns[name].set(this.#columns[name]);
    const lines = new Uint32Array(capacity);
    lines.set(this.#lines);
    this.#columns = columns;
    this.#lines = lines;
    this.#capacity = capacity;
  }
}
