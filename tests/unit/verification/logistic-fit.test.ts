import { describe, expect, it } from "vitest";
import { fitLogistic, type LogisticFit } from "@/server/verification/logistic-fit";
import { isRelativelyClose, readFixture, type LogitFixture } from "./fixture-loader";

type ConvergedFit = Extract<LogisticFit, { converged: true }>;

function expectConverged(fit: LogisticFit): ConvergedFit {
  if (!fit.converged) throw new Error(`fit did not converge: ${fit.reason}`);
  return fit;
}

// The 23 launches before 1986 (temperature °F, any O-ring incident), typed from memory of
// Dalal, Fowlkes & Hoadley 1989 (JASA 84, 945); see the note in shuttle-oring.json.
const shuttle = readFixture<{ temperatureF: number[]; incident: number[] }>("shuttle-oring.json");
// statsmodels Logit on the same data (scripts/fixtures/make-sklearn-fixtures.py).
const statsmodelsShuttle = readFixture<LogitFixture>("statsmodels-shuttle.json");
const statsmodelsGenerated = readFixture<LogitFixture>("statsmodels-logit-generated.json");

describe("fitLogistic on the shuttle O-ring data", () => {
  const fit = expectConverged(
    fitLogistic(
      shuttle.temperatureF.map((t) => [t]),
      shuttle.incident,
    ),
  );

  it("has the 23 flights with 7 incidents (from memory)", () => {
    expect(shuttle.temperatureF).toHaveLength(23);
    expect(shuttle.incident.filter((y) => y === 1)).toHaveLength(7);
  });

  it("reproduces the published fit (Dalal, Fowlkes & Hoadley 1989)", () => {
    expect(fit.coefficients[0]).toBeCloseTo(15.0429, 4);
    expect(fit.coefficients[1]).toBeCloseTo(-0.2322, 4);
    expect(fit.standardErrors[0]).toBeCloseTo(7.3786, 4);
    expect(fit.standardErrors[1]).toBeCloseTo(0.1082, 4);
    expect(fit.deviance).toBeCloseTo(20.315, 3);
    expect(fit.nullDeviance).toBeCloseTo(28.267, 3);
  });

  it("matches statsmodels Logit to 1e-8 relative", () => {
    const reference = statsmodelsShuttle;
    expect(reference.converged).toBe(true);
    reference.params.forEach((b, j) =>
      expect(isRelativelyClose(fit.coefficients[j]!, b, 1e-8)).toBe(true),
    );
    reference.bse.forEach((se, j) =>
      expect(isRelativelyClose(fit.standardErrors[j]!, se, 1e-8)).toBe(true),
    );
    expect(isRelativelyClose(fit.deviance, reference.deviance, 1e-10)).toBe(true);
    // statsmodels fits the null model iteratively; the closed form here agrees to ~1e-11.
    expect(isRelativelyClose(fit.nullDeviance, reference.null_deviance, 1e-9)).toBe(true);
    expect(fit.logLikelihood).toBeCloseTo(-reference.deviance / 2, 8);
  });

  it("would notice one mistyped flight (the check can fail)", () => {
    const changed = [...shuttle.incident];
    changed[0] = 1; // the first flight (66 °F) had no incident
    const other = expectConverged(
      fitLogistic(
        shuttle.temperatureF.map((t) => [t]),
        changed,
      ),
    );
    expect(Math.abs(other.coefficients[1]! - -0.2322)).toBeGreaterThan(0.01);
  });
});

describe("fitLogistic with two predictors", () => {
  it("matches statsmodels Logit on generated data", () => {
    const { x, y, params, bse, deviance, null_deviance } = statsmodelsGenerated;
    const fit = expectConverged(fitLogistic(x as number[][], y));
    params.forEach((b, j) => expect(isRelativelyClose(fit.coefficients[j]!, b, 1e-7)).toBe(true));
    bse.forEach((se, j) => expect(isRelativelyClose(fit.standardErrors[j]!, se, 1e-7)).toBe(true));
    expect(isRelativelyClose(fit.deviance, deviance, 1e-10)).toBe(true);
    expect(isRelativelyClose(fit.nullDeviance, null_deviance, 1e-9)).toBe(true);
    expect(fit.covariance[1]![2]).toBe(fit.covariance[2]![1]);
  });
});

describe("fitLogistic failures", () => {
  it("reports complete separation instead of returning huge coefficients", () => {
    const x = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    const fit = fitLogistic(
      x.map((v) => [v]),
      x.map((v) => (v > 5 ? 1 : 0)),
    );
    expect(fit.converged).toBe(false);
    if (!fit.converged) expect(fit.reason).toMatch(/separation/);
  });

  it("reports quasi-complete separation", () => {
    const x = [0, 0, 1, 1, 2, 2, 3, 3, 4, 4];
    const y = [0, 0, 0, 0, 0, 1, 1, 1, 1, 1];
    const fit = fitLogistic(
      x.map((v) => [v]),
      y,
    );
    expect(fit.converged).toBe(false);
    if (!fit.converged) expect(fit.reason).toMatch(/separation/);
  });

  it("reports collinear predictors as a singular information matrix", () => {
    const rows = shuttle.temperatureF.map((t) => [t, 2 * t]);
    const fit = fitLogistic(rows, shuttle.incident);
    expect(fit.converged).toBe(false);
    if (!fit.converged) expect(fit.reason).toMatch(/singular/);
  });

  it("reports a sample without events, and running out of iterations", () => {
    const none = fitLogistic([[1], [2], [3]], [0, 0, 0]);
    expect(none.converged).toBe(false);
    if (!none.converged) expect(none.reason).toMatch(/no events/);
    const short = fitLogistic(
      shuttle.temperatureF.map((t) => [t]),
      shuttle.incident,
      { maxIterations: 1 },
    );
    expect(short.converged).toBe(false);
    if (!short.converged) expect(short.reason).toBe("no convergence within 1 iterations");
  });

  it("rejects malformed designs", () => {
    expect(() => fitLogistic([[1], [2]], [0, 1, 1])).toThrow(/rows/);
    expect(() => fitLogistic([[1], [2, 3], [4]], [0, 1, 1])).toThrow(/Row 1/);
    expect(() => fitLogistic([[1], [Number.NaN], [4]], [0, 1, 1])).toThrow(/finite/);
    expect(() => fitLogistic([[1], [2], [4]], [0, 1, 2])).toThrow(/0 or 1/);
    expect(() => fitLogistic([[1], [2]], [0, 1])).toThrow(/more than 2 cases/);
    const rows = shuttle.temperatureF.map((t) => [t]);
    expect(() => fitLogistic(rows, shuttle.incident, { maxIterations: 0 })).toThrow(
      /maxIterations/,
    );
    expect(() => fitLogistic(rows, shuttle.incident, { tolerance: 0 })).toThrow(/tolerance/);
  });
});
