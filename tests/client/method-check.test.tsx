// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { tallyKeys } from '@/features/tallies/api/keys';
import { MethodCheck } from '@/features/tallies/components/method-check';
import type { TallyView } from '@/shared/schemas/tally';

afterEach(cleanup);

/**
 * The method check on a surface tally's page (issue 13, item 4): average end area and prismoidal from the item's
 * end-area tally beside the surface figure. Average end area V = L (A1 + A2) / 2 (FHWA FP Section 109; US Army
 * FM 5-233 ch. 4); prismoidal V = L (A1 + 4 Am + A2) / 6 (surveying texts; reference.md section 1); 27 cu ft to the
 * CY. Stations 0, 50, 100 ft with cut areas 100, 200, 100 sq ft, by hand: AEA 15,000 cu ft = 555.56 CY, $4,000.00
 * at $7.20; prismoidal 16,666.67 cu ft = 617.28 CY, $4,444.44; the surface tally's 600 CY is $4,320.00. Against
 * the surface: AEA -7.41 % (-$320.00), prismoidal +2.88 % (+$124.44).
 */
const surfaceTally = {
  id: 's1',
  projectId: 'p1',
  method: 'surface',
  bidItem: { id: 'b1', itemNumber: '203-1' },
  result: { engine: { cut: 600, fill: 12, volumeUnit: 'CY' }, measured: { component: 'cut' } },
} as unknown as TallyView;

function show(stations: { station: number; cutArea: number; fillArea: number }[] | null) {
  const client = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  const list = stations
    ? [{ id: 'e1', method: 'end-area', title: 'Sections of the east cut', measuredOn: '2026-10-01' }]
    : [{ id: 's1', method: 'surface', title: 'Surfaces', measuredOn: '2026-10-02' }];
  client.setQueryData(tallyKeys.list('p1', { bidItemId: 'b1' }), list);
  if (stations) client.setQueryData(tallyKeys.detail('e1'), { tally: { inputs: { unit: 'ft', stations } } });
  return render(
    <QueryClientProvider client={client}>
      <MethodCheck tally={surfaceTally} unitPriceCents={720} />
    </QueryClientProvider>,
  );
}

const cells = (name: RegExp) =>
  within(screen.getByRole('table', { name: 'Method check' }))
    .getByRole('row', { name })
    .querySelectorAll('td');

describe('method check beside the surface tally', () => {
  it('shows average end area and prismoidal beside the surface figure, in percent and dollars at the item price', () => {
    show([
      { station: 0, cutArea: 100, fillArea: 0 },
      { station: 50, cutArea: 200, fillArea: 0 },
      { station: 100, cutArea: 100, fillArea: 0 },
    ]);
    expect(screen.getByText(/Sections of the east cut/)).toBeTruthy();
    const text = (r: RegExp) => [...cells(r)].map((c) => c.textContent);
    expect(text(/Average end area/)).toEqual([
      'Average end area (sections)',
      '555.56',
      '$4,000.00',
      '−7.41 %',
      '−$320.00',
    ]);
    expect(text(/Prismoidal/)).toEqual(['Prismoidal (sections)', '617.28', '$4,444.44', '+2.88 %', '+$124.44']);
    expect(text(/Surface to surface/)).toEqual(['Surface to surface (this tally)', '600', '$4,320.00', '—', '—']);
  });

  it('says why prismoidal cannot be used on an even count of stations, and keeps average end area', () => {
    show([
      { station: 0, cutArea: 100, fillArea: 0 },
      { station: 50, cutArea: 200, fillArea: 0 },
    ]);
    // AEA: 50 (100 + 200) / 2 = 7,500 cu ft = 277.78 CY.
    expect(cells(/Average end area/)[1]!.textContent).toBe('277.78');
    expect(cells(/Prismoidal/)[1]!.textContent).toMatch(/odd count/);
  });

  it('is not shown when the item has no end-area tally', () => {
    const { container } = show(null);
    expect(container.textContent).toBe('');
  });
});
