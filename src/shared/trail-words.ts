import type { PayUnit } from './constants';
import { formatMoney, formatNumber, formatPercentBps, formatQuantity } from './format';

/**
 * The trail in the product's words: each audit event as a sentence, and its changed values as before and after,
 * money and quantities with their units. The server names the object (it reads the rows); this file only words.
 * No id, hash or field code is ever printed: fields without a label here are left out of the changes.
 */

/** The object an event is about, named by the server: "pay application 3", "change order 2 (Extra rock)". */
export type TrailObject = { label: string; href: string | null; unit: PayUnit | null };

export type TrailChange = { field: string; before: string; after: string };

type Event = { objectType: string; action: string; before: unknown; after: unknown; actorName: string | null };

const STATUS_WORDS: Record<string, string> = {
  draft: 'draft',
  submitted: 'submitted',
  in_review: 'in review',
  returned: 'returned',
  certified: 'certified',
  payment_processing: 'payment processing',
  partially_paid: 'partly paid',
  paid: 'paid',
  ready: 'ready to bill',
  billed: 'billed',
  proposed: 'proposed',
  approved: 'approved',
  rejected: 'rejected',
  created: 'started',
  processing: 'processing',
  succeeded: 'succeeded',
  failed: 'failed',
  canceled: 'canceled',
  refunded: 'refunded',
};

const ROLE_WORDS: Record<string, string> = {
  subcontractor: 'subcontractor',
  general_contractor: 'general contractor',
  owner: 'owner',
};
export const WAIVER_WORDS: Record<string, string> = {
  conditional_progress: 'conditional progress waiver',
  unconditional_progress: 'unconditional progress waiver',
  conditional_final: 'conditional final waiver',
  unconditional_final: 'unconditional final waiver',
};
const METHOD_WORDS: Record<string, string> = { card: 'card', us_bank_account: 'bank debit (ACH)' };

type Kind = 'waiver' | 'money' | 'bps' | 'quantity' | 'text' | 'status' | 'flag' | 'count' | 'role' | 'method' | 'date';

/** The fields people read, with their label and how to show the value. Anything else stays off the screen. */
const FIELDS: Record<string, [string, Kind]> = {
  status: ['Status', 'status'],
  revision: ['Revision', 'count'],
  number: ['Number', 'count'],
  title: ['Title', 'text'],
  reason: ['Reason', 'text'],
  note: ['Note', 'text'],
  body: ['Comment', 'text'],
  name: ['Name', 'text'],
  location: ['Location', 'text'],
  contractNumber: ['Contract number', 'text'],
  itemNumber: ['Item', 'text'],
  description: ['Description', 'text'],
  payUnit: ['Pay unit', 'text'],
  basis: ['Measure', 'text'],
  email: ['E-mail', 'text'],
  role: ['Role', 'role'],
  method: ['Method', 'method'],
  kind: ['Form', 'waiver'],
  signedName: ['Signed as', 'text'],
  manualBasis: ['Basis', 'text'],
  measuredOn: ['Measured on', 'date'],
  periodStart: ['Period start', 'date'],
  periodEnd: ['Period end', 'date'],
  throughDate: ['Through', 'date'],
  isMajor: ['Major item', 'flag'],
  isFinal: ['Final application', 'flag'],
  allowPartialPayments: ['Partial payments', 'flag'],
  ownerApprovesChangeOrders: ['Owner approves change orders', 'flag'],
  paymentTermsDays: ['Payment terms (days)', 'count'],
  unitPriceCents: ['Unit price', 'money'],
  newUnitPriceCents: ['New unit price', 'money'],
  amountCents: ['Amount', 'money'],
  balanceCents: ['Balance', 'money'],
  currentDueCents: ['Current due', 'money'],
  thisPeriodCents: ['This period', 'money'],
  earnedToDateCents: ['Earned to date', 'money'],
  retainageCents: ['Retainage', 'money'],
  previousCertifiedCents: ['Previously certified', 'money'],
  paidCents: ['Paid to date', 'money'],
  feeCents: ['Processing fee', 'money'],
  retainageBps: ['Retainage rate', 'bps'],
  retainageReducedBps: ['Reduced retainage rate', 'bps'],
  retainageReductionAtBps: ['Retainage reduced at', 'bps'],
  bandOverBps: ['Band over', 'bps'],
  bandUnderBps: ['Band under', 'bps'],
  majorItemThresholdBps: ['Major item threshold', 'bps'],
  quantity: ['Quantity', 'quantity'],
  contractQuantity: ['Contract quantity', 'quantity'],
  forecastQuantity: ['Forecast at completion', 'quantity'],
  counterQuantity: ['Counter quantity', 'quantity'],
  quantityDelta: ['Quantity change', 'quantity'],
  thisPeriodQuantity: ['This period', 'quantity'],
  swellPercent: ['Swell', 'text'],
  shrinkagePercent: ['Shrinkage', 'text'],
};

function show(value: unknown, kind: Kind, unit: PayUnit | null): string {
  if (value === null || value === undefined || value === '') return '—';
  if (kind === 'money' && typeof value === 'number') return formatMoney(value);
  if (kind === 'bps' && typeof value === 'number') return formatPercentBps(value);
  if (kind === 'quantity' && typeof value === 'number')
    return unit ? formatQuantity(value, unit) : formatNumber(value, 2);
  if (kind === 'status') return STATUS_WORDS[String(value)] ?? 'another status';
  if (kind === 'role') return ROLE_WORDS[String(value)] ?? String(value);
  if (kind === 'waiver') return WAIVER_WORDS[String(value)] ?? 'another form';
  if (kind === 'method') return METHOD_WORDS[String(value)] ?? String(value);
  if (kind === 'flag') return value === true ? 'yes' : value === false ? 'no' : String(value);
  if (kind === 'count' && typeof value === 'number') return formatNumber(value, 0);
  if (typeof value === 'object') return '';
  return String(value);
}

const record = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {};

/** The labelled fields of before and after; both sides shown where either has the field. */
export function trailChanges(before: unknown, after: unknown, unit: PayUnit | null): TrailChange[] {
  const b = record(before);
  const a = record(after);
  const own = (o: Record<string, unknown>) => (typeof o.payUnit === 'string' ? (o.payUnit as PayUnit) : unit);
  const changes: TrailChange[] = [];
  for (const key of Object.keys(FIELDS)) {
    if (!(key in b) && !(key in a)) continue;
    const [field, kind] = FIELDS[key]!;
    const was = key in b ? show(b[key], kind, own(b)) : '';
    const now = key in a ? show(a[key], kind, own(a)) : '';
    if (was === '' && now === '') continue;
    changes.push({ field, before: was, after: now });
  }
  return changes;
}

const plural = (n: number, one: string, many = `${one}s`) => `${formatNumber(n, 0)} ${n === 1 ? one : many}`;

/** The sentence of one event, with `{object}` where the object's name (a link on screen) goes. */
export function trailSentence(e: Event, unit: PayUnit | null): string {
  const who = e.actorName ?? (e.objectType === 'payment' ? 'The payment processor' : 'Tallyard');
  const a = record(e.after);
  const b = record(e.before);
  const money = (v: unknown) => (typeof v === 'number' ? formatMoney(v) : '');
  const qty = (v: unknown) => (typeof v === 'number' ? (unit ? formatQuantity(v, unit) : formatNumber(v, 2)) : '');
  const verb = SENTENCES[e.action]?.({ a, b, money, qty });
  if (verb) return `${who} ${verb}`;
  const [, step = e.action] = e.action.split('.');
  return `${who} recorded “${step.replace(/_/g, ' ')}” on {object}`;
}

type Words = {
  a: Record<string, unknown>;
  b: Record<string, unknown>;
  money: (v: unknown) => string;
  qty: (v: unknown) => string;
};

const lines = (a: Record<string, unknown>) => (Array.isArray(a.lines) ? (a.lines as { decision?: string }[]) : []);
const files = (a: Record<string, unknown>) => (Array.isArray(a.files) ? (a.files as { fileName?: string }[]) : []);

const SENTENCES: Record<string, (w: Words) => string> = {
  'project.created': () => 'set up {object}',
  'project.updated': () => 'changed the contract settings of {object}',
  'demo.seeded': ({ a }) =>
    `loaded the demo into {object}${typeof a.bidItems === 'number' ? ` with ${plural(a.bidItems, 'bid item')}` : ''}`,
  'bid_item.created': ({ a, money, qty }) =>
    `added {object} at ${money(a.unitPriceCents)} per ${String(a.payUnit ?? 'unit')}, ${qty(a.contractQuantity)} in the contract`,
  'bid_item.updated': () => 'changed {object}',
  'bid_item.deleted': () => 'removed {object} from the bid schedule',
  'bid_item.imported': ({ a }) =>
    `imported ${typeof a.count === 'number' ? plural(a.count, 'bid item') : 'bid items'} into {object}`,
  'change_order.proposed': () => 'proposed {object}',
  'change_order.drafted_from_watch': () => 'drafted {object} from the quantity watch',
  'change_order.gc_approved': () => 'approved {object} for the general contractor',
  'change_order.owner_approved': () => 'approved {object} for the owner',
  'change_order.approved': () => 'approved {object}; it now applies to the bid schedule',
  'change_order.rejected': () => 'rejected {object}',
  'change_order.documents_attached': ({ a }) => `attached ${plural(files(a).length, 'document')} to {object}`,
  'forecast.updated': ({ a, qty }) => `set the forecast at completion of {object} to ${qty(a.forecastQuantity)}`,
  'invitation.sent': ({ a }) => `sent {object} to join as ${ROLE_WORDS[String(a.role)] ?? 'a member'}`,
  'invitation.revoked': () => 'withdrew {object}',
  'invitation.accepted': ({ a }) => `accepted {object} and joined as ${ROLE_WORDS[String(a.role)] ?? 'a member'}`,
  'tally.created': ({ a, qty }) => `measured {object}${typeof a.quantity === 'number' ? `: ${qty(a.quantity)}` : ''}`,
  'tally.updated': () => 'changed {object}',
  'tally.deleted': () => 'deleted {object}',
  'tally.ready': ({ a, qty }) =>
    `marked {object} ready to bill${typeof a.quantity === 'number' ? ` at ${qty(a.quantity)}` : ''}`,
  'tally.evidence_added': ({ a }) => `attached ${plural(files(a).length, 'evidence file')} to {object}`,
  'tally.evidence_removed': () => 'removed an evidence file from {object}',
  'pay_app.created': ({ a }) => `started {object} for ${String(a.periodStart ?? '')} to ${String(a.periodEnd ?? '')}`,
  'pay_app.submitted': ({ a, money }) => `submitted {object}, ${money(a.currentDueCents)} due`,
  'pay_app.reviewed': ({ a }) => {
    const l = lines(a);
    const disputed = l.filter((x) => x.decision === 'dispute').length;
    return `reviewed {object}: ${plural(l.length - disputed, 'line')} approved, ${plural(disputed, 'line')} disputed`;
  },
  'pay_app.returned': () => 'returned {object} with its disputes',
  'pay_app.revised': ({ a }) => `revised {object}${typeof a.revision === 'number' ? ` (revision ${a.revision})` : ''}`,
  'pay_app.certified': ({ a, money }) => `certified {object} for payment, ${money(a.currentDueCents)} due`,
  'dispute.commented': () => 'commented on {object}',
  'payment.created': ({ a, money }) => `started {object} of ${money(a.amountCents)}`,
  'payment.checkout_opened': () => 'opened the checkout of {object}',
  'payment.canceled': () => 'closed {object} unpaid',
  'payment.succeeded': ({ a, money }) => `recorded {object} of ${money(a.amountCents)} as received`,
  'payment.failed': () => 'recorded {object} as failed',
  'payment.receipt': () => 'sent the receipt of {object}',
  'payment.event_rejected': () => 'refused a processor message about {object}',
  'lien_waiver.issued': ({ a, money }) =>
    `signed and issued {object}${typeof a.amountCents === 'number' ? ` for ${money(a.amountCents)}` : ''}`,
  'email.failed': () => 'could not deliver {object}',
  'account.admin_created': ({ a }) =>
    `made {object} the first administrator${typeof a.companyName === 'string' ? ` of ${a.companyName}` : ''}`,
  'member.removed': ({ a }) =>
    a.reason === 'removed from the company'
      ? 'removed {object} from the job with the company'
      : 'removed {object} from the job',
  'company_member.removed': () => 'removed {object} from the company and ended their sessions',
  'dispute.edited': ({ a, qty }) =>
    `changed {object}${typeof a.counterQuantity === 'number' ? `: counter quantity ${qty(a.counterQuantity)}` : ''}`,
  'dispute.withdrawn': () => 'withdrew {object}',
  'measurement_profile.set': () => 'set how {object} is measured and paid',
  'lump_sum_stages.set': ({ a }) => {
    const stages = Array.isArray(a.stages) ? (a.stages as { completedOn?: string | null }[]) : [];
    const done = stages.filter((s) => s.completedOn).length;
    return `set the stage schedule of {object}: ${plural(stages.length, 'stage')}, ${done} done`;
  },
  'truck.registered': () => 'registered {object} for truck tickets',
  'truck_ticket.added': () => 'added {object}',
  'truck_tickets.imported': ({ a }) => {
    const n = typeof a.tickets === 'number' ? plural(a.tickets, 'truck ticket') : 'truck tickets';
    const flagged =
      typeof a.flagged === 'number' && a.flagged > 0 ? `, ${plural(a.flagged, 'ticket')} flagged for a look` : '';
    return `imported ${n} into {object}${flagged}`;
  },
  'material_source.added': () => 'added {object} as a material source',
  'scale_ticket.added': () => 'added {object}',
  'force_account_sheet.added': () => 'recorded {object}, a time-and-materials day',
  'force_account_sheet.signed': () => 'signed {object} for the general contractor',
  'stored_material.added': ({ a, qty }) =>
    a.kind === 'added' && typeof a.quantity === 'number'
      ? `recorded ${qty(a.quantity)} delivered to storage for {object}`
      : 'added {object} to the materials stored',
  'stored_material.used': ({ a, qty }) =>
    `recorded ${typeof a.quantity === 'number' ? qty(a.quantity) : 'material'} taken from storage and built in, for {object}`,
  'pay_adjustment.added': ({ a, money }) =>
    `recorded {object}${typeof a.amountCents === 'number' ? `, ${money(a.amountCents)}` : ''}`,
};

/** The event kinds worded above, for the filter and the tests. */
export const WORDED_ACTIONS = Object.keys(SENTENCES);
