/** A least-recently-used cache of rendered files, bounded by the total size of what it holds. */
export class RenderCache<T extends { text: string }> {
  private readonly entries = new Map<string, T>();
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
    const size = value.text.length * 2;
    if (size > this.maxBytes) return;
    const old = this.entries.get(key);
    if (old !== undefined) {
      this.bytes -= old.text.length * 2;
      this.entries.delete(key);
    }
    while (this.bytes + size > this.maxBytes) {
      const oldest = this.entries.keys().next();
      if (oldest.done) break;
      const dropped = this.entries.get(oldest.value);
      this.entries.delete(oldest.value);
      this.bytes -= (dropped?.text.length ?? 0) * 2;
    }
    this.entries.set(key, value);
    this.bytes += size;
  }
}
