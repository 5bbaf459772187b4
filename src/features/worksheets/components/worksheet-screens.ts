import { lazy, type ComponentType, type LazyExoticComponent } from 'react';
import type { WorksheetMethod, WorksheetProps } from '../lib/types';

type Screen = LazyExoticComponent<ComponentType<WorksheetProps>>;

/** One lazy chunk per worksheet: opening one method never loads the others (or their chart code). */
export const WORKSHEET_SCREENS: Record<WorksheetMethod, Screen> = {
  'end-area': lazy(() => import('../end-area/end-area-worksheet').then((m) => ({ default: m.EndAreaWorksheet }))),
  grid: lazy(() => import('../grid/grid-worksheet').then((m) => ({ default: m.GridWorksheet }))),
  pit: lazy(() => import('../pit/pit-worksheet').then((m) => ({ default: m.PitWorksheet }))),
  trench: lazy(() => import('../trench/trench-worksheet').then((m) => ({ default: m.TrenchWorksheet }))),
  'load-count': lazy(() =>
    import('../load-count/load-count-worksheet').then((m) => ({ default: m.LoadCountWorksheet })),
  ),
  spoil: lazy(() => import('../spoil/spoil-worksheet').then((m) => ({ default: m.SpoilWorksheet }))),
  surface: lazy(() => import('../surface/surface-worksheet').then((m) => ({ default: m.SurfaceWorksheet }))),
  'mass-haul': lazy(() => import('../mass-haul/mass-haul-worksheet').then((m) => ({ default: m.MassHaulWorksheet }))),
};

/** One line under the picker: what the worksheet measures. */
export const WORKSHEET_BLURBS: Record<WorksheetMethod, string> = {
  'end-area':
    'Cut and fill end areas by station, typed or worked from cross sections (CSV or LandXML), to bank and compacted volumes.',
  grid: 'Cut and fill depths at grid nodes over a borrow pit or pad, weighted by the cells that share each node.',
  pit: 'A rectangular pit from its four corner depths, with optional side slopes.',
  trench: 'Trench runs by length, depth and bottom width, in a box or sloped or benched by soil class.',
  'load-count':
    'Truck tickets to loose and bank volume, with swell; and conversions between bank, loose and compacted.',
  spoil: 'How high and wide a pile or bank the excavated material makes, and where it may sit.',
  surface: 'Cut and fill between two point surveys (x, y, z), triangulated over the area both cover.',
  'mass-haul': 'Mass ordinates from end areas, balance points, free haul and overhaul.',
};
