import { eq } from 'drizzle-orm';
import type { PayAppStatus } from '../../src/shared/constants';
import { lineAmountCents, sumCents } from '../../src/shared/domain/money';
import type { Db } from '../../server/db/client';
import { payAppLines, payApps, projects } from '../../server/db/schema';
import { makeBidItem } from './factories';

export type LineSpec = { quantity: number; unitPriceCents: number; description?: string };

/**
 * A pay application written straight to the database (not through the pay application routes), with lines whose
 * cents agree: amount = quantity x unit price rounded once; retainage per line at the app's rate; current due =
 * earned to date - retainage - previously certified.
 */
export async function makeCertifiedPayApp(
  db: Db,
  projectId: string,
  createdByUserId: string,
  opts: {
    number?: number;
    status?: PayAppStatus;
    isFinal?: boolean;
    retainageBps?: number;
    lines?: LineSpec[];
    periodEnd?: string;
  } = {},
) {
  const retainageBps = opts.retainageBps ?? 1000;
  const specs = opts.lines ?? [
    { quantity: 1200, unitPriceCents: 725, description: 'Unclassified excavation' },
    { quantity: 340.5, unitPriceCents: 1890, description: 'Select fill, placed and compacted' },
  ];
  const lines = [];
  for (const [i, spec] of specs.entries()) {
    const item = await makeBidItem(db, projectId, {
      unitPriceCents: spec.unitPriceCents,
      contractQuantity: spec.quantity * 4,
      description: spec.description ?? 'Excavation',
    });
    const amount = lineAmountCents(spec.quantity, spec.unitPriceCents);
    lines.push({ item, spec, amount, retainage: lineAmountCents(retainageBps / 10_000, amount), sortOrder: i });
  }
  const earned = sumCents(lines.map((l) => l.amount));
  const retainage = sumCents(lines.map((l) => l.retainage));
  const status = opts.status ?? 'certified';
  const [app] = await db
    .insert(payApps)
    .values({
      projectId,
      number: opts.number ?? 1,
      status,
      periodStart: '2026-10-01',
      periodEnd: opts.periodEnd ?? '2026-10-31',
      isFinal: opts.isFinal ?? false,
      retainageBps,
      earnedToDateCents: earned,
      thisPeriodCents: earned,
      retainageCents: retainage,
      previousCertifiedCents: 0,
      currentDueCents: sumCents([earned, -retainage]),
      submittedAt: new Date(),
      certifiedAt: status === 'draft' || status === 'submitted' || status === 'in_review' ? null : new Date(),
      createdByUserId,
    })
    .returning();
  await db.insert(payAppLines).values(
    lines.map((l) => ({
      payAppId: app!.id,
      bidItemId: l.item.id,
      sortOrder: l.sortOrder,
      itemNumber: l.item.itemNumber,
      description: l.item.description,
      payUnit: l.item.payUnit,
      unitPriceCents: l.spec.unitPriceCents,
      contractQuantity: l.item.contractQuantity,
      previousQuantity: 0,
      thisPeriodQuantity: l.spec.quantity,
      toDateQuantity: l.spec.quantity,
      previousAmountCents: 0,
      thisPeriodAmountCents: l.amount,
      amountToDateCents: l.amount,
      retainageCents: l.retainage,
      reviewStatus: 'approved' as const,
    })),
  );
  return app!;
}

export async function allowPartialPayments(db: Db, projectId: string, allow = true) {
  await db.update(projects).set({ allowPartialPayments: allow }).where(eq(projects.id, projectId));
}
