import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { formatMoney } from '@/lib/format';
import type { LengthUnit, MassHaulFactorKind } from '@/shared/constants';
import { NumberField } from '../components/number-field';
import { ResultPanel } from '../components/result-panel';
import { stationValue, StationsTable, type StationRow } from '../components/stations-table';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { issueAt } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { useWorksheetCalc } from '../lib/use-worksheet-calc';
import { unitLabels } from '../lib/units';
import { MassHaulChart } from './mass-haul-chart';

type MassHaulForm = {
  kind: MassHaulFactorKind;
  percent: number;
  freeHaul: number;
  balanceLine: number;
  price: number;
  stations: StationRow[];
};

/** An invented quarter-mile of haul road: a cut hill, a fill hollow, and a cut rise again. */
function sampleStations(unit: LengthUnit): StationRow[] {
  const cut = [0, 60, 110, 140, 90, 30, 0, 0, 0, 10, 40, 120, 150];
  const fill = [20, 0, 0, 0, 0, 20, 110, 180, 160, 90, 30, 0, 0];
  const k = unit === 'ft' ? 1 : 0.09;
  return cut.map((c, i) => ({ station: i * (unit === 'ft' ? 100 : 30), cutArea: c * k, fillArea: fill[i]! * k }));
}

export function MassHaulWorksheet({ unit, initial, defaults, onInputs }: WorksheetProps) {
  const i = (initial ?? {}) as {
    stations?: StationRow[];
    factor?: { kind: MassHaulFactorKind; percent: number };
    freeHaul?: number;
    balanceLine?: number;
    overhaulPriceCents?: number;
  };
  const form = useForm<MassHaulForm>({
    defaultValues: {
      kind: i.factor?.kind ?? 'shrinkage',
      percent: i.factor?.percent ?? defaults.shrinkagePercent,
      freeHaul: i.freeHaul ?? (unit === 'ft' ? 500 : 150),
      balanceLine: i.balanceLine ?? 0,
      price: i.overhaulPriceCents !== undefined ? i.overhaulPriceCents / 100 : 2.5,
      stations: i.stations ?? sampleStations(unit),
    },
  });
  const stations = useFieldArray({ control: form.control, name: 'stations' });
  const values = useWatch({ control: form.control }) as MassHaulForm;
  const input = useJsonValue({
    unit,
    stations: values.stations,
    factor: { kind: values.kind, percent: values.percent },
    freeHaul: values.freeHaul,
    ...(Number.isFinite(values.balanceLine) ? { balanceLine: values.balanceLine } : {}),
    ...(Number.isFinite(values.price) ? { overhaulPriceCents: Math.round(values.price * 100) } : {}),
  });
  const { result, issues } = useWorksheetCalc('mass-haul', input, onInputs, 150);
  const u = unitLabels(unit);
  const n = NUMBER_INPUT;
  const register = (k: number, cell: keyof StationRow) =>
    form.register(`stations.${k}.${cell}`, cell === 'station' ? { setValueAs: stationValue } : n);
  const ou = unit === 'ft' ? 'station-yd' : 'station-m3';

  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Mass haul">
          <div className="grid grid-cols-2 gap-3">
            <Field label="Fill adjusted by">
              {(c) => (
                <Select
                  {...c}
                  {...form.register('kind')}
                  options={[
                    { value: 'shrinkage', label: 'Shrinkage (earth)' },
                    { value: 'swell', label: 'Swell (rock)' },
                  ]}
                />
              )}
            </Field>
            <NumberField
              label="Factor"
              unit="%"
              error={issueAt(issues, 'factor.percent')}
              registration={form.register('percent', n)}
            />
            <NumberField
              label="Free haul"
              unit={u.length}
              error={issueAt(issues, 'freeHaul')}
              registration={form.register('freeHaul', n)}
            />
            <NumberField
              label="Balance line"
              unit={u.volume}
              error={issueAt(issues, 'balanceLine')}
              registration={form.register('balanceLine', n)}
            />
            <NumberField
              label="Overhaul price"
              unit={`$ per ${ou}`}
              hint="Optional"
              error={issueAt(issues, 'overhaulPriceCents')}
              registration={form.register('price', n)}
            />
          </div>
          <StationsTable
            unit={unit}
            rows={stations.fields}
            values={values.stations}
            issues={issues}
            register={register}
            onRemove={stations.remove}
            onAdd={() => stations.append({ station: NaN, cutArea: 0, fillArea: 0 })}
          />
        </WorksheetForm>
      }
      result={
        <ResultPanel
          issues={issues}
          figures={
            result
              ? [
                  { label: 'Overhaul', value: result.overhaul, unit: result.overhaulUnit, strong: true },
                  { label: 'Overhaul volume', value: result.overhaulVolume, unit: u.volume },
                  { label: 'Haul', value: result.haul, unit: result.overhaulUnit },
                  { label: 'Waste', value: result.waste, unit: u.volume },
                  { label: 'Borrow', value: result.borrow, unit: u.volume },
                ]
              : undefined
          }
          picture={result ? <MassHaulChart result={result} unit={unit} /> : null}
          trail={result?.trail}
        >
          {result?.overhaulAmountCents != null ? (
            <p className="text-sm text-stone-800">
              Overhaul amount: <span className="num font-semibold">{formatMoney(result.overhaulAmountCents)}</span>
            </p>
          ) : null}
        </ResultPanel>
      }
    />
  );
}
