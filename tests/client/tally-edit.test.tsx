// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DirectQuantityForm } from '@/features/tallies/components/direct-quantity-form';
import type { TallyView } from '@/shared/schemas/tally';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// An invented draft: 84 CY counted by truck tickets, written by hand.
const DRAFT: TallyView = {
  id: '8c0e6d2a-3b1f-4a7e-b5d9-2e4f6a8c0b12',
  projectId: 'p1',
  bidItem: {
    id: '4f1c2b9e-0d7a-4c55-9e31-6a2f0b8d1c10',
    itemNumber: '210',
    description: 'Haul off unsuitable material',
    payUnit: 'CY',
    basis: 'loose',
  },
  measuredOn: '2026-11-12',
  title: 'Tickets 4411-4417',
  method: 'manual',
  inputs: null,
  result: null,
  quantity: 84,
  manualBasis: 'Seven truck tickets at 12 CY loose',
  sanityReason: null,
  status: 'draft',
  payAppId: null,
  author: { id: 'u1', name: 'Sam Ortiz' },
  evidenceCount: 1,
  createdAt: '2026-11-12T15:00:00.000Z',
  updatedAt: '2026-11-12T15:00:00.000Z',
  can: { edit: true, delete: true, markReady: true, addEvidence: true, removeEvidence: true },
};

describe('editing a draft tally', () => {
  it('starts from the saved values and sends the change as a PATCH of that tally', async () => {
    const fetchMock = vi.fn().mockResolvedValue(
      new Response(JSON.stringify({ tally: { ...DRAFT, quantity: 96 } }), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      }),
    );
    vi.stubGlobal('fetch', fetchMock);
    const onDone = vi.fn();
    render(
      <QueryClientProvider client={new QueryClient()}>
        <DirectQuantityForm
          projectId="p1"
          tally={DRAFT}
          item={{ id: '4f1c2b9e-0d7a-4c55-9e31-6a2f0b8d1c10', itemNumber: '210', payUnit: 'CY' }}
          onDone={onDone}
        />
      </QueryClientProvider>,
    );
    const quantity = screen.getByLabelText('Quantity (CY)') as HTMLInputElement;
    expect(quantity.value).toBe('84');
    expect((screen.getByLabelText('Basis') as HTMLTextAreaElement).value).toBe('Seven truck tickets at 12 CY loose');
    const user = userEvent.setup();
    await user.clear(quantity);
    await user.type(quantity, '1,096');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await vi.waitFor(() => expect(onDone).toHaveBeenCalled());
    const [url, init] = fetchMock.mock.calls[0]! as [string, RequestInit];
    expect(url).toBe('/api/tallies/8c0e6d2a-3b1f-4a7e-b5d9-2e4f6a8c0b12');
    expect(init.method).toBe('PATCH');
    expect(JSON.parse(init.body as string)).toMatchObject({
      bidItemId: '4f1c2b9e-0d7a-4c55-9e31-6a2f0b8d1c10',
      measuredOn: '2026-11-12',
      method: 'manual',
      quantity: 1096,
      manualBasis: 'Seven truck tickets at 12 CY loose',
    });
  });
});

describe('a new direct quantity', () => {
  it('is not sent without an evidence file, and says so on the files field', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    render(
      <QueryClientProvider client={new QueryClient()}>
        <DirectQuantityForm
          projectId="p1"
          item={{ id: DRAFT.bidItem.id, itemNumber: '310', payUnit: 'EA' }}
          onDone={vi.fn()}
        />
      </QueryClientProvider>,
    );
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Quantity (EA)'), '12');
    await user.type(screen.getByLabelText('Basis'), 'Inlet count signed on site by both sides');
    await user.click(screen.getByRole('button', { name: 'Save draft tally' }));
    expect(await screen.findByText(/Attach at least one file/)).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('says "not a number" for a quantity that is not one', async () => {
    render(
      <QueryClientProvider client={new QueryClient()}>
        <DirectQuantityForm
          projectId="p1"
          item={{ id: DRAFT.bidItem.id, itemNumber: '310', payUnit: 'EA' }}
          onDone={vi.fn()}
        />
      </QueryClientProvider>,
    );
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Quantity (EA)'), 'twelve');
    await user.click(screen.getByRole('button', { name: 'Save draft tally' }));
    expect(await screen.findByText(/Not a number/)).toBeTruthy();
  });
});
