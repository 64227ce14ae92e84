/** A ready message: the subject line and both bodies. */
export interface EmailContent {
  subject: string;
  text: string;
  html: string;
}

/** What a message says, before it is rendered as plain text and HTML. Every value is plain text. */
export interface EmailDraft {
  subject: string;
  paragraphs: readonly string[];
  /** Bulleted lines after the paragraphs (drift findings). */
  list?: readonly string[];
  /** The one link the message leads to. */
  action: { label: string; url: string };
  /** A paragraph set apart after the link (the safety caution). */
  caution?: string;
}

const htmlEscapes: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Escapes text for HTML element content and quoted attribute values. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => htmlEscapes[c]!);
}

/** A subject is one header line: collapse line breaks and runs of spaces. */
function oneLine(value: string): string {
  return value.replace(/\s+/g, ' ').trim();
}

const footer = "Sent by Stablehand, your team's review service for numerical kernels.";

/** Renders a draft as plain text and as simple HTML with every interpolated value escaped. */
export function composeEmail(draft: EmailDraft): EmailContent {
  const { action, caution, list = [] } = draft;
  const text = [
    ...draft.paragraphs,
    ...(list.length > 0 ? [list.map((item) => `- ${item}`).join('\n')] : []),
    `${action.label}: ${action.url}`,
    ...(caution ? [caution] : []),
    `-- \n${footer}`,
  ].join('\n\n');

  const p = (content: string, style = '') =>
    `<p${style ? ` style="${style}"` : ''}>${escapeHtml(content)}</p>`;
  const html = [
    '<!doctype html>',
    '<html><body style="font-family: sans-serif; font-size: 15px; line-height: 1.5; color: #1f2933;">',
    ...draft.paragraphs.map((para) => p(para)),
    ...(list.length > 0
      ? [`<ul>${list.map((item) => `<li>${escapeHtml(item)}</li>`).join('')}</ul>`]
      : []),
    `<p><a href="${escapeHtml(action.url)}">${escapeHtml(action.label)}</a></p>`,
    ...(caution ? [p(caution, 'padding: 8px 12px; border-left: 3px solid #b7791f;')] : []),
    p(footer, 'color: #6b7280; font-size: 12px;'),
    '</body></html>',
  ].join('\n');

  return { subject: oneLine(draft.subject), text, html };
}
