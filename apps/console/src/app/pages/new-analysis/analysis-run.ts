import type { CreateAnalysisRequest, DatasetAnalysisRequest } from '@tallyfit/contracts';
import type { Hypothesis } from '@tallyfit/engine';
import type { DataChoice } from './data-step/data-choice';
import type { AnalysisOptions } from './options-step/analysis-options';

/** The request the run step sends: the three steps' answers put together. */
export function analysisRequest(
  title: string,
  studyId: number | null,
  data: DataChoice,
  hypothesis: Hypothesis,
  options: AnalysisOptions,
): CreateAnalysisRequest {
  const request: CreateAnalysisRequest = {
    title: title.trim(),
    spec: { observed: data.observed, hypothesis, ...options },
  };
  if (studyId !== null) request.studyId = studyId;
  if (data.datasetName) request.notes = `Counts from the uploaded file “${data.datasetName}”.`;
  return request;
}

/** The request for a run on an uploaded dataset: the API fills the observed counts from the chosen column(s). */
export function datasetAnalysisRequest(
  title: string,
  data: DataChoice,
  hypothesis: Hypothesis,
  options: AnalysisOptions,
): DatasetAnalysisRequest | null {
  if (!data.selection) return null;
  const request: DatasetAnalysisRequest = { title: title.trim(), selection: data.selection, spec: { hypothesis, ...options } };
  if (data.segments) {
    request.segmentColumn = data.segments.column;
    request.segmentAdjust = data.segments.adjust;
  }
  return request;
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
