// A small seeded generator (mulberry32), so one seed gives the same cases on
// every run.
export type Random = {
  /** A number in [0, 1). */
  next(): number;
  /** A whole number in [0, n). */
  int(n: number): number;
  pick<T>(items: readonly T[]): T;
  chance(p: number): boolean;
  /** One of the items, each as likely as its weight. */
  weighted<T>(items: readonly (readonly [number, T])[]): T;
};

export function random(seed: number): Random {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (n: number) => Math.floor(next() * n);
  return {
    next,
    int,
    pick: (items) => items[int(items.length)],
    chance: (p) => next() < p,
    weighted(items) {
      const total = items.reduce((sum, [weight]) => sum + weight, 0);
      let at = next() * total;
      for (const [weight, item] of items) {
        if ((at -= weight) < 0) return item;
      }
      return items[items.length - 1][1];
    },
  };
}
