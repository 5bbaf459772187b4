import { describe, expect, it } from 'vitest';
import { fieldDateSchema, latestFieldDay } from '../../src/shared/schemas/tally';

// Time zones run from UTC-12 to UTC+14 (IANA tz database, Pacific/Kiritimati at +14): the latest local date anywhere
// is the UTC date 14 hours on.
describe('the latest day a field record may carry', () => {
  it('is today where the calendar is furthest ahead', () => {
    expect(latestFieldDay(new Date('2026-12-05T09:00:00Z'))).toBe('2026-12-05');
    expect(latestFieldDay(new Date('2026-12-05T10:00:00Z'))).toBe('2026-12-06');
    expect(latestFieldDay(new Date('2026-12-31T23:59:00Z'))).toBe('2027-01-01');
  });

  it('refuses a day still to come, such as next year typed for this one, and keeps the date checks', () => {
    const nextYear = `${new Date().getUTCFullYear() + 1}-01-04`;
    expect(fieldDateSchema.safeParse(nextYear).error?.issues[0]?.message).toBe('Cannot be a day still to come');
    expect(fieldDateSchema.safeParse('2026-10-31').success).toBe(true);
    expect(fieldDateSchema.safeParse(new Date().toISOString().slice(0, 10)).success).toBe(true);
    // One message for a date that is not real, never a second one about the future.
    expect(fieldDateSchema.safeParse('2026-13-01').error?.issues.map((i) => i.message)).toEqual(['Not a real date']);
  });
});
