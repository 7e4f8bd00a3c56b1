import { describe, expect, it } from 'vitest';
import { RenderCache } from './render-cache.js';

describe('RenderCache', () => {
  it('keeps values up to its size bound, dropping the least recently used first', () => {
    const cache = new RenderCache<{ text: string; byteSize: number }>(20);
    cache.set('a', { text: 'aaaa', byteSize: 8 });
    cache.set('b', { text: 'bbbb', byteSize: 8 });
    expect(cache.get('a')?.text).toBe('aaaa'); // a is now the most recently used
    cache.set('c', { text: 'cccc', byteSize: 8 }); // 24 bytes > 20: b goes
    expect(cache.get('b')).toBeUndefined();
    expect(cache.get('a')?.text).toBe('aaaa');
    expect(cache.get('c')?.text).toBe('cccc');
  });

  it('does not keep a value larger than the whole bound', () => {
    const cache = new RenderCache<{ text: string; byteSize: number }>(10);
    cache.set('big', { text: 'x'.repeat(6), byteSize: 12 });
    expect(cache.get('big')).toBeUndefined();
  });
});
