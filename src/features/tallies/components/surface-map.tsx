import { useMemo } from 'react';
import { CutFillMap } from '@/components/cut-fill-map';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { pointsFromRows, type PayLimits } from '@/shared/domain/earthwork/surface';
import { depthGrid } from '@/shared/domain/earthwork/surface-depth-grid';

type Rows = [number, number, number][];
const isRows = (v: unknown): v is Rows =>
  Array.isArray(v) && v.length >= 3 && v.every((r) => Array.isArray(r) && r.length === 3);

/** A surface tally's cut and fill map, drawn from its stored surveys and pay limits. */
export function SurfaceMap({ inputs }: { inputs: Record<string, unknown> }) {
  const { existing, design, unit, payLimits } = inputs;
  const grid = useMemo(
    () => (isRows(existing) && isRows(design) ? depthGrid(pointsFromRows(existing), pointsFromRows(design)) : null),
    [existing, design],
  );
  if (!grid) return null;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Cut and fill map</CardTitle>
      </CardHeader>
      <CardBody>
        <CutFillMap
          grid={grid}
          payLimits={(payLimits as PayLimits | undefined) ?? null}
          unit={unit === 'm' ? 'm' : 'ft'}
        />
      </CardBody>
    </Card>
  );
}
