import { describe, expect, it } from "vitest";
import { buildCases, sharedCases } from "@/server/verification-desk/cases";

const HOUR = 3_600_000;
const T = Date.parse("2031-09-01T06:00:00Z");
const row = (
  source: string,
  hours: number,
  probability: number,
  regionNumber: string | null = null,
) => ({ source, issueTimeMs: T + hours * HOUR, regionNumber, probability });
const options = {
  source: "forecaster",
  reference: "model:m@1",
  level: "M+" as const,
  windowHours: 24,
  convention: "true" as const,
};

describe("verification cases", () => {
  it("keeps one case per issue time and region, the later record of a repeated case winning", () => {
    const cases = buildCases(
      [
        row("forecaster", 0, 0.2),
        row("forecaster", 0, 0.3),
        row("forecaster", 24, 0.4),
        row("forecaster", 24, 0.1, "hr-0900"),
      ],
      options,
      [],
    );
    expect(Array.from(cases.p)).toEqual([0.3, 0.4, 0.1]);
    expect(cases.collapsedDuplicates).toBe(1);
    expect(cases.regionNumber).toEqual([null, null, "hr-0900"]);
  });

  it("aligns the reference by case, region numbers compared case-blind, NaN where it has none", () => {
    const cases = buildCases(
      [
        row("forecaster", 0, 0.2, "HR-0900"),
        row("forecaster", 24, 0.4, "HR-0900"),
        row("model:m@1", 0, 0.7, "hr-0900"),
        row("model:m@1", 48, 0.9, "HR-0900"),
      ],
      options,
      [],
    );
    expect(Array.from(cases.pRef).map((v) => (Number.isNaN(v) ? "none" : v))).toEqual([
      0.7,
      "none",
    ]);
    const shared = sharedCases(cases);
    expect([Array.from(shared.p), Array.from(shared.pRef), Array.from(shared.index)]).toEqual([
      [0.2],
      [0.7],
      [0],
    ]);
  });

  it("orders cases by issue time even when records arrive out of order, and matches outcomes", () => {
    const events = [{ peakTimeMs: T + 30 * HOUR, peakFluxTrue: 2e-5, regionNumber: null }];
    const cases = buildCases(
      [row("forecaster", 24, 0.5), row("forecaster", 0, 0.1)],
      options,
      events,
    );
    expect(Array.from(cases.issueTimeMs)).toEqual([T, T + 24 * HOUR]);
    // The M2 at +30 h is outside [T, T + 24 h) and inside [T + 24 h, T + 48 h).
    expect(Array.from(cases.o)).toEqual([0, 1]);
    expect(Array.from(cases.p)).toEqual([0.1, 0.5]);
  });
});
