import { summariseExpectedCounts } from './cochran-rule';
import { proposeMerge } from './propose-merge';

describe("Cochran's rule", () => {
  it('allows at most 20% of expected counts below 5 and none below 1 (Cochran 1954)', () => {
    expect(summariseExpectedCounts([10, 10, 10, 10, 4]).cochranOk).toBe(true);
    expect(summariseExpectedCounts([10, 10, 10, 4]).cochranOk).toBe(false);
    expect(summariseExpectedCounts([100, 100, 100, 100, 100, 0.9]).cochranOk).toBe(false);
    expect(summariseExpectedCounts([4, 6])).toEqual({ minExpected: 4, cellsBelow5: 1, cellsBelow1: 0, shareBelow5: 0.5, cochranOk: false });
  });
});

describe('proposeMerge', () => {
  it('merges ordered categories with their sparser neighbour', () => {
    // 4 + 5 gives 4, one of five cells below 5 (20%): enough
    expect(proposeMerge(['0', '1', '2', '3', '4', '5'], [40, 30, 20, 10, 3, 1], true, 0)).toEqual({
      groups: [{ label: '4–5', members: ['4', '5'] }],
    });
    // 3 + 4 gives 4, still one of four cells below 5 (25%): 2 joins as well
    expect(proposeMerge(['0', '1', '2', '3', '4'], [40, 30, 20, 3, 1], true, 0)).toEqual({
      groups: [{ label: '2–4', members: ['2', '3', '4'] }],
    });
  });

  it('merges unordered categories with the next sparsest', () => {
    expect(proposeMerge(['a', 'b', 'c', 'd', 'e'], [40, 2, 30, 20, 3], false, 0)).toEqual({
      groups: [{ label: 'b + e', members: ['b', 'e'] }],
    });
  });

  it('gives up when no merge leaves a degree of freedom', () => {
    expect(proposeMerge(['a', 'b'], [3, 2], false, 0)).toBeUndefined();
    expect(proposeMerge(['a', 'b', 'c'], [9, 3, 2], true, 1)).toBeUndefined();
  });
});
