import { describe, expect, it } from "vitest";
import {
  brierScore,
  logLoss,
  reliabilityCurve,
  rocCurve,
  type ScoreValue,
} from "@/server/verification/scores";
import { isRelativelyClose, readFixture, type SklearnSet } from "./fixture-loader";

// Reference values: scikit-learn (Debian python3-sklearn) on synthetic data, written by
// scripts/fixtures/make-sklearn-fixtures.py into tests/fixtures/verification/sklearn.json.
const { sets } = readFixture<{ sets: SklearnSet[] }>("sklearn.json");

function valueOf(score: ScoreValue): number {
  if (score.value === null) throw new Error(`undefined score: ${score.reason}`);
  return score.value;
}

describe.each(sets.map((set) => [set.name, set] as const))(
  "scikit-learn reference set %s",
  (_, set) => {
    it("Brier score equals brier_score_loss", () => {
      expect(isRelativelyClose(valueOf(brierScore(set.p, set.o)), set.brier_score_loss)).toBe(true);
    });

    it("ROC area equals roc_auc_score", () => {
      expect(isRelativelyClose(valueOf(rocCurve(set.p, set.o).auc), set.roc_auc_score)).toBe(true);
    });

    it("ROC points equal roc_curve(drop_intermediate=False) after the origin", () => {
      const { points } = rocCurve(set.p, set.o);
      expect(points[0]).toEqual({ threshold: null, pod: 0, pofd: 0 });
      const rest = points.slice(1);
      expect(rest.map((pt) => pt.threshold)).toEqual(set.roc_curve.thresholds);
      rest.forEach((pt, i) => {
        expect(pt.pod).toBeCloseTo(set.roc_curve.tpr[i] as number, 14);
        expect(pt.pofd).toBeCloseTo(set.roc_curve.fpr[i] as number, 14);
      });
    });

    // The tied set has forecasts on the edges of 5 and 10 bins, where scikit-learn 1.2 bins to the
    // left and Facula to the right (see findBinIndex); 3 and 7 bins have no such edges.
    const binCounts = set.name === "tied" ? ["3", "7"] : ["3", "5", "7", "10"];
    it.each(binCounts)("reliability curve with %s bins equals calibration_curve", (bins) => {
      const reference = set.calibration_curve[bins];
      if (!reference) throw new Error(`fixture lacks ${bins} bins`);
      const filled = reliabilityCurve(set.p, set.o, Number(bins)).filter((b) => b.count > 0);
      expect(filled.map((b) => valueOf(b.observedFrequency))).toHaveLength(
        reference.prob_true.length,
      );
      filled.forEach((b, i) => {
        expect(valueOf(b.observedFrequency)).toBeCloseTo(reference.prob_true[i] as number, 13);
        expect(valueOf(b.meanForecast)).toBeCloseTo(reference.prob_pred[i] as number, 13);
      });
    });

    it("log-loss equals log_loss, or is undefined where a forecast of 0 or 1 was wrong", () => {
      const isConfidentlyWrong = set.p.some((p, i) => Math.abs(p - (set.o[i] as number)) === 1);
      const score = logLoss(set.p, set.o);
      if (set.log_loss === undefined) {
        // scikit-learn clips such forecasts to finite values; the fixture leaves them out.
        expect(isConfidentlyWrong).toBe(true);
        expect(score.value).toBeNull();
        expect(score.reason).toMatch(/infinite/);
      } else {
        expect(isConfidentlyWrong).toBe(false);
        expect(isRelativelyClose(valueOf(score), set.log_loss)).toBe(true);
      }
    });

    it("would notice one flipped outcome (the comparison can fail)", () => {
      const flipped = [...set.o];
      flipped[0] = 1 - (flipped[0] as number);
      expect(isRelativelyClose(valueOf(brierScore(set.p, flipped)), set.brier_score_loss)).toBe(
        false,
      );
      expect(isRelativelyClose(valueOf(rocCurve(set.p, flipped).auc), set.roc_auc_score)).toBe(
        false,
      );
    });
  },
);
