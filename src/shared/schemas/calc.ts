import { z } from 'zod';
import {
  END_AREA_FORMULAS,
  GRID_MIXED_CELL_SPLITS,
  MASS_HAUL_FACTOR_KINDS,
  MEASUREMENT_BASES,
  SOIL_CLASSES,
  SPOIL_SHAPES,
  TRENCH_PROTECTIONS,
  VARIATION_PRESETS,
  ZERO_AREA_END_RULES,
  type CalcMethod,
} from '../constants';
import { CALC_LIMITS } from './calc-limits';
import {
  cents,
  finite,
  nodeRows,
  nonNegative,
  percent,
  faceRows,
  pointRows,
  polyline,
  positive,
  stationList,
  unit,
} from './calc-fields';

export { CALC_LIMITS } from './calc-limits';

/**
 * Request bodies of POST /api/calc/:method (issue 3). Field names follow the issue exactly; unknown fields are
 * refused (a misspelt optional field would otherwise fall back to its default silently). See docs/calc-api.md.
 */
export const sectionSchema = z.strictObject({
  unit,
  ground: polyline(CALC_LIMITS.sectionPoints),
  design: polyline(CALC_LIMITS.sectionPoints),
});

export const endAreaSchema = z.strictObject({
  unit,
  stations: stationList(CALC_LIMITS.stations),
  formula: z.enum(END_AREA_FORMULAS).optional(),
  zeroAreaEnds: z.enum(ZERO_AREA_END_RULES).optional(),
});

export const gridSchema = z.strictObject({
  unit,
  spacingX: positive,
  spacingY: positive,
  depths: nodeRows(CALC_LIMITS.gridNodes),
  mixedCellSplit: z.enum(GRID_MIXED_CELL_SPLITS).optional(),
});

export const pitSchema = z.strictObject({
  unit,
  length: positive,
  width: positive,
  cornerDepths: z.tuple([nonNegative, nonNegative, nonNegative, nonNegative]),
  sideSlope: z.number().min(0).max(CALC_LIMITS.maxSideSlope).optional(),
});

export const trenchSchema = z
  .strictObject({
    unit,
    protection: z.enum(TRENCH_PROTECTIONS),
    soilClass: z.enum(SOIL_CLASSES).optional(),
    runs: z
      .array(z.strictObject({ length: positive, depth: positive, bottomWidth: positive }))
      .min(1, 'At least one run')
      .max(CALC_LIMITS.trenchRuns),
  })
  .superRefine((t, ctx) => {
    if (t.protection !== 'box' && !t.soilClass) {
      ctx.addIssue({
        code: 'custom',
        message: `A soil class is needed when protection is ${t.protection}`,
        path: ['soilClass'],
      });
    }
    if (t.protection === 'bench' && (t.soilClass === 'C' || t.soilClass === 'A-short-term')) {
      ctx.addIssue({
        code: 'custom',
        message: 'Benching is for Type A (3/4:1) and B soils; Type C may not be benched',
        path: ['soilClass'],
      });
    }
  });

const swellPercent = z.number().min(0).max(CALC_LIMITS.maxSwellPercent);

export const convertSchema = z.strictObject({
  volume: nonNegative,
  from: z.enum(MEASUREMENT_BASES),
  to: z.enum(MEASUREMENT_BASES),
  swellPercent,
  shrinkagePercent: z.number().gt(-100).lt(100),
  unit: unit.optional(),
});

export const loadCountSchema = z.strictObject({
  swellPercent,
  loads: z
    .array(
      z.strictObject({ capacity: positive, count: z.number().int('Whole loads').min(0).max(CALC_LIMITS.maxMagnitude) }),
    )
    .min(1, 'At least one load line')
    .max(CALC_LIMITS.loadLines),
  unit: unit.optional(),
});

export const spoilSchema = z
  .strictObject({
    unit,
    shape: z.enum(SPOIL_SHAPES),
    bankVolume: nonNegative,
    swellPercent,
    angleOfReposeDeg: z.number().gt(0).lt(90),
    length: positive.optional(),
  })
  .superRefine((s, ctx) => {
    if (s.shape === 'bank' && s.length === undefined)
      ctx.addIssue({ code: 'custom', message: 'A spoil bank needs its length', path: ['length'] });
  });

export const massHaulSchema = z.strictObject({
  unit,
  stations: stationList(CALC_LIMITS.massHaulStations),
  factor: z.strictObject({ kind: z.enum(MASS_HAUL_FACTOR_KINDS), percent: z.number().min(0).lt(100) }).optional(),
  freeHaul: nonNegative,
  balanceLine: finite.optional(),
  stationLength: positive.optional(),
  overhaulPriceCents: cents.min(0).optional(),
  zeroAreaEnds: z.enum(ZERO_AREA_END_RULES).optional(),
});

const payRing = z
  .array(z.tuple([finite, finite]))
  .min(3, 'At least 3 corners')
  .max(CALC_LIMITS.payLimitCorners, `At most ${CALC_LIMITS.payLimitCorners} corners`);

const breaklineList = z
  .array(pointRows(3, 2, CALC_LIMITS.breaklineVertices))
  .max(CALC_LIMITS.breaklines, `At most ${CALC_LIMITS.breaklines} breaklines`)
  .refine((lines) => lines.reduce((n, l) => n + l.length, 0) <= CALC_LIMITS.breaklineVertices, {
    message: `At most ${CALC_LIMITS.breaklineVertices} breakline vertices in all`,
  });

export const surfaceSchema = z.strictObject({
  unit,
  existing: pointRows(3, 3, CALC_LIMITS.surfacePoints),
  design: pointRows(3, 3, CALC_LIMITS.surfacePoints),
  /** A surface's faces as given (LandXML Faces): the TIN is these triangles of its rows, not a triangulation. */
  existingFaces: faceRows(CALC_LIMITS.surfaceFaces).optional(),
  designFaces: faceRows(CALC_LIMITS.surfaceFaces).optional(),
  /** Breaklines of a point survey: [x, y, z] polylines kept as edges of its triangulation. */
  existingBreaklines: breaklineList.optional(),
  designBreaklines: breaklineList.optional(),
  /** Plan polygons [x, y]: only the area inside `outer` and outside every void is measured. */
  payLimits: z
    .strictObject({ outer: payRing.optional(), voids: z.array(payRing).max(CALC_LIMITS.payLimitVoids).optional() })
    .optional(),
});

export const varianceSchema = z.strictObject({
  contractQuantity: positive,
  forecastQuantity: nonNegative,
  unitPriceCents: cents.min(0),
  band: z.strictObject({ overPercent: z.number().min(0).max(1000), underPercent: percent }),
  preset: z.enum(VARIATION_PRESETS).optional(),
});

export const payAppCalcSchema = z
  .strictObject({
    retainagePercent: percent,
    previousCertifiedCents: cents,
    lines: z
      .array(
        z.strictObject({
          unitPriceCents: cents.min(0),
          contractQuantity: nonNegative,
          previousQuantity: nonNegative,
          thisPeriodQuantity: finite,
        }),
      )
      .max(CALC_LIMITS.payAppLines),
    retainageReduction: z.strictObject({ afterPercentComplete: percent, reducedPercent: percent }).optional(),
  })
  .superRefine((p, ctx) => {
    p.lines.forEach((l, i) => {
      if (l.previousQuantity + l.thisPeriodQuantity < 0) {
        ctx.addIssue({
          code: 'custom',
          message: 'The quantity to date cannot go below 0',
          path: ['lines', i, 'thisPeriodQuantity'],
        });
      }
    });
  });

/** Every method's request schema, keyed as in CALC_METHODS. */
export const calcSchemas = {
  section: sectionSchema,
  'end-area': endAreaSchema,
  grid: gridSchema,
  pit: pitSchema,
  trench: trenchSchema,
  convert: convertSchema,
  'load-count': loadCountSchema,
  spoil: spoilSchema,
  'mass-haul': massHaulSchema,
  surface: surfaceSchema,
  variance: varianceSchema,
  'pay-app': payAppCalcSchema,
} as const satisfies Record<CalcMethod, z.ZodType>;

export type CalcInput<M extends CalcMethod> = z.infer<(typeof calcSchemas)[M]>;
export type SectionCalcInput = z.infer<typeof sectionSchema>;
export type EndAreaCalcInput = z.infer<typeof endAreaSchema>;
export type GridCalcInput = z.infer<typeof gridSchema>;
export type PitCalcInput = z.infer<typeof pitSchema>;
export type TrenchCalcInput = z.infer<typeof trenchSchema>;
export type ConvertCalcInput = z.infer<typeof convertSchema>;
export type LoadCountCalcInput = z.infer<typeof loadCountSchema>;
export type SpoilCalcInput = z.infer<typeof spoilSchema>;
export type MassHaulCalcInput = z.infer<typeof massHaulSchema>;
export type SurfaceCalcInput = z.infer<typeof surfaceSchema>;
export type VarianceCalcInput = z.infer<typeof varianceSchema>;
export type PayAppCalcInput = z.infer<typeof payAppCalcSchema>;
