import { describe, expect, it } from "vitest";
import { parseUtcTimestamp } from "@/lib/schemas/verification";
import {
  checkEventRows,
  checkEventValues,
  eventKey,
  normaliseTrueFlux,
} from "@/server/verification-desk/event-rows";

const ROW = {
  start: "2031-05-01T06:10Z",
  peak: "2031-05-01T06:24Z",
  end: "2031-05-01T06:40Z",
  goesClass: "M2.5",
  region: "HR-0412",
};

describe("UTC times", () => {
  it("reads ISO-8601 with Z, with +00:00 and without an offset as the same UTC instant", () => {
    const expected = Date.UTC(2031, 4, 1, 6, 24, 0); // 2031-05-01 06:24 UTC
    for (const text of [
      "2031-05-01T06:24Z",
      "2031-05-01T06:24:00+00:00",
      "2031-05-01 06:24:00",
      "2031-05-01T06:24:00.000Z",
    ]) {
      expect(parseUtcTimestamp(text)).toEqual({ ok: true, ms: expected });
    }
  });
  it("refuses other offsets, impossible dates and non-times", () => {
    expect(parseUtcTimestamp("2031-05-01T08:24+02:00")).toMatchObject({
      ok: false,
      message: expect.stringContaining("UTC"),
    });
    expect(parseUtcTimestamp("2031-02-30T00:00Z")).toMatchObject({
      ok: false,
      message: expect.stringContaining("not a real date"),
    });
    expect(parseUtcTimestamp("2031-05-01T24:10Z").ok).toBe(false);
    expect(parseUtcTimestamp("yesterday").ok).toBe(false);
  });
});

describe("one event row", () => {
  it("keeps the class as given and stores the true peak flux", () => {
    const { event, errors } = checkEventValues(ROW, "true");
    expect(errors).toEqual({});
    expect(event).toMatchObject({
      originalClass: "M2.5",
      peakFluxTrue: 2.5e-5,
      regionNumber: "HR-0412",
    });
    expect(event?.peakTime.toISOString()).toBe("2031-05-01T06:24:00.000Z");
  });

  it("divides a legacy-scaled class by 0.7 (NOAA GOES-R XRS L2 Users Guide, 2020)", () => {
    // A legacy list writes a true M1.0 flare as C7.0: 7e-6 / 0.7 = 1e-5 W m⁻², once rounded to
    // 10 significant digits.
    const { event } = checkEventValues({ ...ROW, goesClass: "c7.0" }, "legacy-scaled");
    expect(event?.originalClass).toBe("C7.0");
    expect(event?.peakFluxTrue).toBe(1e-5);
    expect(
      checkEventValues({ ...ROW, goesClass: "X1.4" }, "legacy-scaled").event?.peakFluxTrue,
    ).toBe(2e-4);
  });

  it.each([
    ["M", /not a GOES class/],
    ["Q1.0", /not a GOES class/],
    ["M10", /less than 10/],
    ["C0.5", /at least 1.0/],
  ])("refuses the class %s with the parser's message", (goesClass, message) => {
    const { event, errors } = checkEventValues({ ...ROW, goesClass }, "true");
    expect(event).toBeNull();
    expect(errors.goesClass).toMatch(message);
  });

  it("refuses a peak before the start and an end before the peak", () => {
    expect(checkEventValues({ ...ROW, peak: "2031-05-01T06:00Z" }, "true").errors.peak).toBe(
      "The peak is before the start.",
    );
    expect(checkEventValues({ ...ROW, end: "2031-05-01T06:20Z" }, "true").errors.end).toBe(
      "The end is before the peak.",
    );
    // Equal times are allowed: start ≤ peak ≤ end.
    expect(
      checkEventValues({ ...ROW, start: ROW.peak, end: ROW.peak }, "true").event,
    ).not.toBeNull();
  });

  it("refuses missing times, local-time offsets and malformed regions", () => {
    const { errors } = checkEventValues(
      { ...ROW, start: "", end: "2031-05-01T08:40+02:00", region: "0412" },
      "true",
    );
    expect(Object.keys(errors).sort()).toEqual(["end", "region", "start"]);
    expect(checkEventValues({ ...ROW, region: "" }, "true").event?.regionNumber).toBeNull();
  });
});

describe("duplicates: same peak time and same true flux", () => {
  it("marks the second of two equal rows and names the first", () => {
    const rows = checkEventRows(
      [ROW, { ...ROW, region: "HR-0413" }, { ...ROW, goesClass: "M2.6" }],
      "true",
      new Set(),
    );
    expect(rows.map((r) => r.isDuplicate)).toEqual([false, true, false]);
    expect(rows[1]?.errors.row).toBe("Duplicate of row 1 (same peak time and peak flux).");
  });

  it("recognises one flare listed in both conventions (legacy C7.0 = true M1.0)", () => {
    const legacy = checkEventRows([{ ...ROW, goesClass: "C7.0" }], "legacy-scaled", new Set())[0]!;
    const stored = new Set([
      eventKey(legacy.event!.peakTime.getTime(), legacy.event!.peakFluxTrue),
    ]);
    const rows = checkEventRows(
      [
        { ...ROW, goesClass: "M1.0" },
        { ...ROW, goesClass: "M1.1" },
      ],
      "true",
      stored,
    );
    expect(rows.map((r) => r.isDuplicate)).toEqual([true, false]);
    expect(rows[0]?.errors.row).toMatch(/Already stored/);
  });

  it("rounds flux to 10 significant digits, no further", () => {
    expect(normaliseTrueFlux(7e-6 / 0.7)).toBe(1e-5);
    expect(normaliseTrueFlux(1.23456789012e-5)).toBe(1.23456789e-5);
    expect(normaliseTrueFlux(1.2345678906e-5)).not.toBe(1.23456789e-5);
  });
});
