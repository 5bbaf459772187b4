import { formatMoney } from '@/lib/format';
import { LIEN_WAIVER_TITLES } from '@/shared/domain/lien-waiver-text';
import type { LienWaiverView, ProjectLienWaiversView } from '@/shared/schemas/payment';

type AppEntry = Pick<ProjectLienWaiversView['payApps'][number], 'options'>;

/**
 * Where one application's waivers stand, in a sentence for the reader: the waiver the subcontractor may sign now
 * and for how much, or whom it waits on, or that nothing is due yet (the reason the server gives).
 */
export function waiverNextStep(app: AppEntry, signed: Pick<LienWaiverView, 'kind'>[], canIssue: boolean): string {
  const due = app.options.filter((o) => o.allowed);
  if (due.length > 0) {
    const what = due.map((o) => `the ${LIEN_WAIVER_TITLES[o.kind].toLowerCase()} (${formatMoney(o.amountCents)})`);
    return canIssue
      ? `Ready for your signature: ${what.join(' or ')}. Sign it below.`
      : `Waits on the subcontractor to sign ${what.join(' or ')}.`;
  }
  if (signed.length > 0) return 'Nothing more to sign for this application now.';
  const reason = app.options.find((o) => o.reason)?.reason;
  return reason ? `Nothing to sign yet. ${reason}` : 'Nothing to sign yet.';
}
