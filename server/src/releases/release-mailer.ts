import nodemailer, { type Transporter } from 'nodemailer';
import type { Settings } from '../config.js';

export interface OutgoingRelease {
  to: { address: string; name: string }[];
  subject: string;
  text: string;
  csvName: string;
  csv: Buffer;
  fingerprintName: string;
  fingerprint: string;
}

export type SendRelease = (message: OutgoingRelease) => Promise<{ messageId: string }>;

/** SMTP per the mail settings (locally the mail sink on loopback); the CSV attached byte for byte (base64). */
export function createReleaseSender(mail: Settings['mail']): SendRelease {
  const transport: Transporter = nodemailer.createTransport({
    host: mail.host,
    port: mail.port,
    secure: mail.secure,
    ...(mail.user ? { auth: { user: mail.user, pass: mail.password } } : {}),
  });
  return async (message) => {
    const info = await transport.sendMail({
      from: mail.from,
      to: message.to.map((r) => (r.name ? { name: r.name, address: r.address } : r.address)),
      subject: message.subject,
      text: message.text,
      attachments: [
        { filename: message.csvName, content: message.csv, contentType: 'text/csv; charset=utf-8', contentTransferEncoding: 'base64' },
        { filename: message.fingerprintName, content: Buffer.from(message.fingerprint, 'utf8'), contentType: 'text/plain; charset=utf-8', contentTransferEncoding: 'base64' },
      ],
    });
    return { messageId: String(info.messageId) };
  };
}
