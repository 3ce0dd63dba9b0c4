import { describe, expect, it } from "vitest";
import {
  decomposeCholesky,
  invertFromCholesky,
  solveCholesky,
} from "@/server/verification/dense-cholesky";

describe("decomposeCholesky", () => {
  it("factors and inverts a hand-worked matrix", () => {
    // A = [[4, 2], [2, 3]]: L = [[2, 0], [1, √2]], A⁻¹ = (1/8)[[3, −2], [−2, 4]] (hand-derived).
    const result = decomposeCholesky([
      [4, 2],
      [2, 3],
    ]);
    if (!result.ok) throw new Error(result.message);
    expect(result.lower[0]).toEqual([2, 0]);
    expect(result.lower[1]![0]).toBe(1);
    expect(result.lower[1]![1]).toBeCloseTo(Math.SQRT2, 15);
    const inverse = invertFromCholesky(result.lower);
    expect(inverse[0]![0]).toBeCloseTo(3 / 8, 15);
    expect(inverse[0]![1]).toBeCloseTo(-2 / 8, 15);
    expect(inverse[1]![1]).toBeCloseTo(4 / 8, 15);
    // A x = b with b = [8, 7] → x = [1.25, 1.5].
    const x = solveCholesky(result.lower, [8, 7]);
    expect(x[0]).toBeCloseTo(1.25, 14);
    expect(x[1]).toBeCloseTo(1.5, 14);
  });

  it("refuses singular and indefinite matrices", () => {
    const singular = decomposeCholesky([
      [1, 2],
      [2, 4],
    ]);
    expect(singular.ok).toBe(false);
    if (!singular.ok) expect(singular.message).toMatch(/singular/);
    expect(
      decomposeCholesky([
        [1, 3],
        [3, 1],
      ]).ok,
    ).toBe(false);
  });
});
