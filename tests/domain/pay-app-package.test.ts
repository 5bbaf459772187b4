import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { changeOrderSummary } from '../../src/shared/domain/change-order-summary';
import { payApplication } from '../../src/shared/domain/pay-app';
import { payAppPackage, SUMMARY_KEYS } from '../../src/shared/domain/pay-app-package';
import { mobilizationLine } from '../../src/shared/domain/provisions/mobilization';
import { settingsQuantityToDate } from '../../src/shared/domain/provisions/settings-quantity';

const noChangeOrders = changeOrderSummary([], [], null, null);

describe('pay application with materials stored and adjustments (hand-worked, invented figures)', () => {
  // One line: 120.25 LF x $42.10 = $5,062.525 -> $5,062.53 (rounded once, half away from zero); $5,840.00 of pipe
  // stored (23 CFR 635.122: stored materials may be paid); retainage 10 % on $10,902.53 = $1,090.253 -> $1,090.25;
  // a deduction of $250.00; due = 5,062.53 + 5,840.00 - 1,090.25 - 250.00 = $9,562.28.
  const result = payApplication({
    retainagePercent: 10,
    previousCertifiedCents: 0,
    adjustmentsToDateCents: -25_000,
    lines: [
      {
        unitPriceCents: 4210,
        contractQuantity: 500,
        previousQuantity: 0,
        thisPeriodQuantity: 120.25,
        storedMaterialsCents: 584_000,
      },
    ],
  });

  it('holds retainage on work and stored materials, and counts the adjustment to date', () => {
    expect(result.lines[0]).toMatchObject({
      amountToDateCents: 506_253,
      storedMaterialsCents: 584_000,
      retainageCents: 109_025,
    });
    expect(result).toMatchObject({
      storedMaterialsCents: 584_000,
      adjustmentsCents: -25_000,
      currentDueCents: 956_228,
    });
    expect(result.trail.at(-1)).toContain('materials stored');
  });

  it('refuses stored materials that are not whole non-negative cents, naming the line', () => {
    expect(() =>
      payApplication({
        retainagePercent: 10,
        previousCertifiedCents: 0,
        lines: [
          {
            unitPriceCents: 1,
            contractQuantity: 1,
            previousQuantity: 0,
            thisPeriodQuantity: 0,
            storedMaterialsCents: -1,
          },
        ],
      }),
    ).toThrow(expect.objectContaining({ code: 'INVALID_NUMBER', path: 'lines.0.storedMaterialsCents' }));
  });
});

describe('payAppPackage: schedule of values and summary lines', () => {
  it('works a two-line example by hand', () => {
    // A: 1,000 CY x $7.25 = $7,250.00 scheduled, $2,900.00 before, $800.00 this period: $3,700.00 = 51.03 % (down).
    // B: 1 LS x $1,000.00 with $300.00 stored only: 30 %.
    const pkg = payAppPackage({
      lines: [
        {
          itemNumber: 'A',
          description: 'Cut',
          contractQuantity: 1000,
          unitPriceCents: 725,
          previousAmountCents: 290_000,
          thisPeriodAmountCents: 80_000,
          amountToDateCents: 370_000,
          storedMaterialsCents: 0,
          retainageCents: 37_000,
        },
        {
          itemNumber: 'B',
          description: 'Pipe',
          contractQuantity: 1,
          unitPriceCents: 100_000,
          previousAmountCents: 0,
          thisPeriodAmountCents: 0,
          amountToDateCents: 0,
          storedMaterialsCents: 30_000,
          retainageCents: 3_000,
        },
      ],
      originalContractCents: 825_000,
      changeOrders: noChangeOrders,
      retainageBps: 1000,
      adjustmentsCents: -5_000,
      previousCertifiedCents: 261_000,
    });
    expect(pkg.schedule[0]).toMatchObject({
      completedAndStoredCents: 370_000,
      percentBps: 5103,
      balanceToFinishCents: 355_000,
    });
    expect(pkg.schedule[1]).toMatchObject({
      completedAndStoredCents: 30_000,
      percentBps: 3000,
      balanceToFinishCents: 70_000,
    });
    // 400,000 - 40,000 = 360,000 earned less retainage; - 5,000 - 261,000 = 94,000 due; 825,000 - 360,000 left.
    expect(Object.fromEntries(pkg.summary.map((s) => [s.key, s.amountCents]))).toEqual({
      originalContract: 825_000,
      netChangeOrders: 0,
      contractToDate: 825_000,
      completedAndStored: 400_000,
      retainage: 40_000,
      earnedLessRetainage: 360_000,
      adjustments: -5_000,
      previousCertified: 261_000,
      currentDue: 94_000,
      balanceToFinish: 465_000,
    });
    expect(pkg.summary.find((s) => s.key === 'retainage')!.label).toBe('Less retainage held (10 %)');
  });

  it('agrees with payApplication for any lines: totals are column sums and current due is the same (fast-check)', () => {
    const line = fc.record({
      unitPriceCents: fc.integer({ min: 0, max: 500_000 }),
      contractQuantity: fc.integer({ min: 0, max: 1_000_000 }).map((q) => q / 100),
      previousQuantity: fc.integer({ min: 0, max: 500_000 }).map((q) => q / 100),
      thisPeriodQuantity: fc.integer({ min: 0, max: 500_000 }).map((q) => q / 100),
      storedMaterialsCents: fc.integer({ min: 0, max: 10_000_000 }),
    });
    fc.assert(
      fc.property(
        fc.array(line, { maxLength: 12 }),
        fc.integer({ min: 0, max: 1500 }),
        fc.integer({ min: -1_000_000, max: 1_000_000 }),
        fc.integer({ min: 0, max: 50_000_000 }),
        (lines, retainageBps, adjustments, previous) => {
          const app = payApplication({
            retainagePercent: retainageBps / 100,
            previousCertifiedCents: previous,
            adjustmentsToDateCents: adjustments,
            lines,
          });
          const pkg = payAppPackage({
            lines: lines.map((l, i) => ({ ...l, ...app.lines[i]!, itemNumber: `${i}`, description: '' })),
            originalContractCents: app.contractAmountCents,
            changeOrders: noChangeOrders,
            retainageBps,
            adjustmentsCents: adjustments,
            previousCertifiedCents: previous,
          });
          const get = (k: string) => pkg.summary.find((s) => s.key === k)!.amountCents;
          expect(pkg.summary.map((s) => s.key)).toEqual([...SUMMARY_KEYS]);
          expect(get('currentDue')).toBe(app.currentDueCents);
          expect(get('retainage')).toBe(app.retainageCents);
          expect(pkg.totals.scheduledValueCents).toBe(app.contractAmountCents);
          expect(pkg.totals.completedAndStoredCents).toBe(app.earnedToDateCents + app.storedMaterialsCents);
          for (const k of [
            'previousCents',
            'thisPeriodCents',
            'storedMaterialsCents',
            'balanceToFinishCents',
          ] as const) {
            expect(pkg.totals[k]).toBe(pkg.schedule.reduce((s, r) => s + r[k], 0));
          }
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('mobilizationLine: steps of the original contract earned (Iowa DOT 2533 pattern, 25 % at 5 %, 50 % at 10 %)', () => {
  const steps = [
    { contractEarnedPercent: 5, mobilizationPercent: 25 },
    { contractEarnedPercent: 10, mobilizationPercent: 50 },
    { contractEarnedPercent: 50, mobilizationPercent: 100 },
  ];
  // Hand-worked: mobilization 1 LS at $60,000.00, original contract $1,200,000.00; the other items have earned
  // $130,000.00 = 10.83 % -> the 10 % step: 50 %, so 0.5 LS to date ($30,000.00); 0.25 LS paid before -> 0.25 now.
  it('pays the step reached, less what was paid before', () => {
    const line = mobilizationLine({
      contractQuantity: 1,
      mobilizationCents: 6_000_000,
      previousQuantity: 0.25,
      originalContractCents: 120_000_000,
      otherEarnedToDateCents: 13_000_000,
      steps,
    });
    expect(line).toMatchObject({ toDateQuantity: 0.5, thisPeriodQuantity: 0.25 });
    expect(line.earned).toMatchObject({ mobilizationPercent: 50, earnedCents: 3_000_000 });
  });

  it('never takes back a step already paid when other earnings dip (common practice)', () => {
    const line = mobilizationLine({
      contractQuantity: 1,
      mobilizationCents: 6_000_000,
      previousQuantity: 0.5,
      originalContractCents: 120_000_000,
      otherEarnedToDateCents: 7_000_000,
      steps,
    });
    expect(line).toMatchObject({ toDateQuantity: 0.5, thisPeriodQuantity: 0 });
  });
});

describe('settingsQuantityToDate: items paid from their own settings (hand-worked)', () => {
  const stages = [
    { name: 'Pad', percentOfItem: 45 },
    { name: 'Basin', percentOfItem: 35 },
    { name: 'Borrow', percentOfItem: 20 },
  ];
  it('pays a lump sum by its stages done, the whole quantity once all are done', () => {
    expect(settingsQuantityToDate('lump_sum', { stages, completedStages: [0, 1] }, 1, 3)).toBe(0.8);
    expect(settingsQuantityToDate('lump_sum', { stages, completedStages: [0, 1, 2] }, 1, 3)).toBe(1);
    expect(settingsQuantityToDate('lump_sum', { percentComplete: 37.25 }, 1, 3)).toBe(0.3725);
  });
  it('pays a plan quantity by percent complete to the measured decimals (FDOT 9-3.2.1: paid at plan quantity)', () => {
    // 4,100 CY x 37.5 % = 1,537.5 CY; 1,234.5 SY x 33.33 % = 411.45885 -> 411.5 at 1 decimal.
    expect(settingsQuantityToDate('plan_quantity', { percentComplete: 37.5 }, 4100, 2)).toBe(1537.5);
    expect(settingsQuantityToDate('plan_quantity', { percentComplete: 33.33 }, 1234.5, 1)).toBe(411.5);
  });
  it('says nothing for measured items or settings without a measure', () => {
    expect(settingsQuantityToDate('worksheet', { percentComplete: 50 }, 10, 2)).toBeNull();
    expect(settingsQuantityToDate('lump_sum', {}, 1, 3)).toBeNull();
    expect(settingsQuantityToDate('plan_quantity', {}, 10, 2)).toBeNull();
  });
});
