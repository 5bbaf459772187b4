import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { optionsOf, Select } from '@/components/ui/select';
import { errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { UNIT_SYSTEM_LABELS } from '@/lib/labels';
import { UNIT_SYSTEMS, type CompanyKind } from '@/shared/constants';
import type { CompanyView, CreateProjectInput, ProjectView } from '@/shared/schemas/project';
import { useCreateProject } from '../api/create-project';
import { NEW_JOB_DEFAULTS, NEW_JOB_FIELDS, newJobFormSchema, type NewJobFormInput } from './new-job-schema';
import { useClearOnEdit } from '@/lib/use-clear-on-edit';

const UNIT_OPTIONS = optionsOf(UNIT_SYSTEMS, (units) => UNIT_SYSTEM_LABELS[units]);

function companyOptions(companies: readonly CompanyView[], kind: CompanyKind) {
  return companies
    .filter((company) => company.kind === kind)
    .map((company) => ({ value: company.id, label: company.name }));
}

type NewJobFormProps = {
  companies: readonly CompanyView[];
  onCreated: (project: ProjectView) => void;
  onCancel: () => void;
};

export function NewJobForm({ companies, onCreated, onCancel }: NewJobFormProps) {
  const createProject = useCreateProject();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<NewJobFormInput, unknown, CreateProjectInput>({
    resolver: zodResolver(newJobFormSchema),
    mode: 'onTouched',
    defaultValues: NEW_JOB_DEFAULTS,
  });
  useClearOnEdit(form, () => setFormError(null));
  const { errors } = form.formState;
  const subcontractors = companyOptions(companies, 'subcontractor');
  const owners = companyOptions(companies, 'owner');

  const submit = form.handleSubmit((input) => {
    setFormError(null);
    createProject.mutate(input, {
      onSuccess: onCreated,
      onError: (error) => {
        const leftover = applyServerErrors(error, form.setError, NEW_JOB_FIELDS, { retainageBps: 'retainagePercent' });
        setFormError(leftover.length ? leftover.join('; ') : errorMessage(error));
      },
    });
  });

  return (
    <form noValidate onSubmit={submit} className="grid grid-cols-2 gap-x-4 gap-y-3" aria-label="New job">
      <Field label="Job name" error={errors.name?.message} className="col-span-2">
        {(control) => <Input autoFocus {...control} {...form.register('name')} />}
      </Field>
      <Field label="Location" error={errors.location?.message}>
        {(control) => <Input placeholder="Town, county" {...control} {...form.register('location')} />}
      </Field>
      <Field label="Contract number" error={errors.contractNumber?.message}>
        {(control) => <Input {...control} {...form.register('contractNumber')} />}
      </Field>
      <Field label="Subcontractor company" error={errors.subcontractorCompanyId?.message}>
        {(control) => (
          <Select {...control} {...form.register('subcontractorCompanyId')} options={subcontractors}>
            <option value="">Choose…</option>
          </Select>
        )}
      </Field>
      <Field label="Owner company" error={errors.ownerCompanyId?.message}>
        {(control) => (
          <Select {...control} {...form.register('ownerCompanyId')} options={owners}>
            <option value="">Choose…</option>
          </Select>
        )}
      </Field>
      <Field label="Units" error={errors.units?.message}>
        {(control) => <Select {...control} {...form.register('units')} options={UNIT_OPTIONS} />}
      </Field>
      <Field
        label="Retainage (%)"
        error={errors.retainagePercent?.message}
        hint="Withheld on each pay application line"
      >
        {(control) => <Input inputMode="decimal" className="num" {...control} {...form.register('retainagePercent')} />}
      </Field>
      {formError ? <Alert className="col-span-2">{formError}</Alert> : null}
      <div className="col-span-2 flex justify-end gap-2 border-t border-stone-200 pt-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={createProject.isPending}>
          {createProject.isPending ? 'Creating…' : 'Create job'}
        </Button>
      </div>
    </form>
  );
}
