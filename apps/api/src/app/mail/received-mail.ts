/** A message the local SMTP stand-in received, as the outbox lists it. */
export interface ReceivedMail {
  id: number;
  receivedAt: string;
  /** the envelope sender and recipients (what the SMTP conversation said) */
  envelopeFrom: string;
  envelopeTo: string[];
  /** the headers' view */
  from: string;
  to: string[];
  subject: string;
  text: string;
  /** the HTML alternative, when the message had one */
  html?: string;
  attachments: Array<{ fileName: string; contentType: string; sizeBytes: number; content: string }>;
}
