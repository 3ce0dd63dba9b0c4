import { describe, expect, it } from "vitest";
import { modelImportSchema, REGISTRY_MODEL_KINDS } from "@/lib/schemas/models";
import { paramsFromCsv } from "@/server/forecast/model-csv";
import { MODEL_KINDS, parseModelParams } from "@/server/scoring/model-params";

// Invented coefficients; only their placement in the parameter object is under test.
const LOGISTIC = [
  "level,term,transform,coefficient",
  "C+,intercept,,-2",
  "C+,logR,identity,0.5",
  "M+,intercept,,-4",
  "M+,unsignedFluxMx,log10,0.1",
  "X,intercept,,-6",
];

describe("logistic coefficients from CSV", () => {
  it("puts intercepts and predictors under their levels, identity by default", () => {
    const result = paramsFromCsv({ kind: "logistic", csv: LOGISTIC.join("\n"), windowHours: 24 });
    expect(result).toEqual({
      ok: true,
      params: {
        windowHours: 24,
        levels: {
          "C+": {
            intercept: -2,
            predictors: [{ input: "logR", transform: "identity", coefficient: 0.5 }],
          },
          "M+": {
            intercept: -4,
            predictors: [{ input: "unsignedFluxMx", transform: "log10", coefficient: 0.1 }],
          },
          X: { intercept: -6, predictors: [] },
        },
      },
    });
    expect(result.ok && parseModelParams("logistic", result.params).ok).toBe(true);
  });

  it("leaves a missing level to the parameter schema, and names a bad level or second intercept", () => {
    const noX = paramsFromCsv({
      kind: "logistic",
      csv: LOGISTIC.slice(0, -1).join("\n"),
      windowHours: 24,
    });
    const checked = noX.ok ? parseModelParams("logistic", noX.params) : null;
    expect(checked?.ok === false && checked.fieldErrors.map((e) => e.path)).toEqual(["levels.X"]);
    const bad = paramsFromCsv({
      kind: "logistic",
      csv: [...LOGISTIC, "M,logR,identity,1", "X,intercept,,-5"].join("\n"),
      windowHours: 24,
    });
    expect(bad).toEqual({
      ok: false,
      fields: {
        "csv.6.level": 'Row 6: the level must be C+, M+ or X; got "M".',
        "csv.7.term": "Row 7: X has an intercept already.",
      },
    });
  });
});

describe("rate tables from CSV", () => {
  it("sends single Zurich letters to the fallback rates and full classes to the table", () => {
    const result = paramsFromCsv({
      kind: "mcintosh-poisson",
      csv: "Class,C,M,X\nD,0.3,0.05,0.005\nDkc,0.9,0.2,0.05",
      correctionFactor: 1,
    });
    expect(result).toEqual({
      ok: true,
      params: {
        rates: { Dkc: { C: 0.9, M: 0.2, X: 0.05 } },
        zurichRates: { D: { C: 0.3, M: 0.05, X: 0.005 } },
        correctionFactor: 1,
      },
    });
  });

  it("names a class McIntosh (1990) does not allow, a repeated class and missing columns", () => {
    const bad = paramsFromCsv({
      kind: "mcintosh-poisson",
      csv: "class,C,M,X\nDrc,1,0.1,0\nDkc,1,0.1,0\nDkc,1,0.1,0",
      correctionFactor: 1,
    });
    expect(bad.ok === false && Object.keys(bad.fields)).toEqual(["csv.1.class", "csv.3.class"]);
    expect(bad.ok === false && bad.fields["csv.1.class"]).toMatch(/Drc is not valid/);
    expect(
      paramsFromCsv({ kind: "mcintosh-poisson", csv: "class,C,M\nDkc,1,0.1", correctionFactor: 1 }),
    ).toEqual({
      ok: false,
      fields: { csv: "The table needs the columns class, C, M, X; missing: X." },
    });
    expect(paramsFromCsv({ kind: "persistence", csv: "a,b\n1,2" }).ok).toBe(false);
  });
});

describe("the import request", () => {
  const base = {
    key: "mcintosh-poisson",
    version: "2031-1",
    kind: "mcintosh-poisson",
    name: "Rates",
    provenance: "Fitted by the office, 2031.",
  };

  it("asks for the number that belongs to a CSV table's kind", () => {
    const issues = (v: object) => {
      const r = modelImportSchema.safeParse(v);
      return r.success ? [] : r.error.issues.map((i) => i.path.join("."));
    };
    expect(issues({ ...base, format: "csv", csv: "class,C,M,X" })).toEqual(["correctionFactor"]);
    expect(issues({ ...base, format: "csv", csv: "class,C,M,X", correctionFactor: "0.8" })).toEqual(
      [],
    );
    expect(
      issues({ ...base, kind: "logistic", format: "csv", csv: "level,term,transform,coefficient" }),
    ).toEqual(["windowHours"]);
    expect(issues({ ...base, params: "" })).toEqual(["params"]);
  });

  it("offers exactly the kinds the scoring code knows", () => {
    expect([...REGISTRY_MODEL_KINDS].sort()).toEqual([...MODEL_KINDS].sort());
  });
});
