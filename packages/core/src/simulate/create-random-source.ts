import { xoroshiro128plus } from 'pure-rand/generator/XoroShiro';
import { InvalidArgumentError } from '../errors.js';

/** A seeded stream of random numbers; the same seed always gives the same sequence. */
export interface RandomSource {
  /** A uniform number in [0, 1). */
  uniform(): number;
  /** A uniform number in [min, max). */
  between(min: number, max: number): number;
  /** A normally distributed number with the given mean and standard deviation (Box–Muller). */
  normal(mean?: number, sigma?: number): number;
  /** A uniform whole number in [min, max], both included. */
  integer(min: number, max: number): number;
  /** Whether an event with probability `p` happens. */
  chance(p: number): boolean;
  /** One element of a non-empty list, uniformly. */
  pick<T>(items: readonly T[]): T;
}

const TWO_POW_32 = 4294967296;
const WARM_UP_DRAWS = 16;

/**
 * Creates a random source from a whole-number seed, on pure-rand's xoroshiro128+ generator.
 * Deterministic: the same seed yields the same numbers on every run and machine with the same
 * JavaScript engine. Throws `InvalidArgumentError` for a seed that is not a safe integer.
 */
export function createRandomSource(seed: number): RandomSource {
  if (!Number.isSafeInteger(seed)) throw new InvalidArgumentError(`the seed must be a whole number, got ${seed}`);
  // pure-rand takes a 32-bit seed; fold the upper bits in so large seeds still differ, and mix it,
  // because xoroshiro's first outputs from nearby small seeds are nearly alike.
  const generator = xoroshiro128plus(mix32((seed ^ Math.floor(seed / TWO_POW_32)) | 0) | 0);
  for (let i = 0; i < WARM_UP_DRAWS; i++) generator.unsafeNext();
  let spareNormal = Number.NaN;
  const uniform = (): number => {
    // 53 random bits from two 32-bit draws, so values are spread evenly over [0, 1).
    const high = (generator.unsafeNext() >>> 0) >>> 5;
    const low = (generator.unsafeNext() >>> 0) >>> 6;
    return (high * 67108864 + low) / 9007199254740992;
  };
  return {
    uniform,
    between: (min, max) => min + (max - min) * uniform(),
    normal(mean = 0, sigma = 1) {
      if (!Number.isNaN(spareNormal)) {
        const value = spareNormal;
        spareNormal = Number.NaN;
        return mean + sigma * value;
      }
      let u = uniform();
      while (u === 0) u = uniform();
      const v = uniform();
      const radius = Math.sqrt(-2 * Math.log(u));
      spareNormal = radius * Math.sin(2 * Math.PI * v);
      return mean + sigma * radius * Math.cos(2 * Math.PI * v);
    },
    integer: (min, max) => min + Math.floor(uniform() * (max - min + 1)),
    chance: (p) => uniform() < p,
    pick<T>(items: readonly T[]): T {
      if (items.length === 0) throw new InvalidArgumentError('cannot pick from an empty list');
      return items[Math.floor(uniform() * items.length)] as T;
    },
  };
}

/**
 * Derives an independent whole-number seed for item `index` of a seeded collection (e.g. dive 17
 * of a season), so each item can be generated alone and in any order. A 32-bit integer mix
 * (MurmurHash3's `fmix32` finaliser, constants from memory); deterministic.
 */
export function deriveSeed(seed: number, index: number): number {
  return mix32((Math.imul(seed | 0, 0x9e3779b1) + Math.imul(index + 1, 0x85ebca6b)) | 0);
}

function mix32(value: number): number {
  let z = Math.imul(value ^ (value >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  z ^= z >>> 16;
  return z >>> 0;
}
