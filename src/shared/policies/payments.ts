import type { AccessRole, PayAppStatus, PaymentStatus } from '../constants';
import { sumCents } from '../domain/money';

/** Only the owner (the payer on the project) starts a payment. */
export const canPay = (roles: AccessRole[]) => roles.includes('owner');

/** Statuses in which a payment can be started. */
export const PAYABLE_STATUSES: readonly PayAppStatus[] = ['certified', 'partially_paid'];

/**
 * How far along a payment is: created < processing < succeeded or failed (both final). An event never moves a
 * payment to a lower or equal rank, so a late `processing` after `succeeded` is ignored. Canceled only ends an
 * attempt nobody paid; refunds are handled apart.
 */
const RANK: Record<PaymentStatus, number> = {
  created: 0,
  canceled: 1,
  processing: 2,
  succeeded: 3,
  failed: 3,
  refunded: 4,
};

export function canMovePayment(from: PaymentStatus, to: PaymentStatus): boolean {
  if (to === 'refunded') return from === 'succeeded';
  if (from === 'succeeded' || from === 'failed' || from === 'refunded') return false;
  if (to === 'canceled') return from === 'created';
  return RANK[to] > RANK[from];
}

/** Balance of an application: current due less paid to date less what is still processing (integer cents). */
export function balanceCents(app: { currentDueCents: number; paidCents: number }, processingCents: number): number {
  return sumCents([app.currentDueCents, -app.paidCents, -processingCents]);
}

export type AmountDecision = { ok: true; amountCents: number } | { ok: false; message: string };

/**
 * The amount to charge: the whole balance, or the owner's partial amount where the project allows partial
 * payments and it does not exceed the balance.
 */
export function chargeAmount(
  balance: number,
  partialAllowed: boolean,
  partialAmountCents: number | undefined,
): AmountDecision {
  if (partialAmountCents === undefined) return { ok: true, amountCents: balance };
  if (!partialAllowed)
    return { ok: false, message: 'This project does not accept partial payments; pay the whole balance.' };
  if (partialAmountCents > balance)
    return { ok: false, message: `The amount is more than the balance of ${balance} cents.` };
  return { ok: true, amountCents: partialAmountCents };
}

/** What the payer is charged for a payment: its amount, plus the fee when the payer bore it. */
export function chargedCents(p: {
  amountCents: number;
  feeCents: number | null;
  feeBearer: 'payer' | 'payee';
}): number {
  return p.feeBearer === 'payer' ? sumCents([p.amountCents, p.feeCents ?? 0]) : p.amountCents;
}

/** A checkout someone else opened is theirs to finish for this long; then anyone on the payer's seat may replace it. */
export const OTHERS_CHECKOUT_KEPT_MS = 15 * 60_000;
/** A payer's own checkout is replaced by their next start after this long; sooner, the two clicks were one. */
export const OWN_CHECKOUT_KEPT_MS = 60_000;

/**
 * Whether a new start may end an open checkout (not yet paid) and open its own: the payer's own attempt after a
 * minute (the tab was closed, they start again), another person's after fifteen minutes (they walked away). A
 * checkout still within its time is refused with 409, so two people clicking Pay at once, or one double click,
 * never hand out two checkouts and never end one that is being filled in. Common practice; the times are ours.
 */
export function mayReplaceCheckout(
  open: { createdByUserId: string; createdAt: Date },
  actorUserId: string,
  now = Date.now(),
): boolean {
  const age = now - open.createdAt.getTime();
  return open.createdByUserId === actorUserId ? age > OWN_CHECKOUT_KEPT_MS : age > OTHERS_CHECKOUT_KEPT_MS;
}
