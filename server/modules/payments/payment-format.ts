import { toDecimal } from 'dinero.js';
import { usd } from '../../../src/shared/domain/money';

/** "$12,345.67" for e-mails and PDFs, from integer cents through dinero.js. */
export function formatCentsPlain(cents: number): string {
  return toDecimal(usd(cents), ({ value }) => {
    const [whole = '0', fraction = '00'] = value.replace('-', '').split('.');
    return `${value.startsWith('-') ? '-' : ''}$${whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}.${fraction}`;
  });
}
