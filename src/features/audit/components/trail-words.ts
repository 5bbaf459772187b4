/** Readable words for the trail's object types and actions ("change_order.gc_approved"). */
const OBJECT_WORDS: Record<string, string> = {
  project: 'Project',
  bid_item: 'Bid item',
  change_order: 'Change order',
  forecast: 'Forecast',
  invitation: 'Invitation',
  tally: 'Tally',
  pay_app: 'Pay application',
  pay_app_line: 'Pay application line',
  dispute: 'Dispute',
  payment: 'Payment',
  lien_waiver: 'Lien waiver',
  email: 'E-mail',
};

const ACTION_WORDS: Record<string, string> = {
  gc_approved: 'approved by the general contractor',
  owner_approved: 'approved by the owner',
  drafted_from_watch: 'drafted from the quantity watch',
};

const words = (code: string) => code.replace(/_/g, ' ');

export function objectLabel(objectType: string): string {
  return OBJECT_WORDS[objectType] ?? words(objectType).replace(/^./, (c) => c.toUpperCase());
}

/** "change_order.gc_approved" -> "approved by the general contractor"; the object is shown beside it. */
export function actionLabel(action: string): string {
  const verb = action.includes('.') ? action.slice(action.indexOf('.') + 1) : action;
  return ACTION_WORDS[verb] ?? words(verb);
}

const timeFormat = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });
export const formatTime = (iso: string) => timeFormat.format(new Date(iso));
