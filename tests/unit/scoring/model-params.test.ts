import { describe, expect, it } from "vitest";
import { MCINTOSH_CLASSES } from "@/lib/domain/mcintosh";
import { parseModelParams } from "@/server/scoring/model-params";
import { DEMO_MODELS } from "@/server/scoring/demo-models";

function demoParams(key: string): unknown {
  const model = DEMO_MODELS.find((m) => m.key === key);
  if (!model) throw new Error(`no demo model ${key}`);
  return structuredClone(model.params);
}

function errorPaths(result: ReturnType<typeof parseModelParams>): string[] {
  return result.ok ? [] : result.fieldErrors.map((e) => e.path);
}

describe("rate-table parameters", () => {
  it("accept the demo table", () => {
    expect(parseModelParams("mcintosh-poisson", demoParams("mcintosh-poisson")).ok).toBe(true);
  });

  it("reject a negative rate, naming the field", () => {
    const params = demoParams("mcintosh-poisson") as { rates: Record<string, { M: number }> };
    params.rates.Dkc!.M = -0.2;
    expect(errorPaths(parseModelParams("mcintosh-poisson", params))).toEqual(["rates.Dkc.M"]);
  });

  it("reject a class that McIntosh (1990) does not allow", () => {
    const params = demoParams("mcintosh-poisson") as { rates: Record<string, unknown> };
    params.rates.Drc = { C: 1, M: 0.1, X: 0.01 };
    const result = parseModelParams("mcintosh-poisson", params);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.fieldErrors[0]?.message).toMatch(/Drc/);
  });

  it("reject a table that leaves classes without rates or fallback", () => {
    const result = parseModelParams("mcintosh-poisson", {
      rates: { Axx: { C: 0.01, M: 0, X: 0 } },
      zurichRates: { D: { C: 0.5, M: 0.05, X: 0.005 } },
      correctionFactor: 1,
    });
    expect(errorPaths(result)).toEqual(["rates"]);
    // Uncovered: all 60 classes but Axx and the 14 D classes (McIntosh 1990 rule).
    const uncovered = MCINTOSH_CLASSES.filter((c) => c !== "Axx" && !c.startsWith("D"));
    expect(uncovered).toHaveLength(45);
    if (!result.ok)
      expect(result.fieldErrors[0]?.message).toContain(`45 classes: ${uncovered.join(", ")}`);
    const fallback = { C: 0.5, M: 0.05, X: 0.005 };
    const everyZurich = {
      A: fallback,
      B: fallback,
      C: fallback,
      D: fallback,
      E: fallback,
      F: fallback,
      H: fallback,
    };
    expect(
      parseModelParams("mcintosh-poisson", {
        rates: {},
        zurichRates: everyZurich,
        correctionFactor: 1,
      }).ok,
    ).toBe(true);
  });

  it("reject a missing or non-positive correction factor", () => {
    const params = demoParams("mcintosh-poisson") as Record<string, unknown>;
    params.correctionFactor = 0;
    expect(errorPaths(parseModelParams("mcintosh-poisson", params))).toEqual(["correctionFactor"]);
    delete params.correctionFactor;
    expect(errorPaths(parseModelParams("mcintosh-poisson", params))).toEqual(["correctionFactor"]);
  });
});

describe("logistic parameters", () => {
  it("accept the demo coefficients", () => {
    expect(parseModelParams("logistic", demoParams("logistic-magnetic")).ok).toBe(true);
  });

  it("reject an unknown transform, input or a missing level", () => {
    const params = demoParams("logistic-magnetic") as {
      levels: Record<string, { predictors: { transform: string; input: string }[] } | undefined>;
    };
    params.levels["M+"]!.predictors[0]!.transform = "log2";
    params.levels["C+"]!.predictors[1]!.input = "sunspotMood";
    delete params.levels.X;
    expect(errorPaths(parseModelParams("logistic", params)).sort()).toEqual(
      ["levels.C+.predictors.1.input", "levels.M+.predictors.0.transform", "levels.X"].sort(),
    );
  });
});

describe("persistence parameters and input forms", () => {
  it("reject a negative prior weight and unknown keys", () => {
    expect(parseModelParams("persistence", demoParams("flare-history")).ok).toBe(true);
    const params = { ...(demoParams("flare-history") as object), priorWeight: -1, extra: 1 };
    expect(errorPaths(parseModelParams("persistence", params)).sort()).toEqual(["", "priorWeight"]);
  });

  it("read JSON text and report syntax errors and unknown kinds", () => {
    const text = JSON.stringify(demoParams("flare-history"));
    expect(parseModelParams("persistence", text).ok).toBe(true);
    const broken = parseModelParams("persistence", "{ priorWeight: ");
    expect(broken.ok).toBe(false);
    if (!broken.ok) expect(broken.fieldErrors[0]?.message).toMatch(/Not valid JSON/);
    expect(errorPaths(parseModelParams("neural" as "logistic", {}))).toEqual(["kind"]);
  });
});
