import { z } from 'zod';
import { LENGTH_UNITS } from '../constants';
import { CALC_LIMITS } from './calc-limits';

const M = CALC_LIMITS.maxMagnitude;

/** zod 4's number already refuses NaN and Infinity; this adds the magnitude limit. */
export const finite = z.number().min(-M).max(M);
export const nonNegative = z.number().min(0, 'Must be 0 or more').max(M);
export const positive = z.number().gt(0, 'Must be more than 0').max(M);
export const cents = z.number().int('Whole cents').min(-Number.MAX_SAFE_INTEGER).max(Number.MAX_SAFE_INTEGER);
export const unit = z.enum(LENGTH_UNITS);
export const percent = z.number().min(0).max(100);

export type Point2 = [number, number];
export type Point3 = [number, number, number];

/** [offset, elevation] pairs, offsets strictly increasing (issue path: `ground.3.0`). */
export function polyline(max: number) {
  return z
    .array(z.tuple([finite, finite]))
    .min(2, 'At least 2 points')
    .max(max, `At most ${max} points`)
    .superRefine((points, ctx) => {
      for (let i = 1; i < points.length; i++) {
        if (!(points[i]![0] > points[i - 1]![0])) {
          ctx.addIssue({ code: 'custom', message: `Offsets must increase: point ${i} is not right of point ${i - 1}`, path: [i, 0] });
          return;
        }
      }
    });
}

/** Rows of finite numbers checked in one plain loop (zod's per-element tuples cost about 0.4 s a million). */
export function pointRows(width: 2 | 3, min: number, max: number) {
  return z
    .array(z.unknown())
    .min(min, `At least ${min} points`)
    .max(max, `At most ${max} points`)
    .superRefine((rows, ctx) => {
      let issues = 0;
      for (let i = 0; i < rows.length && issues < 20; i++) {
        const r = rows[i];
        if (!Array.isArray(r) || r.length !== width) {
          ctx.addIssue({ code: 'custom', message: `Expected [${width === 3 ? 'x, y, z' : 'x, y'}]`, path: [i] });
          issues++;
          continue;
        }
        for (let k = 0; k < width; k++) {
          const v: unknown = r[k];
          if (typeof v !== 'number' || !Number.isFinite(v) || Math.abs(v) > M) {
            ctx.addIssue({ code: 'custom', message: 'Expected a finite number', path: [i, k] });
            issues++;
          }
        }
      }
    })
    .transform((rows) => rows as Point3[]);
}

export const station = z.strictObject({ station: finite, cutArea: nonNegative, fillArea: nonNegative });

/** Cross-section stations, strictly increasing (issue path: `stations.3.station`). */
export function stationList(max: number) {
  return z
    .array(station)
    .min(2, 'At least 2 stations')
    .max(max, `At most ${max} stations`)
    .superRefine((list, ctx) => {
      for (let i = 1; i < list.length; i++) {
        if (!(list[i]!.station > list[i - 1]!.station)) {
          ctx.addIssue({ code: 'custom', message: `Station ${i} must be beyond station ${i - 1}`, path: [i, 'station'] });
          return;
        }
      }
    });
}
