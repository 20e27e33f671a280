import { createHmac, timingSafeEqual } from 'node:crypto';
import { WEBHOOK_SIGNATURE_PREFIX } from '@tallyfit/contracts';

/**
 * The webhook signature header's value: `sha256=` and the hex HMAC-SHA256 (RFC 2104 with SHA-256)
 * of the raw body under the watch's secret. A receiver recomputes it over the bytes it received.
 */
export function webhookSignature(secret: string, rawBody: string | Buffer): string {
  return WEBHOOK_SIGNATURE_PREFIX + createHmac('sha256', secret).update(rawBody).digest('hex');
}

/** A receiver's check, in constant time (used by the tests' receiver; shown in the README). */
export function verifyWebhookSignature(secret: string, rawBody: string | Buffer, header: string | undefined): boolean {
  if (!header) return false;
  const expected = Buffer.from(webhookSignature(secret, rawBody));
  const given = Buffer.from(header);
  return expected.length === given.length && timingSafeEqual(expected, given);
}
