import { describe, expect, it } from "vitest";
import {
  DISTRIBUTION_CLASSES,
  explainMcIntoshError,
  isValidMcIntosh,
  MCINTOSH_CLASSES,
  PENUMBRA_CLASSES,
  ZURICH_CLASSES,
  zurichClassOf,
} from "@/lib/domain/mcintosh";

// The 60 classes written out by Zurich class from the rule of McIntosh (1990, Solar Phys. 125,
// 251): A → Axx; B → Bxo, Bxi; C → p ≠ x with o/i; H → p ≠ x with x; D/E/F → p ≠ x with o/i/c
// except rc.
const PUBLISHED_CLASSES = [
  "Axx",
  "Bxo",
  "Bxi",
  "Cro",
  "Cri",
  "Cso",
  "Csi",
  "Cao",
  "Cai",
  "Cho",
  "Chi",
  "Cko",
  "Cki",
  "Dro",
  "Dri",
  "Dso",
  "Dsi",
  "Dsc",
  "Dao",
  "Dai",
  "Dac",
  "Dho",
  "Dhi",
  "Dhc",
  "Dko",
  "Dki",
  "Dkc",
  "Ero",
  "Eri",
  "Eso",
  "Esi",
  "Esc",
  "Eao",
  "Eai",
  "Eac",
  "Eho",
  "Ehi",
  "Ehc",
  "Eko",
  "Eki",
  "Ekc",
  "Fro",
  "Fri",
  "Fso",
  "Fsi",
  "Fsc",
  "Fao",
  "Fai",
  "Fac",
  "Fho",
  "Fhi",
  "Fhc",
  "Fko",
  "Fki",
  "Fkc",
  "Hrx",
  "Hsx",
  "Hax",
  "Hhx",
  "Hkx",
];

// The same rule, stated independently of the module, for the exhaustive 7 × 6 × 4 check.
function isAllowedByRule(z: string, p: string, c: string): boolean {
  if (z === "A") return p === "x" && c === "x";
  if (z === "B") return p === "x" && (c === "o" || c === "i");
  if (z === "H") return p !== "x" && c === "x";
  if (z === "C") return p !== "x" && (c === "o" || c === "i");
  return p !== "x" && c !== "x" && !(p === "r" && c === "c");
}

describe("McIntosh classes (McIntosh 1990)", () => {
  it("lists exactly the 60 valid classes", () => {
    expect(PUBLISHED_CLASSES).toHaveLength(60);
    expect([...MCINTOSH_CLASSES].sort()).toEqual([...PUBLISHED_CLASSES].sort());
    for (const cls of PUBLISHED_CLASSES) expect(isValidMcIntosh(cls), cls).toBe(true);
  });

  it("accepts exactly the rule's 60 of all 168 letter combinations", () => {
    let allowed = 0;
    let combos = 0;
    for (const z of ZURICH_CLASSES) {
      for (const p of PENUMBRA_CLASSES) {
        for (const c of DISTRIBUTION_CLASSES) {
          combos++;
          const isAllowed = isAllowedByRule(z, p, c);
          if (isAllowed) allowed++;
          expect(isValidMcIntosh(`${z}${p}${c}`), `${z}${p}${c}`).toBe(isAllowed);
          expect(explainMcIntoshError(`${z}${p}${c}`) === null, `${z}${p}${c}`).toBe(isAllowed);
        }
      }
    }
    expect(combos).toBe(168);
    expect(allowed).toBe(60);
  });

  it("keeps a stable order: Zurich class, then penumbra, then distribution", () => {
    expect(MCINTOSH_CLASSES[0]).toBe("Axx");
    expect(MCINTOSH_CLASSES.slice(1, 3)).toEqual(["Bxo", "Bxi"]);
    expect(MCINTOSH_CLASSES[MCINTOSH_CLASSES.length - 1]).toBe("Hkx");
    expect(MCINTOSH_CLASSES.indexOf("Dkc")).toBeLessThan(MCINTOSH_CLASSES.indexOf("Ero"));
  });

  it.each([
    ["Drc", /rudimentary/],
    ["Axo", /only Axx is valid/],
    ["Bxc", /o or i/],
    ["Hxx", /cannot be x/],
    ["Cxo", /cannot be x/],
    ["Ckc", /o or i/],
    ["Dkx", /o, i or c/],
  ])("rejects %s and says why", (cls, message) => {
    expect(isValidMcIntosh(cls)).toBe(false);
    expect(explainMcIntoshError(cls)).toMatch(message);
  });

  it("accepts exact case only and hints at the case mistake", () => {
    expect(isValidMcIntosh("dkc")).toBe(false);
    expect(isValidMcIntosh("DKC")).toBe(false);
    expect(explainMcIntoshError("dkc")).toMatch(/upper-case.*Dkc/);
    expect(explainMcIntoshError("DKC")).toMatch(/Dkc/);
    expect(explainMcIntoshError("Dkc")).toBeNull();
  });

  it("explains malformed input", () => {
    expect(explainMcIntoshError("")).toMatch(/Enter a McIntosh class/);
    expect(explainMcIntoshError("Dk")).toMatch(/three letters/);
    expect(explainMcIntoshError("Gkc")).toMatch(/first letter/);
    expect(explainMcIntoshError("Dzc")).toMatch(/second letter/);
    expect(explainMcIntoshError("Dkq")).toMatch(/third letter/);
    expect(isValidMcIntosh(42)).toBe(false);
  });

  it("gives the Zurich class of a valid class", () => {
    expect(zurichClassOf("Ekc")).toBe("E");
    expect(zurichClassOf("Hsx")).toBe("H");
    expect(zurichClassOf("Axx")).not.toBe("B");
  });
});
