/** Readable words for the trail's object types (the filter); the sentences come from src/shared/trail-words.ts. */
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

const words = (code: string) => code.replace(/_/g, ' ');

export function objectLabel(objectType: string): string {
  return OBJECT_WORDS[objectType] ?? words(objectType).replace(/^./, (c) => c.toUpperCase());
}

const timeFormat = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });
export const formatTime = (iso: string) => timeFormat.format(new Date(iso));
