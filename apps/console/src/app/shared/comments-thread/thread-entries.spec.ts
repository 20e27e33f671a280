import { threadEntries } from './thread-entries';

describe('threadEntries', () => {
  it('merges comments and decisions by time and words each decision', () => {
    const entries = threadEntries(
      [{ id: 1, analysisId: 9, body: 'Which week is this?', author: { id: 3, name: 'Lee' }, createdAt: '2026-11-22T10:05:00Z' }],
      [
        { id: 1, analysisId: 9, decision: 'submitted', comment: null, by: { id: 2, name: 'Ana' }, createdAt: '2026-11-22T10:00:00Z' },
        { id: 2, analysisId: 9, decision: 'returned', comment: 'Add the week.', by: { id: 3, name: 'Lee' }, createdAt: '2026-11-22T10:10:00Z' },
      ],
    );
    expect(entries.map((e) => [e.who, e.headline ?? e.body])).toEqual([
      ['Ana', 'submitted it for review'],
      ['Lee', 'Which week is this?'],
      ['Lee', 'returned it for changes'],
    ]);
    expect(entries[2].body).toBe('Add the week.');
  });

  it('gives an empty timeline for an analysis nobody has discussed', () => expect(threadEntries([], [])).toEqual([]));
});
