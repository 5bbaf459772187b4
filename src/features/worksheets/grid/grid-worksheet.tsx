import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import type { LengthUnit } from '@/shared/constants';
import { FileIssues } from '../components/file-issues';
import { FileSource } from '../components/file-source';
import { NumberField } from '../components/number-field';
import { ResultPanel } from '../components/result-panel';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { issueAt, useDebounced, useLiveCalc } from '../lib/live-calc';
import { useJsonValue, useReportInputs } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { unitLabels } from '../lib/units';
import { gridDepths, type GridEntry } from './grid-source';
import { HeatMap } from './heat-map';
import { formatNumber } from '@/shared/format';

const PASTE = 'Paste from a spreadsheet or upload CSV.';

type GridForm = { spacingX: number; spacingY: number };

/** An invented building pad: cut on the high side, fill on the low, corners outside the outline. */
const SAMPLE = [
  '-, 1.8, 2.4, 2.9, 3.1, -',
  '0.9, 1.2, 1.9, 2.2, 2.6, 2.8',
  '-0.4, 0.3, 0.8, 1.1, 1.5, 1.9',
  '-1.3, -0.8, -0.2, 0.2, 0.6, 0.9',
  '-, -1.6, -1.1, -0.7, -0.3, -',
];

function depthsText(depths: unknown): string {
  return Array.isArray(depths)
    ? depths.map((row: unknown[]) => row.map((d) => (d === null ? '-' : String(d))).join(', ')).join('\n')
    : '';
}

export function GridWorksheet({ unit, initial, onInputs }: WorksheetProps) {
  const start = (initial ?? {}) as { spacingX?: number; spacingY?: number; depths?: unknown };
  const spacing = (u: LengthUnit) => (u === 'ft' ? 25 : 10);
  const form = useForm<GridForm>({
    defaultValues: { spacingX: start.spacingX ?? spacing(unit), spacingY: start.spacingY ?? spacing(unit) },
  });
  const [entry, setEntry] = useState<GridEntry>('depths');
  const [texts, setTexts] = useState(() => ({
    depths: initial ? depthsText(start.depths) : SAMPLE.join('\n'),
    existing: '',
    design: '',
  }));
  const size = texts.depths.length + texts.existing.length + texts.design.length;
  const held = useDebounced(texts, size > 20_000 ? 400 : 0);
  const parsed = useMemo(() => gridDepths(entry, held), [entry, held]);
  const edit = (key: keyof typeof texts) => (t: string) => setTexts((x) => ({ ...x, [key]: t }));
  const switchEntry = (next: GridEntry) => {
    setEntry(next);
    // The sample as elevations: an invented pad at 250.00 over the same ground.
    if (next === 'elevations' && !texts.existing && !texts.design) {
      const shift = (t: string, f: (d: number) => number) =>
        t
          .split('\n')
          .map((r) =>
            r
              .split(',')
              .map((c) => (c.trim() === '-' ? '-' : f(Number(c)).toFixed(2)))
              .join(', '),
          )
          .join('\n');
      const rows = SAMPLE.join('\n');
      setTexts((x) => ({ ...x, existing: shift(rows, (d) => 250 + d), design: shift(rows, () => 250) }));
    }
  };
  const values = useWatch({ control: form.control }) as GridForm;
  const spacings = useJsonValue(values);
  const input = useMemo(() => ({ unit, ...spacings, depths: parsed.depths }), [unit, spacings, parsed.depths]);
  const { result, issues } = useLiveCalc(
    'grid',
    parsed.issues.length ? null : input,
    parsed.depths.length > 10_000 ? 300 : 0,
  );
  useReportInputs(input, parsed.issues.length === 0 ? result : null, onInputs);
  const u = unitLabels(unit);
  const n = NUMBER_INPUT;

  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Grid levels">
          <div className="grid grid-cols-2 gap-3">
            <NumberField
              label="Node spacing across (x)"
              unit={u.length}
              error={issueAt(issues, 'spacingX')}
              registration={form.register('spacingX', n)}
            />
            <NumberField
              label="Node spacing down (y)"
              unit={u.length}
              error={issueAt(issues, 'spacingY')}
              registration={form.register('spacingY', n)}
            />
          </div>
          <Field label="Enter the grid as">
            {(c) => (
              <Select
                {...c}
                value={entry}
                onChange={(e) => switchEntry(e.target.value as GridEntry)}
                options={[
                  { value: 'depths', label: 'Node depths (cut +, fill −)' },
                  { value: 'elevations', label: 'Existing and design elevations' },
                ]}
              />
            )}
          </Field>
          {entry === 'depths' ? (
            <FileSource
              label={`Node depths (${u.length}), one grid row a line`}
              hint={`Cut positive, fill negative; an empty cell or - is outside the outline. ${PASTE}`}
              value={texts.depths}
              onChange={edit('depths')}
              rows={8}
            />
          ) : (
            <>
              <FileSource
                label={`Existing elevations (${u.length}), one grid row a line`}
                hint={`An empty cell or - is outside the outline. ${PASTE}`}
                value={texts.existing}
                onChange={edit('existing')}
                rows={5}
              />
              <FileSource
                label={`Design elevations (${u.length}), same grid`}
                hint="Depth = existing − design at each node."
                value={texts.design}
                onChange={edit('design')}
                rows={5}
              />
            </>
          )}
          <FileIssues issues={parsed.issues} fileLabel="Node depths" />
        </WorksheetForm>
      }
      result={
        <ResultPanel
          issues={parsed.issues.length ? [] : issues}
          figures={
            result && !parsed.issues.length
              ? [
                  { label: 'Cut', value: result.cut, unit: u.volume, strong: true },
                  { label: 'Fill', value: result.fill, unit: u.volume, strong: true },
                  { label: 'Net (cut − fill)', value: result.net, unit: u.volume },
                  {
                    label: 'Cells',
                    whole: true,
                    value: result.cells,
                    unit: `of ${u.area === 'sq ft' ? fmtArea(result.cellArea, 'sq ft') : fmtArea(result.cellArea, 'm2')}`,
                  },
                  { label: 'Mixed cells', whole: true, value: result.mixedCells, unit: 'cut and fill' },
                ]
              : undefined
          }
          picture={result ? <HeatMap depths={parsed.depths} unit={unit} /> : null}
          trail={result?.trail}
        />
      }
    />
  );
}

function fmtArea(area: number, label: string): string {
  return `${formatNumber(area, 2)} ${label} each`;
}
