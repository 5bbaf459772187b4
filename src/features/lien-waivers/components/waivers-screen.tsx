import { Download, Scale } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { formatDate, formatMoney } from '@/lib/format';
import { LIEN_WAIVER_SUMMARIES, LIEN_WAIVER_TITLES, statutoryNotice } from '@/shared/domain/lien-waiver-text';
import type { LienWaiverView, ProjectLienWaiversView } from '@/shared/schemas/payment';
import { useProjectWaivers } from '../api/get-waivers';
import { ExceptionList } from './exception-list';
import { IssueWaiverForm } from './issue-waiver-form';
import { waiverNextStep } from './next-step';

type AppEntry = ProjectLienWaiversView['payApps'][number];

function IssuedList({ waivers }: { waivers: LienWaiverView[] }) {
  if (waivers.length === 0) return <p className="text-sm text-stone-600">No waiver issued for this application yet.</p>;
  return (
    <ul className="flex flex-col gap-1.5 text-sm">
      {waivers.map((w) => (
        <li key={w.id} className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <span className="font-medium">{LIEN_WAIVER_TITLES[w.kind]}</span>
          <span className="tabular-nums">{formatMoney(w.amountCents)}</span>
          <span className="text-stone-600">
            signed “{w.signedName}”, {formatDate(w.signedAt)}
          </span>
          {w.exceptions.length > 0 ? (
            <span className="text-stone-600">
              except {formatMoney(w.exceptions.reduce((sum, e) => sum + e.amountCents, 0))} ({w.exceptions.length}{' '}
              listed)
            </span>
          ) : null}
          <a
            href={w.downloadUrl}
            className="inline-flex items-center gap-1 text-spruce-700 underline-offset-2 hover:underline"
            download
          >
            <Download aria-hidden className="size-3.5" /> PDF
          </a>
        </li>
      ))}
    </ul>
  );
}

function AppWaivers({
  projectId,
  app,
  waivers,
  canIssue,
  signerName,
}: {
  projectId: string;
  app: AppEntry;
  waivers: LienWaiverView[];
  canIssue: boolean;
  signerName: string;
}) {
  const [signing, setSigning] = useState<string | null>(null);
  return (
    <Card aria-label={`Waivers for pay application ${app.number}`}>
      <CardHeader>
        <CardTitle>
          Pay application No. {app.number}
          {app.isFinal ? ' (final)' : ''}{' '}
          <span className="font-normal text-stone-600">· work through {formatDate(app.periodEnd)}</span>
        </CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-3">
        <p className="text-sm font-medium text-spruce-900" data-testid="next-step">
          {waiverNextStep(
            app,
            waivers.filter((w) => w.payAppId === app.id),
            canIssue,
          )}
        </p>
        <IssuedList waivers={waivers.filter((w) => w.payAppId === app.id)} />
        <div className="flex flex-col gap-1">
          <p className="text-xs font-medium text-stone-700">Exceptions a waiver signed now carries (not released)</p>
          <ExceptionList exceptions={app.exceptions} />
        </div>
        {canIssue ? (
          <div className="grid gap-2 md:grid-cols-2">
            {app.options.map((o) => (
              <div key={o.kind} className="flex flex-col gap-1 rounded-md border border-stone-200 p-3">
                <p className="text-sm font-medium">{LIEN_WAIVER_TITLES[o.kind]}</p>
                <p className="text-xs text-stone-600">{LIEN_WAIVER_SUMMARIES[o.kind]}</p>
                {o.allowed ? (
                  signing === o.kind ? (
                    <IssueWaiverForm
                      projectId={projectId}
                      payAppId={app.id}
                      option={o}
                      exceptions={app.exceptions}
                      signerName={signerName}
                      onDone={() => setSigning(null)}
                    />
                  ) : (
                    <div>
                      <Button size="sm" onClick={() => setSigning(o.kind)}>
                        Issue for {formatMoney(o.amountCents)}
                      </Button>
                    </div>
                  )
                ) : (
                  <p className="text-xs text-stone-500">{o.reason}</p>
                )}
              </div>
            ))}
          </div>
        ) : null}
      </CardBody>
    </Card>
  );
}

/** The Waivers tab: the statutory notice, then per certified application its waivers and (for the subcontractor) what may be issued. */
/** `signerName`: the signed-in person's account name, under which a waiver is signed. */
export function WaiversScreen({
  projectId,
  canIssue,
  signerName,
}: {
  projectId: string;
  canIssue: boolean;
  signerName: string;
}) {
  const query = useProjectWaivers(projectId);
  if (query.isPending) return <LoadingState label="Loading waivers…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const { payApps, waivers, state } = query.data;
  return (
    <div className="flex flex-col gap-4">
      <aside
        className="flex gap-2 rounded-md border border-clay-200 bg-clay-50 px-3 py-2 text-sm text-clay-900"
        aria-label="Statutory forms"
      >
        <Scale aria-hidden className="mt-0.5 size-4 shrink-0" />
        <p>{statutoryNotice(state)}</p>
      </aside>
      {canIssue ? null : (
        <p className="text-sm text-stone-600">
          The subcontractor issues and signs the waivers; everyone on the job can download them.
        </p>
      )}
      {payApps.length === 0 ? (
        <EmptyState title="No certified pay applications yet">
          Waivers can be issued once an application is certified.
        </EmptyState>
      ) : (
        payApps.map((a) => (
          <AppWaivers
            key={a.id}
            projectId={projectId}
            app={a}
            waivers={waivers}
            canIssue={canIssue}
            signerName={signerName}
          />
        ))
      )}
    </div>
  );
}
