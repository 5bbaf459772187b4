// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { PayForm } from '@/features/payments/components/pay-form';
import { DEFAULT_FEE_RATES, feeQuote } from '@/shared/domain/payment-fees';
import type { PayablePayAppView } from '@/shared/schemas/payment';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// An invented certified application: $12,500.00 due, above the re-authentication threshold.
const PAY_APP: PayablePayAppView = {
  id: 'a1',
  projectId: 'p1',
  number: 4,
  status: 'certified',
  periodStart: '2026-11-01',
  periodEnd: '2026-11-30',
  isFinal: false,
  currentDueCents: 1_250_000,
  paidCents: 0,
  processingCents: 0,
  balanceCents: 1_250_000,
  payable: true,
  allowPartialPayments: false,
  feeBearer: 'payee',
  feeRates: DEFAULT_FEE_RATES,
  feeQuotes: {
    card: feeQuote(1_250_000, 'card', 'payee'),
    us_bank_account: feeQuote(1_250_000, 'us_bank_account', 'payee'),
  },
};

const answer = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

describe('the payment form when the server asks for the password again (OWASP ASVS 4.0.3 3.7.1)', () => {
  it('shows a password field, re-sends the step with it, and shows a wrong password as an error', async () => {
    const fetchMock = vi
      .fn()
      .mockResolvedValueOnce(
        answer(403, {
          error: {
            code: 'REAUTH_REQUIRED',
            message: 'Enter your password again to confirm this step.',
            details: [{ path: 'reauthPassword', message: 'Password required.' }],
          },
        }),
      )
      .mockResolvedValueOnce(
        answer(403, {
          error: {
            code: 'REAUTH_FAILED',
            message: 'That password is not right. Enter your Tallyard password.',
            details: [],
          },
        }),
      );
    vi.stubGlobal('fetch', fetchMock);
    render(
      <QueryClientProvider client={new QueryClient()}>
        <PayForm payApp={PAY_APP} />
      </QueryClientProvider>,
    );
    const user = userEvent.setup();
    await user.click(screen.getByRole('radio', { name: /Card/ }));
    await user.click(screen.getByRole('button', { name: 'Continue to payment' }));
    const field = await screen.findByLabelText('Your password');
    expect(screen.getByText('Enter your password again to confirm this step.')).toBeTruthy();
    expect(JSON.parse(fetchMock.mock.calls[0]![1].body as string)).toEqual({ method: 'card' });
    expect((screen.getByRole('button', { name: 'Continue to payment' }) as HTMLButtonElement).disabled).toBe(true);

    await user.type(field, 'wrong-password');
    await user.click(screen.getByRole('button', { name: 'Continue to payment' }));
    expect(await screen.findByRole('alert')).toHaveProperty(
      'textContent',
      'That password is not right. Enter your Tallyard password.',
    );
    expect(JSON.parse(fetchMock.mock.calls[1]![1].body as string)).toEqual({
      method: 'card',
      reauthPassword: 'wrong-password',
    });
  });
});
