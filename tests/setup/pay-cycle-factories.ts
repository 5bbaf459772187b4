import { eq } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { auditEvents, tallies } from '../../server/db/schema';

/** A tally written straight to the database (status `ready` by default), for pay application tests. */
export async function makeTally(
  db: Db,
  v: {
    projectId: string;
    bidItemId: string;
    authorUserId: string;
    measuredOn: string;
    quantity: number;
    status?: 'draft' | 'ready' | 'billed';
  },
) {
  const [row] = await db
    .insert(tallies)
    .values({
      ...v,
      status: v.status ?? 'ready',
      method: 'manual',
      manualBasis: 'Test quantity written by the factory',
      result: { engine: null, measured: null, quantity: v.quantity, unit: 'CY', basis: 'bank', trail: ['factory'] },
    })
    .returning();
  return row!;
}

export async function auditActions(db: Db, objectId: string): Promise<string[]> {
  const rows = await db.select().from(auditEvents).where(eq(auditEvents.objectId, objectId)).orderBy(auditEvents.id);
  return rows.map((r) => r.action);
}

/** Minimal valid files of each evidence kind. */
export const FILES = {
  pdf: Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n'),
  png: Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(24)]),
  jpeg: Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(16)]),
  csv: Buffer.from('station,cut_area,fill_area\n1000,50,0\n1100,70,0\n'),
  landxml: Buffer.from(
    '<?xml version="1.0" encoding="UTF-8"?>\n<!-- survey -->\n<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2"><Surfaces/></LandXML>\n',
  ),
};

/**
 * A project with two bid items of hand-checkable prices and ready tallies in October 2026:
 * A-1 1,000 CY at $7.25 (400 CY measured), B-2 500 LF at $42.10 (120.25 LF measured).
 */
export async function makeBillableProject(
  db: Db,
  projectId: string,
  authorUserId: string,
  makeItem: (o: object) => Promise<{ id: string }>,
) {
  const a = await makeItem({ itemNumber: 'A-1', payUnit: 'CY', unitPriceCents: 725, contractQuantity: 1000 });
  const b = await makeItem({
    itemNumber: 'B-2',
    description: 'Storm trench',
    payUnit: 'LF',
    unitPriceCents: 4210,
    contractQuantity: 500,
    method: 'trench',
  });
  const t = (bidItemId: string, measuredOn: string, quantity: number, status?: 'draft' | 'ready') =>
    makeTally(db, { projectId, bidItemId, authorUserId, measuredOn, quantity, status });
  const tallies = [
    await t(a.id, '2026-10-03', 300.5),
    await t(a.id, '2026-10-28', 99.5),
    await t(b.id, '2026-10-15', 120.25),
  ];
  const outside = [await t(a.id, '2026-11-02', 100), await t(b.id, '2026-10-20', 50, 'draft')];
  return { a, b, tallies, outside };
}
