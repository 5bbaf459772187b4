import type { InboxKind } from '../constants';

/** One thing that waits on the signed-in person, with the exact place to act. */
export type InboxEntryView = {
  /** Stable within one answer: kind and object. */
  id: string;
  kind: InboxKind;
  /** What to do, in a sentence ("Review pay application 3"). */
  title: string;
  /** A second line: the amount, the period, the person it came from. */
  detail: string;
  /** The money at stake, where there is one (integer cents); the client formats it. */
  amountCents: number | null;
  /** The pay period concerned (ISO dates), where the entry is about a pay application. */
  period: { start: string; end: string } | null;
  project: { id: string; name: string };
  /** When it started waiting (ISO). */
  since: string;
  /** When it is due, where a rule gives a date (payment terms, invitation expiry). */
  dueAt: string | null;
  overdue: boolean;
  /** The client path of the screen where the person acts. */
  href: string;
};

export type InboxView = {
  entries: InboxEntryView[];
  counts: { total: number; overdue: number; byKind: Partial<Record<InboxKind, number>> };
};
