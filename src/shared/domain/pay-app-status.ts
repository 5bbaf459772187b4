import type { AccessRole, PayAppStatus } from '../constants';

/** The actions that move a pay application, and who may take them. */
export const PAY_APP_ACTIONS = [
  'submit',
  'start_review',
  'return',
  'revise',
  'certify',
  'payment_started',
  'payment_partial',
  'payment_settled',
  'payment_reopened',
] as const;
export type PayAppAction = (typeof PAY_APP_ACTIONS)[number];

type Transition = { from: readonly PayAppStatus[]; to: PayAppStatus; by: readonly (AccessRole | 'system')[] };

/**
 * Allowed transitions: draft -> submitted -> in_review -> (returned -> draft (revised, new revision) -> submitted
 * again) -> certified -> payment_processing -> partially_paid / paid. `system` moves come from payment events.
 * A certified application is frozen: no action edits its lines.
 */
export const PAY_APP_TRANSITIONS: Record<PayAppAction, Transition> = {
  submit: { from: ['draft'], to: 'submitted', by: ['subcontractor'] },
  start_review: { from: ['submitted'], to: 'in_review', by: ['general_contractor'] },
  return: { from: ['submitted', 'in_review'], to: 'returned', by: ['general_contractor'] },
  revise: { from: ['returned'], to: 'draft', by: ['subcontractor'] },
  certify: { from: ['submitted', 'in_review'], to: 'certified', by: ['general_contractor'] },
  payment_started: { from: ['certified', 'partially_paid'], to: 'payment_processing', by: ['system'] },
  payment_partial: {
    from: ['certified', 'payment_processing', 'partially_paid'],
    to: 'partially_paid',
    by: ['system'],
  },
  payment_settled: { from: ['certified', 'payment_processing', 'partially_paid'], to: 'paid', by: ['system'] },
  payment_reopened: { from: ['payment_processing'], to: 'certified', by: ['system'] },
};

/** Whether `action` may move an application in `status`; returns the target status or null. */
export function nextStatus(status: PayAppStatus, action: PayAppAction): PayAppStatus | null {
  const t = PAY_APP_TRANSITIONS[action];
  return t.from.includes(status) ? t.to : null;
}

/** Statuses after certification: the lines and totals are frozen. */
export const FROZEN_STATUSES: readonly PayAppStatus[] = ['certified', 'payment_processing', 'partially_paid', 'paid'];
export const isFrozen = (status: PayAppStatus) => FROZEN_STATUSES.includes(status);

/**
 * Why the next period cannot be billed yet, or null: an earlier application that is not certified blocks it. The
 * server refuses with this sentence (409 PAY_APP_OPEN) and the screen shows it beside the disabled command first.
 */
export function newPayAppBlocker(apps: readonly { number: number; status: PayAppStatus }[]): string | null {
  const open = [...apps].sort((a, b) => a.number - b.number).find((a) => !isFrozen(a.status));
  if (!open) return null;
  return `Pay application ${open.number} is still ${open.status.replaceAll('_', ' ')}; it must be certified before the next period is billed.`;
}
