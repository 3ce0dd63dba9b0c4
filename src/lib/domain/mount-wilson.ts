// Mount Wilson magnetic classes (Hale et al. 1919, ApJ 49, 153; delta added by Künzel 1960 —
// references from memory; the eight classes are those of the product brief).
// A delta configuration has opposite-polarity umbrae within one penumbra, less than 2° apart.

export const MOUNT_WILSON_CLASSES = [
  "alpha",
  "beta",
  "gamma",
  "beta-gamma",
  "delta",
  "beta-delta",
  "beta-gamma-delta",
  "gamma-delta",
] as const;

export type MountWilsonClass = (typeof MOUNT_WILSON_CLASSES)[number];

/** The Greek-letter form used in the trade (α, β-γ-δ, ...), for display only. */
export const MOUNT_WILSON_SYMBOLS: Readonly<Record<MountWilsonClass, string>> = {
  alpha: "α",
  beta: "β",
  gamma: "γ",
  "beta-gamma": "β-γ",
  delta: "δ",
  "beta-delta": "β-δ",
  "beta-gamma-delta": "β-γ-δ",
  "gamma-delta": "γ-δ",
};

const VALID_SET: ReadonlySet<string> = new Set(MOUNT_WILSON_CLASSES);

export function isValidMountWilson(s: unknown): s is MountWilsonClass {
  return typeof s === "string" && VALID_SET.has(s);
}

/** A message saying why `s` is not a Mount Wilson class, or null when it is one. */
export function explainMountWilsonError(s: unknown): string | null {
  if (isValidMountWilson(s)) return null;
  if (typeof s === "string" && isValidMountWilson(s.trim().toLowerCase())) {
    return `Write the class in lower case: ${s.trim().toLowerCase()}`;
  }
  return `Mount Wilson class must be one of: ${MOUNT_WILSON_CLASSES.join(", ")}`;
}

export function hasDelta(cls: MountWilsonClass): boolean {
  return cls === "delta" || cls.endsWith("-delta");
}
