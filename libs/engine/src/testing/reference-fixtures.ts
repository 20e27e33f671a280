/**
 * Reference values computed outside the engine by tools/fixtures/engine-reference.py (mpmath and
 * SciPy; the versions and the date are in each file's `meta`). The tests read them; `npm test`
 * never regenerates them. Test helper only.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

export interface FixtureMeta {
  description: string;
  generatedBy: string;
  generatedOn: string;
  python: string;
  scipy: string;
  mpmath: string;
}

export interface TailRow {
  x: number;
  df: number;
  upper: number;
  logUpper: number;
  lower: number;
  logLower: number;
}

export interface ChiSquareFixture {
  tails: TailRow[];
  quantiles: { df: number; alpha: number; criticalValue: number; lowerQuantile?: number }[];
}

export interface NoncentralFixture {
  cases: { x: number; df: number; lambda: number; upper: number; lower: number }[];
}

export interface PowerFixture {
  power: { w: number; df: number; n: number; alpha: number; criticalValue: number; ncp: number; power: number }[];
  sampleSize: { w: number; df: number; power: number; alpha: number; ncp: number; nContinuous: number; n: number; powerAtN: number }[];
}

export interface CohensWIntervalFixture {
  cases: { statistic: number; df: number; n: number; level: number; lambdaLow: number; lambdaHigh: number; wLow: number; wHigh: number }[];
}

export interface SpecialFunctionsFixture {
  logGamma: { x: number; logGamma: number }[];
  stirlingError: { x: number; stirlingError: number }[];
  incompleteGamma: { a: number; x: number; lower: number; upper: number; logLower: number; logUpper: number }[];
  poisson: { k: number; lambda: number; logDensity: number; deviance: number }[];
}

export interface StatisticsFixture {
  cases: {
    name: string;
    counts: number[];
    expected: number[];
    pearson: number;
    g: number;
    cressieRead: { lambda: number; statistic: number }[];
  }[];
}

export interface BinomialTestFixture {
  cases: { x: number; n: number; share: number; p: number; logP: number }[];
}

export type Ordering = 'probability' | 'llr' | 'pearson';

export interface ExactMultinomialFixture {
  cases: ({ counts: number[]; weights: number[] } & Record<Ordering, { p: number; logP: number }>)[];
}

export interface IntervalsFixture {
  coverage: { counts: number[]; c: number; edgeworth: number; exact?: number }[];
  edgeworthError: number;
  sisonGlaz: { counts: number[]; level: number; c: number; gamma: number; intervals: { low: number; high: number }[] }[];
  wilson: { x: number; n: number; level: number; low: number; high: number }[];
}

export interface BinnedNormalFixture {
  cases: { counts: number[]; breaks: number[]; mean: number; sd: number; logLikelihood: number; shares: number[] }[];
}

export interface AnalysesFixture {
  cases: {
    name: string;
    counts: number[];
    shares: number[];
    df: number;
    pearson: { statistic: number; p: number };
    g: { statistic: number; p: number };
    w: number;
    wInterval: { level: number; low: number; high: number };
    categories: { expected: number; residual: number; adjustedResidual: number; p: number; pHolm: number }[];
  }[];
}

interface Fixtures {
  'chi-square': ChiSquareFixture;
  'noncentral-chi-square': NoncentralFixture;
  power: PowerFixture;
  'cohens-w-interval': CohensWIntervalFixture;
  'special-functions': SpecialFunctionsFixture;
  statistics: StatisticsFixture;
  'binomial-test': BinomialTestFixture;
  'exact-multinomial': ExactMultinomialFixture;
  intervals: IntervalsFixture;
  'binned-normal': BinnedNormalFixture;
  analyses: AnalysesFixture;
}

/** The fixture file `fixtures/<name>.json`; throws when it does not say what produced it. */
export function readFixture<Name extends keyof Fixtures>(name: Name): Fixtures[Name] & { meta: FixtureMeta } {
  const fixture = JSON.parse(readFileSync(join(__dirname, 'fixtures', `${name}.json`), 'utf8'));
  const { meta } = fixture as { meta?: Partial<FixtureMeta> };
  if (!meta?.generatedBy || !meta.scipy || !meta.mpmath || !meta.python || !meta.generatedOn) {
    throw new Error(`fixtures/${name}.json does not record the script, versions and date that produced it`);
  }
  return fixture;
}

/** The one row of `rows` matching `key`, so that a fixture regenerated without it fails loudly. */
export function rowWhere<Row>(rows: readonly Row[], key: Partial<Row>): Row {
  const matches = rows.filter((row) => Object.entries(key).every(([field, value]) => JSON.stringify(row[field as keyof Row]) === JSON.stringify(value)));
  if (matches.length !== 1) throw new Error(`expected one fixture row with ${JSON.stringify(key)}, found ${matches.length}`);
  return matches[0];
}
