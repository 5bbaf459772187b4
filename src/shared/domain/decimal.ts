/**
 * Exact decimal arithmetic on the numbers users type. A double's shortest round-trip text (what String(n) gives,
 * ECMAScript Number::toString) is the decimal the user entered whenever that had at most 15 significant digits,
 * so 8.01 is read as 801 / 100 exactly, never as the binary 8.0099999999999997868...
 */
export interface Decimal {
  /** value = digits / 10^scale */
  digits: bigint;
  scale: number;
}

/** The decimal a finite number stands for (its shortest round-trip text), as digits and a scale >= 0. */
export function decimalOf(value: number): Decimal {
  if (!Number.isFinite(value)) throw new RangeError(`Expected a finite number, got ${value}`);
  const [mantissa = '0', exp = '0'] = String(value).toLowerCase().split('e');
  const negative = mantissa.startsWith('-');
  const [whole = '0', fraction = ''] = mantissa.replace('-', '').split('.');
  let digits = BigInt(whole + fraction);
  let scale = fraction.length - Number(exp);
  if (scale < 0) {
    digits *= 10n ** BigInt(-scale);
    scale = 0;
  }
  return { digits: negative ? -digits : digits, scale };
}

export const pow10 = (n: number): bigint => 10n ** BigInt(n);

/** Both decimals at one scale. */
export function aligned(a: Decimal, b: Decimal): [bigint, bigint, number] {
  const scale = Math.max(a.scale, b.scale);
  return [a.digits * pow10(scale - a.scale), b.digits * pow10(scale - b.scale), scale];
}

/** Exact sum of two decimals, as a number (the double nearest the exact decimal sum). */
export function addExact(a: number, b: number): number {
  const [x, y, scale] = aligned(decimalOf(a), decimalOf(b));
  return toNumber({ digits: x + y, scale });
}

/** The double nearest a decimal. */
export function toNumber(d: Decimal): number {
  return Number(`${d.digits}e-${d.scale}`);
}

/** n / d rounded half away from zero to an integer (d > 0). */
export function divRoundHalfAway(n: bigint, d: bigint): bigint {
  const negative = n < 0n;
  const abs = negative ? -n : n;
  const q = (2n * abs + d) / (2n * d);
  return negative ? -q : q;
}

/** a / 10^a.scale compared with b / 10^b.scale: -1, 0 or 1. */
export function compareDecimal(a: Decimal, b: Decimal): number {
  const [x, y] = aligned(a, b);
  return x < y ? -1 : x > y ? 1 : 0;
}
