import type { MeasurementProfile } from '../../src/shared/constants';
import type { BidItemInput } from '../../src/shared/schemas/bid-item';
import type { Db } from '../../server/db/client';
import {
  bidItemProfiles,
  changeOrders,
  forceAccountSheets,
  materialSources,
  storedMaterials,
} from '../../server/db/schema';
import { makeBidItem } from './factories';

/** A bid item with a saved measurement profile (settings as given). */
export async function makeProfiledItem(
  db: Db,
  projectId: string,
  profile: MeasurementProfile,
  overrides: Partial<BidItemInput> = {},
  settings: Record<string, unknown> = {},
) {
  const item = await makeBidItem(db, projectId, overrides);
  await db.insert(bidItemProfiles).values({ bidItemId: item.id, projectId, profile, payDecimals: 1, settings });
  return item;
}

/** A material source at 1.473 t/CY with three weighed loads. */
export async function makeSource(db: Db, projectId: string, name = `Pit ${Math.random().toString(36).slice(2, 7)}`) {
  const [row] = await db
    .insert(materialSources)
    .values({
      projectId,
      name,
      weighedLoads: [
        { netTons: 18.42, volumeCy: 12.5 },
        { netTons: 19.1, volumeCy: 13 },
        { netTons: 18.75, volumeCy: 12.7 },
      ],
      factorComputed: 1.473,
      factorUsed: 1.473,
      statedMoisturePercent: 5,
    })
    .returning();
  return row!;
}

/** A change order on the project, approved unless asked otherwise. */
export async function makeChangeOrder(
  db: Db,
  projectId: string,
  proposedByUserId: string,
  status: 'approved' | 'proposed' = 'approved',
) {
  const [row] = await db
    .insert(changeOrders)
    .values({
      projectId,
      number: Math.floor(Math.random() * 1e9),
      title: 'Extra work on time and materials',
      proposedByUserId,
      status,
    })
    .returning();
  return row!;
}

/** A stored material on a bid item: 24 in RCP, 400 LF needed at $58.40 invoice cost. */
export async function makeStoredMaterial(db: Db, projectId: string, bidItemId: string) {
  const [row] = await db
    .insert(storedMaterials)
    .values({
      projectId,
      bidItemId,
      description: '24 in RCP, class III',
      unit: 'LF',
      unitCostCents: 5840,
      neededQuantity: 400,
      storedAt: 'Yard east of Sta 20+00',
    })
    .returning();
  return row!;
}

/** An unsigned force account daily sheet of one labor line. */
export async function makeDailySheet(db: Db, projectId: string, changeOrderId: string, createdByUserId: string) {
  const [row] = await db
    .insert(forceAccountSheets)
    .values({
      projectId,
      changeOrderId,
      workedOn: '2026-06-01',
      description: 'Muck removal',
      lines: {
        labor: [{ trade: 'Operator', hours: 8, rateCents: 6250 }],
        equipment: [],
        materials: [],
        markups: { laborPercent: 25, equipmentPercent: 0, materialPercent: 0 },
      },
      totalCents: 62_500,
      createdByUserId,
    })
    .returning();
  return row!;
}
