import { describe, expect, it } from "vitest";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import {
  eventMeetsLevel,
  matchForecasts,
  type MatchConvention,
  type MatchEvent,
  type MatchForecast,
} from "@/server/verification-desk/matching";
import { normaliseTrueFlux } from "@/server/verification-desk/event-rows";
import { createMulberry32 } from "@/server/verification/prng";
import { LEVEL_THRESHOLD_WM2, toTrueFlux } from "@/server/verification/goes";

const HOUR = 3_600_000;
const T0 = Date.parse("2031-05-01T12:00:00Z");

const fc = (over: Partial<MatchForecast> = {}): MatchForecast => ({
  issueTimeMs: T0,
  regionNumber: null,
  level: "M+",
  windowHours: 24,
  ...over,
});
const ev = (over: Partial<MatchEvent> = {}): MatchEvent => ({
  peakTimeMs: T0,
  peakFluxTrue: 2e-5,
  regionNumber: "HR-0101",
  ...over,
});
const one = (f: MatchForecast, events: MatchEvent[], convention?: MatchConvention) =>
  matchForecasts([f], events, convention)[0];

describe("validity window [issue time, issue time + window)", () => {
  // The window rule is the product's: windows start at the issue time (DESIGN.md); a half-open
  // interval so back-to-back windows never share a flare (common practice).
  it("counts a flare peaking exactly at the issue time", () => {
    expect(one(fc(), [ev({ peakTimeMs: T0 })])).toBe(1);
  });
  it("does not count a flare peaking 1 ms before the issue time", () => {
    expect(one(fc(), [ev({ peakTimeMs: T0 - 1 })])).toBe(0);
  });
  it("counts a flare 1 ms before the window closes, not one exactly at its end", () => {
    expect(one(fc(), [ev({ peakTimeMs: T0 + 24 * HOUR - 1 })])).toBe(1);
    expect(one(fc(), [ev({ peakTimeMs: T0 + 24 * HOUR })])).toBe(0);
  });
  it("widens with the window: a flare 30 h later is in 48 h and 72 h, not in 24 h", () => {
    const events = [ev({ peakTimeMs: T0 + 30 * HOUR })];
    expect([24, 48, 72].map((w) => one(fc({ windowHours: w }), events))).toEqual([0, 1, 1]);
  });
});

describe("region forecasts and full-disk forecasts", () => {
  const events = [
    ev({ regionNumber: "HR-0102", peakTimeMs: T0 + HOUR }),
    ev({ regionNumber: null, peakTimeMs: T0 + 2 * HOUR, peakFluxTrue: 3e-5 }),
  ];
  it("a region forecast ignores flares of other regions and flares without a region", () => {
    expect(one(fc({ regionNumber: "HR-0101" }), events)).toBe(0);
  });
  it("a region forecast counts its own region's flare, whatever the case of the number", () => {
    expect(one(fc({ regionNumber: "hr-0102 " }), events)).toBe(1);
  });
  it("a full-disk forecast counts any flare, with or without a region", () => {
    expect(one(fc(), [events[0]!])).toBe(1);
    expect(one(fc(), [events[1]!])).toBe(1);
    expect(one(fc(), [])).toBe(0);
  });
});

describe("levels", () => {
  it("counts a flare for every level it meets and none above (C5 is C+ only; X2 is all three)", () => {
    const levels: FlareLevel[] = ["C+", "M+", "X"];
    expect(levels.map((level) => one(fc({ level }), [ev({ peakFluxTrue: 5e-6 })]))).toEqual([
      1, 0, 0,
    ]);
    expect(levels.map((level) => one(fc({ level }), [ev({ peakFluxTrue: 2e-4 })]))).toEqual([
      1, 1, 1,
    ]);
  });
  it("refuses an unknown level or a window of 0 h", () => {
    expect(() => matchForecasts([fc({ level: "B" as FlareLevel })], [])).toThrow(/unknown level/);
    expect(() => matchForecasts([fc({ windowHours: 0 })], [])).toThrow(/window/);
  });
});

describe("flux convention of the thresholds", () => {
  // NOAA GOES-R XRS L2 Users Guide (2020): legacy = true × 0.7. A true-flux M1.0 is 7e-6 legacy (written C7.0 in a legacy list).
  const trueM1 = ev({ peakFluxTrue: 1e-5 });
  it("true convention: a true-flux M1.0 meets M+", () => {
    expect(one(fc(), [trueM1], "true")).toBe(1);
  });
  it("legacy convention: the same flare is legacy 7e-6 (C7.0), below M1", () => {
    expect(one(fc(), [trueM1], "legacy")).toBe(0);
    expect(one(fc({ level: "C+" }), [trueM1], "legacy")).toBe(1);
  });
  it("a legacy-list M1.0 (true M1.43) meets M+ in both conventions", () => {
    const legacyM1 = ev({ peakFluxTrue: normaliseTrueFlux(toTrueFlux(1e-5, "legacy-scaled")) });
    expect(one(fc(), [legacyM1], "true")).toBe(1);
    expect(one(fc(), [legacyM1], "legacy")).toBe(1);
  });
  it("a legacy-list C7.0 is true M1.0: M+ in the true convention, not in the legacy one", () => {
    const legacyM07 = normaliseTrueFlux(toTrueFlux(7e-6, "legacy-scaled"));
    expect(legacyM07).toBe(1e-5);
    expect(eventMeetsLevel(legacyM07, "M+", "true")).toBe(true);
    expect(eventMeetsLevel(legacyM07, "M+", "legacy")).toBe(false);
  });
  it("just below the legacy threshold stays below (true 1.4e-5 is legacy 0.98e-5)", () => {
    expect(eventMeetsLevel(1.4e-5, "M+", "legacy")).toBe(false);
    expect(eventMeetsLevel(1.43e-5, "M+", "legacy")).toBe(true);
  });
});

/** The rule applied literally, pair by pair: the reference the fast matcher must agree with. */
function matchByScanning(forecasts: MatchForecast[], events: MatchEvent[]): number[] {
  return forecasts.map((f) =>
    events.some(
      (e) =>
        e.peakFluxTrue >= LEVEL_THRESHOLD_WM2[f.level] &&
        e.peakTimeMs >= f.issueTimeMs &&
        e.peakTimeMs < f.issueTimeMs + f.windowHours * HOUR &&
        (f.regionNumber === null || f.regionNumber === e.regionNumber),
    )
      ? 1
      : 0,
  );
}

function randomCase(n: number, m: number, seed: number) {
  const random = createMulberry32(seed);
  const span = 730 * 24 * HOUR;
  const regions = Array.from({ length: 40 }, (_, i) => `HR-${String(1000 + i)}`);
  const pick = <T>(list: readonly T[]) => list[Math.floor(random() * list.length)] as T;
  const forecasts = Array.from({ length: n }, () => ({
    issueTimeMs: T0 + Math.floor(random() * span),
    regionNumber: random() < 0.2 ? null : pick(regions),
    level: pick(["C+", "M+", "X"] as const),
    windowHours: pick([24, 48, 72]),
  }));
  const events = Array.from({ length: m }, () => ({
    peakTimeMs: T0 + Math.floor(random() * span),
    peakFluxTrue: 10 ** (-6.5 + 3 * random()),
    regionNumber: random() < 0.1 ? null : pick(regions),
  }));
  return { forecasts, events };
}

describe("speed and agreement with a pair-by-pair scan", () => {
  it("agrees with the literal rule on 3,000 random forecasts and 400 flares", () => {
    const { forecasts, events } = randomCase(3000, 400, 11);
    const fast = Array.from(matchForecasts(forecasts, events));
    expect(fast).toEqual(matchByScanning(forecasts, events));
    // Both outcomes occur, so the comparison is not between two columns of zeros.
    expect(fast.filter((o) => o === 1).length).toBeGreaterThan(100);
    expect(fast.filter((o) => o === 0).length).toBeGreaterThan(100);
  });

  it("matches 66,000 forecasts against 6,000 flares in well under a second", () => {
    const { forecasts, events } = randomCase(66_000, 6_000, 12);
    const start = performance.now();
    const outcomes = matchForecasts(forecasts, events);
    const elapsed = performance.now() - start;
    expect(outcomes).toHaveLength(66_000);
    expect(elapsed).toBeLessThan(500);
  });
});
