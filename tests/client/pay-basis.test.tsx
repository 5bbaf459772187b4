// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { PayBasisScreen } from '@/features/field-records';
import type { AccessRole } from '@/shared/constants';
import { projectCan } from '@/shared/policies/projects';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented answers of the provisions routes, in the shapes the server sends.
const ANSWERS: Record<string, unknown> = {
  'measurement-profiles': {
    profiles: [
      {
        bidItemId: 'i1',
        itemNumber: '303',
        description: 'Haul off unsuitable',
        payUnit: 'CY',
        profile: 'truck_measure',
        profileLabel: 'Counted loads (truck register)',
        payDecimals: 1,
        measuredDecimals: 2,
        stage: 'interim',
        settings: {},
        isDefault: false,
        earnedCents: null,
      },
    ],
  },
  trucks: {
    trucks: [
      { id: 't1', label: 'H-07', hauler: '', bedVolumeCy: 12.42, measuredBy: 'O. H.', measuredOn: '2026-08-28' },
    ],
  },
  'truck-tickets': {
    nextCursor: null,
    items: [
      {
        id: 'k1',
        bidItemId: 'i1',
        deliveredOn: '2026-09-15',
        truckLabel: 'H-19',
        material: 'Muck',
        source: 'Cut',
        loadedAt: 'Outlet',
        deliveredTo: 'Spoil B',
        loadCheckerInitials: 'RD',
        deliveryCheckerInitials: 'OH',
        loadVolumeCy: null,
        volumeCy: 0,
        flags: ['unregistered_truck'],
      },
    ],
  },
  'truck-tickets/totals': {
    totals: { byDay: [{ key: '2026-09-15', loads: 0, computedCy: 0, payCy: 0, flagged: 1 }], byItem: [] },
  },
  'material-sources': { sources: [] },
  'scale-tickets': { items: [], nextCursor: null },
  'daily-sheets': { sheets: [] },
  'stored-materials': { materials: [] },
  'pay-adjustments': {
    adjustments: [
      {
        id: 'a1',
        kind: 'liquidated_damages',
        appliesOn: '2026-11-30',
        description: 'Late by 12 days',
        amountCents: -3_420_000,
        basis: {},
      },
    ],
  },
};

function stubFetch(importAnswer?: { status: number; body: unknown }) {
  const fetchMock = vi.fn(async (path: string) => {
    if (path.endsWith('/truck-tickets/import') && importAnswer) {
      return new Response(JSON.stringify(importAnswer.body), {
        status: importAnswer.status,
        headers: { 'Content-Type': 'application/json' },
      });
    }
    const route = path.split('?')[0]!;
    const key = Object.keys(ANSWERS).find((k) => route.endsWith(`/${k}`));
    return new Response(JSON.stringify(key ? ANSWERS[key] : {}), {
      status: key ? 200 : 404,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

// The screen reads the `can` the server's project presenter sends for these roles.
function renderScreen(myRoles: AccessRole[]) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <PayBasisScreen projectId="p1" can={projectCan(myRoles)} />
    </QueryClientProvider>,
  );
}

describe('pay basis screen', () => {
  it('lets the general contractor choose how an item is paid; the owner only reads it', async () => {
    stubFetch();
    renderScreen(['general_contractor']);
    expect(await screen.findByLabelText('How item 303 is paid')).toBeTruthy();
    cleanup();
    renderScreen(['owner']);
    expect(await screen.findByText('Counted loads (truck register)')).toBeTruthy();
    expect(screen.queryByLabelText('How item 303 is paid')).toBeNull();
    expect(screen.queryByText(/Tickets for item/)).toBeNull();
  });

  it('shows a load on an unregistered truck as flagged and a deduction as a negative amount', async () => {
    stubFetch();
    renderScreen(['owner']);
    expect(await screen.findByText('Truck not on the register')).toBeTruthy();
    expect(await screen.findByText('-$34,200.00')).toBeTruthy();
  });

  it('lists the line and column of each refused CSV row', async () => {
    stubFetch({
      status: 400,
      body: {
        error: {
          code: 'VALIDATION_FAILED',
          message: 'Some rows need attention',
          details: [
            { path: 'line 3.load_checker', line: 3, column: 'load_checker', message: 'Initials are 1 to 4 letters' },
          ],
        },
      },
    });
    renderScreen(['subcontractor']);
    const input = await screen.findByLabelText(/Load sheet/);
    await userEvent.upload(input, new File(['delivered_on\n'], 'loads.csv', { type: 'text/csv' }));
    await waitFor(() =>
      expect(screen.getByRole('alert').textContent).toContain('line 3.load_checker: Initials are 1 to 4 letters'),
    );
  });
});
