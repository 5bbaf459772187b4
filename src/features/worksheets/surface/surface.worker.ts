/// <reference lib="webworker" />
import type { LengthUnit } from '@/shared/constants';
import { workSurfaces } from './surface-work';

type Job = { id: number; unit: LengthUnit; existing: string; design: string };

/** Large surveys: parse and triangulate off the main thread. */
self.onmessage = (event: MessageEvent<Job>) => {
  const { id, unit, existing, design } = event.data;
  self.postMessage({ id, work: workSurfaces(unit, existing, design) });
};
