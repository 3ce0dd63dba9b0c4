// McIntosh Zpc sunspot-group classification (McIntosh 1990, Solar Phys. 125, 251).
// Z: modified Zurich class; p: penumbra of the largest spot; c: spot distribution.

export const ZURICH_CLASSES = ["A", "B", "C", "D", "E", "F", "H"] as const;
export const PENUMBRA_CLASSES = ["x", "r", "s", "a", "h", "k"] as const;
export const DISTRIBUTION_CLASSES = ["x", "o", "i", "c"] as const;

export type ZurichClass = (typeof ZURICH_CLASSES)[number];
export type PenumbraClass = (typeof PENUMBRA_CLASSES)[number];
export type DistributionClass = (typeof DISTRIBUTION_CLASSES)[number];
export type McIntoshClass = `${ZurichClass}${PenumbraClass}${DistributionClass}`;

/**
 * Why a combination is not allowed, or null when it is. The rule is McIntosh (1990): A → Axx
 * only; B → p = x, c ∈ {o,i}; H → p ≠ x, c = x; C → p ≠ x, c ∈ {o,i}; D, E, F → p ≠ x,
 * c ∈ {o,i,c} except p = r with c = c. Exactly 60 combinations pass.
 */
function explainCombination(z: ZurichClass, p: PenumbraClass, c: DistributionClass): string | null {
  switch (z) {
    case "A":
      return p === "x" && c === "x" ? null : "A-class groups have no penumbra: only Axx is valid";
    case "B":
      if (p !== "x")
        return "B-class groups have no penumbra: the second letter must be x (Bxo, Bxi)";
      return c === "o" || c === "i"
        ? null
        : "B-class groups are bipolar: the third letter must be o or i (Bxo, Bxi)";
    case "H":
      if (p === "x") return "H-class groups have penumbra: the second letter cannot be x";
      return c === "x" ? null : "H-class groups are unipolar: the third letter must be x";
    case "C":
      if (p === "x") return "C-class groups have penumbra: the second letter cannot be x";
      return c === "o" || c === "i"
        ? null
        : "C-class groups are bipolar with an open or intermediate distribution: o or i";
    default:
      if (p === "x") return `${z}-class groups have penumbra: the second letter cannot be x`;
      if (c === "x") return `${z}-class groups are bipolar: the third letter must be o, i or c`;
      if (p === "r" && c === "c") {
        return `A compact distribution (c) is not combined with rudimentary penumbra (r): ${z}rc is not valid`;
      }
      return null;
  }
}

function enumerateValidClasses(): McIntoshClass[] {
  const valid: McIntoshClass[] = [];
  for (const z of ZURICH_CLASSES) {
    for (const p of PENUMBRA_CLASSES) {
      for (const c of DISTRIBUTION_CLASSES) {
        if (explainCombination(z, p, c) === null) valid.push(`${z}${p}${c}`);
      }
    }
  }
  return valid;
}

/** The 60 valid classes, ordered by Zurich class, then penumbra, then distribution letter. */
export const MCINTOSH_CLASSES: readonly McIntoshClass[] = Object.freeze(enumerateValidClasses());

const VALID_SET: ReadonlySet<string> = new Set(MCINTOSH_CLASSES);

export function isValidMcIntosh(s: unknown): s is McIntoshClass {
  return typeof s === "string" && VALID_SET.has(s);
}

function isMember<T extends string>(list: readonly T[], s: string): s is T {
  return (list as readonly string[]).includes(s);
}

/** A message saying why `s` is not a McIntosh class, or null when it is one. */
export function explainMcIntoshError(s: unknown): string | null {
  if (typeof s !== "string" || s.trim() === "") return "Enter a McIntosh class, e.g. Dkc";
  if (isValidMcIntosh(s)) return null;
  if (s.length !== 3)
    return `A McIntosh class has exactly three letters (Zpc), e.g. Dkc; got "${s}"`;
  const [z, p, c] = [s.charAt(0), s.charAt(1), s.charAt(2)];
  const normalised = z.toUpperCase() + p.toLowerCase() + c.toLowerCase();
  if (normalised !== s && isValidMcIntosh(normalised)) {
    return `Write the first letter upper-case and the other two lower-case: ${normalised}`;
  }
  if (!isMember(ZURICH_CLASSES, z)) {
    const hint = isMember(ZURICH_CLASSES, z.toUpperCase()) ? " (upper-case)" : "";
    return `The first letter (Zurich class) must be one of ${ZURICH_CLASSES.join(", ")}${hint}`;
  }
  if (!isMember(PENUMBRA_CLASSES, p)) {
    const hint = isMember(PENUMBRA_CLASSES, p.toLowerCase()) ? " (lower-case)" : "";
    return `The second letter (penumbra) must be one of ${PENUMBRA_CLASSES.join(", ")}${hint}`;
  }
  if (!isMember(DISTRIBUTION_CLASSES, c)) {
    const hint = isMember(DISTRIBUTION_CLASSES, c.toLowerCase()) ? " (lower-case)" : "";
    return `The third letter (distribution) must be one of ${DISTRIBUTION_CLASSES.join(", ")}${hint}`;
  }
  return explainCombination(z, p, c);
}

export function zurichClassOf(cls: McIntoshClass): ZurichClass {
  return cls.charAt(0) as ZurichClass;
}
