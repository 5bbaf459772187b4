import { describe, expect, it } from 'vitest';
import { payAppFlags, type FlagLine } from '../../src/shared/domain/pay-app-flags';
import { formatCount } from '../../src/shared/format';

// The flags' words go to the screens, the PDF and the e-mails: quantities, money and percents through the one
// formatter (issue 12, item 7). The over-run band is FAR 52.211-18 (15 %); the figures are invented.
const line = (over: Partial<FlagLine>): FlagLine => ({
  id: 'l1',
  itemNumber: '402',
  payUnit: 'SY',
  unitPriceCents: 135,
  contractQuantity: 21_500,
  thisPeriodQuantity: 8_600,
  toDateQuantity: 8_600,
  paidFrom: 'tallies',
  ...over,
});

describe('pay application flags in words', () => {
  it('formats a line with no tally behind it with separators and the display precision of its unit', () => {
    const [flag] = payAppFlags([line({})], 1500, new Map());
    expect(flag!.message).toBe('Item 402: 8,600.00 SY billed this period with no tally behind it.');
  });

  it('looks for no tally behind a line paid by mobilization steps or by the item’s percent complete or stages', () => {
    // The settings and their audit events are the record of such a line (FDOT 9-3.2.1 pays a plan quantity as the
    // work is completed, with no measurement); tickets are the record of a line paid from loads (common practice).
    expect(payAppFlags([line({ paidFrom: 'settings' })], 1500, new Map())).toEqual([]);
    expect(payAppFlags([line({ paidFrom: 'steps' })], 1500, new Map())).toEqual([]);
    const [loads] = payAppFlags([line({ paidFrom: 'tickets' })], 1500, new Map());
    expect(loads!.message).toBe('Item 402: 8,600.00 SY billed this period with no ticket behind it.');
    // An over-run is still flagged, whatever the line was paid from.
    const over = payAppFlags([line({ paidFrom: 'settings', toDateQuantity: 25_000 })], 1500, new Map());
    expect(over.map((f) => f.kind)).toEqual(['beyond_band']);
  });

  it('says "the tally ... has" for one tally and counts several', () => {
    const one = payAppFlags([line({})], 1500, new Map([['l1', { tallies: 1, withoutEvidence: 1 }]]));
    expect(one[0]!.message).toBe('Item 402: the tally billed this period has no evidence file.');
    const some = payAppFlags([line({})], 1500, new Map([['l1', { tallies: 3, withoutEvidence: 1 }]]));
    expect(some[0]!.message).toBe('Item 402: 1 of the 3 tallies billed this period has no evidence file.');
  });

  it('words an over-run past the 15 % band and leaves exactly 115 % unflagged', () => {
    // 21,500 x 1.15 = 24,725 SY: exactly at the band is not flagged (FAR 52.211-18: "more than 15 percent").
    expect(
      payAppFlags([line({ toDateQuantity: 24_725 })], 1500, new Map([['l1', { tallies: 1, withoutEvidence: 0 }]])),
    ).toEqual([]);
    const [flag] = payAppFlags(
      [line({ toDateQuantity: 25_000 })],
      1500,
      new Map([['l1', { tallies: 1, withoutEvidence: 0 }]]),
    );
    // 25,000 / 21,500 = 116.28 %; 275 SY past the band x $1.35 = $371.25.
    expect(flag!.message).toBe(
      'Item 402: 25,000.00 SY to date is 116.28 % of the contract quantity 21,500.00 SY; 275.00 SY past the +15 % band ($371.25 at the unit price).',
    );
  });

  it('counts with the right noun', () => {
    expect(formatCount(1, 'file')).toBe('1 file');
    expect(formatCount(2, 'file')).toBe('2 files');
    expect(formatCount(1200, 'tally', 'tallies')).toBe('1,200 tallies');
  });
});
