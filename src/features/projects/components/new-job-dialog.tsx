import { Plus } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { ErrorState, LoadingState } from '@/components/ui/states';
import type { CompanyView, ProjectView } from '@/shared/schemas/project';
import { NewJobForm } from './new-job-form';

type NewJobDialogProps = {
  /** Companies to pick from; undefined while they load. */
  companies: readonly CompanyView[] | undefined;
  companiesError: unknown;
  onCreated: (project: ProjectView) => void;
};

export function NewJobDialog({ companies, companiesError, onCreated }: NewJobDialogProps) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <Button onClick={() => setOpen(true)}>
        <Plus aria-hidden />
        New job
      </Button>
      <Dialog
        open={open}
        onClose={() => setOpen(false)}
        title="New job"
        description="Pick the subcontractor and owner companies on this contract."
      >
        {companiesError ? (
          <ErrorState error={companiesError} title="Companies could not be loaded" />
        ) : companies ? (
          <NewJobForm
            companies={companies}
            onCancel={() => setOpen(false)}
            onCreated={(project) => {
              setOpen(false);
              onCreated(project);
            }}
          />
        ) : (
          <LoadingState label="Loading companies…" />
        )}
      </Dialog>
    </>
  );
}
