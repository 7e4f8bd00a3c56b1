import { describe, expect, it } from 'vitest';
import { ifNoneMatchHits } from './send-prepared-file.js';

describe('ifNoneMatchHits', () => {
  // RFC 9110 §13.1.2: If-None-Match uses the weak comparison, takes a list, and "*" matches any representation.
  it('matches the same tag, weak or strong, anywhere in a list, and "*"', () => {
    expect(ifNoneMatchHits('"abc"', '"abc"')).toBe(true);
    expect(ifNoneMatchHits('W/"abc"', '"abc"')).toBe(true);
    expect(ifNoneMatchHits('"x", "abc" , "y"', '"abc"')).toBe(true);
    expect(ifNoneMatchHits('*', '"abc"')).toBe(true);
  });

  it('does not match another tag, a tag without its quotes, or no header', () => {
    expect(ifNoneMatchHits('"abd"', '"abc"')).toBe(false);
    expect(ifNoneMatchHits('abc', '"abc"')).toBe(false);
    expect(ifNoneMatchHits(undefined, '"abc"')).toBe(false);
    expect(ifNoneMatchHits('', '"abc"')).toBe(false);
  });
});
