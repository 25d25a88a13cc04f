/**
 * The Re_D iteration of ISO 5167-1:2003 Annex C (informative), "qm unknown":
 * invariant A1 = ε d² sqrt(2Δpρ1)/(μ D sqrt(1 − β⁴)), so that Re_D = C·A1;
 * unknown X = Re_D, residual δ = A1 − X/C(X); secant X_n = X_{n−1} − δ_{n−1}(X_{n−1} − X_{n−2})/(δ_{n−1} − δ_{n−2});
 * stop when |δ/A1| < 1e-10.
 */

/** Precision criterion of the annex, |δ/A1| < 1e-n with n = 10. */
export const REYNOLDS_TOLERANCE = 1e-10;
const MAX_ITERATIONS = 60;

export interface ReynoldsSolution {
  reynoldsNumber: number;
  dischargeCoefficient: number;
  iterations: number;
}

/**
 * Solves Re_D = C(Re_D)·A1 by the secant method.
 * @param invariantA1 A1 of the annex (Re_D per unit C), > 0
 * @param dischargeCoefficientAt C as a function of Re_D
 * @param startDischargeCoefficient first guess of C (0.606 for an orifice, as the annex suggests)
 * @returns Re_D, the C there, and the iterations used
 */
export function solveReynoldsNumber(
  invariantA1: number,
  dischargeCoefficientAt: (reynoldsNumber: number) => number,
  startDischargeCoefficient: number,
): ReynoldsSolution {
  if (!(invariantA1 > 0 && Number.isFinite(invariantA1))) {
    throw new Error(`solveReynoldsNumber: invariantA1 must be finite and > 0 (got ${invariantA1})`);
  }
  let x0 = startDischargeCoefficient * invariantA1;
  const c0 = dischargeCoefficientAt(x0);
  let d0 = invariantA1 - x0 / c0;
  if (Math.abs(d0 / invariantA1) < REYNOLDS_TOLERANCE)
    return { reynoldsNumber: x0, dischargeCoefficient: c0, iterations: 1 };
  // Second point: one fixed-point step X = C(X0)·A1.
  let x1 = c0 * invariantA1;
  let c1 = dischargeCoefficientAt(x1);
  let d1 = invariantA1 - x1 / c1;
  for (let i = 2; i <= MAX_ITERATIONS; i++) {
    if (Math.abs(d1 / invariantA1) < REYNOLDS_TOLERANCE)
      return { reynoldsNumber: x1, dischargeCoefficient: c1, iterations: i };
    const slope = d1 - d0;
    let x2 = slope !== 0 ? x1 - (d1 * (x1 - x0)) / slope : c1 * invariantA1;
    // Re_D must stay positive: fall back to a fixed-point step if the secant overshoots.
    if (!(x2 > 0) || !Number.isFinite(x2)) x2 = c1 * invariantA1;
    x0 = x1;
    d0 = d1;
    x1 = x2;
    c1 = dischargeCoefficientAt(x1);
    d1 = invariantA1 - x1 / c1;
  }
  throw new Error(
    `solveReynoldsNumber: no convergence after ${MAX_ITERATIONS} steps (A1 = ${invariantA1}, last Re_D = ${x1})`,
  );
}
