import { useMemo } from 'react';
import { useParams } from 'react-router';
import { useBidItems } from '@/features/bid-items/api/get-bid-items';
import { useProject } from '@/features/projects/api/get-project';
import { useQuery } from '@tanstack/react-query';
import { surfaceBaselinesQueryOptions } from '@/features/surface-baselines/api/surface-baselines';
import { WorksheetsScreen } from '@/features/worksheets/components/worksheets-screen';
import { WorksheetBaselinesContext } from '@/features/worksheets/lib/baseline-context';

/** Worksheets: every measurement method as a live calculator; the subcontractor saves one as a tally. */
export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const canSave = project.can.createTally;
  const bidItems = useBidItems(projectId);
  // Read afresh on each visit: a surface locked by the other side a moment ago must be offered.
  const baselines = useQuery({ ...surfaceBaselinesQueryOptions(projectId), refetchOnMount: 'always' });
  // The locked original ground surfaces: the surface worksheet measures from one of them.
  const locked = useMemo(
    () =>
      (baselines.data?.baselines ?? [])
        .filter((b) => b.status === 'locked')
        .map((b) => ({
          id: b.id,
          label: `${b.area || 'Whole project'}: ${b.fileName}`,
          sha256: b.sha256,
          downloadUrl: b.downloadUrl,
          pointOrder: b.pointOrder,
        })),
    [baselines.data],
  );
  return (
    <WorksheetBaselinesContext.Provider value={locked}>
      <title>{`${project.name} · Worksheets · Tallyard`}</title>
      <WorksheetsScreen
        projectId={projectId}
        units={project.units}
        canSave={canSave}
        bidItems={bidItems.data?.bidItems ?? []}
        defaults={{ swellPercent: project.swellPercent, shrinkagePercent: project.shrinkagePercent }}
      />
    </WorksheetBaselinesContext.Provider>
  );
}
