import type { PayAppStatus, PaymentMethod, PaymentStatus } from '@/shared/constants';

export const PAYMENT_STATUS_LABELS: Record<PaymentStatus, string> = {
  created: 'Awaiting checkout',
  processing: 'Processing',
  succeeded: 'Succeeded',
  failed: 'Failed',
  canceled: 'Canceled',
  refunded: 'Refunded',
};

export const PAYMENT_STATUS_TONES: Record<PaymentStatus, 'neutral' | 'spruce' | 'clay' | 'brick'> = {
  created: 'neutral',
  processing: 'clay',
  succeeded: 'spruce',
  failed: 'brick',
  canceled: 'neutral',
  refunded: 'neutral',
};

export const METHOD_LABELS: Record<PaymentMethod, string> = { card: 'Card', us_bank_account: 'ACH bank debit' };

export const PAY_APP_STATUS_LABELS: Partial<Record<PayAppStatus, string>> = {
  certified: 'Certified',
  payment_processing: 'Payment processing',
  partially_paid: 'Partially paid',
  paid: 'Paid',
};

export const PAY_APP_STATUS_TONES: Partial<Record<PayAppStatus, 'neutral' | 'spruce' | 'clay'>> = {
  certified: 'neutral',
  payment_processing: 'clay',
  partially_paid: 'clay',
  paid: 'spruce',
};
