// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FeeBearerCard } from '@/features/payments/components/fee-bearer-card';
import { DEFAULT_FEE_RATES } from '@/shared/domain/payment-fees';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const show = (canEdit: boolean) =>
  render(
    <QueryClientProvider client={new QueryClient()}>
      <FeeBearerCard projectId="p1" bearer="payee" rates={DEFAULT_FEE_RATES} canEdit={canEdit} />
    </QueryClientProvider>,
  );

// The schedule's example on $10,000.00 at the default rates (2.9 % + 30 cents by card; ACH 0.8 % capped at $5.00,
// the processor's standard US pricing from memory), by hand: the payer bearing the card fee is charged $10,298.97
// (2.9 % of 1,029,897 = 29,867.013 -> 29,867 + 30 = 29,897 = 1,029,897 - 1,000,000); the payee absorbing nets
// $10,000.00 - ($290.00 + $0.30) = $9,709.70; ACH's 0.8 % ($80.00) is capped at $5.00 either way.
describe('who bears the processing fees (project setting)', () => {
  it('shows the schedule as the server defines it, with its worked example', () => {
    show(false);
    const table = screen.getByRole('table', { name: 'Processing fee schedule' });
    const card = within(table).getByRole('row', { name: /Card/ });
    expect(card.textContent).toContain('2.9 % of the charge + $0.30');
    expect(card.textContent).toContain('$10,298.97 / $10,000.00');
    expect(card.textContent).toContain('$10,000.00 / $9,709.70');
    const ach = within(table).getByRole('row', { name: /ACH/ });
    expect(ach.textContent).toContain('0.8 % of the charge, at most $5.00');
    expect(ach.textContent).toContain('$10,005.00 / $10,000.00');
    expect(ach.textContent).toContain('$10,000.00 / $9,995.00');
  });

  it('is read-only for those who do not manage the contract', () => {
    show(false);
    expect(screen.queryByRole('radio')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Save' })).toBeNull();
    expect(screen.getByTestId('fee-bearer').textContent).toContain('The payee absorbs it.');
  });

  it('lets the general contractor’s side change it; Save sends only the setting', async () => {
    const fetchMock = vi.fn().mockResolvedValue(
      new Response(JSON.stringify({ project: { processingFeeBearer: 'payer' } }), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      }),
    );
    vi.stubGlobal('fetch', fetchMock);
    show(true);
    const user = userEvent.setup();
    const save = screen.getByRole('button', { name: 'Save' }) as HTMLButtonElement;
    expect((screen.getByRole('radio', { name: /payee absorbs/ }) as HTMLInputElement).checked).toBe(true);
    expect(save.disabled).toBe(true);
    await user.click(screen.getByRole('radio', { name: /payer bears/ }));
    expect(save.disabled).toBe(false);
    await user.click(save);
    await vi.waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(String(url)).toBe('/api/projects/p1');
    expect(init.method).toBe('PATCH');
    expect(JSON.parse(init.body as string)).toEqual({ processingFeeBearer: 'payer' });
  });
});
