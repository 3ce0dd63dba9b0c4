import { describe, expect, it } from "vitest";
import { generateDemoArchive } from "@/server/demo/archive/generate";
import { createStream, deriveSeed } from "@/server/demo/archive/random";

const SHORT = { startDay: "2025-03-01", days: 120 };

describe("generateDemoArchive is a pure function of its options", () => {
  const first = generateDemoArchive({ seed: 7, ...SHORT });

  it("gives identical archives for the same seed", () => {
    const again = generateDemoArchive({ seed: 7, ...SHORT });
    expect(again).toEqual(first);
    // JSON round trip: nothing hides in undefined fields, functions or dates.
    expect(JSON.stringify(again)).toBe(JSON.stringify(first));
  });

  it("gives a different archive for a different seed", () => {
    const other = generateDemoArchive({ seed: 8, ...SHORT });
    expect(JSON.stringify(other)).not.toBe(JSON.stringify(first));
    expect(other.flares.map((f) => f.peakTime)).not.toEqual(first.flares.map((f) => f.peakTime));
    expect(other.regionDays.map((r) => r.input.location)).not.toEqual(
      first.regionDays.map((r) => r.input.location),
    );
  });

  it("covers exactly the requested days, starting on startDay", () => {
    expect(first.dayRecords).toHaveLength(120);
    expect(first.dayRecords[0]?.day).toBe("2025-03-01");
    expect(first.dayRecords[119]?.day).toBe("2025-06-28"); // 2025-03-01 + 119 days (calendar)
    expect(first.dayRecords.every((d) => d.issueTime === `${d.day}T00:30:00.000Z`)).toBe(true);
  });

  it("depends on the start day only through its dates", () => {
    const later = generateDemoArchive({ seed: 7, startDay: "2025-04-01", days: 120 });
    const strip = (a: typeof first) =>
      a.regionDays.map(({ day: _d, issueTime: _t, ...rest }) => rest);
    expect(strip(later)).toEqual(strip(first));
    const shiftMs = Date.parse("2025-04-01") - Date.parse("2025-03-01");
    expect(later.flares.map((f) => Date.parse(f.peakTime) - shiftMs)).toEqual(
      first.flares.map((f) => Date.parse(f.peakTime)),
    );
    expect(later.nextRegionNumber).toBe(first.nextRegionNumber);
  });

  it("refuses options it cannot honour", () => {
    expect(() => generateDemoArchive({ seed: 1.5, ...SHORT })).toThrow(/seed/);
    expect(() => generateDemoArchive({ seed: 1, startDay: "2025-02-30", days: 5 })).toThrow(
      /calendar date/,
    );
    expect(() => generateDemoArchive({ seed: 1, startDay: "1 March 2025", days: 5 })).toThrow(
      /YYYY-MM-DD/,
    );
    expect(() => generateDemoArchive({ seed: 1, startDay: "2025-03-01", days: 0 })).toThrow(/days/);
  });
});

describe("named random streams", () => {
  it("derive distinct, reproducible seeds per label", () => {
    expect(deriveSeed(412, "flares")).toBe(deriveSeed(412, "flares"));
    expect(deriveSeed(412, "flares")).not.toBe(deriveSeed(412, "groups"));
    expect(deriveSeed(412, "flares")).not.toBe(deriveSeed(413, "flares"));
    const a = createStream(412, "flares");
    const b = createStream(412, "flares");
    const c = createStream(412, "groups");
    const draws = (r: () => number) => Array.from({ length: 5 }, r);
    const fromA = draws(a);
    expect(draws(b)).toEqual(fromA);
    expect(draws(c)).not.toEqual(fromA);
  });
});
