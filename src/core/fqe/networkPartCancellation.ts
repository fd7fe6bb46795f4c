/**
 * How much the network's two parts cancel: Q = P + H with P = φᵀ·linear (the polynomial part) and
 * H = hᵀ·hidden (the hidden features' correction), measured on the probe rows as
 *   κ = Σ_i (|P_i| + |H_i|) / Σ_i |Q_i|,
 * the condition number of the sums Q_i = P_i + H_i pooled over the rows (for one sum, Σ|x_j| / |Σx_j|:
 * Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed. 2002, §4.2): relative changes of
 * the parts reach Q amplified by up to κ. κ = 1 when the hidden part only adds to (or trims less than)
 * what the polynomial part says; κ ≫ 1 when two large, nearly collinear parts cancel — a direction of
 * the last-layer system the data hardly determine (its reciprocal condition was 2·10⁻⁶ where this was
 * seen: the steam-drum hold-out, bench/networkIterateTrace.ts), along which J moved by tens of per cent
 * between iterates. Shapes: rows count×d (d = d1 + dh), v d.
 */
export function partCancellation(rows: Float64Array, v: ArrayLike<number>, d: number, d1: number): number {
  const count = rows.length / d;
  let parts = 0, total = 0;
  for (let r = 0; r < count; r++) {
    let p = 0, h = 0;
    for (let f = 0; f < d1; f++) p += rows[r * d + f] * v[f];
    for (let f = d1; f < d; f++) h += rows[r * d + f] * v[f];
    parts += Math.abs(p) + Math.abs(h);
    total += Math.abs(p + h);
  }
  return total > 0 ? parts / total : parts > 0 ? Number.POSITIVE_INFINITY : 1;
}
