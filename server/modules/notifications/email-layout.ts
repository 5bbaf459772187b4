/**
 * Shared pieces of our e-mails: HTML escaping, one plain layout with the product name, a link button, and the
 * matching plain-text layout. Templates build paragraphs and call these; every message goes out as HTML + text.
 */

export const PRODUCT_NAME = 'Tallyard';

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for HTML content and attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}

/** A link styled as a button (inline styles: mail clients ignore style sheets). */
export function linkButton(href: string, label: string): string {
  return (
    `<p style="margin:24px 0"><a href="${escapeHtml(href)}" style="display:inline-block;background:#1f5040;color:#ffffff;` +
    `text-decoration:none;font-weight:600;padding:10px 18px;border-radius:6px">${escapeHtml(label)}</a></p>`
  );
}

/** Paragraphs of plain text as escaped HTML paragraphs. */
export const paragraphsHtml = (paragraphs: readonly string[]) =>
  paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('\n');

export type EmailParts = {
  /** The heading inside the message (not the subject line). */
  heading: string;
  paragraphs: readonly string[];
  action?: { href: string; label: string };
  /** Small print under the button: why the person got this, how long a link lasts. */
  footnote?: string;
};

/** The HTML version: our name on top, the heading, the paragraphs, the button, the small print. */
export function layoutHtml({ heading, paragraphs, action, footnote }: EmailParts): string {
  return [
    '<!doctype html><html><body style="margin:0;background:#f7f6f3">',
    '<div style="max-width:560px;margin:0 auto;padding:24px;font-family:\'Work Sans\',Arial,sans-serif;color:#24221f;font-size:14px;line-height:1.5">',
    `<p style="margin:0 0 16px;font-weight:600;color:#1f5040">${PRODUCT_NAME}</p>`,
    '<div style="background:#ffffff;border:1px solid #dedad2;border-radius:8px;padding:20px">',
    `<h1 style="margin:0 0 12px;font-size:18px">${escapeHtml(heading)}</h1>`,
    paragraphsHtml(paragraphs),
    action ? linkButton(action.href, action.label) : '',
    action ? `<p style="margin:0;font-size:12px;color:#5f594f">Or open this address: ${escapeHtml(action.href)}</p>` : '',
    '</div>',
    footnote ? `<p style="margin:16px 0 0;font-size:12px;color:#5f594f">${escapeHtml(footnote)}</p>` : '',
    '</div></body></html>',
  ].join('\n');
}

/** The plain-text version of the same message. */
export function layoutText({ heading, paragraphs, action, footnote }: EmailParts): string {
  return [
    heading,
    '',
    ...paragraphs.flatMap((p) => [p, '']),
    ...(action ? [`${action.label}: ${action.href}`, ''] : []),
    ...(footnote ? [footnote, ''] : []),
    `-- ${PRODUCT_NAME}`,
  ].join('\n');
}
