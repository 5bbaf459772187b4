import { Download } from 'lucide-react';
import { toast } from 'sonner';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { errorMessage } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import type { BaselineStatus } from '@/shared/constants';
import {
  BASELINE_STATUS_LABELS,
  type BaselineAcceptance,
  type SurfaceBaselineView,
} from '@/shared/schemas/surface-baseline';
import { useAcceptBaseline, useSurfaceBaselines } from '../api/surface-baselines';
import { RecordBaselineForm } from './record-baseline-form';

const TONES: Record<BaselineStatus, 'clay' | 'spruce' | 'neutral'> = {
  proposed: 'clay',
  locked: 'spruce',
  replaced: 'neutral',
};
const UNIT_WORDS: Record<string, string> = { foot: 'feet', USSurveyFoot: 'US survey feet', meter: 'metres' };
const time = (iso: string) => `${formatDate(iso)}, ${new Date(iso).toISOString().slice(11, 16)} UTC`;

function Acceptance({ side, value }: { side: string; value: BaselineAcceptance }) {
  return (
    <div>
      <dt className="text-xs text-stone-500">{side}</dt>
      <dd className="text-sm">
        {value ? (
          <>
            {value.name} <span className="text-stone-500">· {time(value.at)}</span>
          </>
        ) : (
          <span className="text-clay-800">Not yet accepted</span>
        )}
      </dd>
    </div>
  );
}

function BaselineCard({ b, projectId }: { b: SurfaceBaselineView; projectId: string }) {
  const accept = useAcceptBaseline(projectId);
  return (
    <Card>
      <CardHeader>
        <div className="flex flex-wrap items-center gap-2">
          <CardTitle>{b.area === '' ? 'Whole project' : b.area}</CardTitle>
          <Badge tone={TONES[b.status]}>{BASELINE_STATUS_LABELS[b.status]}</Badge>
          {b.replacesId ? (
            <span className="text-xs text-stone-500">replaces the locked surface once accepted</span>
          ) : null}
        </div>
      </CardHeader>
      <CardBody className="flex flex-col gap-3">
        <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <div>
            <dt className="text-xs text-stone-500">File</dt>
            <dd className="text-sm">
              <a className="inline-flex items-center gap-1 text-spruce-700 underline" href={b.downloadUrl}>
                <Download aria-hidden className="size-3.5" /> {b.fileName}
              </a>
            </dd>
          </div>
          <div>
            <dt className="text-xs text-stone-500">Surface</dt>
            <dd className="text-sm">
              {b.surfaceName} · {b.pointCount.toLocaleString('en-US')} points
            </dd>
          </div>
          <div>
            <dt className="text-xs text-stone-500">Units</dt>
            <dd className="text-sm">
              Plan in {UNIT_WORDS[b.linearUnit] ?? b.linearUnit}, elevations in{' '}
              {UNIT_WORDS[b.elevationUnit] ?? b.elevationUnit}
              {b.unitsFrom === 'recorder' ? ' (as the recorder said)' : ''}
            </dd>
          </div>
          <div>
            <dt className="text-xs text-stone-500">Recorded</dt>
            <dd className="text-sm">
              {b.recordedBy} <span className="text-stone-500">· {time(b.recordedAt)}</span>
            </dd>
          </div>
          <Acceptance side="Subcontractor accepted" value={b.subcontractorAccepted} />
          <Acceptance side="General contractor accepted" value={b.generalContractorAccepted} />
          <div>
            <dt className="text-xs text-stone-500">{b.replacedAt ? 'Replaced' : 'Locked'}</dt>
            <dd className="text-sm">{b.replacedAt ? time(b.replacedAt) : b.lockedAt ? time(b.lockedAt) : '—'}</dd>
          </div>
        </dl>
        <div>
          <p className="text-xs text-stone-500">SHA-256 of the file</p>
          <p className="font-mono text-xs break-all text-stone-800" data-testid="baseline-sha256">
            {b.sha256}
          </p>
        </div>
        {b.can.accept ? (
          <div className="flex items-center gap-3">
            <Button
              onClick={() =>
                accept.mutate(b.id, {
                  onSuccess: (v) =>
                    toast.success(
                      v.status === 'locked' ? 'Accepted: the surface is now locked.' : 'Accepted for your side.',
                    ),
                  onError: (e) => toast.error(errorMessage(e)),
                })
              }
              disabled={accept.isPending}
            >
              Accept this surface for my side
            </Button>
            <span className="text-xs text-stone-600">
              Check the file and its SHA-256 first: once both sides accept, surface tallies measure from it.
            </span>
          </div>
        ) : null}
      </CardBody>
    </Card>
  );
}

/** The project's original ground surfaces: who recorded and accepted each, when, and the file's SHA-256. */
export function BaselinesScreen({ projectId }: { projectId: string }) {
  const query = useSurfaceBaselines(projectId);
  if (query.isPending) return <LoadingState />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const { baselines, can } = query.data;
  const order: BaselineStatus[] = ['locked', 'proposed', 'replaced'];
  const sorted = [...baselines].sort(
    (a, b) => order.indexOf(a.status) - order.indexOf(b.status) || a.area.localeCompare(b.area),
  );
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Original ground"
        subtitle="The surface every surface tally measures from: recorded once per area, accepted by the subcontractor and the general contractor, then locked. A replacement needs both acceptances again."
      />
      {can.record ? <RecordBaselineForm projectId={projectId} /> : null}
      {sorted.length === 0 ? (
        <EmptyState title="No original ground recorded yet">
          Either measuring party records the surveyed original ground as a LandXML file; the other side checks and
          accepts it.
        </EmptyState>
      ) : (
        sorted.map((b) => <BaselineCard key={b.id} b={b} projectId={projectId} />)
      )}
    </div>
  );
}
