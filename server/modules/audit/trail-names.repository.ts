import { eq, inArray } from 'drizzle-orm';
import type { PayUnit } from '../../../src/shared/constants';
import { WAIVER_WORDS, type TrailObject } from '../../../src/shared/trail-words';
import type { Executor } from '../../db/client';
import {
  bidItems,
  changeOrders,
  disputes,
  emailOutbox,
  invitations,
  lienWaivers,
  payAppLines,
  payApps,
  payments,
  projects,
  tallies,
} from '../../db/schema';
import type { AuditRow } from './audit-query.repository';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const record = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {};

/**
 * Names each event's object by its human name and number, with the screen it lives on: read from the rows of this
 * project only (an id of another project never resolves), else from what the event itself recorded (a deleted bid
 * item keeps its number in `before`). Never an id: an object that cannot be named is "a bid item".
 */
export async function nameObjects(
  db: Executor,
  projectId: string,
  rows: AuditRow[],
): Promise<Map<number, TrailObject>> {
  const idsOf = (type: string) => [
    ...new Set(rows.filter((r) => r.objectType === type && UUID.test(r.objectId)).map((r) => r.objectId)),
  ];
  const none = <T>(): Promise<T[]> => Promise.resolve([]);
  const ids = {
    payApp: idsOf('pay_app'),
    co: idsOf('change_order'),
    item: [...idsOf('bid_item'), ...idsOf('forecast')],
    tally: idsOf('tally'),
    payment: idsOf('payment'),
    waiver: idsOf('lien_waiver'),
    dispute: idsOf('dispute'),
    invitation: idsOf('invitation'),
    email: idsOf('email'),
  };
  // Sequential: one connection on the embedded database.
  const project = (await db.select({ name: projects.name }).from(projects).where(eq(projects.id, projectId)))[0];
  const apps = ids.payApp.length
    ? await db
        .select({ id: payApps.id, projectId: payApps.projectId, number: payApps.number })
        .from(payApps)
        .where(inArray(payApps.id, ids.payApp))
    : await none<{ id: string; projectId: string; number: number }>();
  const cos = ids.co.length
    ? await db
        .select({
          id: changeOrders.id,
          projectId: changeOrders.projectId,
          number: changeOrders.number,
          title: changeOrders.title,
        })
        .from(changeOrders)
        .where(inArray(changeOrders.id, ids.co))
    : [];
  const talliesFound = ids.tally.length
    ? await db
        .select({
          id: tallies.id,
          projectId: tallies.projectId,
          title: tallies.title,
          measuredOn: tallies.measuredOn,
          itemNumber: bidItems.itemNumber,
          payUnit: bidItems.payUnit,
        })
        .from(tallies)
        .innerJoin(bidItems, eq(bidItems.id, tallies.bidItemId))
        .where(inArray(tallies.id, ids.tally))
    : [];
  const items = ids.item.length
    ? await db
        .select({
          id: bidItems.id,
          projectId: bidItems.projectId,
          itemNumber: bidItems.itemNumber,
          description: bidItems.description,
          payUnit: bidItems.payUnit,
        })
        .from(bidItems)
        .where(inArray(bidItems.id, ids.item))
    : [];
  const paid = ids.payment.length
    ? await db
        .select({ id: payments.id, projectId: payments.projectId, payAppId: payments.payAppId, number: payApps.number })
        .from(payments)
        .innerJoin(payApps, eq(payApps.id, payments.payAppId))
        .where(inArray(payments.id, ids.payment))
    : [];
  const waivers = ids.waiver.length
    ? await db
        .select({
          id: lienWaivers.id,
          projectId: lienWaivers.projectId,
          kind: lienWaivers.kind,
          number: payApps.number,
        })
        .from(lienWaivers)
        .innerJoin(payApps, eq(payApps.id, lienWaivers.payAppId))
        .where(inArray(lienWaivers.id, ids.waiver))
    : [];
  const disputed = ids.dispute.length
    ? await db
        .select({
          id: disputes.id,
          projectId: payApps.projectId,
          payAppId: payApps.id,
          number: payApps.number,
          itemNumber: payAppLines.itemNumber,
        })
        .from(disputes)
        .innerJoin(payApps, eq(payApps.id, disputes.payAppId))
        .innerJoin(payAppLines, eq(payAppLines.id, disputes.lineId))
        .where(inArray(disputes.id, ids.dispute))
    : [];
  const invites = ids.invitation.length
    ? await db
        .select({ id: invitations.id, projectId: invitations.projectId, email: invitations.email })
        .from(invitations)
        .where(inArray(invitations.id, ids.invitation))
    : [];
  const mails = ids.email.length
    ? await db
        .select({ id: emailOutbox.id, subject: emailOutbox.subject })
        .from(emailOutbox)
        .where(inArray(emailOutbox.id, ids.email))
    : [];

  const base = `/projects/${projectId}`;
  const mine = <T extends { id: string; projectId?: string }>(list: T[], id: string) =>
    list.find((x) => x.id === id && (x.projectId === undefined || x.projectId === projectId));
  const names = new Map<number, TrailObject>();
  for (const r of rows) {
    const seen = { ...record(r.before), ...record(r.after) };
    const unitSeen = typeof seen.payUnit === 'string' ? (seen.payUnit as PayUnit) : null;
    let name: TrailObject = { label: `a ${r.objectType.replace(/_/g, ' ')}`, href: null, unit: unitSeen };
    switch (r.objectType) {
      case 'project':
        name = { label: `the job ${project?.name ?? ''}`.trim(), href: base, unit: null };
        break;
      case 'pay_app': {
        const app = mine(apps, r.objectId);
        const n = app?.number ?? seen.number;
        name = {
          label: n !== undefined ? `pay application ${String(n)}` : 'a pay application',
          href: app ? `${base}/pay-apps/${app.id}` : null,
          unit: null,
        };
        break;
      }
      case 'change_order': {
        const co = mine(cos, r.objectId);
        name = co
          ? { label: `change order ${co.number} (${co.title})`, href: `${base}/change-orders/${co.id}`, unit: null }
          : { label: 'a change order', href: null, unit: null };
        break;
      }
      case 'bid_item':
      case 'forecast': {
        const item = mine(items, r.objectId);
        const number = item?.itemNumber ?? (typeof seen.itemNumber === 'string' ? seen.itemNumber : null);
        const words = item
          ? ` ${item.description}`
          : typeof seen.description === 'string'
            ? ` ${seen.description}`
            : '';
        const href = r.objectType === 'forecast' ? `${base}/quantity-watch` : `${base}/bid-items`;
        name = {
          label: number ? `bid item ${number}${words}` : 'a bid item',
          href: item ? href : null,
          unit: item?.payUnit ?? unitSeen,
        };
        if (r.action === 'bid_item.imported')
          name = { label: 'the bid schedule', href: `${base}/bid-items`, unit: null };
        break;
      }
      case 'tally': {
        const t = mine(talliesFound, r.objectId);
        name = t
          ? {
              label: `the tally ${t.title ? `“${t.title}”` : `of ${t.measuredOn}`} on bid item ${t.itemNumber}`,
              href: `${base}/tallies/${t.id}`,
              unit: t.payUnit,
            }
          : {
              label: typeof seen.title === 'string' && seen.title ? `the tally “${seen.title}”` : 'a tally',
              href: null,
              unit: unitSeen,
            };
        break;
      }
      case 'payment': {
        const p = mine(paid, r.objectId);
        name = {
          label: p ? `the payment on pay application ${p.number}` : 'a payment',
          href: p ? `${base}/pay-apps/${p.payAppId}` : null,
          unit: null,
        };
        break;
      }
      case 'lien_waiver': {
        const w = mine(waivers, r.objectId);
        name = {
          label: w ? `the ${WAIVER_WORDS[w.kind] ?? 'waiver'} on pay application ${w.number}` : 'a lien waiver',
          href: w ? `${base}/waivers` : null,
          unit: null,
        };
        break;
      }
      case 'dispute': {
        const d = mine(disputed, r.objectId);
        name = {
          label: d ? `the dispute on item ${d.itemNumber} of pay application ${d.number}` : 'a dispute',
          href: d ? `${base}/pay-apps/${d.payAppId}` : null,
          unit: null,
        };
        break;
      }
      case 'invitation': {
        const i = mine(invites, r.objectId);
        name = { label: 'the invitation', href: `${base}/people`, unit: null };
        if (i) name.label = `the invitation of ${i.email}`;
        break;
      }
      case 'email': {
        const m = mails.find((x) => x.id === r.objectId);
        name = { label: m ? `the e-mail “${m.subject}”` : 'an e-mail', href: null, unit: null };
        break;
      }
    }
    names.set(r.id, name);
  }
  return names;
}
