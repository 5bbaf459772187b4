import { Plus } from 'lucide-react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import {
  SOIL_CLASSES,
  TRENCH_PROTECTIONS,
  type LengthUnit,
  type SoilClass,
  type TrenchProtection,
} from '@/shared/constants';
import { dualLength } from '@/shared/domain/earthwork/trench-slopes';
import { Cautions } from '../components/cautions';
import { NumberCell } from '../components/number-field';
import { ResultPanel } from '../components/result-panel';
import { RemoveRowButton, WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { issueAt } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { useWorksheetCalc } from '../lib/use-worksheet-calc';
import { unitLabels } from '../lib/units';
import { TrenchDrawing } from './trench-drawing';

type Run = { length: number; depth: number; bottomWidth: number };
type TrenchForm = { protection: TrenchProtection; soilClass: SoilClass | ''; runs: Run[] };

const PROTECTION_LABELS: Record<TrenchProtection, string> = {
  box: 'Trench box (vertical sides)',
  slope: 'Sloped sides (Table B-1)',
  bench: 'Benched sides (Table B-1)',
};
const SOIL_LABELS: Record<SoilClass, string> = {
  'stable-rock': 'Stable rock (vertical)',
  A: 'Type A (3/4:1)',
  'A-short-term': 'Type A, open 24 h or less, 12 ft or less (1/2:1)',
  B: 'Type B (1:1)',
  C: 'Type C (1-1/2:1)',
};

/** Sample runs of an invented storm line. */
function sample(unit: LengthUnit): TrenchForm {
  const runs =
    unit === 'ft'
      ? [
          { length: 240, depth: 6.5, bottomWidth: 4 },
          { length: 80, depth: 4, bottomWidth: 3 },
        ]
      : [
          { length: 72, depth: 2, bottomWidth: 1.2 },
          { length: 25, depth: 1.2, bottomWidth: 0.9 },
        ];
  return { protection: 'slope', soilClass: 'B', runs };
}

function fromInitial(initial: Record<string, unknown> | null, unit: LengthUnit): TrenchForm {
  if (!initial) return sample(unit);
  const i = initial as Partial<TrenchForm>;
  return { protection: i.protection ?? 'box', soilClass: i.soilClass ?? '', runs: i.runs ?? [] };
}

export function TrenchWorksheet({ unit, initial, onInputs }: WorksheetProps) {
  const form = useForm<TrenchForm>({ defaultValues: fromInitial(initial, unit) });
  const runs = useFieldArray({ control: form.control, name: 'runs' });
  const values = useWatch({ control: form.control }) as TrenchForm;
  const { soilClass, ...rest } = values;
  const input = useJsonValue({ unit, ...rest, ...(soilClass ? { soilClass } : {}) });
  const outcome = useWorksheetCalc('trench', input, onInputs);
  const u = unitLabels(unit);
  const { result, issues } = outcome;
  const deepest = result ? result.runs.reduce((best, r, i) => (r.depth > result.runs[best]!.depth ? i : best), 0) : 0;
  const numeric = NUMBER_INPUT;

  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Trench runs">
          <div className="grid grid-cols-2 gap-3">
            <Field label="Protection" error={issueAt(issues, 'protection')}>
              {(c) => (
                <Select
                  {...c}
                  {...form.register('protection')}
                  options={TRENCH_PROTECTIONS.map((p) => ({ value: p, label: PROTECTION_LABELS[p] }))}
                />
              )}
            </Field>
            <Field
              label="Soil class (OSHA App. A)"
              error={issueAt(issues, 'soilClass')}
              hint={values.protection === 'box' ? 'Not needed in a box' : undefined}
            >
              {(c) => (
                <Select
                  {...c}
                  {...form.register('soilClass')}
                  options={SOIL_CLASSES.map((s) => ({ value: s, label: SOIL_LABELS[s] }))}
                >
                  <option value="">Not classified</option>
                </Select>
              )}
            </Field>
          </div>
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-stone-600">
              <tr>
                <th className="w-10 pb-1 font-medium">Run</th>
                <th className="pb-1 font-medium">Length ({u.length})</th>
                <th className="pb-1 font-medium">Depth ({u.length})</th>
                <th className="pb-1 font-medium">Bottom width ({u.length})</th>
                <th className="w-8" />
              </tr>
            </thead>
            <tbody>
              {runs.fields.map((field, i) => (
                <tr key={field.id} className="align-top">
                  <td className="pt-2 num text-stone-600">{i + 1}</td>
                  {(['length', 'depth', 'bottomWidth'] as const).map((name) => (
                    <td key={name} className="pt-1 pr-2">
                      <NumberCell
                        label={`Run ${i + 1} ${name === 'bottomWidth' ? 'bottom width' : name}`}
                        error={issueAt(issues, `runs.${i}.${name}`)}
                        registration={form.register(`runs.${i}.${name}`, numeric)}
                      />
                    </td>
                  ))}
                  <td className="pt-1">
                    <RemoveRowButton label={`Remove run ${i + 1}`} onClick={() => runs.remove(i)} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <Button
            variant="secondary"
            size="sm"
            onClick={() => runs.append({ length: NaN, depth: NaN, bottomWidth: NaN })}
          >
            <Plus aria-hidden /> Add run
          </Button>
          <Cautions
            items={
              result?.cautions ?? [
                `A protective system is required at ${dualLength('protectiveSystemDepth', unit)} or more unless the excavation is entirely in stable rock (1926.652(a)(1)).`,
                `At ${dualLength('engineerDepth', unit)} or more a registered professional engineer designs the system (1926.652(b)(4)).`,
                `Keep spoil and equipment at least ${dualLength('spoilSetback', unit)} from the edge (1926.651(j)(2)).`,
              ]
            }
          />
        </WorksheetForm>
      }
      result={
        <ResultPanel
          issues={issues}
          figures={
            result
              ? [
                  { label: 'Excavation', value: result.volume, unit: u.volume, strong: true },
                  { label: 'Runs', whole: true, value: result.runs.length, unit: 'runs' },
                  { label: 'Side slope', value: result.slope, unit: 'H per V' },
                ]
              : undefined
          }
          picture={
            result ? (
              <TrenchDrawing
                run={result.runs[deepest]!}
                index={deepest}
                slope={result.slope}
                benched={result.protection === 'bench'}
                unit={unit}
              />
            ) : null
          }
          trail={result?.trail}
        />
      }
    />
  );
}
