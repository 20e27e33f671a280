import nodemailer, { type Transporter } from 'nodemailer';
import type { ReceivedMail } from './received-mail';
import { SmtpStandIn } from './smtp-stand-in';

export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
  /** an HTML alternative to `text`, for mail programs that show it */
  html?: string;
  attachments?: Array<{ filename: string; content: string; contentType: string }>;
  replyTo?: string;
}

export interface MailService {
  /** Sends one message; rejects with the SMTP server's reason when it cannot be delivered to it. */
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
  /** What the local stand-in received, newest first; undefined when mail goes to a real server. */
  outbox(): ReceivedMail[] | undefined;
  /** Where mail goes, without credentials, for logs and the outbox. */
  readonly destination: string;
  stop(): Promise<void>;
}

export interface MailSettings {
  /** smtp:// or smtps:// URL of the mail server; absent: start the local stand-in */
  smtpUrl?: string;
  from: string;
  /** how long to wait for the server to answer, in milliseconds */
  timeoutMs?: number;
}

/**
 * Starts mail delivery: through the configured SMTP server, or, for the embedded default,
 * development and tests, through a local stand-in started here and stopped by `stop()`.
 */
export async function startMailService(settings: MailSettings): Promise<MailService> {
  const standIn = settings.smtpUrl ? undefined : new SmtpStandIn();
  const url = settings.smtpUrl ?? (await standIn!.start());
  const timeout = settings.timeoutMs ?? 15_000;
  const transport: Transporter = nodemailer.createTransport({
    url,
    connectionTimeout: timeout,
    greetingTimeout: timeout,
    socketTimeout: timeout,
    // The stand-in speaks plain SMTP on loopback; a real server negotiates TLS as its URL says.
    ...(standIn ? { ignoreTLS: true } : {}),
  });
  return {
    destination: standIn ? `the local stand-in at ${withoutCredentials(url)}` : withoutCredentials(url),
    async send(mail) {
      const info = await transport.sendMail({ ...mail, from: settings.from });
      return { messageId: String(info.messageId ?? '') };
    },
    outbox: () => standIn?.messages(),
    async stop() {
      transport.close();
      await standIn?.stop();
    },
  };
}

function withoutCredentials(url: string): string {
  try {
    const parsed = new URL(url);
    parsed.username = '';
    parsed.password = '';
    return parsed.toString();
  } catch {
    return 'the configured SMTP server';
  }
}
