import { MAX_SHARE_RECIPIENTS } from '@tallyfit/contracts';

/** E-mail addresses typed into one field, separated by commas, semicolons, spaces or new lines. */
export type AddressesOutcome = { ok: true; addresses: string[] } | { ok: false; message: string };

/** A plain address check: something@something.something, no spaces (common practice, no source). */
const ADDRESS = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;
export const MAX_RECIPIENTS = MAX_SHARE_RECIPIENTS;

export function readAddresses(text: string): AddressesOutcome {
  const parts = text
    .split(/[\s,;]+/)
    .map((part) => part.trim())
    .filter((part) => part.length > 0);
  if (parts.length === 0) return { ok: false, message: 'Give at least one e-mail address.' };
  const wrong = parts.filter((part) => !ADDRESS.test(part));
  if (wrong.length > 0) {
    return { ok: false, message: `${wrong.map((part) => `“${part}”`).join(', ')} ${wrong.length === 1 ? 'is not an e-mail address' : 'are not e-mail addresses'}.` };
  }
  const addresses = [...new Set(parts.map((part) => part.toLowerCase()))];
  if (addresses.length > MAX_RECIPIENTS) return { ok: false, message: `Share with at most ${MAX_RECIPIENTS} addresses at a time.` };
  return { ok: true, addresses };
}
