import { useParams, type LoaderFunctionArgs } from 'react-router';
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
  return (
    <>
      <title>{`${project.name} · Tally · Tallyard`}</title>
      <TallyDetail tallyId={tallyId} />
    </>
  );
}
