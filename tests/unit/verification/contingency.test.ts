import { describe, expect, it } from "vitest";
import { contingencyScores, type ScoreValue } from "@/server/verification/scores";

function valueOf(score: ScoreValue): number {
  if (score.value === null) throw new Error(`undefined score: ${score.reason}`);
  return score.value;
}

// Finley (1884) tornado forecasts, as scored in Wilks, Statistical Methods in the Atmospheric
// Sciences, ch. forecast verification: a = 28, b = 72, c = 23, d = 2680, n = 2803.
const FINLEY = { hits: 28, falseAlarms: 72, misses: 23, correctNegatives: 2680 };

describe("contingencyScores on the Finley (1884) table", () => {
  const s = contingencyScores(FINLEY);

  it("reproduces the published ratios (Wilks)", () => {
    expect(valueOf(s.pc)).toBeCloseTo(2708 / 2803, 12); // 0.966
    expect(valueOf(s.pod)).toBeCloseTo(28 / 51, 12); // 0.549
    expect(valueOf(s.far)).toBeCloseTo(0.72, 12);
    expect(valueOf(s.bias)).toBeCloseTo(100 / 51, 12); // 1.96
    expect(valueOf(s.csi)).toBeCloseTo(28 / 123, 12); // 0.228
    expect(valueOf(s.pofd)).toBeCloseTo(72 / 2752, 12);
  });

  it("reproduces the skill scores (Wilks)", () => {
    // HSS = 2(ad − bc)/((a+c)(c+d) + (a+b)(b+d)) = 146768/413053.
    expect(valueOf(s.hss)).toBeCloseTo(146768 / 413053, 12);
    expect(valueOf(s.hss)).toBeCloseTo(0.3553, 4);
    expect(valueOf(s.tss)).toBeCloseTo(0.5229, 4);
    // GSS = (an − (a+b)(a+c))/((a+b+c)n − (a+b)(a+c)) = 73384/339669 = 0.21605 (hand-derived);
    // Wilks quotes 0.216.
    expect(valueOf(s.gss)).toBeCloseTo(73384 / 339669, 12);
    expect(valueOf(s.gss)).toBeCloseTo(0.216, 3);
  });

  it("reproduces the Appleman skill score", () => {
    // Hand derivation: events are the minority (51 < 2752), so the reference forecast is
    // "never a tornado" with PCᵣ = 2752/2803. APSS = (PC − PCᵣ)/(1 − PCᵣ)
    // = ((2708 − 2752)/2803)/(51/2803) = −44/51 = (a − b)/(a + c) ≈ −0.8627:
    // Finley did worse than always saying no (Gilbert 1884's point, as told by Wilks).
    expect(valueOf(s.apss)).toBeCloseTo(-44 / 51, 12);
    expect(valueOf(s.apss)).toBeLessThan(0);
  });

  it("satisfies GSS = HSS / (2 − HSS) (Schaefer 1990, Wea. Forecasting 5, 570)", () => {
    const hss = valueOf(s.hss);
    expect(valueOf(s.gss)).toBeCloseTo(hss / (2 - hss), 12);
  });
});

describe("contingencyScores on other tables", () => {
  it("uses the non-event branch of APSS when events are the majority", () => {
    // a+c = 60 ≥ b+d = 40, reference "always yes": APSS = (d − c)/(b + d) = (30 − 10)/40.
    const s = contingencyScores({ hits: 50, falseAlarms: 10, misses: 10, correctNegatives: 30 });
    expect(valueOf(s.apss)).toBeCloseTo(0.5, 12);
    // Check against the definition: PC = 0.8, PCᵣ = 0.6 → (0.8 − 0.6)/0.4 = 0.5.
    expect(valueOf(s.pc)).toBeCloseTo(0.8, 12);
  });

  it("gives zero skill to a random forecast and full skill to a perfect one", () => {
    // Warnings independent of events: ad = bc (common practice).
    const random = contingencyScores({
      hits: 10,
      falseAlarms: 40,
      misses: 10,
      correctNegatives: 40,
    });
    expect(valueOf(random.tss)).toBe(0);
    expect(valueOf(random.hss)).toBe(0);
    expect(valueOf(random.gss)).toBe(0);
    const perfect = contingencyScores({ hits: 7, falseAlarms: 0, misses: 0, correctNegatives: 93 });
    for (const k of ["pod", "csi", "bias", "pc", "tss", "hss", "gss", "apss"] as const) {
      expect(valueOf(perfect[k]), k).toBe(1);
    }
    expect(valueOf(perfect.far)).toBe(0);
  });

  it("says why a score is undefined when there are no events", () => {
    const s = contingencyScores({ hits: 0, falseAlarms: 3, misses: 0, correctNegatives: 97 });
    expect(s.pod).toEqual({ value: null, reason: "no observed events in the sample" });
    expect(s.bias.value).toBeNull();
    expect(s.tss.value).toBeNull();
    expect(s.apss.value).toBeNull();
    // Scores that stay defined without events.
    expect(valueOf(s.far)).toBe(1);
    expect(valueOf(s.pofd)).toBeCloseTo(0.03, 12);
    expect(valueOf(s.pc)).toBeCloseTo(0.97, 12);
  });

  it("says why a score is undefined with no warnings, no variation or an empty table", () => {
    const quiet = contingencyScores({ hits: 0, falseAlarms: 0, misses: 4, correctNegatives: 96 });
    expect(quiet.far.value).toBeNull();
    expect(quiet.far.reason).toMatch(/no warnings/);
    expect(valueOf(quiet.hss)).toBe(0);
    const constant = contingencyScores({
      hits: 0,
      falseAlarms: 0,
      misses: 0,
      correctNegatives: 50,
    });
    expect(constant.hss.value).toBeNull();
    expect(constant.gss.value).toBeNull();
    expect(constant.csi.value).toBeNull();
    const empty = contingencyScores({ hits: 0, falseAlarms: 0, misses: 0, correctNegatives: 0 });
    for (const score of Object.values(empty)) {
      expect(score.value).toBeNull();
      expect(typeof score.reason).toBe("string");
    }
  });

  it("rejects counts that are not whole numbers ≥ 0", () => {
    expect(() => contingencyScores({ ...FINLEY, hits: -1 })).toThrow(/hits/);
    expect(() => contingencyScores({ ...FINLEY, misses: 2.5 })).toThrow(/misses/);
    expect(() => contingencyScores({ ...FINLEY, correctNegatives: Number.NaN })).toThrow(
      /correctNegatives/,
    );
  });
});
