import { sql } from 'drizzle-orm';
import {
  customType,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { BASELINE_STATUSES } from '../../../src/shared/constants';
import { user } from './auth';
import { timestamps } from './columns';
import { projects } from './projects';

export const baselineStatus = pgEnum('baseline_status', BASELINE_STATUSES);

/** Raw bytes (PostgreSQL bytea). */
const bytea = customType<{ data: Buffer; driverData: Buffer | Uint8Array }>({
  dataType: () => 'bytea',
  fromDriver: (v) => (Buffer.isBuffer(v) ? v : Buffer.from(v)),
});

const at = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

/**
 * A project's (or one area's) original ground surface: the LandXML file as stored (SHA-256), its points read once
 * (x, y, z as little-endian float64 triples in the file's own units, converted when measured), and who accepted it
 * for each side. One proposed and one locked baseline per project area at a time.
 */
export const surfaceBaselines = pgTable(
  'surface_baselines',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    /** The area of the project it covers; '' is the whole project. */
    area: text('area').notNull().default(''),
    status: baselineStatus('status').notNull().default('proposed'),
    fileName: text('file_name').notNull(),
    contentType: text('content_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    sha256: text('sha256').notNull(),
    storageKey: text('storage_key').notNull().unique(),
    surfaceName: text('surface_name').notNull(),
    pointCount: integer('point_count').notNull(),
    /** LandXML length units of plan and elevations (from <Units>, or as the recorder said when the file has none). */
    linearUnit: text('linear_unit').notNull(),
    elevationUnit: text('elevation_unit').notNull(),
    unitsFrom: text('units_from').notNull(),
    points: bytea('points').notNull(),
    /** The surface's faces as given (LandXML Faces): 0-based point indices, little-endian uint32 triples; null without. */
    faces: bytea('faces'),
    /** Breaklines of a surface without faces: [x, y, z] polylines in the file's units; null without. */
    breaklines: jsonb('breaklines').$type<[number, number, number][][]>(),
    /** A point file's column order (PNEZD or PENZD: from its header or as the recorder said); null for LandXML. */
    pointOrder: text('point_order'),
    replacesId: uuid('replaces_id'),
    recordedByUserId: text('recorded_by_user_id')
      .notNull()
      .references(() => user.id),
    subAcceptedByUserId: text('sub_accepted_by_user_id').references(() => user.id),
    subAcceptedAt: at('sub_accepted_at'),
    gcAcceptedByUserId: text('gc_accepted_by_user_id').references(() => user.id),
    gcAcceptedAt: at('gc_accepted_at'),
    lockedAt: at('locked_at'),
    replacedAt: at('replaced_at'),
    ...timestamps,
  },
  (t) => [
    index().on(t.projectId),
    uniqueIndex('surface_baselines_one_proposed')
      .on(t.projectId, t.area)
      .where(sql`status = 'proposed'`),
    uniqueIndex('surface_baselines_one_locked')
      .on(t.projectId, t.area)
      .where(sql`status = 'locked'`),
  ],
);
