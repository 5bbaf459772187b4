import type { AccessRole, LienWaiverKind } from '../../../src/shared/constants';
import { isFrozen } from '../../../src/shared/domain/pay-app-status';
import type { WaiverOptionView } from '../../../src/shared/schemas/payment';

/** The subcontractor (the claimant) issues and signs waivers; everyone on the project reads them. */
export const canIssueWaiver = (roles: AccessRole[]) => roles.includes('subcontractor');

type App = { status: Parameters<typeof isFrozen>[0]; isFinal: boolean; currentDueCents: number; paidCents: number };
type Paid = { id: string; amountCents: number; status: string };
type Issued = { kind: LienWaiverKind; paymentId: string | null };

/**
 * Which forms may be issued now. Conditional: once the application is certified, for the amount due.
 * Unconditional: only for a payment that has settled (never before the funds arrive). A final application uses
 * the final forms; the unconditional final form only when the application is paid in full.
 */
export function waiverOptions(app: App, payments: Paid[], issued: Issued[]): WaiverOptionView[] {
  const [conditional, unconditional] = app.isFinal
    ? (['conditional_final', 'unconditional_final'] as const)
    : (['conditional_progress', 'unconditional_progress'] as const);
  const certified = isFrozen(app.status);
  const conditionalDone = issued.some((w) => w.kind === conditional);
  const settled = payments.filter((p) => p.status === 'succeeded' && !issued.some((w) => w.kind === unconditional && w.paymentId === p.id));
  const next = settled[settled.length - 1];
  const fullyPaid = app.status === 'paid';
  const unconditionalReason = !next
    ? 'An unconditional waiver can be issued only after the payment has settled.'
    : app.isFinal && !fullyPaid
      ? 'The unconditional final waiver waits until the final application is paid in full.'
      : null;
  return [
    {
      kind: conditional,
      allowed: certified && !conditionalDone,
      reason: !certified ? 'The application must be certified first.' : conditionalDone ? 'Already issued for this application.' : null,
      amountCents: app.currentDueCents,
      paymentId: null,
    },
    {
      kind: unconditional,
      allowed: unconditionalReason === null,
      reason: unconditionalReason,
      amountCents: app.isFinal ? app.paidCents : (next?.amountCents ?? 0),
      paymentId: next?.id ?? null,
    },
  ];
}
