import { useForm, useWatch } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import type { SpoilShape } from '@/shared/constants';
import { dualLength } from '@/shared/domain/earthwork/trench-slopes';
import { Cautions } from '../components/cautions';
import { MaterialPicker } from '../components/material-picker';
import { NumberField } from '../components/number-field';
import { ResultPanel } from '../components/result-panel';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { issueAt } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { useWorksheetCalc } from '../lib/use-worksheet-calc';
import { unitLabels } from '../lib/units';
import { SpoilDrawing } from './spoil-drawing';

type SpoilForm = {
  shape: SpoilShape;
  bankVolume: number;
  swellPercent: number;
  angleOfReposeDeg: number;
  length: number;
};

export function SpoilWorksheet({ unit, initial, defaults, onInputs }: WorksheetProps) {
  const start = (initial as Partial<SpoilForm> | null) ?? {};
  // An invented trench spoil: what a short sewer run digs.
  const form = useForm<SpoilForm>({
    defaultValues: {
      shape: start.shape ?? 'bank',
      bankVolume: start.bankVolume ?? (unit === 'ft' ? 180 : 140),
      swellPercent: start.swellPercent ?? defaults.swellPercent,
      angleOfReposeDeg: start.angleOfReposeDeg ?? 35,
      length: start.length ?? (unit === 'ft' ? 150 : 45),
    },
  });
  const values = useWatch({ control: form.control }) as SpoilForm;
  const { length, ...rest } = values;
  const input = useJsonValue({ unit, ...rest, ...(values.shape === 'bank' ? { length } : {}) });
  const { result, issues } = useWorksheetCalc('spoil', input, onInputs);
  const u = unitLabels(unit);
  const n = NUMBER_INPUT;
  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Spoil planner">
          <div className="grid grid-cols-2 gap-3">
            <Field label="Shape">
              {(c) => (
                <Select
                  {...c}
                  {...form.register('shape')}
                  options={[
                    { value: 'bank', label: 'Bank along the trench' },
                    { value: 'pile', label: 'Pile (cone)' },
                  ]}
                />
              )}
            </Field>
            <NumberField
              label="Bank volume dug"
              unit={u.volume}
              error={issueAt(issues, 'bankVolume')}
              registration={form.register('bankVolume', n)}
            />
            <NumberField
              label="Swell"
              unit="%"
              error={issueAt(issues, 'swellPercent')}
              registration={form.register('swellPercent', n)}
            />
            <NumberField
              label="Angle of repose"
              unit="°"
              error={issueAt(issues, 'angleOfReposeDeg')}
              registration={form.register('angleOfReposeDeg', n)}
            />
            {values.shape === 'bank' ? (
              <NumberField
                label="Bank length along the trench"
                unit={u.length}
                error={issueAt(issues, 'length')}
                registration={form.register('length', n)}
              />
            ) : null}
          </div>
          <MaterialPicker
            onPick={(m) => {
              form.setValue('swellPercent', m.swellPercent);
              if (m.angleOfReposeDeg) form.setValue('angleOfReposeDeg', m.angleOfReposeDeg);
            }}
          />
          <Cautions
            items={
              result?.cautions ?? [
                `Keep the toe of the spoil and equipment at least ${dualLength('spoilSetback', unit)} from the excavation edge, or retain it (29 CFR 1926.651(j)(2)).`,
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
                  { label: 'Height', value: result.height, unit: u.length, strong: true },
                  {
                    label: result.shape === 'pile' ? 'Diameter' : 'Base width',
                    value: result.diameter ?? result.width,
                    unit: u.length,
                  },
                  { label: 'Loose volume', value: result.looseVolume, unit: u.volume },
                  { label: 'Footprint', value: result.footprintArea, unit: u.area },
                  {
                    label: `${result.shape === 'pile' ? 'Centre' : 'Ridge'} from the edge`,
                    value: result.centerFromEdge,
                    unit: u.length,
                  },
                ]
              : undefined
          }
          picture={result ? <SpoilDrawing result={result} unit={unit} /> : null}
          trail={result?.trail}
        />
      }
    />
  );
}
