/**
 * @tallyfit/engine — goodness-of-fit tests for category counts.
 *
 * One entry point, `analyze(spec)`, takes a plain JSON spec and returns a plain JSON result; the
 * distribution functions, planning functions and category merging are exported for direct use.
 * `analyzeSequential` (and its incremental form `startSequential` / `addSequentialBatch`) tests a
 * stream of batches with an anytime-valid sequential test.
 */
export { analyze, DEFAULT_ALPHA, DEFAULT_INTERVAL_LEVEL, type AnalyzeOptions } from './lib/analyze';
export { ENGINE_VERSION } from './lib/engine-version';
export {
  analysisSpecSchema,
  analysisSpecBaseSchema,
  hypothesisSchema,
  observedSchema,
  exactOptionsSchema,
  distributionFamilies,
  testNames,
  exactOrderings,
  exactMethods,
  adjustMethods,
  intervalMethods,
  type AnalysisSpec,
  type ExactMethod,
  type ExactOrdering,
  type Hypothesis,
  type DistributionFamily,
  type DistributionParams,
  type TestName,
  type AdjustMethod,
  type IntervalMethod,
} from './lib/spec/analysis-spec';
export { parseAnalysisSpec } from './lib/spec/parse-analysis-spec';
export { EngineInputError, type InputIssue } from './lib/spec/engine-input-error';
export type * from './lib/result/analysis-result';
export {
  chiSquareSurvival,
  chiSquareLogSurvival,
  chiSquareCdf,
  chiSquareLogCdf,
  chiSquareTails,
  chiSquareQuantile,
  chiSquareCriticalValue,
  type ChiSquareTails,
} from './lib/distributions/chi-square';
export {
  noncentralChiSquareSurvival,
  noncentralChiSquareCdf,
  noncentralChiSquareTails,
} from './lib/distributions/noncentral-chi-square';
export { power, sampleSize, type PowerInput, type PowerResult, type SampleSizeInput, type SampleSizeResult } from './lib/planning/power';
export { binomialTest, type BinomialTestResult } from './lib/binomial/binomial-test';
export { mergeCategories, type MergeOutcome } from './lib/merge/merge-categories';
export { exactMultinomialTest, type ExactTestOptions, type ExactTestOutcome } from './lib/exact';
export { exactResultMethods, TEST_LABELS, type ExactResultMethod, type TestLabel } from './lib/spec/vocabulary';
export { upgradeStoredResult } from './lib/result/upgrade-stored-result';
export { effectSizeWord } from './lib/effect-size/cohens-w';
export { formatEffectSize, formatP, formatPAt, formatPValue, formatPValueAt, formatShare, formatStatistic, groupDigits } from './lib/report/format-numbers';
export { standsOut, type Departure } from './lib/report/stands-out';
export {
  categoriesMarkdownTable,
  categoryCells,
  categoryHeadings,
  effectSizeText,
  exactHowComputed,
  formatExpectedCount,
  shareDecimals,
  testCells,
  type CategoryCells,
  type TestCells,
} from './lib/report/shown-numbers';
export { SHARE_SUM_EXACT_TOLERANCE, SHARE_SUM_ROUNDING_TOLERANCE } from './lib/spec/share-tolerance';
export {
  analyzeSequential,
  startSequential,
  addSequentialBatch,
  sequentialSpecSchema,
  sequentialStartSchema,
  sequentialStateSchema,
  DEFAULT_CONCENTRATION,
  logBayesFactor,
  logMixtureProbability,
  shareConfidenceInterval,
  type SequentialResult,
  type SequentialState,
  type SequentialLook,
  type SequentialShare,
  type SequentialSpec,
  type SequentialStartSpec,
  type ShareInterval,
} from './lib/sequential';
export {
  analyzeSegments,
  segmentsInputSchema,
  segmentAdjustMethods,
  MAX_SEGMENTS,
  type SegmentsInput,
  type SegmentsResult,
  type SegmentRow,
  type SegmentDriver,
  type SegmentFlag,
  type SegmentAdjustMethod,
} from './lib/segments/analyze-segments';
export { adjustPValues } from './lib/posthoc/adjust-p-values';
