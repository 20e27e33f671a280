import type { CountSelection } from '@tallyfit/contracts';
import type { ParsedCounts } from './pasted-counts';
import type { SegmentChoice } from './segment-choice';

export type DataSource = 'upload' | 'paste' | 'type';

/** The observed counts the analysis will test, and where they came from. */
export interface DataChoice {
  source: DataSource;
  observed: ParsedCounts;
  /** set when the counts come from an uploaded dataset */
  datasetId?: number;
  datasetName?: string;
  /** the column choice that turned the dataset's rows into these counts */
  selection?: CountSelection;
  /** a second column of the dataset to split the counts by, tested segment by segment */
  segments?: SegmentChoice;
}

export function totalOf(counts: readonly number[]): number {
  return counts.reduce((sum, count) => sum + count, 0);
}
