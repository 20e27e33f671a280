/**
 * A normal distribution over bins given by their inner boundaries (`breaks`: k − 1 increasing
 * numbers; the first bin is (−∞, b₁], the last (b_{k−1}, ∞)). Missing parameters are estimated
 * by maximum likelihood from the binned counts, Σ nᵢ ln P(bin i), which is the estimate the
 * chi-square reference with k − 1 − m degrees of freedom assumes (Cramér 1946, Mathematical
 * Methods of Statistics, section 30.3). The maximum is found with Nelder–Mead over (μ, ln σ),
 * started from the midpoint estimates.
 */
import { normalIntervalProbability } from '../../distributions/normal';
import { nelderMead } from '../../optimize/nelder-mead';
import { EngineInputError } from '../../spec/engine-input-error';

export interface BinnedNormalFit {
  mean: number;
  sd: number;
  shares: number[];
  estimatedNames: string[];
}

export function binShares(breaks: readonly number[], mean: number, sd: number): number[] {
  const bounds = [-Infinity, ...breaks.map((b) => (b - mean) / sd), Infinity];
  const shares: number[] = [];
  for (let i = 0; i + 1 < bounds.length; i++) shares.push(normalIntervalProbability(bounds[i], bounds[i + 1]));
  return shares;
}

function checkBreaks(breaks: readonly number[] | undefined, k: number): number[] {
  if (!breaks) {
    throw EngineInputError.at('hypothesis.breaks', `a binned normal fit needs breaks: the ${k - 1} boundaries between the ${k} bins`);
  }
  if (breaks.length !== k - 1) {
    throw EngineInputError.at('hypothesis.breaks', `needs ${k - 1} boundaries for ${k} bins, got ${breaks.length}`);
  }
  for (let i = 1; i < breaks.length; i++) {
    if (!(breaks[i] > breaks[i - 1])) throw EngineInputError.at(`hypothesis.breaks.${i}`, 'breaks must be strictly increasing');
  }
  return [...breaks];
}

/** Midpoint estimates, with the open end bins represented one typical width beyond their boundary. */
function midpointStart(breaks: readonly number[], counts: readonly number[]): { mean: number; sd: number } {
  const widths = breaks.slice(1).map((b, i) => b - breaks[i]);
  const width = widths.length > 0 ? widths.reduce((a, b) => a + b, 0) / widths.length : 1;
  const midpoints = [breaks[0] - width / 2, ...widths.map((w, i) => breaks[i] + w / 2), breaks[breaks.length - 1] + width / 2];
  const n = counts.reduce((a, b) => a + b, 0);
  const mean = counts.reduce((sum, c, i) => sum + c * midpoints[i], 0) / n;
  const variance = counts.reduce((sum, c, i) => sum + c * (midpoints[i] - mean) ** 2, 0) / n;
  return { mean, sd: Math.max(Math.sqrt(variance), width / 4) };
}

export function fitBinnedNormal(
  counts: readonly number[],
  breaksInput: readonly number[] | undefined,
  given: { mean?: number; sd?: number },
): BinnedNormalFit {
  const breaks = checkBreaks(breaksInput, counts.length);
  const start = midpointStart(breaks, counts);
  const estimatedNames = [given.mean === undefined ? 'mean' : '', given.sd === undefined ? 'sd' : ''].filter(Boolean);
  const negativeLogLikelihood = (mean: number, sd: number) => {
    const shares = binShares(breaks, mean, sd);
    let total = 0;
    for (let i = 0; i < counts.length; i++) {
      if (counts[i] > 0) total -= counts[i] * Math.log(Math.max(shares[i], 1e-300));
    }
    return total;
  };
  let mean = given.mean ?? start.mean;
  let sd = given.sd ?? start.sd;
  if (estimatedNames.length > 0) {
    const free = (point: number[]) => ({
      mean: given.mean ?? point[0],
      sd: given.sd ?? Math.exp(given.mean === undefined ? point[1] : point[0]),
    });
    const startPoint = [...(given.mean === undefined ? [start.mean] : []), ...(given.sd === undefined ? [Math.log(start.sd)] : [])];
    const steps = [...(given.mean === undefined ? [start.sd / 2] : []), ...(given.sd === undefined ? [0.2] : [])];
    const found = nelderMead((point) => {
      const candidate = free(point);
      return negativeLogLikelihood(candidate.mean, candidate.sd);
    }, startPoint, steps);
    ({ mean, sd } = free(found.point));
  }
  return { mean, sd, shares: binShares(breaks, mean, sd), estimatedNames };
}
