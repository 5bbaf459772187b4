import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { formatMoney } from '@/lib/format';
import { reconcileMethods, type ReconciledMethod } from '@/shared/domain/earthwork/method-reconciliation';
import type { StationInput } from '@/shared/domain/earthwork/end-area-core';
import type { TallyView } from '@/shared/schemas/tally';
import { tallyQueryOptions, useTallies } from '../api/get-tallies';

const LABELS: Record<ReconciledMethod, string> = {
  'average-end-area': 'Average end area (sections)',
  prismoidal: 'Prismoidal (sections)',
  surface: 'Surface to surface (this tally)',
};

const sign = (v: number) => (v > 0 ? '+' : v < 0 ? '−' : '');

/**
 * For a surface tally whose bid item was also measured by sections (an end-area tally of the same item): the
 * three methods side by side, each priced at the item's unit price, with the section methods' difference from the
 * surface figure in percent and in dollars. Volumes are compared as measured, before any pay-basis conversion.
 */
export function MethodCheck({ tally, unitPriceCents }: { tally: TallyView; unitPriceCents: number }) {
  const list = useTallies(tally.projectId, { bidItemId: tally.bidItem.id });
  const sections = (list.data ?? []).find((t) => t.method === 'end-area');
  const other = useQuery({ ...tallyQueryOptions(sections?.id ?? ''), enabled: sections !== undefined });
  const part = tally.result?.measured?.component ?? 'cut';
  const engine = tally.result?.engine as { cut?: number; fill?: number; volumeUnit?: string } | null | undefined;
  const inputs = other.data?.tally.inputs as { unit?: 'ft' | 'm'; stations?: StationInput[] } | null | undefined;
  const rows = useMemo(() => {
    if (!engine || !inputs?.stations) return null;
    return reconcileMethods({
      unit: inputs.unit ?? 'ft',
      stations: inputs.stations,
      surfaceVolume: (part === 'cut' ? engine.cut : engine.fill) ?? 0,
      part,
      unitPriceCents,
    });
  }, [engine, inputs, part, unitPriceCents]);
  if (!sections || !rows) return null;
  const unit = engine?.volumeUnit ?? 'CY';
  return (
    <Card>
      <CardHeader>
        <CardTitle>Method check: sections against surfaces</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-2">
        <p className="text-xs text-stone-600">
          The {part} of item {tally.bidItem.itemNumber} by the sections of “{sections.title}” and by this tally’s
          surfaces, at {formatMoney(unitPriceCents)} a unit. The surface figure is exact for the two surveys; the
          section methods assume the ground between sections.
        </p>
        <table className="w-full text-sm" aria-label="Method check">
          <thead className="text-left text-xs text-stone-600">
            <tr>
              <th className="py-1 font-medium">Method</th>
              <th className="py-1 text-right font-medium">Volume ({unit})</th>
              <th className="py-1 text-right font-medium">Amount</th>
              <th className="py-1 text-right font-medium">Against surfaces</th>
              <th className="py-1 text-right font-medium">In dollars</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {rows.map((r) => (
              <tr key={r.method} className="border-t border-stone-200">
                <td className="py-1">{LABELS[r.method]}</td>
                {r.volume === null ? (
                  <td colSpan={4} className="py-1 text-right text-xs text-stone-600">
                    {r.reason}
                  </td>
                ) : (
                  <>
                    <td className="py-1 text-right">
                      {r.volume.toLocaleString('en-US', { maximumFractionDigits: 2 })}
                    </td>
                    <td className="py-1 text-right">{formatMoney(r.amountCents!)}</td>
                    <td className="py-1 text-right">
                      {r.method === 'surface' || r.differencePercent === null
                        ? '—'
                        : `${sign(r.differencePercent)}${Math.abs(r.differencePercent).toFixed(2)} %`}
                    </td>
                    <td className="py-1 text-right">
                      {r.method === 'surface'
                        ? '—'
                        : `${sign(r.differenceCents!)}${formatMoney(Math.abs(r.differenceCents!))}`}
                    </td>
                  </>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </CardBody>
    </Card>
  );
}
