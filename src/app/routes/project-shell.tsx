import { Link, Outlet, useParams, type LoaderFunctionArgs } from 'react-router';
import { projectQueryOptions, useProject } from '@/features/projects/api/get-project';
import { RoleBadges } from '@/features/projects/components/role-badges';
import { ProjectTabsNav } from '../layout/project-tabs-nav';
import { ensureWhenSignedIn } from '../prefetch';

export async function loader({ params }: LoaderFunctionArgs) {
  await ensureWhenSignedIn(projectQueryOptions(params.projectId ?? ''));
  return null;
}

/** The frame around every project tab: the job's name, my roles, and the tab bar. */
export function Component() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <div className="mx-auto max-w-7xl px-4 pt-4 pb-10">
      <nav aria-label="Breadcrumb" className="text-xs text-stone-600">
        <Link to="/jobs" className="underline-offset-2 hover:underline">
          Jobs
        </Link>{' '}
        / <span aria-current="page">{project.name}</span>
      </nav>
      <div className="mt-1 flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-stone-900">{project.name}</h1>
          <p className="text-sm text-stone-600">
            {[project.location, project.contractNumber && `Contract ${project.contractNumber}`]
              .filter(Boolean)
              .join(' · ')}
          </p>
        </div>
        <p className="flex items-center gap-2 text-xs text-stone-600">
          My roles <RoleBadges roles={project.myRoles} />
        </p>
      </div>
      <ProjectTabsNav />
      <div className="pt-5">
        <Outlet />
      </div>
    </div>
  );
}
