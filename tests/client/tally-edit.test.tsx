// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { NewTallyForm } from '@/features/tallies/components/new-tally-form';
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
  evidenceCount: 0,
  createdAt: '2026-11-12T15:00:00.000Z',
  updatedAt: '2026-11-12T15:00:00.000Z',
};

describe('editing a draft tally', () => {
  it('starts from the saved values and sends the change as a PATCH of that tally', async () => {
    const fetchMock = vi
      .fn()
      .mockResolvedValue(
        new Response(JSON.stringify({ tally: { ...DRAFT, quantity: 96 } }), {
          status: 200,
          headers: { 'Content-Type': 'application/json' },
        }),
      );
    vi.stubGlobal('fetch', fetchMock);
    const onDone = vi.fn();
    render(
      <QueryClientProvider client={new QueryClient()}>
        <NewTallyForm
          projectId="p1"
          tally={DRAFT}
          bidItems={[
            {
              id: '4f1c2b9e-0d7a-4c55-9e31-6a2f0b8d1c10',
              itemNumber: '210',
              description: 'Haul off unsuitable material',
              payUnit: 'CY',
              method: 'manual',
            },
          ]}
          onDone={onDone}
        />
      </QueryClientProvider>,
    );
    const quantity = screen.getByLabelText('Quantity (CY)') as HTMLInputElement;
    expect(quantity.value).toBe('84');
    expect((screen.getByLabelText('Written basis') as HTMLTextAreaElement).value).toBe(
      'Seven truck tickets at 12 CY loose',
    );
    const user = userEvent.setup();
    await user.clear(quantity);
    await user.type(quantity, '96');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await vi.waitFor(() => expect(onDone).toHaveBeenCalled());
    const [url, init] = fetchMock.mock.calls[0]! as [string, RequestInit];
    expect(url).toBe('/api/tallies/8c0e6d2a-3b1f-4a7e-b5d9-2e4f6a8c0b12');
    expect(init.method).toBe('PATCH');
    expect(JSON.parse(init.body as string)).toMatchObject({
      bidItemId: '4f1c2b9e-0d7a-4c55-9e31-6a2f0b8d1c10',
      measuredOn: '2026-11-12',
      method: 'manual',
      quantity: 96,
      manualBasis: 'Seven truck tickets at 12 CY loose',
    });
  });
});
