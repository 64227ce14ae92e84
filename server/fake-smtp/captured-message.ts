import type { AddressObject, ParsedMail } from 'mailparser';
import type { MailboxMessage } from '@shared/api/mailbox.ts';

/** The addresses of a header that may appear once or several times. */
function addressesOf(header: AddressObject | AddressObject[] | undefined): string[] {
  const objects = header === undefined ? [] : Array.isArray(header) ? header : [header];
  return objects.flatMap((o) => o.value.map((a) => a.address ?? '')).filter((a) => a !== '');
}

/** `Name <address>`, or the bare address when the sender gave no name. */
function senderOf(header: AddressObject | undefined): string {
  const first = header?.value[0];
  if (!first) return '';
  const address = first.address ?? '';
  return first.name ? `${first.name} <${address}>` : address;
}

/**
 * The shape the mailbox shows, from a parsed message. Recipients come from the `To` header,
 * falling back to the SMTP envelope when the header is missing (a message sent only as Bcc).
 */
export function toCapturedMessage(
  id: number,
  mail: ParsedMail,
  envelopeTo: readonly string[],
  receivedAt: Date,
): MailboxMessage {
  const to = addressesOf(mail.to);
  return {
    id,
    from: senderOf(mail.from),
    to: to.length > 0 ? to : [...envelopeTo],
    subject: mail.subject ?? '',
    text: mail.text ?? '',
    html: typeof mail.html === 'string' ? mail.html : null,
    date: receivedAt.toISOString(),
  };
}
