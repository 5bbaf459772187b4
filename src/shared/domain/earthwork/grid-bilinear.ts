/**
 * Exact cut and fill of one grid cell under the bilinear surface through its four corner depths (the option
 * `mixedCellSplit: 'exact-bilinear'`). On the unit square f(u, v) = h00 (1-u)(1-v) + h10 u (1-v) + h01 (1-u) v
 * + h11 u v. For fixed v, f is linear in u between A(v) = f(0, v) and E(v) = f(1, v), so the positive part
 * integrates in closed form: (A + E) / 2 when both are >= 0, 0 when both are <= 0, and P^2 / (2 (|A| + |E|))
 * with P the positive end otherwise. Between the roots of A and E in v the case is fixed; each piece is linear or
 * P(v)^2 / (2 D(v)) with P and D linear, integrated in closed form (logarithm), or by 16-point Gauss-Legendre
 * where D barely changes (the closed form would cancel; the integrand is then a near-polynomial and the rule is
 * exact to rounding). Returns [cut, fill] as fractions of the cell area (depth x 1).
 */
const GL_X = [
  -0.9894009349916499, -0.9445750230732326, -0.8656312023878318, -0.755404408355003, -0.6178762444026438,
  -0.4580167776572274, -0.2816035507792589, -0.0950125098376374, 0.0950125098376374, 0.2816035507792589,
  0.4580167776572274, 0.6178762444026438, 0.755404408355003, 0.8656312023878318, 0.9445750230732326, 0.9894009349916499,
];
const GL_W = [
  0.0271524594117541, 0.0622535239386479, 0.0951585116824928, 0.1246289712555339, 0.1495959888165767,
  0.1691565193950025, 0.1826034150449236, 0.1894506104550685, 0.1894506104550685, 0.1826034150449236,
  0.1691565193950025, 0.1495959888165767, 0.1246289712555339, 0.0951585116824928, 0.0622535239386479,
  0.0271524594117541,
];

/** Integral over [v0, v1] of P^2 / (2 D) with P = p0 + p1 v, D = d0 + d1 v > 0 on the interval. */
function rationalPiece(p0: number, p1: number, d0: number, d1: number, v0: number, v1: number): number {
  const D0 = d0 + d1 * v0;
  const D1 = d0 + d1 * v1;
  const len = v1 - v0;
  const closed = closedForm(p0, p1, d0, d1, D0, D1, len);
  if (Math.abs(D1 - D0) <= 0.25 * Math.min(D0, D1) || !Number.isFinite(closed)) {
    let sum = 0;
    for (let k = 0; k < 16; k++) {
      const v = v0 + ((GL_X[k]! + 1) * len) / 2;
      const p = p0 + p1 * v;
      const d = d0 + d1 * v;
      if (d > 0) sum += (GL_W[k]! * p * p) / d;
    }
    return (sum * len) / 4;
  }
  return closed;
}

/** The logarithm form of the same integral (see rationalPiece). */
function closedForm(p0: number, p1: number, d0: number, d1: number, D0: number, D1: number, len: number): number {
  // P = alpha + beta D: P^2 / D = alpha^2 / D + 2 alpha beta + beta^2 D.
  const beta = p1 / d1;
  const alpha = p0 - beta * d0;
  // Where D reaches 0 at an end, P does too (both ends of the u-line meet zero there), so alpha is 0 in exact
  // arithmetic and the logarithm term vanishes.
  const logTerm = alpha === 0 || !(D0 > 0 && D1 > 0) ? 0 : (alpha * alpha * Math.log(D1 / D0)) / d1;
  return (logTerm + 2 * alpha * beta * len + (beta * beta * (D0 + D1) * len) / 2) / 2;
}

/** Positive part of f over the unit square. */
function positivePart(h00: number, h10: number, h01: number, h11: number): number {
  const a0 = h00,
    a1 = h01 - h00; // A(v) = a0 + a1 v (u = 0 side)
  const e0 = h10,
    e1 = h11 - h10; // E(v) = e0 + e1 v (u = 1 side)
  const cuts = [0, 1];
  if (a1 !== 0) cuts.push(-a0 / a1);
  if (e1 !== 0) cuts.push(-e0 / e1);
  const vs = cuts.filter((v) => v >= 0 && v <= 1).sort((x, y) => x - y);
  let total = 0;
  for (let i = 0; i + 1 < vs.length; i++) {
    const v0 = vs[i]!,
      v1 = vs[i + 1]!;
    if (v1 <= v0) continue;
    const vm = (v0 + v1) / 2;
    const A = a0 + a1 * vm;
    const E = e0 + e1 * vm;
    if (A >= 0 && E >= 0) {
      total += ((a0 + e0 + ((a1 + e1) * (v0 + v1)) / 2) / 2) * (v1 - v0);
    } else if (A > 0) {
      total += rationalPiece(a0, a1, a0 - e0, a1 - e1, v0, v1);
    } else if (E > 0) {
      total += rationalPiece(e0, e1, e0 - a0, e1 - a1, v0, v1);
    }
  }
  return total;
}

/** [cut, fill] of one cell as depth x unit area: multiply by the cell area for volume. */
export function bilinearCutFill(h00: number, h10: number, h01: number, h11: number): [cut: number, fill: number] {
  return [positivePart(h00, h10, h01, h11), positivePart(-h00, -h10, -h01, -h11)];
}
