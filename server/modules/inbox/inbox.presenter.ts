import type { InboxEntryView, InboxView } from '../../../src/shared/schemas/inbox';
import type { ProjectRow } from '../projects/projects.repository';

export type EntryDraft = Omit<InboxEntryView, 'project' | 'overdue' | 'dueAt' | 'since' | 'period'> & {
  since: Date;
  dueAt?: Date | null;
  period?: InboxEntryView['period'];
};

/** An entry is overdue once its due date (payment terms, invitation expiry) has passed. */
export function presentEntry(project: ProjectRow, e: EntryDraft, now: Date): InboxEntryView {
  const dueAt = e.dueAt ?? null;
  return {
    id: e.id,
    kind: e.kind,
    title: e.title,
    detail: e.detail,
    amountCents: e.amountCents,
    period: e.period ?? null,
    project: { id: project.id, name: project.name },
    since: e.since.toISOString(),
    dueAt: dueAt?.toISOString() ?? null,
    overdue: dueAt !== null && dueAt.getTime() < now.getTime(),
    href: e.href,
  };
}

export function presentCounts(entries: InboxEntryView[]): InboxView['counts'] {
  const byKind: InboxView['counts']['byKind'] = {};
  for (const e of entries) byKind[e.kind] = (byKind[e.kind] ?? 0) + 1;
  return { total: entries.length, overdue: entries.filter((e) => e.overdue).length, byKind };
}
