import { useParams, type LoaderFunctionArgs } from 'react-router';
import { usePayApps } from '@/features/pay-apps/api/get-pay-apps';
import { useProject } from '@/features/projects/api/get-project';
import { tallyQueryOptions } from '@/features/tallies/api/get-tallies';
import { TallyDetail } from '@/features/tallies/components/tally-detail';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(tallyQueryOptions(params.tallyId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '', tallyId = '' } = useParams();
  const project = useProject(projectId);
  const payApps = usePayApps(projectId).data ?? [];
  return (
    <>
      <title>{`${project.name} · Tally · Tallyard`}</title>
      <TallyDetail
        tallyId={tallyId}
        canWrite={project.myRoles.includes('subcontractor')}
        payAppStatusOf={(id) => payApps.find((a) => a.id === id)?.status}
      />
    </>
  );
}
