// Cholesky factorisation of small symmetric positive-definite matrices, for the logistic fit.

/** Row-major k×k matrix as nested arrays; k is the number of model coefficients (small). */
export type Matrix = number[][];

export type CholeskyResult = { ok: true; lower: Matrix } | { ok: false; message: string };

/**
 * A = L Lᵀ by the Cholesky–Banachiewicz recurrence (Golub & Van Loan, Matrix Computations,
 * §4.2). A pivot that is not clearly positive relative to the diagonal it came from means the
 * matrix is singular or indefinite to working precision (collinear or constant predictors).
 */
export function decomposeCholesky(a: Matrix): CholeskyResult {
  const k = a.length;
  const lower: Matrix = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  for (let i = 0; i < k; i++) {
    const rowA = a[i] as number[];
    const rowL = lower[i] as number[];
    for (let j = 0; j <= i; j++) {
      const rowLj = lower[j] as number[];
      let sum = rowA[j] as number;
      for (let m = 0; m < j; m++) sum -= (rowL[m] as number) * (rowLj[m] as number);
      if (i === j) {
        const diagonal = rowA[i] as number;
        if (!(sum > diagonal * 1e-12) || !Number.isFinite(sum)) {
          return {
            ok: false,
            message: `the information matrix is singular at coefficient ${i} (collinear or constant predictors)`,
          };
        }
        rowL[i] = Math.sqrt(sum);
      } else {
        rowL[j] = sum / (rowLj[j] as number);
      }
    }
  }
  return { ok: true, lower };
}

/** Solves L Lᵀ x = b by forward then back substitution. */
export function solveCholesky(lower: Matrix, b: readonly number[]): number[] {
  const k = lower.length;
  const y = new Array<number>(k).fill(0);
  for (let i = 0; i < k; i++) {
    const row = lower[i] as number[];
    let sum = b[i] as number;
    for (let m = 0; m < i; m++) sum -= (row[m] as number) * (y[m] as number);
    y[i] = sum / (row[i] as number);
  }
  const x = new Array<number>(k).fill(0);
  for (let i = k - 1; i >= 0; i--) {
    let sum = y[i] as number;
    for (let m = i + 1; m < k; m++) sum -= ((lower[m] as number[])[i] as number) * (x[m] as number);
    x[i] = sum / ((lower[i] as number[])[i] as number);
  }
  return x;
}

/**
 * A⁻¹ column by column from the factor; k is small, so k solves are cheap. The two triangles
 * differ in the last bits after separate solves, so they are averaged to return a symmetric
 * matrix, as a covariance must be.
 */
export function invertFromCholesky(lower: Matrix): Matrix {
  const k = lower.length;
  const columns = Array.from({ length: k }, (_, j) =>
    solveCholesky(
      lower,
      Array.from({ length: k }, (_, i) => (i === j ? 1 : 0)),
    ),
  );
  const at = (i: number, j: number) => (columns[j] as number[])[i] as number;
  return Array.from({ length: k }, (_, i) =>
    Array.from({ length: k }, (_, j) => (i === j ? at(i, i) : (at(i, j) + at(j, i)) / 2)),
  );
}
