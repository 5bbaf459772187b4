import { z } from 'zod';
import { BASELINE_STATUSES, type BaselineStatus } from '../constants';
import { POINT_ORDERS, type PointOrder } from '../landxml/point-csv';
import type { BaselineCan } from '../policies/surface-baselines';

/** Form fields sent with the baseline file: the area it covers ('' the whole project), and the unit of a file without <Units>. */
export const recordBaselineSchema = z.strictObject({
  area: z.string().trim().max(80, 'At most 80 characters').optional().default(''),
  unit: z.enum(['ft', 'm']).optional(),
  /** Column order of a point file without a header naming its columns. */
  order: z.enum(POINT_ORDERS).optional(),
});
export type RecordBaselineInput = z.infer<typeof recordBaselineSchema>;

export type BaselineAcceptance = { name: string; at: string } | null;

export type SurfaceBaselineView = {
  id: string;
  projectId: string;
  area: string;
  status: BaselineStatus;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  surfaceName: string;
  pointCount: number;
  /** LandXML units of plan and elevations, and whether they came from the file's <Units> or the recorder. */
  linearUnit: string;
  elevationUnit: string;
  unitsFrom: 'file' | 'recorder';
  /** A point file's column order (PNEZD or PENZD); null for a LandXML file. */
  pointOrder: PointOrder | null;
  replacesId: string | null;
  recordedBy: string;
  recordedAt: string;
  subcontractorAccepted: BaselineAcceptance;
  generalContractorAccepted: BaselineAcceptance;
  lockedAt: string | null;
  replacedAt: string | null;
  downloadUrl: string;
  can: BaselineCan;
};

/** The project's baselines, and whether the reader may record one (either measuring party). */
export type SurfaceBaselineList = { baselines: SurfaceBaselineView[]; can: { record: boolean } };

export const BASELINE_STATUS_LABELS: Record<BaselineStatus, string> = {
  proposed: 'Awaiting acceptance',
  locked: 'Locked',
  replaced: 'Replaced',
};

export { BASELINE_STATUSES };
