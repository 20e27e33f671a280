/**
 * Cohen's w from two sets of shares: the shares expected under the hypothesis (p0) and the shares
 * one wants to be able to detect (p1), w = √(Σ (p1ᵢ − p0ᵢ)² / p0ᵢ)
 * (Cohen 1988, Statistical Power Analysis for the Behavioral Sciences, 2nd ed., eq. 7.2.1).
 */
import { SHARE_SUM_ROUNDING_TOLERANCE } from '@tallyfit/engine';

export type SharesOutcome = { ok: true; w: number; df: number } | { ok: false; message: string };

/** Reads shares written as numbers separated by commas, spaces, semicolons or colons (a ratio works too). */
export function readShares(text: string): number[] | null {
  const parts = text
    .split(/[\s,;:]+/)
    .map((part) => part.trim())
    .filter((part) => part.length > 0);
  if (parts.length === 0) return null;
  const values = parts.map(Number);
  return values.every((value) => Number.isFinite(value) && value >= 0) ? values : null;
}

/**
 * Shares written with colons are a ratio (2:1:1) and are scaled to 1. Otherwise they are shares and
 * follow the analysis flow's rule, the engine's: they must sum to 1 within its rounding tolerance.
 */
function sharesProblem(text: string, values: number[], what: string): string | null {
  if (text.includes(':')) return null;
  const total = values.reduce((sum, value) => sum + value, 0);
  if (Math.abs(total - 1) <= SHARE_SUM_ROUNDING_TOLERANCE) return null;
  return `The ${what} sum to ${Number(total.toPrecision(6))}; shares must sum to 1 (within ${SHARE_SUM_ROUNDING_TOLERANCE}). Write a ratio with colons, e.g. 50:30:20, to have it scaled.`;
}

const normalise = (values: number[]): number[] => {
  const total = values.reduce((sum, value) => sum + value, 0);
  return values.map((value) => value / total);
};

export function effectFromShares(expectedText: string, alternativeText: string): SharesOutcome {
  const expected = readShares(expectedText);
  const alternative = readShares(alternativeText);
  if (!expected) return { ok: false, message: 'Write the expected shares as numbers of 0 or more, e.g. 0.5, 0.3, 0.2 or 2:1:1.' };
  if (!alternative) return { ok: false, message: 'Write the shares to detect as numbers of 0 or more, e.g. 0.45, 0.35, 0.2.' };
  if (expected.length < 2) return { ok: false, message: 'At least two categories are needed.' };
  if (expected.length !== alternative.length) {
    return { ok: false, message: `The expected shares have ${expected.length} categories but the shares to detect have ${alternative.length}.` };
  }
  if (expected.some((value) => value === 0)) return { ok: false, message: 'Every expected share must be above 0.' };
  if (alternative.every((value) => value === 0)) return { ok: false, message: 'The shares to detect must not all be 0.' };
  const problem = sharesProblem(expectedText, expected, 'expected shares') ?? sharesProblem(alternativeText, alternative, 'shares to detect');
  if (problem) return { ok: false, message: problem };
  // Shares within the rounding tolerance and ratios are scaled to sum to exactly 1.
  const p0 = normalise(expected);
  const p1 = normalise(alternative);
  const w = Math.sqrt(p0.reduce((sum, share, index) => sum + (p1[index] - share) ** 2 / share, 0));
  if (!(w > 0)) return { ok: false, message: 'The two sets of shares are the same: there is no difference to detect.' };
  return { ok: true, w, df: p0.length - 1 };
}
