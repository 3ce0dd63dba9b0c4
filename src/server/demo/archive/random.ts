// Seeded random streams and the distributions the demo archive draws from (pure; no Math.random).

import { createMulberry32 } from "@/server/verification/prng";

export type Random = () => number;

/**
 * A 32-bit seed for a named stream: FNV-1a over the label (Fowler–Noll–Vo hash; common practice),
 * mixed with the archive seed by MurmurHash3's fmix32 finaliser (common practice). Separate streams
 * keep, for example, the flare draws unchanged when the forecaster's noise is retuned.
 */
export function deriveSeed(seed: number, label: string): number {
  if (!Number.isInteger(seed)) throw new Error(`A seed must be an integer; got ${String(seed)}`);
  let h = 0x811c9dc5;
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  h ^= seed >>> 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

export function createStream(seed: number, label: string): Random {
  return createMulberry32(deriveSeed(seed, label));
}

/** Uniform on [low, high). */
export function drawUniform(random: Random, low: number, high: number): number {
  return low + (high - low) * random();
}

/** Standard normal by the Box–Muller transform (Box & Muller 1958; common practice). */
export function drawNormal(random: Random, mean = 0, sd = 1): number {
  const u1 = 1 - random(); // (0, 1], so the logarithm stays finite
  const u2 = random();
  return mean + sd * Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

/** Exponential waiting time with the given rate, by inversion: −ln(1 − u)/rate. */
export function drawExponential(random: Random, rate: number): number {
  if (!(rate > 0)) throw new RangeError(`A rate must be > 0; got ${rate}`);
  return -Math.log(1 - random()) / rate;
}

/**
 * Poisson count by Knuth's multiplication method (Knuth, TAOCP vol. 2, §3.4.1): multiply
 * uniforms until the product falls below e^−λ. Exact, and fast for the small rates used here.
 */
export function drawPoisson(random: Random, lambda: number): number {
  if (!(lambda >= 0) || lambda > 50) {
    throw new RangeError(`Poisson rate must lie in [0, 50]; got ${lambda}`);
  }
  const limit = Math.exp(-lambda);
  let k = 0;
  let product = random();
  while (product > limit) {
    k++;
    product *= random();
  }
  return k;
}

/**
 * A value from a density ∝ x^−α on [xmin, xmax] by inverting its distribution function:
 * x = (xmin^(1−α) − u (xmin^(1−α) − xmax^(1−α)))^(1/(1−α)), α ≠ 1 (common practice; see
 * Clauset, Shalizi & Newman 2009, SIAM Review 51, 661, appendix D).
 */
export function drawPowerLaw(random: Random, xmin: number, xmax: number, alpha: number): number {
  if (!(xmin > 0 && xmax > xmin) || alpha === 1) {
    throw new RangeError(`Power law needs 0 < xmin < xmax and α ≠ 1`);
  }
  const e = 1 - alpha;
  const low = xmin ** e;
  const high = xmax ** e;
  return (low - random() * (low - high)) ** (1 / e);
}

/** Fisher–Yates shuffle of a copy (Knuth, TAOCP vol. 2, Algorithm P). */
export function shuffleCopy<T>(items: readonly T[], random: Random): T[] {
  const out = items.slice();
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [out[i], out[j]] = [out[j] as T, out[i] as T];
  }
  return out;
}
