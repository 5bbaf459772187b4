import { useParams } from 'react-router';
import { useBidItems } from '@/features/bid-items/api/get-bid-items';
import { useProject } from '@/features/projects/api/get-project';
import { WorksheetsScreen } from '@/features/worksheets/components/worksheets-screen';

/** Worksheets: every measurement method as a live calculator; the subcontractor saves one as a tally. */
export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const canSave = project.can.createTally;
  const bidItems = useBidItems(projectId);
  return (
    <>
      <title>{`${project.name} · Worksheets · Tallyard`}</title>
      <WorksheetsScreen
        projectId={projectId}
        units={project.units}
        canSave={canSave}
        bidItems={bidItems.data?.bidItems ?? []}
        defaults={{ swellPercent: project.swellPercent, shrinkagePercent: project.shrinkagePercent }}
      />
    </>
  );
}
