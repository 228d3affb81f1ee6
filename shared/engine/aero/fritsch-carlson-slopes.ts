/**
 * Node slopes of the Fritsch–Carlson monotone piecewise cubic Hermite interpolant.
 *
 * Method: secants Δ_k = (y_{k+1} − y_k)/(x_{k+1} − x_k); initial slopes the mean of the adjacent secants at
 * interior nodes (0 where the secants differ in sign or one is 0, i.e. at local extrema and flat pieces) and
 * the one-sided secant at the ends; then on every interval with α = m_k/Δ_k, β = m_{k+1}/Δ_k and
 * α² + β² > 9 both slopes are scaled by τ = 3/√(α² + β²) (the circle inside the monotonicity region).
 * Source: F. N. Fritsch and R. E. Carlson, Monotone piecewise cubic interpolation, SIAM J. Numer. Anal.
 * 17(2), 1980, pp. 238–246.
 *
 * Notes: the interpolant passes through every node and is monotone on every interval where the data are
 * (so it never overshoots between two nodes); it is C¹, not C². Two nodes give the straight line.
 *
 * @param x - abscissae, strictly increasing (any unit)
 * @param y - ordinates, same length as x
 * @param out - receives dy/dx at each node (unit of y per unit of x); same length as x
 * @returns out
 */
export function fritschCarlsonSlopes(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  out: Float64Array = new Float64Array(x.length),
): Float64Array {
  const n = x.length;
  if (n < 2 || y.length !== n || out.length < n) {
    throw new RangeError(
      `monotone cubic needs ≥ 2 nodes and equal lengths (x ${n}, y ${y.length}, out ${out.length})`,
    );
  }
  let previousSecant = (y[1] - y[0]) / (x[1] - x[0]);
  out[0] = previousSecant;
  for (let k = 1; k < n - 1; k++) {
    const secant = (y[k + 1] - y[k]) / (x[k + 1] - x[k]);
    out[k] = previousSecant * secant > 0 ? 0.5 * (previousSecant + secant) : 0;
    previousSecant = secant;
  }
  out[n - 1] = previousSecant;
  for (let k = 0; k < n - 1; k++) {
    const secant = (y[k + 1] - y[k]) / (x[k + 1] - x[k]);
    if (secant === 0) {
      out[k] = 0;
      out[k + 1] = 0;
      continue;
    }
    const alpha = out[k] / secant;
    const beta = out[k + 1] / secant;
    const radius2 = alpha * alpha + beta * beta;
    if (radius2 > 9) {
      const tau = 3 / Math.sqrt(radius2);
      out[k] = tau * alpha * secant;
      out[k + 1] = tau * beta * secant;
    }
  }
  return out;
}
