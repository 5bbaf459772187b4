import { useForm, useWatch } from 'react-hook-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { BASIS_LABELS } from '@/lib/labels';
import { MEASUREMENT_BASES, type LengthUnit, type MeasurementBasis } from '@/shared/constants';
import { NumberField } from '../components/number-field';
import { Figures, IssueList, Trail } from '../components/result-panel';
import { issueAt, useLiveCalc } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { unitLabels } from '../lib/units';
import { NUMBER_INPUT } from '../lib/types';

type ConvertForm = {
  volume: number;
  from: MeasurementBasis;
  to: MeasurementBasis;
  swellPercent: number;
  shrinkagePercent: number;
};
const BASIS_OPTIONS = MEASUREMENT_BASES.map((b) => ({ value: b, label: BASIS_LABELS[b] }));

/** Bank, loose and compacted: one volume from one measure to another with the project's factors. */
export function ConvertCard({
  unit,
  defaults,
}: {
  unit: LengthUnit;
  defaults: { swellPercent: number; shrinkagePercent: number };
}) {
  const form = useForm<ConvertForm>({
    defaultValues: { volume: unit === 'ft' ? 1000 : 750, from: 'bank', to: 'compacted', ...defaults },
  });
  const values = useWatch({ control: form.control }) as ConvertForm;
  const input = useJsonValue({ ...values, unit });
  const { result, issues } = useLiveCalc('convert', input);
  const u = unitLabels(unit);
  const n = NUMBER_INPUT;
  return (
    <Card aria-label="Convert between measures">
      <CardHeader>
        <CardTitle>Bank, loose, compacted</CardTitle>
      </CardHeader>
      <CardBody className="space-y-3">
        <div className="grid grid-cols-3 gap-3">
          <NumberField
            label="Volume"
            unit={u.volume}
            error={issueAt(issues, 'volume')}
            registration={form.register('volume', n)}
          />
          <Field label="From">{(c) => <Select {...c} {...form.register('from')} options={BASIS_OPTIONS} />}</Field>
          <Field label="To">{(c) => <Select {...c} {...form.register('to')} options={BASIS_OPTIONS} />}</Field>
          <NumberField
            label="Swell"
            unit="%"
            error={issueAt(issues, 'swellPercent')}
            registration={form.register('swellPercent', n)}
          />
          <NumberField
            label="Shrinkage"
            unit="%"
            error={issueAt(issues, 'shrinkagePercent')}
            registration={form.register('shrinkagePercent', n)}
          />
        </div>
        <IssueList issues={issues.filter((i) => !['volume', 'swellPercent', 'shrinkagePercent'].includes(i.path))} />
        {result ? (
          <>
            <Figures
              figures={[
                { label: `${BASIS_LABELS[result.to]} volume`, value: result.volume, unit: u.volume, strong: true },
                { label: 'Factor', value: result.factor, unit: `${result.to} per ${result.from}` },
              ]}
            />
            <Trail steps={result.trail} />
          </>
        ) : null}
      </CardBody>
    </Card>
  );
}
