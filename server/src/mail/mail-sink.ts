import { simpleParser, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Logger } from 'pino';

export interface SinkedMessage {
  envelopeFrom: string;
  envelopeTo: string[];
  raw: Buffer;
  parsed: ParsedMail;
}

export type StoreMessage = (message: SinkedMessage) => Promise<void>;

/**
 * The local stand-in for an SMTP relay: accepts every message on loopback, parses it and hands it
 * to `store`. No authentication and no TLS: it listens on 127.0.0.1 only.
 */
export function createMailSink(store: StoreMessage, logger: Logger): SMTPServer {
  return new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Clinometer mail sink',
    size: 50 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
        simpleParser(raw)
          .then((parsed) => store({ envelopeFrom, envelopeTo, raw, parsed }))
          .then(() => callback())
          .catch((err: unknown) => {
            logger.error({ err }, 'mail sink could not store a message');
            callback(new Error('message not stored'));
          });
      });
    },
  });
}

export function listen(server: SMTPServer, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
}
