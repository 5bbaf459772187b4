import { useMemo } from 'react';
import { CutFillMap } from '@/components/cut-fill-map';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { facesFromRows, pointsFromRows, type PayLimits, type SurfacePoints } from '@/shared/domain/earthwork/surface';
import { depthMap } from '@/shared/domain/earthwork/surface-map';

type Rows = [number, number, number][];
const isRows = (v: unknown): v is Rows =>
  Array.isArray(v) && v.length >= 3 && v.every((r) => Array.isArray(r) && r.length === 3);

/** A stored survey as the volume built it: its points with its faces or breaklines. */
function survey(rows: Rows, faces: unknown, breaklines: unknown): SurfacePoints {
  return {
    ...pointsFromRows(rows),
    ...(Array.isArray(faces) && faces.length > 0 ? { faces: facesFromRows(faces as Rows) } : {}),
    ...(Array.isArray(breaklines) && breaklines.length > 0 ? { breaklines: breaklines as Rows[] } : {}),
  };
}

/** A surface tally's cut and fill map, drawn from its stored surveys and pay limits. */
export function SurfaceMap({ inputs }: { inputs: Record<string, unknown> }) {
  const { existing, design, unit, payLimits } = inputs;
  const length = unit === 'm' ? 'm' : 'ft';
  const map = useMemo(
    () =>
      isRows(existing) && isRows(design)
        ? depthMap(
            survey(existing, inputs.existingFaces, inputs.existingBreaklines),
            survey(design, inputs.designFaces, inputs.designBreaklines),
            length,
          )
        : null,
    [
      existing,
      design,
      inputs.existingFaces,
      inputs.existingBreaklines,
      inputs.designFaces,
      inputs.designBreaklines,
      length,
    ],
  );
  if (!map) return null;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Cut and fill map</CardTitle>
      </CardHeader>
      <CardBody>
        <CutFillMap map={map} payLimits={(payLimits as PayLimits | undefined) ?? null} unit={length} />
      </CardBody>
    </Card>
  );
}
