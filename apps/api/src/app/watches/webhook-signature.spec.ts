import { verifyWebhookSignature, webhookSignature } from './webhook-signature';

describe('webhook signature', () => {
  it('is the HMAC-SHA256 of RFC 4231 test case 2', () => {
    // RFC 4231, "Identifiers and Test Vectors for HMAC-SHA-224, -256, -384, and -512", 2005, section 4.3.
    expect(webhookSignature('Jefe', 'what do ya want for nothing?')).toBe(
      'sha256=5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843',
    );
  });

  it('verifies the same bytes only', () => {
    const body = JSON.stringify({ event: 'watch.alarm', alertId: 1 });
    const header = webhookSignature('a long enough secret', body);
    expect(verifyWebhookSignature('a long enough secret', body, header)).toBe(true);
    expect(verifyWebhookSignature('a long enough secret', body + ' ', header)).toBe(false);
    expect(verifyWebhookSignature('another secret here', body, header)).toBe(false);
    expect(verifyWebhookSignature('a long enough secret', body, undefined)).toBe(false);
  });
});
