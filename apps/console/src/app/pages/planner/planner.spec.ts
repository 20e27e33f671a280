import { power, sampleSize } from '@tallyfit/engine';
import { effectFromShares, readShares } from './effect-from-shares';
import { powerCurve } from './power-curve';

describe('effectFromShares', () => {
  it('computes Cohen’s w from expected shares and shares to detect', () => {
    // w = √((0.6−0.5)²/0.5 + (0.4−0.5)²/0.5) = √0.04 = 0.2 (arithmetic, Cohen 1988 eq. 7.2.1).
    const outcome = effectFromShares('0.5, 0.5', '0.6 0.4');
    expect(outcome.ok).toBe(true);
    if (outcome.ok) {
      expect(outcome.w).toBeCloseTo(0.2, 12);
      expect(outcome.df).toBe(1);
    }
  });

  it('reads ratios and percentages by rescaling both sets to 1', () => {
    const fromRatio = effectFromShares('1:1', '60:40');
    expect(fromRatio.ok && fromRatio.w).toBeCloseTo(0.2, 12);
  });

  it('says what is wrong with the shares', () => {
    expect(effectFromShares('0.5, 0.5', '0.3, 0.3, 0.4')).toEqual({
      ok: false,
      message: 'The expected shares have 2 categories but the shares to detect have 3.',
    });
    expect(effectFromShares('0.5, 0', '0.5, 0.5')).toEqual({ ok: false, message: 'Every expected share must be above 0.' });
    expect(effectFromShares('1:1', '2:2')).toEqual({ ok: false, message: 'The two sets of shares are the same: there is no difference to detect.' });
    expect(readShares('a, 1')).toBeNull();
  });

  it('refuses shares that do not sum to 1 with the analysis flow’s rule, and says so', () => {
    expect(effectFromShares('0.5, 0.6', '0.5, 0.5')).toEqual({
      ok: false,
      message: 'The expected shares sum to 1.1; shares must sum to 1 (within 0.01). Write a ratio with colons, e.g. 50:30:20, to have it scaled.',
    });
    expect(effectFromShares('0.5, 0.5', '0.6, 0.5').ok).toBe(false);
    // 0.333 × 3 = 0.999: a rounded published figure, accepted (common practice, no source).
    expect(effectFromShares('0.333, 0.333, 0.333', '0.4, 0.3, 0.3').ok).toBe(true);
  });
});

describe('powerCurve', () => {
  it('rises with n and ends at the requested size', () => {
    const curve = powerCurve(0.3, 3, 0.05, 200);
    expect(curve[0].n).toBe(2);
    expect(curve[curve.length - 1].n).toBe(200);
    for (let i = 1; i < curve.length; i++) expect(curve[i].power).toBeGreaterThanOrEqual(curve[i - 1].power);
  });

  it('agrees with the sample size the engine finds for a target power', () => {
    // Cohen (1988), Table 7.4.6 (from memory): w = 0.3, df = 3, alpha = .05, power .80 needs n ≈ 121.
    const { n } = sampleSize({ w: 0.3, df: 3, power: 0.8, alpha: 0.05 });
    expect(n).toBeGreaterThanOrEqual(119);
    expect(n).toBeLessThanOrEqual(123);
    expect(power({ w: 0.3, df: 3, n, alpha: 0.05 }).power).toBeGreaterThanOrEqual(0.8);
  });
});
