import { afterAll, describe, expect, it } from 'vitest';

// A calendar date (a pay period's first day, a measurement day) names the same day wherever the reader is. West of
// Greenwich `new Date('2026-10-01')` is the evening of September 30 (ECMA-262, Date Time String Format: a date-only
// form is read as UTC), so formatting it in the reader's zone would show the day before.
const before = process.env.TZ;
process.env.TZ = 'America/Los_Angeles';
const { formatDate, formatDateRange } = await import('@/lib/format');
afterAll(() => {
  process.env.TZ = before;
});

describe('formatDate', () => {
  it('shows a calendar date as that day in a zone west of Greenwich', () => {
    expect(formatDate('2026-10-01')).toBe('Oct 1, 2026');
    expect(formatDateRange('2026-10-01', '2026-10-31')).toBe('Oct 1, 2026 – Oct 31, 2026');
  });

  it('shows an instant in the reader’s zone, and leaves text that is no date as it is', () => {
    expect(formatDate('2026-10-01T03:00:00Z')).toBe('Sep 30, 2026');
    expect(formatDate('soon')).toBe('soon');
  });
});
