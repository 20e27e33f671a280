import type { CreateAnalysisRequest } from '@tallyfit/contracts';
import type { AnalysisSpec, Hypothesis } from '@tallyfit/engine';
import type { DataChoice } from './data-step/data-choice';
import type { AnalysisOptions } from './options-step/analysis-options';

/**
 * The request the run step sends: the three steps' answers put together. Counts from an uploaded
 * dataset go as the dataset and its column choice, so the API counts them itself and the analysis
 * records where its counts came from; typed or pasted counts go in the spec.
 */
export function analysisRequest(
  title: string,
  studyId: number | null,
  data: DataChoice,
  hypothesis: Hypothesis,
  options: AnalysisOptions,
  notes = '',
): CreateAnalysisRequest {
  const described = notes.trim() ? { notes: notes.trim() } : {};
  if (data.datasetId !== undefined && data.selection) {
    return {
      title: title.trim(),
      ...described,
      datasetId: data.datasetId,
      selection: data.selection,
      spec: { hypothesis, ...options },
      ...(data.segments ? { segmentColumn: data.segments.column, segmentAdjust: data.segments.adjust } : {}),
    };
  }
  return {
    title: title.trim(),
    ...described,
    spec: rerunSpec(data, hypothesis, options),
    ...(studyId !== null ? { studyId } : {}),
  };
}

/** The whole spec the three steps describe: what a re-run with changes sends. */
export function rerunSpec(data: DataChoice, hypothesis: Hypothesis, options: AnalysisOptions): AnalysisSpec {
  return { observed: data.observed, hypothesis, ...options };
}

/** A title to start from, so the person only has to adjust it. */
export function suggestedTitle(data: DataChoice, hypothesis: Hypothesis): string {
  const what = data.datasetName ? data.datasetName.replace(/\.(csv|tsv|txt|xlsx)$/i, '') : data.observed.labels.slice(0, 3).join(', ');
  const against: Record<Hypothesis['kind'], string> = {
    equal: 'equal shares',
    proportions: 'the expected shares',
    ratio: hypothesis.kind === 'ratio' ? `a ${hypothesis.values.join(':')} ratio` : 'a ratio',
    counts: 'the expected counts',
    distribution: hypothesis.kind === 'distribution' ? `a ${hypothesis.family} distribution` : 'a distribution',
  };
  return `${what}${data.datasetName || data.observed.labels.length <= 3 ? '' : ', …'} against ${against[hypothesis.kind]}`;
}
