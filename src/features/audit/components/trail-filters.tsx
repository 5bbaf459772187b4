import { Download } from 'lucide-react';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import type { AuditPage } from '@/shared/schemas/audit';
import { trailCsvUrl, type TrailFilter } from '../api/get-trail';
import { objectLabel } from './trail-words';

type Props = {
  projectId: string;
  filter: TrailFilter;
  onChange: (filter: TrailFilter) => void;
  data: Pick<AuditPage, 'objectTypes' | 'people'>;
};

/** Object, person and date filters of the trail, and the CSV export of what they select. */
export function TrailFilters({ projectId, filter, onChange, data }: Props) {
  const set = (patch: Partial<TrailFilter>) => onChange({ ...filter, ...patch });
  const invalid = filter.fromDay !== '' && filter.toDay !== '' && filter.fromDay > filter.toDay;
  return (
    <div role="search" aria-label="Filter the trail" className="flex flex-wrap items-end gap-3 text-xs text-stone-700">
      <label className="flex flex-col gap-1">
        Object
        <Select
          className="w-48"
          value={filter.objectType}
          onChange={(e) => set({ objectType: e.target.value })}
          options={data.objectTypes.map((t) => ({ value: t, label: objectLabel(t) }))}
        >
          <option value="">Everything</option>
        </Select>
      </label>
      <label className="flex flex-col gap-1">
        Person
        <Select
          className="w-48"
          value={filter.person}
          onChange={(e) => set({ person: e.target.value })}
          options={data.people.map((p) => ({ value: p.userId, label: p.name }))}
        >
          <option value="">Everyone</option>
        </Select>
      </label>
      <label className="flex flex-col gap-1">
        From
        <Input
          type="date"
          className="w-40"
          value={filter.fromDay}
          max={filter.toDay || undefined}
          onChange={(e) => set({ fromDay: e.target.value })}
          aria-invalid={invalid || undefined}
        />
      </label>
      <label className="flex flex-col gap-1">
        To
        <Input
          type="date"
          className="w-40"
          value={filter.toDay}
          min={filter.fromDay || undefined}
          onChange={(e) => set({ toDay: e.target.value })}
          aria-invalid={invalid || undefined}
        />
      </label>
      <a
        href={trailCsvUrl(projectId, filter)}
        download
        className="inline-flex h-9 items-center gap-1.5 rounded-md border border-stone-300 bg-white px-3 text-sm font-medium text-stone-800 hover:border-spruce-500"
      >
        <Download aria-hidden className="size-4" />
        Export CSV
      </a>
      {invalid ? (
        <p role="alert" className="w-full text-brick-700">
          The From day is after the To day.
        </p>
      ) : null}
    </div>
  );
}
