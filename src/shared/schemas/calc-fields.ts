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
          ctx.addIssue({
            code: 'custom',
            message: `Offsets must increase: point ${i} is not right of point ${i - 1}`,
            path: [i, 0],
          });
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

/** Faces as point-row triples [i, j, k] (0-based indices of the survey's rows), each checked in one pass. */
export function faceRows(max: number) {
  return z
    .array(z.unknown())
    .max(max, `At most ${max} faces`)
    .superRefine((rows, ctx) => {
      let issues = 0;
      for (let i = 0; i < rows.length && issues < 20; i++) {
        const r = rows[i];
        if (!Array.isArray(r) || r.length !== 3 || !r.every((v) => Number.isInteger(v) && (v as number) >= 0)) {
          ctx.addIssue({ code: 'custom', message: 'Expected [i, j, k]: three point rows (0-based)', path: [i] });
          issues++;
        }
      }
    })
    .transform((rows) => rows as [number, number, number][]);
}

export interface StationRow {
  station: number;
  cutArea: number;
  fillArea: number;
}

const STATION_KEYS = ['station', 'cutArea', 'fillArea'] as const;

/**
 * Cross-section stations `{ station, cutArea, fillArea }`, strictly increasing, areas 0 or more, no other keys.
 * Checked in one plain loop (100,000 stations through zod's object schema took 100-200 ms). Paths:
 * `stations.3.station`, `stations.3.cutArea`, `stations.3` (not an object, or an unknown key).
 */
export function stationList(max: number) {
  return z
    .array(z.unknown())
    .min(2, 'At least 2 stations')
    .max(max, `At most ${max} stations`)
    .superRefine((list, ctx) => {
      let previous = -Infinity;
      let issues = 0;
      for (let i = 0; i < list.length && issues < 20; i++) {
        const row = list[i] as Record<string, unknown> | null;
        if (typeof row !== 'object' || row === null || Array.isArray(row)) {
          ctx.addIssue({ code: 'custom', message: 'Expected { station, cutArea, fillArea }', path: [i] });
          issues++;
          continue;
        }
        for (const key of STATION_KEYS) {
          const v = row[key];
          const ok = typeof v === 'number' && Number.isFinite(v) && Math.abs(v) <= M && (key === 'station' || v >= 0);
          if (!ok) {
            ctx.addIssue({
              code: 'custom',
              message: key === 'station' ? 'Expected a finite station' : 'Expected an area of 0 or more',
              path: [i, key],
            });
            issues++;
          }
        }
        const extra = Object.keys(row).find((k) => !(STATION_KEYS as readonly string[]).includes(k));
        if (extra) {
          ctx.addIssue({ code: 'custom', message: `Unknown field "${extra}"`, path: [i, extra] });
          issues++;
        }
        const s = row.station;
        if (typeof s === 'number') {
          if (!(s > previous) && issues === 0) {
            ctx.addIssue({
              code: 'custom',
              message: `Station ${i} must be beyond station ${i - 1}`,
              path: [i, 'station'],
            });
            issues++;
          }
          previous = s;
        }
      }
    })
    .transform((list) => list as StationRow[]);
}

/**
 * Rows of grid nodes (number or null), checked in one plain loop: a million nodes through zod's per-element
 * schemas took a few hundred milliseconds. Paths: `depths.4` for a ragged or non-array row, `depths.4.7` for a
 * bad node.
 */
export function nodeRows(maxNodes: number) {
  return z
    .array(z.unknown())
    .min(2, 'At least 2 rows')
    .max(maxNodes)
    .superRefine((rows, ctx) => {
      const first = rows[0];
      const cols = Array.isArray(first) ? first.length : 0;
      if (cols < 2) {
        ctx.addIssue({ code: 'custom', message: 'At least 2 nodes a row', path: [0] });
        return;
      }
      if (rows.length * cols > maxNodes) {
        ctx.addIssue({ code: 'custom', message: `At most ${maxNodes} nodes`, path: [] });
        return;
      }
      let issues = 0;
      for (let r = 0; r < rows.length && issues < 20; r++) {
        const row = rows[r];
        if (!Array.isArray(row) || row.length !== cols) {
          ctx.addIssue({
            code: 'custom',
            message: `Row ${r} has ${Array.isArray(row) ? row.length : 'no'} nodes; row 0 has ${cols}`,
            path: [r],
          });
          issues++;
          continue;
        }
        for (let c = 0; c < cols; c++) {
          const v: unknown = row[c];
          if (v !== null && (typeof v !== 'number' || !Number.isFinite(v) || Math.abs(v) > M)) {
            ctx.addIssue({ code: 'custom', message: 'Expected a finite depth or null', path: [r, c] });
            issues++;
          }
        }
      }
    })
    .transform((rows) => rows as (number | null)[][]);
}
