/**
 * Parses a dollar amount typed by a person or read from a CSV cell ("1,234.5", "$12.50", "0.07") into integer
 * cents without going through floating point. Returns null when the text is not an amount with at most two
 * decimals.
 */
export function parseDollarsToCents(text: string): number | null {
  const cleaned = text.trim().replace(/^\$/, '').replace(/,/g, '');
  const match = /^(\d+)(?:\.(\d{0,2}))?$/.exec(cleaned);
  if (!match) return null;
  const whole = Number(match[1]);
  const fraction = Number((match[2] ?? '').padEnd(2, '0'));
  const cents = whole * 100 + fraction;
  return Number.isSafeInteger(cents) ? cents : null;
}
