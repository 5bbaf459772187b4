import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { changeOrderSummary } from '../../src/shared/domain/change-order-summary';
import { payApplication } from '../../src/shared/domain/pay-app';
import { payAppPackage } from '../../src/shared/domain/pay-app-package';
import {
  allowanceDrawnQuantity,
  forceAccountAsPayLine,
  forceAccountPayLines,
} from '../../src/shared/domain/provisions/force-account-pay';

// MoDOT EPG 109.5: force account work is paid on the daily records signed by both sides, under the change order
// that authorised it. Figures invented, worked by hand.
describe('force account lines of a pay application', () => {
  const numbers = new Map([
    ['co-7', 7],
    ['co-2', 2],
  ]);
  const orderOf = (id: string) => numbers.get(id)!;

  it('groups the signed days by change order, after what each paid before, in change order order', () => {
    const lines = forceAccountPayLines(
      new Map([['co-7', 120_000]]),
      [
        { id: 'd1', changeOrderId: 'co-7', totalCents: 57_600 },
        { id: 'd2', changeOrderId: 'co-2', totalCents: 190_150 },
        { id: 'd3', changeOrderId: 'co-7', totalCents: 30_001 },
      ],
      orderOf,
    );
    expect(lines).toEqual([
      { changeOrderId: 'co-2', previousCents: 0, thisPeriodCents: 190_150, days: 1, sheetIds: ['d2'] },
      { changeOrderId: 'co-7', previousCents: 120_000, thisPeriodCents: 87_601, days: 2, sheetIds: ['d1', 'd3'] },
    ]);
  });

  it('keeps a change order with earlier payments and no new day (this period $0.00)', () => {
    expect(forceAccountPayLines(new Map([['co-2', 5_000]]), [], orderOf)).toEqual([
      { changeOrderId: 'co-2', previousCents: 5_000, thisPeriodCents: 0, days: 0, sheetIds: [] },
    ]);
  });

  it('refuses a day total that is not whole cents, naming the day', () => {
    expect(() =>
      forceAccountPayLines(new Map(), [{ id: 'x', changeOrderId: 'co-2', totalCents: 1.5 }], orderOf),
    ).toThrow(expect.objectContaining({ code: 'INVALID_NUMBER', path: 'days.0.totalCents' }));
  });

  it('prices exactly in the pay arithmetic: $1,200.00 before + $876.01 now, retainage 10 % = $207.60', () => {
    const result = payApplication({
      retainagePercent: 10,
      previousCertifiedCents: 108_000,
      lines: [forceAccountAsPayLine({ previousCents: 120_000, thisPeriodCents: 87_601 })],
    });
    // $2,076.01 to date; retainage $207.601 -> $207.60; due $2,076.01 - $207.60 - $1,080.00 = $788.41.
    expect(result.lines[0]).toMatchObject({
      previousAmountCents: 120_000,
      thisPeriodAmountCents: 87_601,
      amountToDateCents: 207_601,
      contractAmountCents: 207_601,
      retainageCents: 20_760,
    });
    expect(result.currentDueCents).toBe(78_841);
  });

  it('draws on the allowance item the change order added: $1,901.50 of $15,000.00 shows on its row, 12.67 %', () => {
    const co = changeOrderSummary(
      [{ id: 'fa', originalQuantity: 0, originalUnitPriceCents: 1_500_000 }],
      [
        {
          number: 4,
          title: 'Buried crib',
          approvedAt: '2026-10-01T00:00:00Z',
          changes: [{ changeOrderNumber: 4, kind: 'change_quantity', bidItemId: 'fa', quantityDelta: 1 }],
        },
      ],
      null,
      null,
    );
    const pkg = payAppPackage({
      lines: [
        {
          itemNumber: 'FA-1',
          description: 'Crib removal allowance',
          contractQuantity: 1,
          unitPriceCents: 1_500_000,
          previousAmountCents: 0,
          thisPeriodAmountCents: 0,
          amountToDateCents: 0,
          storedMaterialsCents: 0,
          retainageCents: 0,
        },
      ],
      forceAccount: [
        {
          changeOrderNumber: 4,
          title: 'Buried crib',
          days: 1,
          previousAmountCents: 0,
          thisPeriodAmountCents: 190_150,
          amountToDateCents: 190_150,
          retainageCents: 19_015,
          allowanceItemNumber: 'FA-1',
        },
      ],
      originalContractCents: 0,
      changeOrders: co,
      retainageBps: 1000,
      adjustmentsCents: 0,
      previousCertifiedCents: 0,
    });
    // 190,150 / 1,500,000 = 12.676... % rounded down to 12.67 %; $15,000.00 - $1,901.50 = $13,098.50 to finish.
    expect(pkg.schedule).toEqual([
      expect.objectContaining({
        kind: 'force_account',
        itemNumber: 'FA-1',
        scheduledValueCents: 1_500_000,
        thisPeriodCents: 190_150,
        percentBps: 1267,
        balanceToFinishCents: 1_309_850,
        retainageCents: 19_015,
      }),
    ]);
    // The allowance is the change order's amount already: the days are named, not added again.
    expect(pkg.changeOrders.netChangeCents).toBe(1_500_000);
    expect(pkg.changeOrders.lines[0]).toMatchObject({ amountCents: 1_500_000, forceAccountCents: 190_150 });
  });

  it('adds force account to its change order, so the schedule total equals the contract sum to date (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ previous: fc.integer({ min: 0, max: 1e8 }), now: fc.integer({ min: 0, max: 1e8 }) }), {
          maxLength: 5,
        }),
        fc.integer({ min: 0, max: 1e9 }),
        (fa, original) => {
          const forceAccount = fa.map((f, i) => ({
            changeOrderNumber: i + 1,
            title: `Extra work ${i + 1}`,
            days: 1,
            previousAmountCents: f.previous,
            thisPeriodAmountCents: f.now,
            amountToDateCents: f.previous + f.now,
            retainageCents: 0,
          }));
          const pkg = payAppPackage({
            lines: [
              {
                itemNumber: '1',
                description: 'Item',
                contractQuantity: 1,
                unitPriceCents: original,
                previousAmountCents: 0,
                thisPeriodAmountCents: 0,
                amountToDateCents: 0,
                storedMaterialsCents: 0,
                retainageCents: 0,
              },
            ],
            forceAccount,
            originalContractCents: original,
            changeOrders: changeOrderSummary([], [], null, null),
            retainageBps: 1000,
            adjustmentsCents: 0,
            previousCertifiedCents: 0,
          });
          const amount = (k: string) => pkg.summary.find((s) => s.key === k)!.amountCents;
          expect(pkg.totals.scheduledValueCents).toBe(amount('contractToDate'));
          expect(pkg.changeOrders.sinceLastCents).toBe(fa.reduce((s, f) => s + f.now, 0));
          expect(pkg.changeOrders.beforeCents).toBe(fa.reduce((s, f) => s + f.previous, 0));
          expect(
            pkg.schedule.filter((r) => r.kind === 'force_account').every((r) => r.balanceToFinishCents === 0),
          ).toBe(true);
        },
      ),
    );
  });
});

describe('an allowance drawn by force account days, in its pay unit', () => {
  it('is the amount over the unit price to the stored 4 decimals (invented figures, worked by hand)', () => {
    // $576.00 on a 1 LS allowance at $1,500.00 = 0.384 LS; $6,010.50 at $15,000.00 = 0.4007 LS.
    expect(allowanceDrawnQuantity(57_600, 150_000)).toBe(0.384);
    expect(allowanceDrawnQuantity(601_050, 1_500_000)).toBe(0.4007);
    // An allowance priced per dollar (unit price $1.00) draws its dollars: $576.00 is 576.
    expect(allowanceDrawnQuantity(57_600, 100)).toBe(576);
    expect(allowanceDrawnQuantity(0, 150_000)).toBe(0);
    expect(allowanceDrawnQuantity(57_600, 0)).toBe(0);
  });

  it('refuses a drawn amount that is not whole cents', () => {
    expect(() => allowanceDrawnQuantity(0.5, 100)).toThrow(/whole cents/);
    expect(() => allowanceDrawnQuantity(-1, 100)).toThrow(/whole cents/);
  });
});
