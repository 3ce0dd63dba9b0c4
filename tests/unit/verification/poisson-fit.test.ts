import { describe, expect, it } from "vitest";
import { fitMcIntoshRates, type RegionDay } from "@/server/verification/poisson-fit";

const day = (mcintosh: string, C: number, M: number, X: number): RegionDay => ({
  mcintosh,
  counts: { C, M, X },
});

// A tiny archive, counted by hand: Dkc 4 region-days with C 2+1+0+1 = 4, M 1+0+0+1 = 2, X 1;
// Dko 1 region-day with one C flare; Axx 2 quiet region-days.
const ARCHIVE: RegionDay[] = [
  day("Dkc", 2, 1, 0),
  day("Dkc", 1, 0, 0),
  day("Dkc", 0, 0, 0),
  day("Dkc", 1, 1, 1),
  day("Dko", 1, 0, 0),
  day("Axx", 0, 0, 0),
  day("Axx", 0, 0, 0),
];

describe("fitMcIntoshRates (maximum-likelihood Poisson rate n/N, SE √n/N)", () => {
  const table = fitMcIntoshRates(ARCHIVE, { minRegionDays: 3 });
  const row = (cls: string) => {
    const found = table.rows.find((r) => r.mcintosh === cls);
    if (!found) throw new Error(`no row for ${cls}`);
    return found;
  };

  it("uses a class's own region-days when it has enough", () => {
    const dkc = row("Dkc");
    expect(dkc.source).toBe("class");
    expect(dkc.basisRegionDays).toBe(4);
    expect(dkc.rates.C).toEqual({ flares: 4, ratePerDay: 1, standardError: 0.5 });
    expect(dkc.rates.M.ratePerDay).toBe(0.5);
    expect(dkc.rates.M.standardError).toBeCloseTo(Math.SQRT2 / 4, 15);
    expect(dkc.rates.X).toEqual({ flares: 1, ratePerDay: 0.25, standardError: 0.25 });
  });

  it("pools a thin class to its Zurich class and reports it", () => {
    // Dko (1 day) takes all D region-days: 5 days with C 5, M 2, X 1.
    const dko = row("Dko");
    expect(dko.source).toBe("zurich-pooled");
    expect(dko.regionDays).toBe(1);
    expect(dko.basisRegionDays).toBe(5);
    expect(dko.rates.C.ratePerDay).toBe(1);
    expect(dko.rates.C.standardError).toBeCloseTo(Math.sqrt(5) / 5, 15);
    expect(dko.rates.M.ratePerDay).toBeCloseTo(0.4, 15);
    expect(dko.rates.X.ratePerDay).toBeCloseTo(0.2, 15);
    expect(dko.isSparse).toBe(false);
    expect(table.pooledClasses).toEqual(["Axx", "Dko"]);
  });

  it("flags a pool that is still below the minimum", () => {
    const axx = row("Axx");
    expect(axx.source).toBe("zurich-pooled");
    expect(axx.isSparse).toBe(true);
    expect(axx.rates.M).toEqual({ flares: 0, ratePerDay: 0, standardError: 0 });
    expect(row("Dkc").isSparse).toBe(false);
  });

  it("pools nothing when every class meets the minimum", () => {
    const strict = fitMcIntoshRates(ARCHIVE, { minRegionDays: 1 });
    expect(strict.pooledClasses).toEqual([]);
    expect(strict.rows.find((r) => r.mcintosh === "Dko")?.rates.C.ratePerDay).toBe(1);
    expect(strict.rows.find((r) => r.mcintosh === "Dko")?.rates.M.ratePerDay).toBe(0);
    expect(fitMcIntoshRates([], { minRegionDays: 5 }).rows).toEqual([]);
  });

  it("rejects invalid classes, counts and minimums", () => {
    expect(() => fitMcIntoshRates([day("Dxx", 0, 0, 0)], { minRegionDays: 1 })).toThrow(
      /Region-day 0/,
    );
    expect(() => fitMcIntoshRates([day("Drc", 0, 0, 0)], { minRegionDays: 1 })).toThrow(
      /not valid/,
    );
    expect(() => fitMcIntoshRates([day("Dkc", -1, 0, 0)], { minRegionDays: 1 })).toThrow(
      /C flare count/,
    );
    expect(() => fitMcIntoshRates([day("Dkc", 0, 0.5, 0)], { minRegionDays: 1 })).toThrow(
      /M flare count/,
    );
    expect(() => fitMcIntoshRates(ARCHIVE, { minRegionDays: 0 })).toThrow(/minimum/);
  });
});
