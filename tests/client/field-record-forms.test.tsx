// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
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
const profile = (over: object) => ({
  payDecimals: 0,
  measuredDecimals: 1,
  stage: 'interim',
  settings: {},
  isDefault: false,
  earnedCents: null,
  ...over,
});
const STAGES = [
  { name: 'Clearing', percentOfItem: 40 },
  { name: 'Grubbing', percentOfItem: 60 },
];
const ANSWERS: Record<string, unknown> = {
  'measurement-profiles': {
    profiles: [
      profile({
        bidItemId: '3f1a9a52-6c1e-4b0a-8f57-1d2e3c4b5a61',
        itemNumber: '101',
        description: 'Clearing and grubbing',
        payUnit: 'LS',
        profile: 'lump_sum',
        profileLabel: 'Lump sum',
        settings: { stages: STAGES, completedStages: [0] },
      }),
      profile({
        bidItemId: '7a2b3c4d-5e6f-4a1b-9c2d-3e4f5a6b7c82',
        itemNumber: '303',
        description: 'Haul off unsuitable',
        payUnit: 'CY',
        profile: 'truck_measure',
        profileLabel: 'Counted loads',
        payDecimals: 1,
      }),
    ],
  },
  trucks: { trucks: [] },
  'truck-tickets': { items: [], nextCursor: null },
  'truck-tickets/totals': { totals: { byDay: [], byItem: [] } },
  'material-sources': { sources: [] },
  'scale-tickets': { items: [], nextCursor: null },
  'daily-sheets': { sheets: [] },
  'stored-materials': { materials: [] },
  'pay-adjustments': { adjustments: [] },
  'change-orders': {
    changeOrders: [
      { id: '0b7c6a34-2f0e-4a59-9d1e-0d6c1a1c0f11', number: 4, title: 'Soft subgrade', status: 'approved' },
      { id: '5d0c1f4e-8a6b-4c3e-9f1a-2b3c4d5e6f70', number: 5, title: 'Not yet decided', status: 'proposed' },
    ],
  },
};

type Call = { method: string; path: string; body: unknown };
function stubFetch(answer?: (call: Call) => { status: number; body: unknown } | undefined) {
  const calls: Call[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (path: string, init?: RequestInit) => {
      const call = {
        method: init?.method ?? 'GET',
        path,
        body: init?.body ? JSON.parse(String(init.body)) : undefined,
      };
      calls.push(call);
      const given = call.method !== 'GET' ? answer?.(call) : undefined;
      const route = path.split('?')[0]!;
      const key = Object.keys(ANSWERS).find((k) => route.endsWith(`/${k}`));
      const { status, body } = given ?? { status: key ? 200 : 404, body: key ? ANSWERS[key] : {} };
      return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return calls;
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

describe('measurement profile selector', () => {
  it('keeps a lump sum item its stages when its profile is saved again', async () => {
    const calls = stubFetch((c) =>
      c.method === 'PUT' ? { status: 200, body: { profile: ANSWERS['measurement-profiles'] } } : undefined,
    );
    renderScreen(['general_contractor']);
    const select = await screen.findByLabelText('How item 101 is paid');
    fireEvent.change(select, { target: { value: 'lump_sum' } });
    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    expect(calls.find((c) => c.method === 'PUT')!.body).toEqual({
      profile: 'lump_sum',
      stage: 'interim',
      payDecimals: 0,
      settings: { stages: STAGES, completedStages: [0] },
    });
  });

  it('sends only the settings the new profile reads when it changes', async () => {
    const calls = stubFetch(() => ({ status: 200, body: { profile: {} } }));
    renderScreen(['general_contractor']);
    fireEvent.change(await screen.findByLabelText('How item 101 is paid'), { target: { value: 'worksheet' } });
    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    expect(calls.find((c) => c.method === 'PUT')!.body).toMatchObject({ profile: 'worksheet', settings: {} });
  });
});

describe('lump-sum stage editor', () => {
  it('shows the running sum, names the row and field of each mistake, and sends nothing until it makes 100 %', async () => {
    const calls = stubFetch((c) =>
      c.method === 'PUT' ? { status: 200, body: { profile: ANSWERS['measurement-profiles'] } } : undefined,
    );
    renderScreen(['general_contractor']);
    await userEvent.click(await screen.findByRole('button', { name: 'Edit stages' }));
    const form = await screen.findByRole('form', { name: 'Stages of item 101' });
    const f = within(form);
    // The stored schedule: 40 % + 60 %; stage 1 was marked done without a day, so the editor asks for one.
    expect(f.getByText('Shares add up to 100 %')).toBeTruthy();
    expect(form.textContent).toContain('marked done without a day');
    await userEvent.click(f.getByRole('button', { name: 'Add a stage' }));
    await userEvent.type(f.getByLabelText('Stage 3 share of the lump sum, percent'), '15');
    expect(f.getByText('Shares add up to 115 % (must be 100 %)')).toBeTruthy();
    await userEvent.click(f.getByRole('button', { name: 'Save stages' }));
    const summary = await f.findByRole('list', { name: 'What to correct' });
    expect(summary.textContent).toContain('Stages, row 3, name: A stage name is required');
    expect(summary.textContent).toContain('The stages add up to 115 %; they must add up to 100 %');
    expect(calls.filter((c) => c.method === 'PUT')).toEqual([]);
    // Fix it: name the stage, take 15 off the second, date the first.
    await userEvent.type(f.getByLabelText('Stage 3 name'), 'Haul off the brush');
    await userEvent.clear(f.getByLabelText('Stage 2 share of the lump sum, percent'));
    await userEvent.type(f.getByLabelText('Stage 2 share of the lump sum, percent'), '45');
    fireEvent.change(f.getByLabelText('Stage 1 day done'), { target: { value: '2026-10-12' } });
    await userEvent.click(f.getByRole('button', { name: 'Save stages' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    const put = calls.find((c) => c.method === 'PUT')!;
    expect(put.path).toBe('/api/bid-items/3f1a9a52-6c1e-4b0a-8f57-1d2e3c4b5a61/lump-sum-stages');
    expect(put.body).toEqual({
      stages: [
        { name: 'Clearing', percentOfItem: 40, completedOn: '2026-10-12' },
        { name: 'Grubbing', percentOfItem: 45, completedOn: null },
        { name: 'Haul off the brush', percentOfItem: 15, completedOn: null },
      ],
    });
  });

  it('is not offered to the subcontractor', async () => {
    stubFetch();
    renderScreen(['subcontractor']);
    expect(await screen.findByText('2 stages, 1 done.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Edit stages' })).toBeNull();
  });
});

describe('field record forms', () => {
  it('names the row and the field of each mistake on a force account day, and sends nothing', async () => {
    const calls = stubFetch();
    renderScreen(['subcontractor']);
    await userEvent.click(await screen.findByRole('button', { name: 'Record a day' }));
    const form = await screen.findByRole('form', { name: 'Record a force account day' });
    const f = within(form);
    await userEvent.click(f.getByRole('button', { name: 'Add a labor row' }));
    await userEvent.type(f.getAllByLabelText('Trade')[0]!, 'Operator');
    await userEvent.type(f.getAllByLabelText('Hours')[0]!, '8');
    await userEvent.type(f.getAllByLabelText('Rate ($/h)')[0]!, '62.50');
    await userEvent.type(f.getAllByLabelText('Trade')[1]!, 'Laborer');
    await userEvent.type(f.getAllByLabelText('Hours')[1]!, '30');
    await userEvent.type(f.getAllByLabelText('Rate ($/h)')[1]!, 'twelve');
    await userEvent.click(f.getByRole('button', { name: 'Record day' }));
    const summary = await f.findByRole('list', { name: 'What to correct' });
    expect(summary.textContent).toContain('Labor, row 2, hours: Hours cannot be above 24');
    expect(summary.textContent).toContain('Labor, row 2, rate: Type dollars like 62.50');
    expect(summary.textContent).toContain('Day worked:');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
    // Only approved change orders are offered.
    expect(f.getByLabelText('Change order that authorised the work').textContent).toBe('CO 4 Soft subgrade');
  });

  it('sends a truck ticket in the server shape and puts the server refusal on its field', async () => {
    const calls = stubFetch((c) =>
      c.path.endsWith('/truck-tickets')
        ? {
            status: 400,
            body: {
              error: {
                code: 'VALIDATION_FAILED',
                message: 'Check the ticket',
                details: [{ path: 'truckLabel', message: 'Not a truck number we know' }],
              },
            },
          }
        : undefined,
    );
    renderScreen(['subcontractor']);
    await userEvent.click(await screen.findByRole('button', { name: 'Record a load' }));
    const f = within(await screen.findByRole('form', { name: 'Record a load ticket' }));
    fireEvent.change(f.getByLabelText('Delivered on'), { target: { value: '2026-10-10' } });
    for (const [label, text] of [
      ['Truck', 'T-12'],
      ['Material', 'Muck'],
      ['Source', 'Outlet ditch'],
      ['Loaded at', 'Sta 3+40'],
      ['Delivered to', 'Spoil B'],
      ['Load checker (initials)', 'RO'],
      ['Delivery checker (initials)', 'JM'],
      ['Load volume (CY)', '13.25'],
    ] as const) {
      await userEvent.type(f.getByLabelText(label), text);
    }
    await userEvent.click(f.getByRole('button', { name: 'Save load' }));
    await waitFor(() => expect(f.getByText('Not a truck number we know')).toBeTruthy());
    expect(calls.find((c) => c.method === 'POST')!.body).toEqual({
      bidItemId: '7a2b3c4d-5e6f-4a1b-9c2d-3e4f5a6b7c82',
      deliveredOn: '2026-10-10',
      truckLabel: 'T-12',
      material: 'Muck',
      source: 'Outlet ditch',
      loadedAt: 'Sta 3+40',
      deliveredTo: 'Spoil B',
      loadCheckerInitials: 'RO',
      deliveryCheckerInitials: 'JM',
      loadVolumeCy: 13.25,
    });
  });

  it('offers the deduction form to the contract side only', async () => {
    stubFetch();
    renderScreen(['subcontractor']);
    await screen.findByRole('button', { name: 'Record a load' });
    expect(screen.queryByRole('button', { name: 'Record a deduction or adjustment' })).toBeNull();
    cleanup();
    renderScreen(['general_contractor']);
    expect(await screen.findByRole('button', { name: 'Record a deduction or adjustment' })).toBeTruthy();
  });
});
