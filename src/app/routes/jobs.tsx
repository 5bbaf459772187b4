import { useNavigate } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useMe } from '@/features/auth/api/get-me';
import { useCompanies } from '@/features/companies/api/get-companies';
import { projectsQueryOptions, useProjects } from '@/features/projects/api/get-projects';
import { NewJobDialog } from '@/features/projects/components/new-job-dialog';
import { ProjectList } from '@/features/projects/components/project-list';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader() {
  prefetchWhenSignedIn(projectsQueryOptions());
  return null;
}

export function Component() {
  const me = useMe();
  const projects = useProjects();
  const canCreate = me.can.createProject;
  const companies = useCompanies({ enabled: canCreate });
  const navigate = useNavigate();

  const newJob = canCreate ? (
    <NewJobDialog
      companies={companies.data}
      companiesError={companies.error}
      onCreated={(project) => void navigate(`/projects/${project.id}/bid-items`)}
    />
  ) : null;

  return (
    <div className="mx-auto max-w-7xl px-4 py-6">
      <title>Jobs · Tallyard</title>
      <PageHeader title="Jobs" subtitle="The contracts you are on, with your roles." actions={newJob} />
      {projects.isPending ? (
        <LoadingState label="Loading jobs…" />
      ) : projects.isError ? (
        <ErrorState error={projects.error} onRetry={() => void projects.refetch()} />
      ) : projects.data.length === 0 ? (
        <EmptyState title="No jobs yet">
          {canCreate
            ? 'Start one with New job, then enter its bid schedule.'
            : 'You will see a job here once a general contractor adds your company to it.'}
        </EmptyState>
      ) : (
        <ProjectList projects={projects.data} />
      )}
    </div>
  );
}
