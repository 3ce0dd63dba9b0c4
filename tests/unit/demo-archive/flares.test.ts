import { describe, expect, it } from "vitest";
import { formatGoesClass, parseGoesClass } from "@/server/verification/goes";
import { getArchive, hasEvent } from "./archive-fixture";

const archive = getArchive();
const DAY_MS = 86_400_000;

/** Fraction of a power law ∝ F^−α on [a, 10a) that lies below 2a: (1 − 2^(1−α))/(1 − 10^(1−α)). */
function fractionBelowTwice(alpha: number): number {
  return (1 - 2 ** (1 - alpha)) / (1 - 10 ** (1 - alpha));
}

describe("flares of the demo archive", () => {
  const windowOf = new Map(archive.regionDays.map((r) => [`${r.regionNumber}|${r.day}`, r]));

  it("match each region-day's counts, class by class, inside its 24 h window", () => {
    const tally = new Map<string, { C: number; M: number; X: number }>();
    for (const f of archive.flares) {
      if (f.regionNumber === null) continue;
      const peak = Date.parse(f.peakTime);
      // The window of day D runs from D 00:30 UTC for 24 h: find the day the peak falls in.
      const day = new Date(peak - 30 * 60_000).toISOString().slice(0, 10);
      const key = `${f.regionNumber}|${day}`;
      const row = windowOf.get(key);
      expect(row, `flare at ${f.peakTime} from ${f.regionNumber} has no region-day`).toBeDefined();
      expect(peak).toBeGreaterThanOrEqual(Date.parse(row!.issueTime));
      expect(peak).toBeLessThan(Date.parse(row!.issueTime) + DAY_MS);
      const t = tally.get(key) ?? { C: 0, M: 0, X: 0 };
      t[f.originalClass.charAt(0) as "C" | "M" | "X"]++;
      tally.set(key, t);
    }
    let mismatches = 0;
    for (const r of archive.regionDays) {
      const t = tally.get(`${r.regionNumber}|${r.day}`) ?? { C: 0, M: 0, X: 0 };
      if (t.C !== r.counts.C || t.M !== r.counts.M || t.X !== r.counts.X) mismatches++;
    }
    expect(mismatches).toBe(0);
    const attributed = archive.flares.filter((f) => f.regionNumber !== null).length;
    const counted = archive.regionDays.reduce(
      (s, r) => s + r.counts.C + r.counts.M + r.counts.X,
      0,
    );
    expect(attributed).toBe(counted);
    expect(counted).toBeGreaterThan(1000);
  });

  it("feed each assessment's last-24-hour flares from the region's previous day", () => {
    const previous = new Map<string, (typeof archive.regionDays)[number]>();
    let carried = 0;
    for (const r of archive.regionDays) {
      const before = previous.get(r.regionNumber);
      const expected = before ? before.counts : { C: 0, M: 0, X: 0 };
      expect({ ...r.input.flares24h }).toEqual({ C: expected.C, M: expected.M, X: expected.X });
      if (before && before.counts.C + before.counts.M + before.counts.X > 0) carried++;
      previous.set(r.regionNumber, r);
    }
    expect(carried).toBeGreaterThan(100);
  });

  it("include a few flares credited to no region", () => {
    const loose = archive.flares.filter((f) => f.regionNumber === null);
    expect(loose.length).toBeGreaterThan(20);
    expect(loose.length / archive.flares.length).toBeLessThan(0.1);
  });

  it("are in the true-flux convention, with a class that names the flux (NOAA class definition)", () => {
    const keys = new Set<string>();
    for (const f of archive.flares) {
      expect(formatGoesClass(f.peakFluxTrue)).toBe(f.originalClass);
      const parsed = parseGoesClass(f.originalClass);
      expect(parsed.ok && parsed.fluxWm2).toBe(f.peakFluxTrue);
      expect(f.peakFluxTrue).toBeGreaterThanOrEqual(1e-6);
      expect(Date.parse(f.startTime)).toBeLessThan(Date.parse(f.peakTime));
      expect(Date.parse(f.endTime)).toBeGreaterThan(Date.parse(f.peakTime));
      keys.add(`${f.peakTime}|${f.peakFluxTrue}`);
    }
    // Event lists key flares on (peak time, peak flux): no two may share both.
    expect(keys.size).toBe(archive.flares.length);
  });

  it("have C-class peak fluxes following the α ≈ 1.8 power law (frequency distribution, from memory)", () => {
    const c = archive.flares.filter((f) => f.originalClass.startsWith("C"));
    const observed = c.filter((f) => f.peakFluxTrue < 2e-6).length / c.length;
    const se = Math.sqrt((observed * (1 - observed)) / c.length);
    // C1.0–C1.9 share: 0.506 for α = 1.8; a flatter law (α = 1.2) would give 0.351.
    expect(Math.abs(observed - fractionBelowTwice(1.8))).toBeLessThan(3 * se);
    expect(Math.abs(observed - fractionBelowTwice(1.2))).toBeGreaterThan(3 * se);
  });

  it("are more frequent on region-days whose true probability is higher", () => {
    const rows = archive.regionDays;
    const high = rows.filter((r) => r.truth["M+"] > 0.2);
    const low = rows.filter((r) => r.truth["M+"] < 0.02);
    const rate = (list: typeof rows) =>
      list.filter((r) => hasEvent("M+", r.counts)).length / list.length;
    expect(high.length).toBeGreaterThan(50);
    expect(rate(high)).toBeGreaterThan(5 * rate(low));
  });
});
