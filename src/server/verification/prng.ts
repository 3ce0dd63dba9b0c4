// Seeded pseudo-random numbers for reproducible resampling (bootstrap) and synthetic data.

/**
 * mulberry32, a 32-bit generator by Tommy Ettinger (public domain; common practice for small
 * seeded streams in JavaScript). Period 2³², ample for resampling indices; not cryptographic.
 * Returns a function yielding doubles in [0, 1).
 */
export function createMulberry32(seed: number): () => number {
  if (!Number.isInteger(seed)) throw new Error(`A seed must be an integer; got ${String(seed)}`);
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
