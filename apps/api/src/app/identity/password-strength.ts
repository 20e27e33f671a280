import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as english from '@zxcvbn-ts/language-en';
import { unprocessable } from '../http/http-error';

/**
 * zxcvbn's scale (Wheeler, "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016):
 * 3 means "safely unguessable: moderate protection from offline slow-hash attacks" (about 10^8
 * guesses or more), the level asked of every new password here.
 */
const LEAST_SCORE = 3;

let estimator: ZxcvbnFactory | undefined;
/** The dictionaries are large: loaded on the first password set, not at start. */
const zxcvbn = () =>
  (estimator ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...english.dictionary },
    graphs: common.adjacencyGraphs,
    translations: english.translations,
  }));

/**
 * Refuses a new password that is easy to guess (common words, repeats, keyboard runs, dates, or
 * the person's own name or e-mail), with zxcvbn's own warning and suggestions as the reason.
 * `field` names the request field, for the answer's `fields`.
 */
export async function requireStrongPassword(password: string, field: string, personalWords: string[] = []): Promise<void> {
  // The whole e-mail or name, and each part of it, count as words an attacker would try first.
  const words = personalWords
    .map((word) => word.toLowerCase())
    .flatMap((word) => [word, ...word.split(/[^\p{L}\p{N}]+/u)])
    .filter((word) => word.length >= 3);
  const result = await zxcvbn().checkAsync(password, words);
  if (result.score >= LEAST_SCORE) return;
  const reasons = [result.feedback.warning, ...result.feedback.suggestions].filter(Boolean).join(' ');
  const message = `too easy to guess. ${reasons || 'Use a longer passphrase of unrelated words.'}`;
  throw unprocessable(`the password is ${message}`, [{ path: field, message }]);
}
