import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { ReceivedMail } from './received-mail';

export interface SmtpStandInOptions {
  /** how many received messages are kept; older ones are dropped first */
  keep?: number;
  /** largest message accepted, in bytes */
  maxMessageBytes?: number;
}

/**
 * A local SMTP server that stands in for the mail service in development and tests: it listens on
 * 127.0.0.1 only, on a free port, accepts every message without authentication and keeps the most
 * recent ones in memory (bounded) so the outbox can list them.
 */
export class SmtpStandIn {
  private readonly received: ReceivedMail[] = [];
  private nextId = 1;
  private readonly keep: number;
  private readonly server: SMTPServer;

  constructor(options: SmtpStandInOptions = {}) {
    this.keep = options.keep ?? 200;
    this.server = new SMTPServer({
      secure: false,
      authOptional: true,
      disabledCommands: ['AUTH', 'STARTTLS'],
      size: options.maxMessageBytes ?? 10 * 1024 * 1024,
      banner: 'Tallyfit local mail stand-in',
      logger: false,
      onData: (stream, session, callback) => {
        simpleParser(stream)
          .then((parsed) => {
            this.store({
              id: this.nextId++,
              receivedAt: new Date().toISOString(),
              envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              envelopeTo: session.envelope.rcptTo.map((recipient) => recipient.address),
              from: parsed.from?.text ?? '',
              to: addresses(parsed.to),
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              ...(typeof parsed.html === 'string' ? { html: parsed.html } : {}),
              attachments: parsed.attachments.map((attachment) => ({
                fileName: attachment.filename ?? '',
                contentType: attachment.contentType,
                sizeBytes: attachment.size,
                content: attachment.contentType.startsWith('text/') ? attachment.content.toString('utf8') : '',
              })),
            });
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
  }

  /** Starts listening on a free loopback port and answers the smtp:// URL to send to. */
  async start(): Promise<string> {
    await new Promise<void>((resolve, reject) => {
      this.server.once('error', reject);
      this.server.listen(0, '127.0.0.1', () => {
        this.server.off('error', reject);
        resolve();
      });
    });
    const { port } = this.server.server.address() as AddressInfo;
    return `smtp://127.0.0.1:${port}`;
  }

  async stop(): Promise<void> {
    await new Promise<void>((resolve) => this.server.close(() => resolve()));
  }

  /** Received messages, newest first. */
  messages(): ReceivedMail[] {
    return [...this.received].reverse();
  }

  private store(mail: ReceivedMail): void {
    this.received.push(mail);
    if (this.received.length > this.keep) this.received.splice(0, this.received.length - this.keep);
  }
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const list = Array.isArray(field) ? field : [field];
  return list.flatMap((entry) => entry.value.map((address) => address.address ?? '')).filter(Boolean);
}
