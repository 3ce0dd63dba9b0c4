import { describe, expect, it } from "vitest";
import { toFormDefaults, toRequestBody } from "@/components/verification/event-form-values";
import {
  formatInterval,
  formatScore,
  undefinedReason,
} from "@/components/verification/format-score";
import type { EventView } from "@/lib/query/verification";

describe("how scores are written", () => {
  it("writes a defined score with three decimals and an undefined one as 'undefined'", () => {
    expect(formatScore({ value: 0.13 })).toBe("0.130");
    expect(formatScore({ value: null, reason: "no observed events in the sample" })).toBe(
      "undefined",
    );
    expect(formatScore(undefined)).toBe("undefined");
    expect(formatScore({ value: -2e-5 })).toBe("0.000");
    expect(formatScore({ value: -0.0006 })).toBe("-0.001");
  });
  it("writes intervals as [lower, upper], 'undefined' without bounds, nothing before they exist", () => {
    const base = { estimate: { value: 0.2 }, level: 0.95, resamples: 200, undefinedResamples: 0 };
    expect(formatInterval({ ...base, lower: { value: 0.1 }, upper: { value: 0.3 } })).toBe(
      "[0.100, 0.300]",
    );
    expect(
      formatInterval({
        ...base,
        lower: { value: null, reason: "r" },
        upper: { value: null, reason: "r" },
      }),
    ).toBe("undefined");
    expect(formatInterval(undefined)).toBe("");
  });
  it("gives the reason of an undefined score, else of an undefined interval, else none", () => {
    const interval = {
      estimate: { value: 0.2 },
      lower: { value: null, reason: "the score was undefined in 200 of 200 resamples" },
      upper: { value: null, reason: "x" },
      level: 0.95,
      resamples: 200,
      undefinedResamples: 200,
    };
    expect(undefinedReason({ value: null, reason: "no events" })).toBe("no events");
    expect(undefinedReason({ value: 0.2 }, interval as never)).toMatch(/200 of 200/);
    expect(undefinedReason({ value: 0.2 })).toBeNull();
  });
});

describe("the event form's values", () => {
  const event: EventView = {
    id: 7,
    listId: 1,
    listName: "L",
    convention: "legacy-scaled",
    startTime: "2031-05-01T06:10:00.000Z",
    peakTime: "2031-05-01T06:24:30.000Z",
    endTime: "2031-05-01T06:40:00.000Z",
    originalClass: "M1.0",
    trueClass: "M1.4",
    peakFluxTrue: 1.428571429e-5,
    regionNumber: null,
    isDemo: false,
    updatedAt: "2031-05-02T00:00:00.000Z",
  };
  it("starts a correction from the stored event, to the minute, in the list's convention", () => {
    expect(toFormDefaults(event)).toEqual({
      start: "2031-05-01T06:10Z",
      peak: "2031-05-01T06:24Z",
      end: "2031-05-01T06:40Z",
      goesClass: "M1.0",
      regionNumber: "",
      convention: "legacy-scaled",
      reason: "",
    });
    expect(toFormDefaults(null).convention).toBe("true");
  });
  it("sends the reason with a correction and the convention with a new event, never both", () => {
    const values = { ...toFormDefaults(event), reason: "typo" };
    expect(toRequestBody(values, true)).not.toHaveProperty("convention");
    expect(toRequestBody(values, true).reason).toBe("typo");
    expect(toRequestBody(values, false)).toMatchObject({ convention: "legacy-scaled" });
    expect(toRequestBody(values, false)).not.toHaveProperty("reason");
  });
});
