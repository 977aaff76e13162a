// A small seeded PRNG for the demo scenario, so the same `now` always yields the same data.
// mulberry32: 32-bit state, fast, good enough for picking demo values (never for secrets).

export type Random = {
  /** Uniform in [0, 1). */
  next(): number;
  /** Integer in [min, max], both inclusive. */
  int(min: number, max: number): number;
  /** One element of a non-empty list. */
  pick<T>(items: readonly T[]): T;
  /** true with probability p. */
  chance(p: number): boolean;
  /** A version-4-shaped UUID made from the stream (deterministic, unlike gen_random_uuid()). */
  uuid(): string;
  /** Lower-case hex of n bytes, for invented ids such as `cs_test_demo_…`. */
  hex(bytes: number): string;
  /** n bytes. */
  bytes(n: number): Uint8Array;
};

export function mulberry32(seed: number): Random {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (min: number, max: number): number => min + Math.floor(next() * (max - min + 1));
  const bytes = (n: number): Uint8Array => {
    const out = new Uint8Array(n);
    for (let i = 0; i < n; i += 1) out[i] = int(0, 255);
    return out;
  };
  const toHex = (b: Uint8Array): string => Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('');
  return {
    next,
    int,
    pick<T>(items: readonly T[]): T {
      if (items.length === 0) throw new Error('pick from an empty list');
      return items[int(0, items.length - 1)] as T;
    },
    chance: (p) => next() < p,
    uuid() {
      const b = bytes(16);
      b[6] = ((b[6] ?? 0) & 0x0f) | 0x40;
      b[8] = ((b[8] ?? 0) & 0x3f) | 0x80;
      const h = toHex(b);
      return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
    },
    hex: (n) => toHex(bytes(n)),
    bytes,
  };
}

/** The demo scenario's fixed seed. */
export const DEMO_SEED = 0x5eed_c0ff;
