// A small seeded PRNG for reproducible random tests: mulberry32 (Tommy Ettinger's
// public-domain 32-bit generator). Same seed, same sequence, on every machine.

export type Random = {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform in [low, high). */
  between(low: number, high: number): number;
  /** An integer in [0, count). */
  index(count: number): number;
};

export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    between: (low, high) => low + (high - low) * next(),
    index: (count) => Math.floor(next() * count),
  };
}
