// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { NewPayAppForm } from '@/features/pay-apps/components/new-pay-app-form';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const answer = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function renderIn(ui: React.ReactNode) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <MemoryRouter>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
}

// Issue 14, item 6: a refusal of the last attempt must not stay beside an input that has changed since.
describe('a form forgets the last refusal once the input changes', () => {
  it('sign in: the wrong-password message goes when the password is edited', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => answer(401, { code: 'INVALID_EMAIL_OR_PASSWORD', message: 'Invalid email or password' })),
    );
    const user = userEvent.setup();
    renderIn(<SignInForm onSignedIn={() => undefined} />);
    await user.type(screen.getByLabelText('E-mail'), 'sub@tallyard.test');
    await user.type(screen.getByLabelText('Password'), 'wrong-one');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('That e-mail and password do not match an account.')).toBeTruthy();
    await user.type(screen.getByLabelText('Password'), 'x');
    await waitFor(() => expect(screen.queryByText('That e-mail and password do not match an account.')).toBeNull());
  });

  it('new pay application: the refusal and its field message go when a date is changed', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        answer(409, {
          error: {
            code: 'PAY_APP_BLOCKED',
            message: 'Pay application 3 is still returned.',
            details: [{ path: 'periodStart', message: 'Overlaps pay application 3' }],
          },
        }),
      ),
    );
    const user = userEvent.setup();
    renderIn(<NewPayAppForm projectId="p1" lastPeriodEnd="2026-10-31" onDone={() => undefined} />);
    await user.click(screen.getByRole('button', { name: 'Compile pay application' }));
    expect(await screen.findByText('Pay application 3 is still returned.')).toBeTruthy();
    expect(screen.getByText('Overlaps pay application 3')).toBeTruthy();
    await user.click(screen.getByRole('checkbox'));
    await waitFor(() => expect(screen.queryByText('Pay application 3 is still returned.')).toBeNull());
    expect(screen.queryByText('Overlaps pay application 3')).toBeNull();
  });
});
