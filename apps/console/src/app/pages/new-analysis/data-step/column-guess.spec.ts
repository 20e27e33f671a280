import { guessColumnChoice } from './column-guess';
import { uploadFileProblem } from './upload-file-check';

describe('guessColumnChoice', () => {
  it('takes a text column beside a whole-number column as labels and counts', () => {
    expect(guessColumnChoice(['variant', 'visitors'], [['control', '5012'], ['new', '4888']])).toEqual({
      shape: 'counts',
      labelColumn: 'variant',
      countColumn: 'visitors',
    });
  });

  it('takes repeated values as raw observations of the first text column', () => {
    expect(guessColumnChoice(['order', 'defect', 'line'], [['1', 'scratch', 'A'], ['2', 'dent', 'A'], ['3', 'scratch', 'B']])).toEqual({
      shape: 'raw',
      column: 'defect',
    });
  });

  it('takes a single column as raw observations and has nothing to guess without columns', () => {
    expect(guessColumnChoice(['digit'], [['1'], ['3']])).toEqual({ shape: 'raw', column: 'digit' });
    expect(guessColumnChoice([], [])).toBeNull();
  });
});

describe('uploadFileProblem', () => {
  it('accepts CSV, TSV, text and Excel files', () => {
    for (const name of ['a.csv', 'b.TSV', 'c.txt', 'd.xlsx']) expect(uploadFileProblem({ name, size: 10 })).toBeNull();
  });

  it('names the file that cannot be uploaded and why', () => {
    expect(uploadFileProblem({ name: 'scan.pdf', size: 10 })).toBe('“scan.pdf” is not a CSV, TSV, text or Excel (.xlsx) file.');
    expect(uploadFileProblem({ name: 'empty.csv', size: 0 })).toBe('“empty.csv” is empty.');
    expect(uploadFileProblem({ name: 'huge.csv', size: 30 * 1024 * 1024 })).toBe(
      '“huge.csv” is 30.0 MB; files up to 20 MB can be uploaded.',
    );
  });
});
