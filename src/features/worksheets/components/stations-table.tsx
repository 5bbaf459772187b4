import { Plus } from 'lucide-react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import type { LengthUnit } from '@/shared/constants';
import type { DomainIssue } from '@/shared/domain/domain-error';
import { formatStation } from '@/shared/domain/earthwork/units';
import { readNumber } from '../lib/csv';
import { issueAt } from '../lib/live-calc';
import { unitLabels } from '../lib/units';
import { NumberCell } from './number-field';
import { RemoveRowButton } from './worksheet-columns';

export type StationRow = { station: number; cutArea: number; fillArea: number };
export type StationCell = keyof StationRow;

/** Reads "1250" or the station text "12+50" (metric "1+250") as a number; anything else is NaN. */
export const stationValue = (v: unknown) => (typeof v === 'number' ? v : (readNumber(String(v)) ?? NaN));

type StationsTableProps = {
  unit: LengthUnit;
  rows: readonly { id: string }[];
  values: readonly Partial<StationRow>[];
  issues: readonly DomainIssue[];
  register: (index: number, cell: StationCell) => UseFormRegisterReturn;
  onRemove: (index: number) => void;
  onAdd: () => void;
};

/** Editable stations with their cut and fill end areas; a row's problem shows in its cell. */
export function StationsTable({ unit, rows, values, issues, register, onRemove, onAdd }: StationsTableProps) {
  const u = unitLabels(unit);
  return (
    <div className="space-y-2">
      <div className="max-h-96 overflow-y-auto">
        <table className="w-full text-sm">
          <thead className="sticky top-0 bg-white text-left text-xs text-stone-600">
            <tr>
              <th className="pb-1 font-medium">Station ({u.length})</th>
              <th className="pb-1 font-medium">Cut area ({u.area})</th>
              <th className="pb-1 font-medium">Fill area ({u.area})</th>
              <th className="w-8" />
            </tr>
          </thead>
          <tbody>
            {rows.map((row, i) => {
              const station = values[i]?.station;
              return (
                <tr key={row.id} className="align-top">
                  <td className="pt-1 pr-2">
                    <NumberCell
                      label={`Row ${i + 1} station`}
                      error={issueAt(issues, `stations.${i}.station`)}
                      registration={register(i, 'station')}
                    />
                    {typeof station === 'number' && Number.isFinite(station) ? (
                      <p className="num text-xs text-stone-500">{formatStation(station, unit)}</p>
                    ) : null}
                  </td>
                  <td className="pt-1 pr-2">
                    <NumberCell
                      label={`Row ${i + 1} cut area`}
                      error={issueAt(issues, `stations.${i}.cutArea`)}
                      registration={register(i, 'cutArea')}
                    />
                  </td>
                  <td className="pt-1 pr-2">
                    <NumberCell
                      label={`Row ${i + 1} fill area`}
                      error={issueAt(issues, `stations.${i}.fillArea`)}
                      registration={register(i, 'fillArea')}
                    />
                  </td>
                  <td className="pt-1">
                    <RemoveRowButton label={`Remove row ${i + 1}`} onClick={() => onRemove(i)} />
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <Button variant="secondary" size="sm" onClick={onAdd}>
        <Plus aria-hidden /> Add station
      </Button>
    </div>
  );
}
