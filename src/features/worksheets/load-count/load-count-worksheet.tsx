import { Plus } from 'lucide-react';
import { useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { FileIssues } from '../components/file-issues';
import { FileSource } from '../components/file-source';
import { MaterialPicker } from '../components/material-picker';
import { NumberCell, NumberField } from '../components/number-field';
import { ResultPanel } from '../components/result-panel';
import { RemoveRowButton, WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { parseNumberTable, type FileIssue } from '../lib/csv';
import { issueAt } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { useWorksheetCalc } from '../lib/use-worksheet-calc';
import { unitLabels } from '../lib/units';
import { ConvertCard } from './convert-card';
import { TicketsChart } from './tickets-chart';

type Load = { capacity: number; count: number };
type LoadForm = { swellPercent: number; loads: Load[] };

export function LoadCountWorksheet({ unit, initial, defaults, onInputs }: WorksheetProps) {
  // Invented tickets: two truck sizes on one haul.
  const sample: Load[] =
    unit === 'ft'
      ? [
          { capacity: 14, count: 38 },
          { capacity: 18, count: 22 },
        ]
      : [
          { capacity: 10, count: 38 },
          { capacity: 14, count: 22 },
        ];
  const start = (initial as Partial<LoadForm> | null) ?? {};
  const form = useForm<LoadForm>({
    defaultValues: { swellPercent: start.swellPercent ?? defaults.swellPercent, loads: start.loads ?? sample },
  });
  const loads = useFieldArray({ control: form.control, name: 'loads' });
  const values = useWatch({ control: form.control }) as LoadForm;
  const input = useJsonValue({ ...values, unit });
  const { result, issues } = useWorksheetCalc('load-count', input, onInputs);
  const [csv, setCsv] = useState('');
  const [fileIssues, setFileIssues] = useState<FileIssue[]>([]);
  const u = unitLabels(unit);
  const n = NUMBER_INPUT;

  const readTickets = (text: string) => {
    setCsv(text);
    if (!text.trim()) return setFileIssues([]);
    const { values: rows, issues: bad } = parseNumberTable(text, ['capacity', 'loads']);
    setFileIssues(bad);
    if (bad.length === 0) loads.replace(rows.map(([capacity, count]) => ({ capacity: capacity!, count: count! })));
  };

  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Truck tickets">
          <div className="grid grid-cols-2 items-start gap-3">
            <NumberField
              label="Swell"
              unit="%"
              error={issueAt(issues, 'swellPercent')}
              registration={form.register('swellPercent', n)}
              hint="Loose over bank, less one"
            />
            <MaterialPicker onPick={(m) => form.setValue('swellPercent', m.swellPercent)} />
          </div>
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-stone-600">
              <tr>
                <th className="w-10 pb-1 font-medium">Line</th>
                <th className="pb-1 font-medium">Truck capacity (loose {u.volume})</th>
                <th className="pb-1 font-medium">Loads</th>
                <th className="w-8" />
              </tr>
            </thead>
            <tbody>
              {loads.fields.map((field, i) => (
                <tr key={field.id} className="align-top">
                  <td className="pt-2 num text-stone-600">{i + 1}</td>
                  <td className="pt-1 pr-2">
                    <NumberCell
                      label={`Line ${i + 1} capacity`}
                      error={issueAt(issues, `loads.${i}.capacity`)}
                      registration={form.register(`loads.${i}.capacity`, n)}
                    />
                  </td>
                  <td className="pt-1 pr-2">
                    <NumberCell
                      label={`Line ${i + 1} loads`}
                      error={issueAt(issues, `loads.${i}.count`)}
                      registration={form.register(`loads.${i}.count`, n)}
                    />
                  </td>
                  <td className="pt-1">
                    <RemoveRowButton label={`Remove line ${i + 1}`} onClick={() => loads.remove(i)} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <Button variant="secondary" size="sm" onClick={() => loads.append({ capacity: NaN, count: NaN })}>
            <Plus aria-hidden /> Add line
          </Button>
          <FileSource
            label="Tickets from a spreadsheet"
            hint="CSV rows of capacity, loads (a header row is skipped); replaces the lines above"
            value={csv}
            onChange={readTickets}
            rows={3}
            placeholder={'capacity,loads\n14,38'}
          />
          <FileIssues
            issues={fileIssues}
            fileLabel="Tickets"
            after="The lines above stay as they were until the file reads without problems."
          />
        </WorksheetForm>
      }
      result={
        <>
          <ResultPanel
            issues={issues}
            figures={
              result
                ? [
                    { label: 'Loose volume hauled', value: result.looseVolume, unit: u.volume, strong: true },
                    { label: 'Bank volume at this swell', value: result.bankVolume, unit: u.volume },
                    { label: 'Loads', whole: true, value: result.loads, unit: 'loads' },
                  ]
                : undefined
            }
            picture={
              result ? (
                <TicketsChart
                  volumeUnit={u.volume}
                  lines={values.loads.map((l, i) => ({ label: `Line ${i + 1}`, loose: l.capacity * l.count }))}
                />
              ) : null
            }
            trail={result?.trail}
          />
          <ConvertCard unit={unit} defaults={defaults} />
        </>
      }
    />
  );
}
