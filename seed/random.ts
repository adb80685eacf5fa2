/**
 * A small seeded random source (mulberry32, a public-domain 32-bit generator)
 * so every scenario is the same on every machine for the same seed.
 */
export interface Rng {
  /** uniform in [0, 1) */
  next(): number;
  /** integer in [lo, hi] */
  int(lo: number, hi: number): number;
  pick<T>(items: readonly T[]): T;
}

export function rng(seed: number): Rng {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (lo, hi) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: (items) => {
      if (items.length === 0) throw new Error("pick from an empty list");
      return items[Math.floor(next() * items.length)] as (typeof items)[number];
    },
  };
}
