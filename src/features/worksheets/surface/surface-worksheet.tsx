import { useEffect, useState } from 'react';
import { FileIssues } from '../components/file-issues';
import { FileSource } from '../components/file-source';
import { ResultPanel } from '../components/result-panel';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import type { WorksheetProps } from '../lib/types';
import { unitLabels } from '../lib/units';
import { PlanChart } from './plan-chart';
import { rowsText, sampleSurfaces } from './surface-work';
import { useSurfaceWork } from './use-surface-work';

const HINT =
  'CSV rows of x (east), y (north), z; or a LandXML <Surface> (its <P> points are northing easting elevation).';

export function SurfaceWorksheet({ unit, initial, onInputs }: WorksheetProps) {
  const [texts, setTexts] = useState(() =>
    initial ? { existing: rowsText(initial.existing), design: rowsText(initial.design) } : sampleSurfaces(unit),
  );
  const { work, busy } = useSurfaceWork(unit, texts.existing, texts.design);
  useEffect(() => {
    const ok = !busy && work?.result && work.inputs;
    onInputs(ok ? work.inputs : null, ok ? (work.result as unknown as Record<string, unknown>) : null);
  }, [work, busy, onInputs]);
  const u = unitLabels(unit);
  const result = work?.result ?? null;
  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Surface to surface">
          <FileSource
            label={`Existing survey (${u.length})`}
            hint={HINT}
            value={texts.existing}
            onChange={(t) => setTexts((s) => ({ ...s, existing: t }))}
            accept=".csv,.txt,.xml,.landxml"
          />
          <FileIssues issues={work?.fileIssues.existing ?? []} fileLabel="Existing survey" />
          <FileSource
            label={`Design survey (${u.length})`}
            hint={HINT}
            value={texts.design}
            onChange={(t) => setTexts((s) => ({ ...s, design: t }))}
            accept=".csv,.txt,.xml,.landxml"
          />
          <FileIssues issues={work?.fileIssues.design ?? []} fileLabel="Design survey" />
          {busy ? (
            <p role="status" className="text-xs text-stone-600">
              Triangulating in the background…
            </p>
          ) : null}
        </WorksheetForm>
      }
      result={
        <ResultPanel
          issues={work?.issues ?? []}
          figures={
            result
              ? [
                  { label: 'Cut', value: result.cut, unit: u.volume, strong: true },
                  { label: 'Fill', value: result.fill, unit: u.volume, strong: true },
                  { label: 'Net (cut − fill)', value: result.net, unit: u.volume },
                  { label: 'Shared footprint', value: result.footprintArea, unit: u.area },
                  { label: 'Existing points', whole: true, value: result.existingPoints, unit: 'points' },
                  { label: 'Design points', whole: true, value: result.designPoints, unit: 'points' },
                ]
              : undefined
          }
          picture={result && work ? <PlanChart preview={work.preview} unit={u.length} /> : null}
          trail={result?.trail}
        />
      }
    />
  );
}
