/** A least-recently-used cache of rendered files, bounded by the total size of what it holds. */
export class RenderCache<T extends { byteSize: number }> {
  private readonly entries = new Map<string, T>();
  private readonly pending = new Map<string, Promise<T>>();
  private bytes = 0;

  constructor(private readonly maxBytes: number) {}

  /** The cached value, made the most recently used; `undefined` when absent. */
  get(key: string): T | undefined {
    const value = this.entries.get(key);
    if (value === undefined) return undefined;
    this.entries.delete(key);
    this.entries.set(key, value);
    return value;
  }

  /** Keeps a value unless it alone exceeds the bound, dropping the least recently used to make room. */
  set(key: string, value: T): void {
    const size = value.byteSize;
    if (size > this.maxBytes) return;
    const old = this.entries.get(key);
    if (old !== undefined) {
      this.bytes -= old.byteSize;
      this.entries.delete(key);
    }
    while (this.bytes + size > this.maxBytes) {
      const oldest = this.entries.keys().next();
      if (oldest.done) break;
      const dropped = this.entries.get(oldest.value);
      this.entries.delete(oldest.value);
      this.bytes -= dropped?.byteSize ?? 0;
    }
    this.entries.set(key, value);
    this.bytes += size;
  }

  /**
   * The cached value, or the one `create` makes; concurrent callers of one key share one `create`.
   * `create` returns the key its value really belongs to (the inputs may have moved on since `key`
   * was made), and the value is kept under that key.
   */
  async getOrCreate(key: string, create: () => Promise<{ key: string; value: T }>): Promise<T> {
    const cached = this.get(key);
    if (cached !== undefined) return cached;
    const waiting = this.pending.get(key);
    if (waiting !== undefined) return waiting;
    const made = create().then(({ key: actual, value }) => {
      this.set(actual, value);
      return value;
    });
    this.pending.set(key, made);
    try {
      return await made;
    } finally {
      this.pending.delete(key);
    }
  }
}
