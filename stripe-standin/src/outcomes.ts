/**
 * The test values this stand-in understands, from Stripe's testing documentation ("Testing" and "ACH Direct
 * Debit: test account numbers"): cards succeed or decline at once; bank debits go processing first.
 */
export type CardOutcome =
  | { kind: 'succeeds' }
  | { kind: 'declines'; declineCode: 'generic_decline' | 'insufficient_funds'; message: string };

export type BankOutcome = { kind: 'settles' } | { kind: 'fails'; code: string; message: string } | { kind: 'stays_processing' };

export type TestCard = { number: string; label: string; outcome: CardOutcome };
export type TestBankAccount = { account: string; label: string; outcome: BankOutcome };

export const TEST_ROUTING_NUMBER = '110000000';

export const TEST_CARDS: readonly TestCard[] = [
  { number: '4242424242424242', label: 'Visa test card: succeeds', outcome: { kind: 'succeeds' } },
  {
    number: '4000000000000002',
    label: 'Test card: declined',
    outcome: { kind: 'declines', declineCode: 'generic_decline', message: 'Your card was declined.' },
  },
  {
    number: '4000000000009995',
    label: 'Test card: insufficient funds',
    outcome: { kind: 'declines', declineCode: 'insufficient_funds', message: 'Your card has insufficient funds.' },
  },
];

export const TEST_BANK_ACCOUNTS: readonly TestBankAccount[] = [
  { account: '000123456789', label: 'Processing, then succeeds', outcome: { kind: 'settles' } },
  {
    account: '000222222227',
    label: 'Processing, then fails: insufficient funds',
    outcome: { kind: 'fails', code: 'insufficient_funds', message: 'The customer’s account has insufficient funds to cover this payment.' },
  },
  { account: '000000000009', label: 'Stays processing', outcome: { kind: 'stays_processing' } },
];

const digits = (value: string) => value.replace(/[\s-]/g, '');

export function findCard(number: string): TestCard | undefined {
  return TEST_CARDS.find((c) => c.number === digits(number));
}

export function findBankAccount(account: string, routing: string): TestBankAccount | undefined {
  if (digits(routing) !== TEST_ROUTING_NUMBER) return undefined;
  return TEST_BANK_ACCOUNTS.find((a) => a.account === digits(account));
}

/** "4242 4242 4242 4242" */
export const groupCardNumber = (number: string) => number.replace(/(\d{4})(?=\d)/g, '$1 ');
