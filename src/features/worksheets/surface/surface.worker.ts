/// <reference lib="webworker" />
import type { LengthUnit } from '@/shared/constants';
import { readLandXmlStream } from '@/shared/landxml';
import { fileText } from './file-text';
import { readSurvey, surveyFromDoc, type SurveyRead } from './surface-file';
import { workSurveys, type SurfaceOptions, type SurfaceSide } from './surface-work';

/** A survey as text, or a LandXML File the worker streams (the page never holds its whole text). */
export type SurveySource = string | File;
type Job = { id: number; unit: LengthUnit; existing: SurveySource; design: SurveySource; options: SurfaceOptions };

async function read(source: SurveySource, unit: LengthUnit, side: SurfaceSide, options: SurfaceOptions) {
  if (typeof source === 'string')
    return readSurvey(source, unit, options.orders?.[side], options.breaklineTexts?.[side]);
  return surveyFromDoc(await readLandXmlStream(fileText(source)), unit) satisfies SurveyRead;
}

/**
 * Large surveys: read (the streaming LandXML reader fed a File's stream piece by piece, point files) and
 * triangulate off the main thread.
 */
self.onmessage = async (event: MessageEvent<Job>) => {
  const { id, unit, existing, design, options } = event.data;
  const [e, d] = await Promise.all([read(existing, unit, 'existing', options), read(design, unit, 'design', options)]);
  self.postMessage({ id, work: workSurveys(unit, e, d, options) });
};
