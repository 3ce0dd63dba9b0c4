// Declared predictor transforms of statistical models, with the domain each one needs.

export const TRANSFORM_NAMES = ["identity", "log10", "log10p1", "ln", "sqrt"] as const;
export type TransformName = (typeof TRANSFORM_NAMES)[number];

interface Transform {
  /** The transformed value, or null when x lies outside the domain. */
  apply: (x: number) => number | null;
  domain: string;
}

export const TRANSFORMS: Readonly<Record<TransformName, Transform>> = {
  identity: { apply: (x) => x, domain: "any finite number" },
  log10: { apply: (x) => (x > 0 ? Math.log10(x) : null), domain: "x > 0" },
  // log10(1 + x) lets counts and lengths that may be 0 enter on a log scale.
  log10p1: { apply: (x) => (x > -1 ? Math.log10(1 + x) : null), domain: "x > −1" },
  ln: { apply: (x) => (x > 0 ? Math.log(x) : null), domain: "x > 0" },
  sqrt: { apply: (x) => (x >= 0 ? Math.sqrt(x) : null), domain: "x ≥ 0" },
};
