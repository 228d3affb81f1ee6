/**
 * Optimal assignment of n rows to m ≥ n columns minimising the summed cost (rectangular assignment problem).
 *
 * Method: the Hungarian method with row/column potentials and shortest augmenting paths, O(n²m) (Kuhn 1955,
 * Naval Research Logistics Quarterly 2; Jonker & Volgenant 1987, Computing 38 — the classical e-maxx form).
 * Notes: costs must be finite (a NaN or infinite cost throws a RangeError: with one, the augmenting-path search
 * would find no column and never end). Each row's search visits at most m columns, which bounds the work. Unlike a greedy pairing, the total is optimal, so one poor pair cannot steal a
 * column that another row needs more.
 * @param cost cost[r*m + c], row-major n×m
 * @param n rows (branches)
 * @param m columns (candidate poles), m ≥ n
 * @returns column assigned to each row
 */
export function optimalAssignment(cost: Float64Array, n: number, m: number): Int32Array {
  if (m < n) throw new Error(`optimalAssignment: need at least as many columns (${m}) as rows (${n})`);
  for (let k = 0; k < n * m; k++) {
    if (!Number.isFinite(cost[k])) {
      throw new RangeError(`optimalAssignment: cost of row ${Math.floor(k / m)}, column ${k % m} is ${cost[k]}, not a finite number`);
    }
  }
  if (n === 2 && m === 2) {
    // the two possible assignments, compared directly (the tracker's 2-mode hot path)
    return cost[0] + cost[3] <= cost[1] + cost[2] ? Int32Array.of(0, 1) : Int32Array.of(1, 0);
  }
  const u = new Float64Array(n + 1);
  const v = new Float64Array(m + 1);
  const p = new Int32Array(m + 1); // p[col] = row assigned (1-based), 0 = free
  const way = new Int32Array(m + 1);
  const minv = new Float64Array(m + 1);
  const used = new Uint8Array(m + 1);
  for (let i = 1; i <= n; i++) {
    p[0] = i;
    let j0 = 0;
    minv.fill(Number.POSITIVE_INFINITY);
    used.fill(0);
    let visits = 0;
    do {
      if (++visits > m + 1) throw new RangeError("optimalAssignment: no augmenting path (costs out of range)");
      used[j0] = 1;
      const i0 = p[j0];
      let delta = Number.POSITIVE_INFINITY;
      let j1 = 0;
      for (let j = 1; j <= m; j++) {
        if (used[j]) continue;
        const cur = cost[(i0 - 1) * m + (j - 1)] - u[i0] - v[j];
        if (cur < minv[j]) {
          minv[j] = cur;
          way[j] = j0;
        }
        if (minv[j] < delta) {
          delta = minv[j];
          j1 = j;
        }
      }
      for (let j = 0; j <= m; j++) {
        if (used[j]) {
          u[p[j]] += delta;
          v[j] -= delta;
        } else {
          minv[j] -= delta;
        }
      }
      if (j1 === 0) throw new RangeError("optimalAssignment: no augmenting path (costs out of range)");
      j0 = j1;
    } while (p[j0] !== 0);
    do {
      const j1 = way[j0];
      p[j0] = p[j1];
      j0 = j1;
    } while (j0 !== 0);
  }
  const result = new Int32Array(n);
  for (let j = 1; j <= m; j++) if (p[j] > 0) result[p[j] - 1] = j - 1;
  return result;
}
