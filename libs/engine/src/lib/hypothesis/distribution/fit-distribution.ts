/**
 * Expected shares from a distribution family, with parameters given or estimated from the data.
 *
 * Counted-value families (Poisson, binomial, geometric, discrete uniform, Benford): the labels are
 * the values. The lowest category also takes the probability below it and the highest the
 * probability above it, so the shares sum to 1. `cells: m` keeps the m − 1 smallest values as their
 * own categories and pools the rest into one upper-tail category labelled "v+", whose share is the
 * whole remaining tail. Parameters are estimated from the unpooled frequencies.
 * Binned normal: the labels name bins in ascending order, bounded by `breaks`.
 */
import type { Hypothesis } from '../../spec/analysis-spec';
import { EngineInputError } from '../../spec/engine-input-error';
import type { ResolvedHypothesis } from '../resolved-hypothesis';
import { fitBinnedNormal } from './binned-normal';
import { readCountedValues, type CountedValue } from './counted-values';
import type { DiscreteFamily } from './discrete-family';
import { benfordFamily, binomialFamily, discreteUniformFamily, geometricFamily, poissonFamily } from './discrete-families';
import { estimateBinomialP, estimateGeometricP, estimatePoissonLambda } from './estimate-parameters';

type DistributionHypothesis = Extract<Hypothesis, { kind: 'distribution' }>;

interface FamilyChoice {
  family: DiscreteFamily;
  fitted: Record<string, number>;
  estimatedNames: string[];
}

const ALLOWED_PARAMS: Record<DistributionHypothesis['family'], string[]> = {
  poisson: ['lambda'],
  binomial: ['trials', 'p'],
  geometric: ['p'],
  normal: ['mean', 'sd'],
  'discrete-uniform': ['min', 'max'],
  benford: [],
};

function checkParamNames(hypothesis: DistributionHypothesis): void {
  const allowed = ALLOWED_PARAMS[hypothesis.family];
  for (const name of Object.keys(hypothesis.params ?? {})) {
    if (!allowed.includes(name)) {
      throw EngineInputError.at(
        `hypothesis.params.${name}`,
        `the ${hypothesis.family} family takes ${allowed.length > 0 ? allowed.join(' and ') : 'no parameters'}, not ${name}`,
      );
    }
  }
}

function chooseFamily(hypothesis: DistributionHypothesis, values: readonly CountedValue[]): FamilyChoice {
  const params = hypothesis.params ?? {};
  switch (hypothesis.family) {
    case 'poisson': {
      const lambda = params.lambda ?? estimatePoissonLambda(values);
      return { family: poissonFamily(lambda), fitted: { lambda }, estimatedNames: params.lambda === undefined ? ['lambda'] : [] };
    }
    case 'binomial': {
      if (params.trials === undefined) {
        throw EngineInputError.at('hypothesis.params.trials', 'a binomial fit needs params.trials, the number of trials per observation');
      }
      const p = params.p ?? estimateBinomialP(values, params.trials);
      return {
        family: binomialFamily(params.trials, p),
        fitted: { trials: params.trials, p },
        estimatedNames: params.p === undefined ? ['p'] : [],
      };
    }
    case 'geometric': {
      const p = params.p ?? estimateGeometricP(values);
      return { family: geometricFamily(p), fitted: { p }, estimatedNames: params.p === undefined ? ['p'] : [] };
    }
    case 'discrete-uniform': {
      const min = params.min ?? values[0].value;
      const max = params.max ?? values[values.length - 1].value;
      if (max <= min) throw EngineInputError.at('hypothesis.params.max', `max (${max}) must be above min (${min})`);
      return { family: discreteUniformFamily(min, max), fitted: { min, max }, estimatedNames: [] };
    }
    default:
      return { family: benfordFamily(), fitted: {}, estimatedNames: [] };
  }
}

/** The values a family can produce, known before any parameter is estimated. */
function supportOf(hypothesis: DistributionHypothesis, values: readonly CountedValue[]): { min: number; max: number } {
  const params = hypothesis.params ?? {};
  switch (hypothesis.family) {
    case 'binomial':
      if (params.trials === undefined) {
        throw EngineInputError.at('hypothesis.params.trials', 'a binomial fit needs params.trials, the number of trials per observation');
      }
      return { min: 0, max: params.trials };
    case 'benford':
      return { min: 1, max: 9 };
    case 'discrete-uniform':
      return { min: params.min ?? values[0].value, max: params.max ?? values[values.length - 1].value };
    default:
      return { min: 0, max: Infinity };
  }
}

function checkSupport(values: readonly CountedValue[], hypothesis: DistributionHypothesis): void {
  const support = supportOf(hypothesis, values);
  for (const { value, index } of values) {
    if (value < support.min || value > support.max) {
      const range = support.max === Infinity ? `${support.min} or more` : `${support.min} to ${support.max}`;
      throw EngineInputError.at(
        `observed.labels.${index}`,
        `the value ${value} is outside what ${hypothesis.family} can produce (${range})`,
      );
    }
  }
}

function describeFit(choice: FamilyChoice): string {
  const { family, estimatedNames } = choice;
  if (estimatedNames.length === 0) return family.description;
  return `${family.description} (${estimatedNames.join(' and ')} estimated from the data)`;
}

function fitCountedValues(labels: readonly string[], counts: readonly number[], hypothesis: DistributionHypothesis): ResolvedHypothesis {
  if (hypothesis.breaks !== undefined) {
    throw EngineInputError.at('hypothesis.breaks', 'breaks apply only to the normal family');
  }
  const values = readCountedValues(labels, counts, hypothesis.family);
  checkSupport(values, hypothesis);
  const choice = chooseFamily(hypothesis, values);
  const { family } = choice;

  const cellCount = hypothesis.cells !== undefined && hypothesis.cells < values.length ? hypothesis.cells : values.length;
  const pooled = cellCount < values.length;
  const kept = values.slice(0, cellCount - 1);
  const tail = values.slice(cellCount - 1);
  const notes: string[] = [];

  const shares: number[] = [];
  kept.forEach(({ value }, position) => shares.push(position === 0 ? family.atMost(value) : family.probability(value)));
  const tailStart = tail[0].value;
  shares.push(family.atLeast(tailStart));
  if (values[0].value > family.supportMin) {
    notes.push(`The lowest category (${values[0].value}) also counts the probability of smaller values.`);
  }
  if (family.supportMax > values[values.length - 1].value || pooled) {
    notes.push(
      pooled
        ? `Values of ${tailStart} and above were pooled into one category "${tailStart}+" whose expected share is the whole upper tail.`
        : `The highest category (${tailStart}) also counts the probability of larger values.`,
    );
  }

  const result: ResolvedHypothesis = {
    shares,
    estimatedParameters: choice.estimatedNames.length,
    description: describeFit(choice),
    fitted: choice.fitted,
    estimatedNames: choice.estimatedNames,
    notes,
    warnings: [],
  };
  if (pooled || values.some((v, position) => v.index !== position)) {
    result.cells = {
      labels: [...kept.map((v) => labels[v.index]), pooled ? `${tailStart}+` : labels[tail[0].index]],
      counts: [...kept.map((v) => v.count), tail.reduce((sum, v) => sum + v.count, 0)],
    };
  }
  return result;
}

function fitNormal(labels: readonly string[], counts: readonly number[], hypothesis: DistributionHypothesis): ResolvedHypothesis {
  if (hypothesis.cells !== undefined) {
    throw EngineInputError.at('hypothesis.cells', 'cells applies to counted values; for the normal family set the bins with breaks');
  }
  const fit = fitBinnedNormal(counts, hypothesis.breaks, hypothesis.params ?? {});
  const estimated = fit.estimatedNames.length > 0 ? ` (${fit.estimatedNames.join(' and ')} estimated from the binned counts)` : '';
  return {
    shares: fit.shares,
    estimatedParameters: fit.estimatedNames.length,
    description: `a normal distribution with mean ${Number(fit.mean.toPrecision(5))} and standard deviation ${Number(fit.sd.toPrecision(5))}${estimated}`,
    fitted: { mean: fit.mean, sd: fit.sd },
    estimatedNames: fit.estimatedNames,
    notes: [`The bins, in the order given, were bounded at ${hypothesis.breaks?.join(', ')}; the first and last bins are open-ended.`],
    warnings: [],
  };
}

export function fitDistribution(
  labels: readonly string[],
  counts: readonly number[],
  hypothesis: DistributionHypothesis,
): ResolvedHypothesis {
  checkParamNames(hypothesis);
  return hypothesis.family === 'normal' ? fitNormal(labels, counts, hypothesis) : fitCountedValues(labels, counts, hypothesis);
}
