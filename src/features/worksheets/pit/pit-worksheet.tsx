import { useForm, useWatch } from 'react-hook-form';
import type { LengthUnit } from '@/shared/constants';
import { NumberField } from '../components/number-field';
import { ResultPanel } from '../components/result-panel';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { issueAt } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { useWorksheetCalc } from '../lib/use-worksheet-calc';
import { unitLabels } from '../lib/units';
import { PitDrawing } from './pit-drawing';

type PitForm = { length: number; width: number; cornerDepths: [number, number, number, number]; sideSlope: number };

/** An invented detention basin. */
function sample(unit: LengthUnit): PitForm {
  return unit === 'ft'
    ? { length: 60, width: 40, cornerDepths: [5, 5, 5, 5], sideSlope: 1.5 }
    : { length: 18, width: 12, cornerDepths: [1.5, 1.5, 1.5, 1.5], sideSlope: 1.5 };
}

function fromInitial(initial: Record<string, unknown> | null, unit: LengthUnit): PitForm {
  if (!initial) return sample(unit);
  const i = initial as Partial<PitForm>;
  return {
    length: i.length ?? NaN,
    width: i.width ?? NaN,
    cornerDepths: i.cornerDepths ?? [NaN, NaN, NaN, NaN],
    sideSlope: i.sideSlope ?? NaN,
  };
}

export function PitWorksheet({ unit, initial, onInputs }: WorksheetProps) {
  const form = useForm<PitForm>({ defaultValues: fromInitial(initial, unit) });
  const values = useWatch({ control: form.control }) as PitForm;
  // Text that is not a number goes to the schema ("Not a number"); only an empty box means vertical sides.
  const { sideSlope, ...rest } = values;
  const input = useJsonValue({
    unit,
    ...rest,
    ...((sideSlope as unknown) !== null && typeof (sideSlope as unknown) === 'string'
      ? { sideSlope }
      : Number.isFinite(sideSlope) && sideSlope > 0
        ? { sideSlope }
        : {}),
  });
  const { result, issues } = useWorksheetCalc('pit', input, onInputs);
  const u = unitLabels(unit);
  const n = NUMBER_INPUT;
  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Pit corners">
          <div className="grid grid-cols-2 gap-3">
            <NumberField
              label="Bottom length"
              unit={u.length}
              error={issueAt(issues, 'length')}
              registration={form.register('length', n)}
            />
            <NumberField
              label="Bottom width"
              unit={u.length}
              error={issueAt(issues, 'width')}
              registration={form.register('width', n)}
            />
          </div>
          <fieldset className="grid grid-cols-2 gap-3">
            <legend className="mb-1 text-xs font-semibold text-stone-700">
              Corner depths, clockwise from the north-west corner
            </legend>
            {([0, 1, 2, 3] as const).map((i) => (
              <NumberField
                key={i}
                label={`d${i + 1}`}
                unit={u.length}
                error={issueAt(issues, `cornerDepths.${i}`)}
                registration={form.register(`cornerDepths.${i}`, n)}
              />
            ))}
          </fieldset>
          <NumberField
            label="Side slope"
            unit="H per V"
            hint="Leave empty for vertical sides; with a slope the volume is a prismoid"
            error={issueAt(issues, 'sideSlope')}
            registration={form.register('sideSlope', n)}
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
                  { label: 'Bottom area', value: result.area, unit: u.area },
                  { label: 'Mean corner depth', value: result.averageDepth, unit: u.length },
                ]
              : undefined
          }
          picture={
            result ? (
              <PitDrawing
                length={values.length}
                width={values.width}
                depths={values.cornerDepths}
                result={result}
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
