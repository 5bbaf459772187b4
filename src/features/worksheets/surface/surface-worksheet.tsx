import { useEffect, useMemo, useState } from 'react';
import type { PayLimits } from '@/shared/domain/earthwork/surface';
import { POINT_ORDERS, type PointOrder } from '@/shared/landxml';
import { useWorksheetBaselines } from '../lib/baseline-context';
import { BaselinePicker } from './baseline-picker';
import { FileIssues } from '../components/file-issues';
import { FileSource } from '../components/file-source';
import { ResultPanel } from '../components/result-panel';
import { WorksheetColumns, WorksheetForm } from '../components/worksheet-columns';
import type { WorksheetProps } from '../lib/types';
import { unitLabels } from '../lib/units';
import { CutFillMap } from '@/components/cut-fill-map';
import { PlanChart } from './plan-chart';
import { rowsText, sampleSurfaces, type SurfaceSide, type SurfaceWork } from './surface-work';
import { streamsInWorker } from './file-text';
import { useSurfaceWork } from './use-surface-work';

const HINT =
  'CSV rows of x (east), y (north), z; a point file (point, northing, easting, elevation, description: PNEZD or PENZD), with its breaklines listed below it; or a LandXML 1.2 file (its first <Surface>: its faces as given, else its points triangulated with its breaklines; units read from <Units>).';

/** What the file was read as, and the column order of a point file when its data do not tell it. */
function FileReading({
  side,
  work,
  order,
  onOrder,
  breaklines,
  onBreaklines,
}: {
  side: SurfaceSide;
  work: SurfaceWork | null;
  order: PointOrder | undefined;
  onOrder: (order: PointOrder) => void;
  breaklines: string;
  onBreaklines: (text: string) => void;
}) {
  const note = work?.fileNotes[side] ?? null;
  const ask = work?.needsOrder[side] ?? false;
  const points = work?.kinds[side] === 'points' || breaklines !== '';
  return (
    <>
      {points ? (
        <label className="flex flex-col gap-1 text-xs text-stone-700">
          Breaklines of this point file (optional): one a line, the point names it joins in order, e.g. 12 13 14
          <textarea
            className="h-16 rounded-md border border-stone-300 bg-white px-2 py-1 font-mono text-xs"
            value={breaklines}
            onChange={(e) => onBreaklines(e.target.value)}
            spellCheck={false}
          />
        </label>
      ) : null}
      {ask || order ? (
        <label className="flex items-center gap-2 text-xs text-stone-700">
          Column order of this point file
          <select
            className="rounded-md border border-stone-300 bg-white px-2 py-1 text-xs"
            value={order ?? ''}
            onChange={(e) => onOrder(e.target.value as PointOrder)}
          >
            <option value="" disabled>
              Choose…
            </option>
            {POINT_ORDERS.map((o) => (
              <option key={o} value={o}>
                {o === 'PNEZD'
                  ? 'PNEZD: point, northing, easting, elevation'
                  : 'PENZD: point, easting, northing, elevation'}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      {ask ? (
        <p role="status" className="text-xs text-clay-800">
          The file has no header naming its columns: say which order it is in.
        </p>
      ) : null}
      {note ? <p className="text-xs text-stone-600">{note}</p> : null}
    </>
  );
}

/** A large LandXML file the worker reads in pieces: named here, since its text is not in the box. */
function StreamedFile({ file }: { file: File | undefined }) {
  if (!file) return null;
  return (
    <p role="status" className="text-xs text-stone-700">
      {file.name} ({(file.size / 1024 / 1024).toLocaleString('en-US', { maximumFractionDigits: 1 })} MB) is read in
      pieces in the background and not shown in the box; type or paste to replace it.
    </p>
  );
}

export function SurfaceWorksheet({ unit, initial, onInputs }: WorksheetProps) {
  const [saved] = useState(() =>
    initial ? { existing: rowsText(initial.existing), design: rowsText(initial.design) } : null,
  );
  const [texts, setTexts] = useState(() => saved ?? sampleSurfaces(unit));
  const [orders, setOrders] = useState<Partial<Record<SurfaceSide, PointOrder>>>({});
  const [breaklineTexts, setBreaklineTexts] = useState<Record<SurfaceSide, string>>({ existing: '', design: '' });
  const kept = (initial?.payLimits as PayLimits | undefined) ?? null;
  const options = useMemo(() => {
    // A saved tally's faces and breaklines stay with its rows while those rows are not replaced.
    const keep = (side: SurfaceSide) =>
      saved && texts[side] === saved[side]
        ? {
            faces: initial?.[`${side}Faces`] as [number, number, number][] | undefined,
            breaklines: initial?.[`${side}Breaklines`] as [number, number, number][][] | undefined,
          }
        : undefined;
    return {
      orders,
      keptPayLimits: kept,
      breaklineTexts,
      kept: { existing: keep('existing'), design: keep('design') },
    };
  }, [orders, kept, breaklineTexts, saved, texts, initial]);
  // Large LandXML uploads stay Files: the worker streams them, the page never holds their text.
  const [files, setFiles] = useState<Partial<Record<SurfaceSide, File>>>({});
  const { work, busy } = useSurfaceWork(unit, texts.existing, texts.design, options, files);
  const keepFile = (side: SurfaceSide) => (file: File) => {
    if (!streamsInWorker(file)) return false;
    setFiles((f) => ({ ...f, [side]: file }));
    setTexts((t) => ({ ...t, [side]: '' }));
    return true;
  };
  const setText = (side: SurfaceSide) => (text: string) => {
    setFiles((f) => ({ ...f, [side]: undefined }));
    setTexts((t) => ({ ...t, [side]: text }));
  };
  const baselines = useWorksheetBaselines();
  const [baselineId, setBaselineId] = useState<string | null>(() =>
    typeof initial?.baselineId === 'string' ? initial.baselineId : null,
  );
  // With a locked original ground, the existing survey is that surface (the server takes it from the baseline).
  const mustUseBaseline = baselines.length > 0;
  useEffect(() => {
    const ok = !busy && work?.result && work.inputs && (!mustUseBaseline || baselineId !== null);
    const inputs = ok ? { ...work.inputs!, ...(baselineId ? { baselineId } : {}) } : null;
    onInputs(inputs, ok ? (work.result as unknown as Record<string, unknown>) : null);
  }, [work, busy, onInputs, baselineId, mustUseBaseline]);
  const u = unitLabels(unit);
  const result = work?.result ?? null;
  return (
    <WorksheetColumns
      inputs={
        <WorksheetForm label="Surface to surface">
          {mustUseBaseline ? (
            <BaselinePicker
              baselines={baselines}
              chosen={baselineId}
              onLoaded={(id, text, pointOrder) => {
                setBaselineId(id);
                setFiles((f) => ({ ...f, existing: undefined }));
                if (pointOrder) setOrders((s) => ({ ...s, existing: pointOrder }));
                setTexts((t) => ({ ...t, existing: text }));
              }}
            />
          ) : null}
          <FileSource
            label={
              mustUseBaseline
                ? `Existing survey: the original ground chosen above (${u.length})`
                : `Existing survey (${u.length})`
            }
            hint={HINT}
            value={texts.existing}
            onChange={setText('existing')}
            onFile={keepFile('existing')}
            accept=".csv,.txt,.xml,.landxml"
          />
          <StreamedFile file={files.existing} />
          <FileReading
            side="existing"
            work={work}
            order={orders.existing}
            onOrder={(o) => setOrders((s) => ({ ...s, existing: o }))}
            breaklines={breaklineTexts.existing}
            onBreaklines={(t) => setBreaklineTexts((s) => ({ ...s, existing: t }))}
          />
          <FileIssues issues={work?.fileIssues.existing ?? []} fileLabel="Existing survey" />
          <FileSource
            label={`Design survey (${u.length})`}
            hint={HINT}
            value={texts.design}
            onChange={setText('design')}
            onFile={keepFile('design')}
            accept=".csv,.txt,.xml,.landxml"
          />
          <StreamedFile file={files.design} />
          <FileReading
            side="design"
            work={work}
            order={orders.design}
            onOrder={(o) => setOrders((s) => ({ ...s, design: o }))}
            breaklines={breaklineTexts.design}
            onBreaklines={(t) => setBreaklineTexts((s) => ({ ...s, design: t }))}
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
          picture={
            result && work ? (
              <div className="flex flex-col gap-4">
                {work.depth ? <CutFillMap map={work.depth} payLimits={work.payLimits} unit={u.length} /> : null}
                <PlanChart preview={work.preview} unit={u.length} />
              </div>
            ) : null
          }
          trail={result?.trail}
        />
      }
    />
  );
}
