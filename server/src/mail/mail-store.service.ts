import type { AddressObject } from 'mailparser';
import type { ContentStore } from '../store/content-store.js';
import { MailMessage, type StoredAttachment } from './mail-message.model.js';
import type { SinkedMessage } from './mail-sink.js';

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (value === undefined) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

/**
 * The mail sink's store: the raw message and each attachment go to the content store (attachments
 * byte for byte as decoded), the envelope, headers and text to `mail_messages` for the Mailroom.
 */
export async function storeSinkedMessage(store: ContentStore, message: SinkedMessage): Promise<void> {
  const raw = await store.put(message.raw);
  const attachments: StoredAttachment[] = [];
  for (const [index, attachment] of message.parsed.attachments.entries()) {
    const stored = await store.put(attachment.content);
    attachments.push({
      index,
      fileName: attachment.filename ?? `attachment-${index + 1}`,
      contentType: attachment.contentType,
      size: stored.size,
      sha256: stored.sha256,
    });
  }
  const parsed = message.parsed;
  await MailMessage.create({
    messageId: parsed.messageId ?? null,
    envelopeFrom: message.envelopeFrom.slice(0, 254),
    envelopeTo: message.envelopeTo,
    fromHeader: addressText(parsed.from).slice(0, 500),
    toHeader: addressText(parsed.to),
    subject: (parsed.subject ?? '').slice(0, 500),
    textBody: parsed.text ?? '',
    attachments,
    rawSha256: raw.sha256,
    rawSize: raw.size,
    receivedAt: new Date(),
  });
}
