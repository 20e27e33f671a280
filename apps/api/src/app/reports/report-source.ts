import { TEST_LABELS, type AnalysisResult, type TestName } from '@tallyfit/engine';

/** Everything a report says about one stored analysis. */
export interface ReportSource {
  id: number;
  title: string;
  studyId: number | null;
  studyName: string | null;
  datasetName: string | null;
  authorName: string;
  createdAt: string;
  engineVersion: string;
  notes: string | null;
  result: AnalysisResult;
}

/** The engine's own heading for a test key (a stored 0.1.x key is upgraded before it gets here). */
export const testName = (key: string) => (key in TEST_LABELS ? TEST_LABELS[key as TestName].name : key);

/** "2026-12-02 14:05 UTC": a date a reader of a printed report understands without a time zone guess. */
export function readableDate(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}

/** The facts that head every report: where the analysis belongs, who ran it, when, with which engine. */
export function reportFacts(source: ReportSource): Array<[label: string, value: string]> {
  const facts: Array<[string, string]> = [];
  if (source.studyName) facts.push(['Study', source.studyName]);
  if (source.datasetName) facts.push(['Dataset', source.datasetName]);
  facts.push(['Run by', source.authorName], ['Run on', readableDate(source.createdAt)], ['Engine version', source.engineVersion]);
  return facts;
}

/** The statistics line of every test that was run, in the engine's order. */
export function statisticsLines(result: AnalysisResult): Array<[test: string, line: string]> {
  return Object.entries(result.report.lines)
    .filter((entry): entry is [string, string] => typeof entry[1] === 'string')
    .map(([key, line]) => [testName(key), line]);
}
