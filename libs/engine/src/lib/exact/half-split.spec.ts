import { chooseHalfSplit } from './half-split';

describe('chooseHalfSplit', () => {
  it('splits equal shares into mirrored halves of equal size', () => {
    for (const k of [2, 4, 6, 10]) {
      const split = chooseHalfSplit(new Array(k).fill(1 / k), 1000, 4);
      expect(split.mirrored).toBe(true);
      expect(split.first.length).toBe(k / 2);
      expect([...split.first, ...split.second].sort((a, b) => a - b)).toEqual(Array.from({ length: k }, (_, i) => i));
    }
  });

  it('uses every category exactly once, in two non-empty halves', () => {
    const shares = [0.02, 0.03, 0.05, 0.1, 0.1, 0.15, 0.25, 0.3];
    const split = chooseHalfSplit(shares, 500, 5);
    expect(split.first.length).toBeGreaterThan(0);
    expect(split.second.length).toBeGreaterThan(0);
    expect([...split.first, ...split.second].sort((a, b) => a - b)).toEqual(shares.map((_, i) => i));
  });

  it('balances many distinct shares greedily', () => {
    const shares = Array.from({ length: 24 }, (_, i) => (i + 1) / 300);
    const split = chooseHalfSplit(shares, 2000, 6);
    expect(Math.abs(split.first.length - split.second.length)).toBeLessThanOrEqual(2);
    expect(split.mirrored).toBe(false);
  });

  it('keeps a run of equal shares together inside each half', () => {
    const shares = [0.1, 0.1, 0.1, 0.2, 0.2, 0.3];
    const split = chooseHalfSplit(shares, 300, 4);
    for (const half of [split.first, split.second]) {
      const values = half.map((i) => shares[i]);
      const seen = new Set<number>();
      values.forEach((value, i) => {
        if (i > 0 && value !== values[i - 1]) expect(seen.has(value)).toBe(false);
        seen.add(values[i]);
      });
    }
  });
});
