import { NotFoundError } from '../shared/errors.js';
import type { ContentStore } from '../store/content-store.js';
import { MailMessage, type StoredAttachment } from './mail-message.model.js';

export interface MailSummary {
  id: string;
  subject: string;
  from: string;
  to: string;
  envelopeTo: string[];
  attachmentCount: number;
  receivedAt: string;
}

export interface MailDetail extends MailSummary {
  messageId: string | null;
  envelopeFrom: string;
  text: string;
  attachments: StoredAttachment[];
  rawSize: number;
}

function summary(m: MailMessage): MailSummary {
  return {
    id: String(m.id),
    subject: m.subject,
    from: m.fromHeader,
    to: m.toHeader,
    envelopeTo: m.envelopeTo,
    attachmentCount: m.attachments.length,
    receivedAt: m.receivedAt.toISOString(),
  };
}

export async function listMail(page: number, pageSize: number): Promise<{ items: MailSummary[]; page: number; pageSize: number; total: number }> {
  const { rows, count } = await MailMessage.findAndCountAll({
    attributes: { exclude: ['textBody'] },
    order: [['id', 'DESC']],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  return { items: rows.map(summary), page, pageSize, total: count };
}

async function messageById(id: number): Promise<MailMessage> {
  const message = await MailMessage.findByPk(id);
  if (!message) throw new NotFoundError(`No mail message ${id}`);
  return message;
}

export async function getMail(id: number): Promise<MailDetail> {
  const m = await messageById(id);
  return { ...summary(m), messageId: m.messageId, envelopeFrom: m.envelopeFrom, text: m.textBody, attachments: m.attachments, rawSize: m.rawSize };
}

export async function mailAttachment(store: ContentStore, id: number, index: number): Promise<{ attachment: StoredAttachment; bytes: Buffer }> {
  const m = await messageById(id);
  const attachment = m.attachments.find((a) => a.index === index);
  if (!attachment) throw new NotFoundError(`Mail message ${id} has no attachment ${index}`);
  return { attachment, bytes: await store.read(attachment.sha256) };
}
