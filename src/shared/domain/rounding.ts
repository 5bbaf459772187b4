/**
 * Decimal rounding, half away from zero, done on the decimal text so 1.005 rounds to 1.01 and 11.35 to 11.4
 * (binary floating point alone would give 1.00 and 11.3).
 */
export function roundTo(value: number, decimals: number): number {
  if (!Number.isFinite(value)) return value;
  if (value < 0) return -roundTo(-value, decimals);
  const [mantissa = '0', exponent = '0'] = value.toExponential().split('e');
  const shifted = Number(`${mantissa}e${Number(exponent) + decimals}`);
  const rounded = Math.round(shifted);
  const [m2 = '0', e2 = '0'] = rounded.toExponential().split('e');
  return Number(`${m2}e${Number(e2) - decimals}`);
}

/** True when a and b agree to a relative tolerance (absolute near zero). */
export function nearlyEqual(a: number, b: number, relative = 1e-9): boolean {
  const scale = Math.max(1, Math.abs(a), Math.abs(b));
  return Math.abs(a - b) <= relative * scale;
}

/** Sum of decimals carried to `decimals` places, so 0.1 + 0.2 gives 0.3 (quantities carry at most 4). */
export function addDecimals(a: number, b: number, decimals = 4): number {
  return roundTo(a + b, decimals);
}
