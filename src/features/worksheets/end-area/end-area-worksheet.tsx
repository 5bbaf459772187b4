import { useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import type { EndAreaFormula, LengthUnit, ZeroAreaEndRule } from '@/shared/constants';
import { FileIssues } from '../components/file-issues';
import { FileSource } from '../components/file-source';
import { ResultPanel } from '../components/result-panel';
import { stationValue, StationsTable, type StationRow } from '../components/stations-table';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import { issueAt } from '../lib/live-calc';
import { useJsonValue } from '../lib/stable';
import { NUMBER_INPUT, type WorksheetProps } from '../lib/types';
import { useWorksheetCalc } from '../lib/use-worksheet-calc';
import { fmt2, unitLabels } from '../lib/units';
import { AreaProfileChart } from './area-profile-chart';
import { readSections, sampleSectionCsv, type WorkedSection } from './section-file';
import { SectionPicture } from './section-picture';

type EndAreaForm = { formula: EndAreaFormula; zeroAreaEnds: ZeroAreaEndRule; stations: StationRow[] };

const round2 = (v: number) => Math.round(v * 100) / 100;
const rowsOf = (worked: readonly WorkedSection[]): StationRow[] =>
  worked.map((s) => ({ station: s.station, cutArea: round2(s.result.cutArea), fillArea: round2(s.result.fillArea) }));

function start(initial: Record<string, unknown> | null, unit: LengthUnit) {
  if (initial) {
    const i = initial as Partial<EndAreaForm>;
    return {
      text: '',
      worked: [],
      form: {
        formula: i.formula ?? 'average-end-area',
        zeroAreaEnds: i.zeroAreaEnds ?? 'average',
        stations: i.stations ?? [],
      },
    };
  }
  const text = sampleSectionCsv(unit);
  const { worked } = readSections(text, unit);
  return {
    text,
    worked,
    form: { formula: 'average-end-area', zeroAreaEnds: 'average', stations: rowsOf(worked) } as EndAreaForm,
  };
}

export function EndAreaWorksheet({ unit, initial, onInputs }: WorksheetProps) {
  const [first] = useState(() => start(initial, unit));
  const [text, setText] = useState(first.text);
  const [sections, setSections] = useState<WorkedSection[]>(first.worked);
  const [fileIssues, setFileIssues] = useState<ReturnType<typeof readSections>['issues']>([]);
  const form = useForm<EndAreaForm>({ defaultValues: first.form });
  const stations = useFieldArray({ control: form.control, name: 'stations' });
  const values = useWatch({ control: form.control }) as EndAreaForm;
  const input = useJsonValue({ unit, ...values });
  const { result, issues } = useWorksheetCalc('end-area', input, onInputs);
  const u = unitLabels(unit);

  const readFile = (next: string) => {
    setText(next);
    if (!next.trim()) return setFileIssues([]);
    const read = readSections(next, unit);
    setFileIssues(read.issues);
    if (read.worked.length > 0 && read.issues.length === 0) {
      setSections(read.worked);
      stations.replace(rowsOf(read.worked));
    }
  };
  const register = (i: number, cell: keyof StationRow) =>
    form.register(`stations.${i}.${cell}`, cell === 'station' ? { setValueAs: stationValue } : NUMBER_INPUT);
  const spacing = result?.spacing;

  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Cross sections">
          <FileSource
            label="Cross sections (CSV or LandXML)"
            hint="CSV rows: station, surface (ground or design), offset, elevation. LandXML: <CrossSect sta> with two <CrossSectSurf>. The areas below are worked from them, to 0.01."
            value={text}
            onChange={readFile}
            accept=".csv,.txt,.xml,.landxml"
            rows={4}
          />
          <FileIssues
            issues={fileIssues}
            fileLabel="Cross sections"
            after="The stations below stay as they were until the file reads without problems."
          />
          <div className="grid grid-cols-2 gap-3">
            <Field label="Formula" error={issueAt(issues, 'formula')}>
              {(c) => (
                <Select
                  {...c}
                  {...form.register('formula')}
                  options={[
                    { value: 'average-end-area', label: 'Average end area' },
                    { value: 'prismoidal', label: 'Prismoidal (odd stations, equal pairs)' },
                  ]}
                />
              )}
            </Field>
            <Field label="Where one end area is zero">
              {(c) => (
                <Select
                  {...c}
                  {...form.register('zeroAreaEnds')}
                  options={[
                    { value: 'average', label: 'Average the ends' },
                    { value: 'pyramid', label: 'Pyramid rule (A L / 3)' },
                  ]}
                />
              )}
            </Field>
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
                  { label: 'Cut (bank)', value: result.cut, unit: u.volume, strong: true },
                  { label: 'Fill (compacted)', value: result.fill, unit: u.volume, strong: true },
                  { label: 'Net (cut − fill)', value: result.net, unit: u.volume },
                ]
              : undefined
          }
          picture={
            result ? (
              <div className="space-y-4">
                <AreaProfileChart stations={values.stations} unit={unit} areaUnit={u.area} />
                {sections.length > 0 ? <SectionPicture sections={sections} unit={unit} /> : null}
              </div>
            ) : null
          }
          trail={result?.trail}
        >
          {spacing ? (
            <p className="text-xs text-stone-700">
              Spacing check:{' '}
              {spacing.flaggedCount === 0
                ? 'no segment is long for its change in area'
                : `${spacing.flaggedCount} segment(s) long for their change in area (over ${fmt2(spacing.maxSpacing)} ${u.length})`}
              .{' '}
              {spacing.dropEveryOther
                ? `Dropping every other section moves the net by ${fmt2(spacing.dropEveryOther.netChange)} ${u.volume}.`
                : ''}
            </p>
          ) : null}
        </ResultPanel>
      }
    />
  );
}
