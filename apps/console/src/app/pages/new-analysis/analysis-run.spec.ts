import { analysisRequest, suggestedTitle } from './analysis-run';
import type { DataChoice } from './data-step/data-choice';

const typed: DataChoice = { source: 'type', observed: { labels: ['a', 'b'], counts: [3, 4] } };
const uploaded: DataChoice = {
  source: 'upload',
  observed: { labels: ['scratch', 'dent'], counts: [2, 1] },
  datasetId: 8,
  datasetName: 'defects.csv',
  selection: { shape: 'raw', column: 'defect' },
};

describe('analysisRequest', () => {
  it('puts the three steps together, in the study when one is chosen', () => {
    expect(analysisRequest('  Check ', 4, typed, { kind: 'equal' }, { alpha: 0.01 })).toEqual({
      title: 'Check',
      studyId: 4,
      spec: { observed: { labels: ['a', 'b'], counts: [3, 4] }, hypothesis: { kind: 'equal' }, alpha: 0.01 },
    });
    expect(analysisRequest('Check', null, typed, { kind: 'equal' }, {}).studyId).toBeUndefined();
  });
});

describe('analysisRequest on an uploaded dataset', () => {
  it('sends the dataset and its column choice instead of the counts, so the API records the dataset', () => {
    expect(analysisRequest('Defects', 4, uploaded, { kind: 'ratio', values: [2, 1] }, { alpha: 0.05 })).toEqual({
      title: 'Defects',
      datasetId: 8,
      selection: { shape: 'raw', column: 'defect' },
      spec: { hypothesis: { kind: 'ratio', values: [2, 1] }, alpha: 0.05 },
    });
  });

  it('sends the counts when a dataset has no column choice', () => {
    const { selection: _none, ...withoutChoice } = uploaded;
    expect(analysisRequest('Defects', null, withoutChoice, { kind: 'equal' }, {})).toEqual({
      title: 'Defects',
      spec: { observed: uploaded.observed, hypothesis: { kind: 'equal' } },
    });
  });

  it('adds the segment column and the adjustment when a split was chosen', () => {
    const split = { ...uploaded, segments: { column: 'line', adjust: 'benjamini-hochberg' as const } };
    expect(analysisRequest('Defects by line', null, split, { kind: 'equal' }, {})).toMatchObject({ segmentColumn: 'line', segmentAdjust: 'benjamini-hochberg' });
  });
});

describe('suggestedTitle', () => {
  it('names the data and what it is tested against', () => {
    expect(suggestedTitle(uploaded, { kind: 'ratio', values: [9, 3, 3, 1] })).toBe('defects against a 9:3:3:1 ratio');
    expect(suggestedTitle({ ...typed, observed: { labels: ['a', 'b', 'c', 'd'], counts: [1, 1, 1, 1] } }, { kind: 'equal' })).toBe(
      'a, b, c, … against equal shares',
    );
  });
});
