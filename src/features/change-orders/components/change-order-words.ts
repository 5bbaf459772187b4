import type { ChangeOrderItemKind, ChangeOrderStatus } from '@/shared/constants';

export const STATUS_BADGES: Record<ChangeOrderStatus, { label: string; tone: 'clay' | 'spruce' | 'brick' }> = {
  proposed: { label: 'Awaiting decision', tone: 'clay' },
  approved: { label: 'Approved', tone: 'spruce' },
  rejected: { label: 'Rejected', tone: 'brick' },
};

export const KIND_LABELS: Record<ChangeOrderItemKind, string> = {
  add_item: 'Add a bid item',
  change_quantity: 'Change a contract quantity',
  change_price: 'Change a unit price',
};

const HISTORY_WORDS: Record<string, string> = {
  'change_order.proposed': 'Proposed',
  'change_order.drafted_from_watch': 'Drafted from the quantity watch',
  'change_order.gc_approved': 'Approved by the general contractor',
  'change_order.owner_approved': 'Approved by the owner',
  'change_order.approved': 'Approved and applied to the bid schedule',
  'change_order.rejected': 'Rejected',
  'change_order.documents_attached': 'Documents attached',
};

export const historyLabel = (action: string) => HISTORY_WORDS[action] ?? action;
