import type { TallyView } from '@/shared/schemas/tally';

type Facts = Pick<TallyView, 'status' | 'evidenceCount' | 'can'>;

/**
 * Where a tally stands, in one sentence for the person reading it: what to do next when it is theirs, or what
 * happens to it next. Shown under the tally's title, as on the pay application and change order pages.
 */
export function tallyNextStep(tally: Facts): string {
  const noFiles =
    tally.evidenceCount === 0 ? ' It has no evidence file yet: a line without one is flagged in review.' : '';
  switch (tally.status) {
    case 'draft':
      return tally.can.markReady
        ? `Draft: check the quantity and its files, then mark it ready to bill.${noFiles}`
        : `Draft: waits on the subcontractor to mark it ready to bill.${noFiles}`;
    case 'ready':
      return tally.can.edit
        ? `Ready to bill: the next pay application compiled for its period takes it; until then you can still change it.${noFiles}`
        : `Ready to bill: the next pay application compiled for its period takes it.${noFiles}`;
    case 'billed':
      return 'Billed on a pay application: its quantity is part of that record and can no longer change.';
  }
}
