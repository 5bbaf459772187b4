import fc from 'fast-check';
import { bignumber, multiply, round, subtract, type BigNumber } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { daysOverrun, fuelAdjustment, liquidatedDamagesCents } from '../../src/shared/domain/provisions/deductions';
import { dailySheetTotals } from '../../src/shared/domain/provisions/force-account';
import { storedAccount } from '../../src/shared/domain/provisions/stored-materials';

describe('force account daily sheet (MoDOT EPG 109.5: labor, equipment incl. standby, materials, contract markups)', () => {
  const sheet = {
    labor: [
      { trade: 'Operator', hours: 8, rateCents: 6250 },
      { trade: 'Laborer', hours: 8, rateCents: 4125 },
    ],
    equipment: [{ unit: 'Excavator 30 t', hours: 6, rateCents: 18_500, standbyHours: 2, standbyRateCents: 9250 }],
    materials: [{ description: 'Geotextile, 2 rolls', invoiceCents: 41_238 }],
    markups: { laborPercent: 25, equipmentPercent: 15, materialPercent: 15 },
  };

  it('totals a day by hand: labor $1,037.50, equipment $1,489.25, materials $474.24, day $3,000.99', () => {
    const t = dailySheetTotals(sheet);
    expect(t.labor).toEqual({ subtotalCents: 83_000, markupCents: 20_750, totalCents: 103_750 });
    expect(t.equipment).toEqual({ subtotalCents: 129_500, markupCents: 19_425, totalCents: 148_925 });
    expect(t.materials).toEqual({ subtotalCents: 41_238, markupCents: 6186, totalCents: 47_424 });
    expect(t.totalCents).toBe(300_099);
  });

  it('refuses more than 24 working and standby hours on one unit, naming the line', () => {
    const bad = { ...sheet, equipment: [{ ...sheet.equipment[0]!, hours: 20, standbyHours: 6 }] };
    expect(() => dailySheetTotals(bad)).toThrow(expect.objectContaining({ path: 'equipment.0' }));
  });

  it('adds up to the sum of its groups and never below the bare costs (property)', () => {
    const labor = fc.record({
      trade: fc.constant('x'),
      hours: fc.integer({ min: 0, max: 96 }).map((q) => q / 4),
      rateCents: fc.integer({ min: 0, max: 50_000 }),
    });
    fc.assert(
      fc.property(fc.array(labor, { maxLength: 10 }), fc.integer({ min: 0, max: 50 }), (lines, pct) => {
        const t = dailySheetTotals({
          labor: lines,
          equipment: [],
          materials: [],
          markups: { laborPercent: pct, equipmentPercent: 0, materialPercent: 0 },
        });
        const bare = lines.reduce((s, l) => s + Math.round(l.hours * l.rateCents), 0);
        expect(t.labor.subtotalCents).toBe(bare);
        expect(t.totalCents).toBe(t.labor.totalCents);
        expect(t.totalCents).toBeGreaterThanOrEqual(bare);
      }),
    );
  });
});

describe('stored materials running account (23 CFR 635.122: paid up to need, at invoice cost)', () => {
  const pipe = { unitCostCents: 5840, neededQuantity: 400 };
  const moves = [
    { kind: 'added' as const, quantity: 240, period: 1 },
    { kind: 'added' as const, quantity: 200, period: 2 },
    { kind: 'used' as const, quantity: 150, period: 2 },
  ];

  it('period 1: 240 LF stored, all payable, $14,016.00 (hand-worked)', () => {
    expect(storedAccount(pipe, moves, 1)).toEqual({
      previousQuantity: 0,
      addedQuantity: 240,
      usedQuantity: 0,
      remainingQuantity: 240,
      payableQuantity: 240,
      payableCents: 1_401_600,
    });
  });

  it('period 2: 240 + 200 - 150 = 290 LF on hand but only 250 LF still needed, so $14,600.00 payable', () => {
    expect(storedAccount(pipe, moves, 2)).toMatchObject({
      previousQuantity: 240,
      addedQuantity: 200,
      usedQuantity: 150,
      remainingQuantity: 290,
      payableQuantity: 250,
      payableCents: 1_460_000,
    });
  });

  it('refuses using more than is stored, naming the movement', () => {
    expect(() => storedAccount(pipe, [{ kind: 'used', quantity: 1, period: 1 }], 1)).toThrow(
      expect.objectContaining({ code: 'INVALID_QUANTITY', path: 'movements.0.quantity' }),
    );
  });

  it('keeps previous + added - used = remaining, and payable within need and on hand (property)', () => {
    const move = fc.record({
      kind: fc.constantFrom('added' as const, 'used' as const),
      quantity: fc.integer({ min: 0, max: 500 }),
      period: fc.integer({ min: 1, max: 4 }),
    });
    fc.assert(
      fc.property(fc.array(move, { maxLength: 20 }), fc.integer({ min: 1, max: 4 }), (ms, period) => {
        let a;
        try {
          a = storedAccount(pipe, ms, period);
        } catch (e) {
          expect(e).toBeInstanceOf(DomainError);
          return;
        }
        expect(a.previousQuantity + a.addedQuantity - a.usedQuantity).toBe(a.remainingQuantity);
        expect(a.payableQuantity).toBeLessThanOrEqual(Math.min(a.remainingQuantity, pipe.neededQuantity));
      }),
    );
  });
});

describe('deductions and adjustments on their own lines', () => {
  it('deducts liquidated damages: 12 days x $2,850.00 = -$34,200.00 (23 CFR 635.127)', () => {
    expect(daysOverrun('2026-10-31', '2026-11-12')).toBe(12);
    expect(liquidatedDamagesCents(12, 285_000)).toBe(-3_420_000);
    expect(daysOverrun('2026-10-31', '2026-10-30')).toBe(0);
    expect(liquidatedDamagesCents(0, 285_000)).toBe(0);
    expect(() => daysOverrun('2026-02-30', '2026-03-01')).toThrow(DomainError);
  });

  it('pays a fuel rise on 25,000 CY excavation: 5,000 gal x ($3.2150 - $2.8500) = $1,825.00 (Iowa DOT 2120 factor 0.20)', () => {
    expect(fuelAdjustment({ kind: 'excavation', quantityCy: 25_000, baseIndex: 2.85, currentIndex: 3.215 })).toEqual({
      gallons: 5000,
      amountCents: 182_500,
      applies: true,
    });
  });

  it('deducts a fuel fall on 18,000 CY embankment: 4,860 gal x -$0.2125 = -$1,032.75 (factor 0.27, FHWA T 5080.3)', () => {
    expect(
      fuelAdjustment({ kind: 'embankment', quantityCy: 18_000, baseIndex: 3.1, currentIndex: 2.8875 }).amountCents,
    ).toBe(-103_275);
  });

  it('adjusts nothing inside the trigger band', () => {
    expect(
      fuelAdjustment({ kind: 'excavation', quantityCy: 1000, baseIndex: 3, currentIndex: 3.1, triggerPercent: 5 }),
    ).toMatchObject({
      applies: false,
      amountCents: 0,
    });
  });

  it('agrees with mathjs BigNumber to the cent for any quantity and index (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('excavation' as const, 'embankment' as const),
        fc.integer({ min: 0, max: 100_000_00 }),
        fc.integer({ min: 10_000, max: 80_000 }),
        fc.integer({ min: 0, max: 80_000 }),
        (kind, qh, b, c) => {
          const q = qh / 100;
          const got = fuelAdjustment({
            kind,
            quantityCy: q,
            baseIndex: b / 10_000,
            currentIndex: c / 10_000,
          }).amountCents;
          const factor = kind === 'excavation' ? '0.2' : '0.27';
          const diff = subtract(bignumber(String(c / 10_000)), bignumber(String(b / 10_000)));
          const dollars = multiply(multiply(bignumber(String(q)), bignumber(factor)), diff) as BigNumber;
          const cents = Number(round(multiply(dollars, bignumber(100)) as BigNumber, 0).toString());
          expect(got).toBe(cents === 0 ? 0 : cents);
        },
      ),
    );
  });
});
