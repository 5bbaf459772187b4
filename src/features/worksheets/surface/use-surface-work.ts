import { useEffect, useMemo, useRef, useState } from 'react';
import type { LengthUnit } from '@/shared/constants';
import { useDebounced } from '../lib/live-calc';
import {
  WORKER_THRESHOLD,
  workSurfaces,
  type SurfaceOptions,
  type SurfaceSide,
  type SurfaceWork,
} from './surface-work';

/** Rough point count of a text (its lines), to choose between the main thread and the worker. */
const lines = (text: string) => text.length / 20;

/**
 * Live surface work: in place for small surveys, in a Web Worker for large ones (the last answer wins). A side
 * given as a File (a large LandXML upload) always goes to the worker, which streams it.
 */
export function useSurfaceWork(
  unit: LengthUnit,
  existingText: string,
  designText: string,
  options: SurfaceOptions,
  files: Partial<Record<SurfaceSide, File>> = {},
): { work: SurfaceWork | null; busy: boolean } {
  const existing = files.existing ?? existingText;
  const design = files.design ?? designText;
  const size = (s: string | File) => (typeof s === 'string' ? lines(s) : Infinity);
  const big = size(existing) + size(design) > WORKER_THRESHOLD;
  const texts = useMemo(() => ({ existing, design, options }), [existing, design, options]);
  const held = useDebounced(texts, big ? 500 : 200);
  const small = useMemo(
    () =>
      big || typeof held.existing !== 'string' || typeof held.design !== 'string'
        ? null
        : workSurfaces(unit, held.existing, held.design, held.options),
    [big, unit, held],
  );
  const [answer, setAnswer] = useState<{ id: number; work: SurfaceWork } | null>(null);
  const [asked, setAsked] = useState(0);
  const worker = useRef<Worker | null>(null);
  const counter = useRef(0);

  useEffect(() => {
    if (!big) return;
    worker.current ??= new Worker(new URL('./surface.worker.ts', import.meta.url), { type: 'module' });
    const w = worker.current;
    const id = ++counter.current;
    setAsked(id);
    w.onmessage = (event: MessageEvent<{ id: number; work: SurfaceWork }>) => {
      if (event.data.id === counter.current) setAnswer(event.data);
    };
    w.postMessage({ id, unit, existing: held.existing, design: held.design, options: held.options });
  }, [big, unit, held]);

  useEffect(() => () => worker.current?.terminate(), []);
  if (!big) return { work: small, busy: false };
  return { work: answer?.work ?? null, busy: answer?.id !== asked };
}
