import type { AccessRole, LienWaiverKind } from '../constants';
import { subtractCents } from '../domain/money';
import { isFrozen } from '../domain/pay-app-status';
import type { WaiverOptionView, WaiverRefusalCode } from '../schemas/payment';

/** The subcontractor (the claimant) issues and signs waivers; everyone on the project reads them. */
export const canIssueWaiver = (roles: AccessRole[]) => roles.includes('subcontractor');

type App = { status: Parameters<typeof isFrozen>[0]; isFinal: boolean; currentDueCents: number; paidCents: number };
type Paid = { id: string; amountCents: number; status: string };
type Issued = { kind: LienWaiverKind; paymentId: string | null };

const REASONS: Record<WaiverRefusalCode, string> = {
  WAIVER_NOT_CERTIFIED: 'The application must be certified first.',
  WAIVER_ALREADY_ISSUED: 'Already issued for this application.',
  WAIVER_PAYMENT_SETTLED:
    'The payment has settled: a conditional waiver no longer serves. Issue the unconditional waiver instead.',
  WAIVER_PAYMENT_NOT_SETTLED: 'An unconditional waiver can be issued only after the payment has settled.',
  WAIVER_FINAL_NOT_PAID_IN_FULL: 'The unconditional final waiver waits until the final application is paid in full.',
};

const option = (
  kind: LienWaiverKind,
  code: WaiverRefusalCode | null,
  amountCents: number,
  paymentId: string | null,
): WaiverOptionView => ({
  kind,
  allowed: code === null,
  code,
  reason: code ? REASONS[code] : null,
  amountCents,
  paymentId,
});

/**
 * Which forms may be issued now, and the code of the reason where not. A final application uses the final forms,
 * any other the progress forms (the service refuses the other pair). Conditional: once certified, and only while
 * the payment has not settled (the application is not paid), for the balance still due. Unconditional: only for a
 * payment that has settled (never before the funds arrive); the final one only when the final application is paid
 * in full.
 */
export function waiverOptions(app: App, payments: Paid[], issued: Issued[]): WaiverOptionView[] {
  const [conditional, unconditional] = app.isFinal
    ? (['conditional_final', 'unconditional_final'] as const)
    : (['conditional_progress', 'unconditional_progress'] as const);
  const certified = isFrozen(app.status);
  const settled = payments.filter(
    (p) => p.status === 'succeeded' && !issued.some((w) => w.kind === unconditional && w.paymentId === p.id),
  );
  const next = settled[settled.length - 1];
  const fullyPaid = app.status === 'paid';
  const conditionalCode: WaiverRefusalCode | null = !certified
    ? 'WAIVER_NOT_CERTIFIED'
    : fullyPaid
      ? 'WAIVER_PAYMENT_SETTLED'
      : issued.some((w) => w.kind === conditional)
        ? 'WAIVER_ALREADY_ISSUED'
        : null;
  const unconditionalCode: WaiverRefusalCode | null = !next
    ? 'WAIVER_PAYMENT_NOT_SETTLED'
    : app.isFinal && !fullyPaid
      ? 'WAIVER_FINAL_NOT_PAID_IN_FULL'
      : null;
  return [
    option(conditional, conditionalCode, subtractCents(app.currentDueCents, app.paidCents), null),
    option(unconditional, unconditionalCode, app.isFinal ? app.paidCents : (next?.amountCents ?? 0), next?.id ?? null),
  ];
}
