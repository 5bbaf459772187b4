/// <reference lib="webworker" />
import type { LengthUnit } from '@/shared/constants';
import { workSurfaces, type SurfaceOptions } from './surface-work';

type Job = { id: number; unit: LengthUnit; existing: string; design: string; options: SurfaceOptions };

/** Large surveys: read (the streaming LandXML reader, point files) and triangulate off the main thread. */
self.onmessage = (event: MessageEvent<Job>) => {
  const { id, unit, existing, design, options } = event.data;
  self.postMessage({ id, work: workSurfaces(unit, existing, design, options) });
};
