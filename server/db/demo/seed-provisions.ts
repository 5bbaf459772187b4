import { and, eq } from 'drizzle-orm';
import { approveChangeOrder } from '../../modules/change-orders/change-order-decisions.service';
import { proposeChangeOrder } from '../../modules/change-orders/change-orders.service';
import { addSheet, signSheet } from '../../modules/force-account/force-account.service';
import { importTickets, registerTruck } from '../../modules/haul-tickets/haul-tickets.service';
import { setProfile } from '../../modules/measurement-profiles/measurement-profiles.service';
import { addAdjustment } from '../../modules/pay-adjustments/pay-adjustments.service';
import { addScaleTicket, addSource } from '../../modules/scale-tickets/scale-tickets.service';
import { addMaterial, addMovement } from '../../modules/stored-materials/stored-materials.service';
import type { Db } from '../client';
import { bidItemProfiles, bidItems } from '../schema';
import * as data from './provisions-data';
import { actorOf } from './seed-pay-cycle';

/**
 * One item of each way of paying on the demo project, with its records, through the real services (so each has
 * its audit event). Runs once: skipped when an item of the project already has a saved profile.
 */
export async function seedProvisions(db: Db, projectId: string): Promise<boolean> {
  const [done] = await db
    .select({ id: bidItemProfiles.bidItemId })
    .from(bidItemProfiles)
    .where(eq(bidItemProfiles.projectId, projectId))
    .limit(1);
  if (done) return false;
  const [sub, gc] = await Promise.all([actorOf(db, 'sub@tallyard.test'), actorOf(db, 'gc@tallyard.test')]);
  const idOf = async (itemNumber: string) => {
    const [row] = await db
      .select({ id: bidItems.id })
      .from(bidItems)
      .where(and(eq(bidItems.projectId, projectId), eq(bidItems.itemNumber, itemNumber)));
    if (!row) throw new Error(`demo item ${itemNumber} is missing`);
    return row.id;
  };

  await setProfile(db, gc, await idOf('101'), {
    profile: 'lump_sum',
    stage: 'interim',
    // Paid in steps of the original contract earned (invented steps, consistent with the demo's August
    // application, where the other items had earned 10.5 % and mobilization was paid in full).
    settings: {
      mobilizationSteps: [
        { contractEarnedPercent: 5, mobilizationPercent: 50 },
        { contractEarnedPercent: 10, mobilizationPercent: 100 },
      ],
    },
  });
  await setProfile(db, gc, await idOf('201'), {
    profile: 'lump_sum',
    stage: 'interim',
    settings: {
      stages: [
        { name: 'Building pad and roads', percentOfItem: 45, completedOn: '2026-09-18' },
        { name: 'Storm basin', percentOfItem: 35, completedOn: '2026-10-09' },
        { name: 'Borrow area', percentOfItem: 20, completedOn: null },
      ],
    },
  });
  await setProfile(db, gc, await idOf('402'), {
    profile: 'plan_quantity',
    payDecimals: 0,
    stage: 'interim',
    settings: { percentComplete: 40, substantialErrorPercent: 5, substantialErrorCents: 500_000 },
  });
  await setProfile(db, gc, await idOf('203'), { profile: 'worksheet', stage: 'interim', settings: {} });

  const haulItem = await idOf('303');
  await setProfile(db, gc, haulItem, { profile: 'truck_measure', stage: 'interim', settings: {} });
  for (const truck of data.DEMO_TRUCKS) await registerTruck(db, gc, projectId, truck);
  await importTickets(db, sub, projectId, { bidItemId: haulItem, csv: data.DEMO_LOAD_SHEET });

  const baseItem = await idOf('401');
  await setProfile(db, gc, baseItem, { profile: 'weight', payDecimals: 2, stage: 'interim', settings: {} });
  const source = await addSource(db, sub, projectId, data.DEMO_SOURCE);
  for (const t of data.DEMO_SCALE_TICKETS) {
    await addScaleTicket(db, sub, projectId, {
      ...t,
      bidItemId: baseItem,
      sourceId: source.id,
      material: '1 1/2 in crushed aggregate base',
      scaleCheckerInitials: 'JW',
      deliveryCheckerInitials: 'RD',
    });
  }

  // The demo's history: its hand-off mail is queued like any other and marked undelivered by the demo seed.
  const changeOrders = { db, appUrl: '' };
  const proposed = await proposeChangeOrder(changeOrders, gc, projectId, {
    title: 'Buried timber crib at the outlet, on time and materials',
    reason:
      'An old timber crib was found under the outlet structure; removal is paid on time and materials up to $15,000.',
    items: [{ kind: 'add_item', newItem: data.DEMO_FORCE_ACCOUNT_ITEM }],
  });
  await approveChangeOrder(changeOrders, gc, proposed.id, 'Agreed on time and materials');
  await setProfile(db, gc, await idOf(data.DEMO_FORCE_ACCOUNT_ITEM.itemNumber), {
    profile: 'force_account',
    stage: 'interim',
    settings: {},
  });
  for (const [i, sheet] of data.DEMO_DAILY_SHEETS.entries()) {
    const made = await addSheet(db, sub, projectId, {
      ...sheet,
      changeOrderId: proposed.id,
      markups: data.DEMO_MARKUPS,
    });
    await signSheet(db, sub, made.id);
    if (i === 0) await signSheet(db, gc, made.id); // the second day waits for the general contractor
  }

  const riprap = await addMaterial(db, sub, projectId, { ...data.DEMO_STORED, bidItemId: await idOf('501') });
  for (const move of data.DEMO_STORED_MOVES) await addMovement(db, sub, riprap.id, move);

  await addAdjustment(db, gc, projectId, {
    kind: 'fuel_adjustment',
    appliesOn: '2026-09-30',
    description: 'September diesel index against the bid month',
    fuelKind: 'excavation',
    quantityCy: 6_240,
    baseIndex: 3.412,
    currentIndex: 3.688,
    triggerPercent: 5,
  });
  await addAdjustment(db, gc, projectId, {
    kind: 'credit',
    appliesOn: '2026-10-31',
    description: 'Silt fence furnished by the owner',
    amountCents: 84_600,
  });
  return true;
}
