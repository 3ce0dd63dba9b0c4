// GOES soft X-ray flare classes (0.1–0.8 nm peak flux) and the legacy/true flux conventions.

import type { FlareLevel } from "@/lib/domain/flare-levels";

export const GOES_LETTERS = ["A", "B", "C", "M", "X"] as const;
export type GoesLetter = (typeof GOES_LETTERS)[number];

/** Decade exponent of each letter: A = 1e-8 … X = 1e-4 W m⁻² (NOAA X-ray flare class definition). */
const DECADE_EXPONENT: Readonly<Record<GoesLetter, number>> = { A: -8, B: -7, C: -6, M: -5, X: -4 };

export type FluxConvention = "legacy-scaled" | "true";

export type ParsedGoesClass =
  | { ok: true; letter: GoesLetter; magnitude: number; fluxWm2: number }
  | { ok: false; message: string };

const CLASS_PATTERN = /^([ABCMX])(\d+(?:\.\d+)?)$/;

/**
 * "M2.5" → 2.5e-5 W m⁻². Within A–M the multiplier must satisfy 1.0 ≤ m < 10 (M10 is X1.0);
 * X is open-ended (X28 = 2.8e-3). The flux is built from the decimal text ("2.5e-5"), so it is the
 * nearest double to the class and never falls below its threshold through 2.5 × 1e-5 rounding.
 */
export function parseGoesClass(input: string): ParsedGoesClass {
  const text = input.trim().toUpperCase();
  const match = CLASS_PATTERN.exec(text);
  if (!match) {
    return {
      ok: false,
      message: `"${input}" is not a GOES class: write a letter A, B, C, M or X and a number, e.g. M2.5`,
    };
  }
  const letter = match[1] as GoesLetter;
  const digits = match[2] as string;
  const magnitude = Number(digits);
  if (magnitude < 1) {
    return { ok: false, message: `"${input}": the number after the letter must be at least 1.0` };
  }
  if (letter !== "X" && magnitude >= 10) {
    const next = GOES_LETTERS[GOES_LETTERS.indexOf(letter) + 1] as GoesLetter;
    return {
      ok: false,
      message: `"${input}": below X the number must be less than 10 (${letter}10 is ${next}1.0)`,
    };
  }
  return { ok: true, letter, magnitude, fluxWm2: Number(`${digits}e${DECADE_EXPONENT[letter]}`) };
}

function assertFlux(fluxWm2: number): void {
  if (!Number.isFinite(fluxWm2) || fluxWm2 <= 0) {
    throw new RangeError(`A peak flux must be a finite number > 0 W m⁻²; got ${String(fluxWm2)}`);
  }
}

/** A flux below its class threshold by less than this relative amount still meets it. */
const RELATIVE_TOLERANCE = 1e-9;

function isAtLeast(fluxWm2: number, thresholdWm2: number): boolean {
  return fluxWm2 >= thresholdWm2 * (1 - RELATIVE_TOLERANCE);
}

/**
 * Class of a peak flux with one decimal, e.g. 2.5e-5 → "M2.5" (one decimal: common practice).
 * A magnitude that rounds to 10 moves to the next letter (9.96e-6 → "M1.0"). Fluxes below A1.0
 * (1e-8) have no class in this scheme and throw.
 */
export function formatGoesClass(fluxWm2: number): string {
  assertFlux(fluxWm2);
  if (!isAtLeast(fluxWm2, 1e-8)) {
    throw new RangeError(`A peak flux below A1.0 (1e-8 W m⁻²) has no GOES class; got ${fluxWm2}`);
  }
  for (let i = GOES_LETTERS.length - 1; i >= 0; i--) {
    const letter = GOES_LETTERS[i] as GoesLetter;
    const decade = Number(`1e${DECADE_EXPONENT[letter]}`);
    if (!isAtLeast(fluxWm2, decade)) continue;
    const rounded = Math.max(1, Math.round((fluxWm2 / decade) * 10) / 10);
    if (rounded >= 10 && letter !== "X") return `${GOES_LETTERS[i + 1]}1.0`;
    return `${letter}${rounded.toFixed(1)}`;
  }
  throw new RangeError(`Unreachable: flux ${fluxWm2} is at least A1.0 but matched no letter`);
}

/** Thresholds of the forecast levels (C+ ≥ C1.0, M+ ≥ M1.0, X ≥ X1.0). */
export const LEVEL_THRESHOLD_WM2: Readonly<Record<FlareLevel, number>> = {
  "C+": 1e-6,
  "M+": 1e-5,
  X: 1e-4,
};

/**
 * Whether a peak flux (in the true-flux convention) meets a level. A relative tolerance of 1e-9
 * keeps a legacy M1.0 converted to true flux and back, or a sum of rounding steps, on the
 * threshold it was published at.
 */
export function meetsLevel(fluxWm2: number, level: FlareLevel): boolean {
  assertFlux(fluxWm2);
  const threshold = LEVEL_THRESHOLD_WM2[level];
  if (threshold === undefined) throw new Error(`Unknown flare level "${String(level)}"`);
  return isAtLeast(fluxWm2, threshold);
}

/**
 * Operational GOES 8–15 0.1–0.8 nm fluxes carry a 0.7 factor (to match GOES-7); true flux is the
 * legacy value divided by 0.7 (NOAA GOES-R XRS L2 Users Guide, 2020). GOES-16 onward and
 * reprocessed GOES 13–15 data are already true fluxes.
 */
const LEGACY_SCALE = 0.7;

function assertConvention(convention: FluxConvention): void {
  if (convention !== "legacy-scaled" && convention !== "true") {
    throw new Error(
      `Flux convention must be "legacy-scaled" or "true"; got "${String(convention)}"`,
    );
  }
}

export function toTrueFlux(fluxWm2: number, convention: FluxConvention): number {
  assertFlux(fluxWm2);
  assertConvention(convention);
  return convention === "legacy-scaled" ? fluxWm2 / LEGACY_SCALE : fluxWm2;
}

export function fromTrueFlux(trueFluxWm2: number, convention: FluxConvention): number {
  assertFlux(trueFluxWm2);
  assertConvention(convention);
  return convention === "legacy-scaled" ? trueFluxWm2 * LEGACY_SCALE : trueFluxWm2;
}
