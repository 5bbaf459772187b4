import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  formatMoney,
  formatMoneyPlain,
  formatNumber,
  formatPercent,
  formatPercentBps,
  formatQuantity,
  formatQuantityPlain,
} from '../../src/shared/format';

// Outside check: the JavaScript Intl API (ECMA-402) with the en-US locale.
const intl = (decimals: number) =>
  new Intl.NumberFormat('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });

describe('one formatter for numbers, quantities, money and percents', () => {
  it('shows quantities at the display precision of their pay unit: CY 2, LF 1, EA 0 (issue 12)', () => {
    expect(formatQuantity(2849.78, 'CY')).toBe('2,849.78 CY');
    expect(formatQuantity(2849.78, 'CY', 'bank')).toBe('2,849.78 CY bank');
    expect(formatQuantity(140.5, 'LF')).toBe('140.5 LF');
    expect(formatQuantity(9999, 'EA')).toBe('9,999 EA');
    expect(formatQuantity(816, 'CY')).toBe('816.00 CY');
  });

  it('rounds half away from zero on the decimal value: 1.005 -> 1.01, 11.35 -> 11.4 (not binary toFixed)', () => {
    expect(formatNumber(1.005, 2)).toBe('1.01');
    expect(formatNumber(11.35, 1)).toBe('11.4');
    expect(formatNumber(-0.004, 2)).toBe('0.00');
  });

  it('agrees with Intl.NumberFormat en-US for any number away from a rounding tie (fast-check)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 2, max: 4 }), (n, decimals) => {
        const value = n / 100; // whole cents: no rounding tie at 2 or more decimals
        expect(formatNumber(value, decimals)).toBe(intl(decimals).format(value));
      }),
    );
  });

  it('prints money from integer cents with the sign before the dollar sign', () => {
    expect(formatMoney(123450)).toBe('$1,234.50');
    expect(formatMoney(-5)).toBe('-$0.05');
    expect(formatMoney(100000000)).toBe(
      new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(1000000),
    );
    expect(formatMoneyPlain(123450)).toBe('1234.50');
  });

  it('prints percents and basis points, trailing zeros dropped', () => {
    expect(formatPercentBps(1000)).toBe('10 %');
    expect(formatPercentBps(1250)).toBe('12.5 %');
    expect(formatPercent(4.875, 3)).toBe('4.875 %');
  });

  it('keeps the data precision in CSV cells: 222.2222 stays 222.2222, no separators', () => {
    expect(formatQuantityPlain(222.22222)).toBe('222.2222');
    expect(formatQuantityPlain(12500)).toBe('12500');
  });
});
