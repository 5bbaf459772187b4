import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { payApplication } from '../../src/shared/domain/pay-app';
import { changeOrderValues, disputedClaims, waiverExceptions } from '../../src/shared/domain/waiver-exceptions';

const none = { disputedLines: [], unpaidChangeOrders: [], signerAdded: [] };

describe('waiverExceptions', () => {
  it('lists held retainage, the uncertified part of a disputed claim, an unpaid change order and the signer’s own, in that order', () => {
    // Worked by hand: 512.963 CY x $9.40 = $4,821.8522 -> $4,821.85 (rounded once, half away from zero).
    const out = waiverExceptions({
      retainageHeldCents: 151_355,
      disputedLines: [
        {
          itemNumber: '205',
          description: 'Unclassified excavation',
          payUnit: 'CY',
          unitPriceCents: 940,
          claimedQuantity: 4712.963,
          certifiedQuantity: 4200,
        },
      ],
      unpaidChangeOrders: [{ number: 3, title: 'Haul road widening', amountCents: 1_250_000 }],
      signerAdded: [{ description: 'Standby time claimed by letter of 12 October', amountCents: 88_000 }],
    });
    expect(out.map((e) => [e.kind, e.amountCents])).toEqual([
      ['retainage_held', 151_355],
      ['disputed', 482_185],
      ['change_order_unpaid', 1_250_000],
      ['signer_added', 88_000],
    ]);
    expect(out[1]!.description).toContain('512.96 CY in dispute'); // display precision (format.ts); priced exactly
    expect(out[2]!.description).toContain('Change order 3');
  });

  it('leaves out zero amounts: no retainage, a dispute settled at the claim, a change order that lowered the contract', () => {
    expect(
      waiverExceptions({
        retainageHeldCents: 0,
        disputedLines: [
          {
            itemNumber: '1',
            description: 'Topsoil',
            payUnit: 'SY',
            unitPriceCents: 100,
            claimedQuantity: 10,
            certifiedQuantity: 10,
          },
        ],
        unpaidChangeOrders: [{ number: 1, title: 'Deduct', amountCents: -5000 }],
        signerAdded: [],
      }),
    ).toEqual([]);
  });

  it('property: the held-retainage exception equals the application’s retainage to date, to the cent (payApplication)', () => {
    const line = fc.record({
      unitPriceCents: fc.integer({ min: 1, max: 5_000_000 }),
      contractQuantity: fc.integer({ min: 0, max: 100_000 }),
      previousQuantity: fc.integer({ min: 0, max: 50_000 }),
      thisPeriodQuantity: fc.double({ min: 0, max: 50_000, noNaN: true }).map((q) => Math.round(q * 1000) / 1000),
    });
    fc.assert(
      fc.property(fc.array(line, { minLength: 1, maxLength: 30 }), fc.integer({ min: 0, max: 2000 }), (lines, bps) => {
        const app = payApplication({ retainagePercent: bps / 100, previousCertifiedCents: 0, lines });
        const held = waiverExceptions({ retainageHeldCents: app.retainageCents, ...none }).filter(
          (e) => e.kind === 'retainage_held',
        );
        const total = held.reduce((s, e) => s + e.amountCents, 0);
        expect(total).toBe(app.retainageCents);
        expect(Number.isInteger(total)).toBe(true);
      }),
    );
  });
});

describe('disputedClaims: the claim a waiver keeps open is the subcontractor’s last own figure (common practice)', () => {
  const line = {
    itemNumber: '205',
    description: 'Unclassified excavation',
    payUnit: 'CY' as const,
    unitPriceCents: 940,
    certifiedQuantity: 4200,
  };
  const dispute = (
    lineId: string,
    claimedQuantity: number | null,
    resolution: 'counter_accepted' | 'quantity_proposed' | 'answered' | null,
  ) => ({
    ...line,
    lineId,
    claimedQuantity,
    resolution,
  });

  it('the counter taken to be paid now keeps the claim open', () => {
    expect(disputedClaims([dispute('a', 4500, 'counter_accepted')])).toEqual([{ ...line, claimedQuantity: 4500 }]);
  });

  it('a quantity the subcontractor proposed itself, then certified, leaves nothing in dispute', () => {
    const claims = disputedClaims([dispute('a', 4500, 'quantity_proposed')]);
    expect(claims).toEqual([]);
    expect(waiverExceptions({ ...none, retainageHeldCents: 0, disputedLines: claims })).toEqual([]);
  });

  it('the latest dispute on a line speaks: a proposal (4,500 to 4,300) then a counter taken keeps 4,300 open', () => {
    const claims = disputedClaims([dispute('a', 4500, 'quantity_proposed'), dispute('a', 4300, 'counter_accepted')]);
    expect(claims).toEqual([{ ...line, claimedQuantity: 4300 }]);
    // 100 CY x $9.40 = $940.00, by hand.
    expect(waiverExceptions({ ...none, retainageHeldCents: 0, disputedLines: claims })[0]!.amountCents).toBe(94_000);
  });

  it('a dispute kept before claims were recorded reserves nothing; lines stand apart', () => {
    expect(disputedClaims([dispute('a', null, 'counter_accepted'), dispute('b', 4400, 'answered')])).toEqual([
      { ...line, claimedQuantity: 4400 },
    ]);
  });
});

describe('changeOrderValues', () => {
  it('values each approved change order as the contract sum after it less before it, in approval order', () => {
    const items = [
      { id: 'a', originalQuantity: 1000, originalUnitPriceCents: 800 },
      { id: 'b', originalQuantity: 0, originalUnitPriceCents: 2500 },
    ];
    // CO 1: +200 on a at $8.00 = $1,600.00. CO 2: a's price to $9.00 on 1,200 = +$1,200.00. CO 3: adds b, 40 x $25 = $1,000.
    const values = changeOrderValues(items, [
      { changeOrderNumber: 1, kind: 'change_quantity', bidItemId: 'a', quantityDelta: 200 },
      { changeOrderNumber: 2, kind: 'change_price', bidItemId: 'a', newUnitPriceCents: 900 },
      { changeOrderNumber: 3, kind: 'change_quantity', bidItemId: 'b', quantityDelta: 40 },
    ]);
    expect([...values]).toEqual([
      [1, 160_000],
      [2, 120_000],
      [3, 100_000],
    ]);
  });
});
