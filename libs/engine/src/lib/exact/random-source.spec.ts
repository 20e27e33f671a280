import { RandomSource } from './random-source';

describe('RandomSource', () => {
  it('repeats its sequence for the same seed and differs for another seed', () => {
    const a = new RandomSource(2024);
    const b = new RandomSource(2024);
    const c = new RandomSource(2025);
    const first = Array.from({ length: 8 }, () => a.nextUint32());
    expect(Array.from({ length: 8 }, () => b.nextUint32())).toEqual(first);
    expect(Array.from({ length: 8 }, () => c.nextUint32())).not.toEqual(first);
  });

  it('keeps seeds beyond 2^32 apart', () => {
    expect(new RandomSource(2 ** 32 + 5).nextUint32()).not.toBe(new RandomSource(5).nextUint32());
  });

  it('gives uniform doubles in [0, 1) with the right mean, variance and balanced bits', () => {
    const random = new RandomSource(99);
    const draws = 200_000;
    let sum = 0;
    let sumSquares = 0;
    const ones = new Array<number>(32).fill(0);
    for (let i = 0; i < draws; i++) {
      const u = random.nextDouble();
      expect(u >= 0 && u < 1).toBe(true);
      sum += u;
      sumSquares += u * u;
      const bits = random.nextUint32();
      for (let b = 0; b < 32; b++) ones[b] += (bits >>> b) & 1;
    }
    // Mean 1/2 with standard error √(1/12 / draws) ≈ 6.5e-4; variance 1/12.
    expect(Math.abs(sum / draws - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / draws));
    expect(Math.abs(sumSquares / draws - (sum / draws) ** 2 - 1 / 12)).toBeLessThan(2e-3);
    // Each bit is 1 half the time, standard error √(draws)/2 ≈ 224 counts.
    for (const count of ones) expect(Math.abs(count - draws / 2)).toBeLessThan(5 * Math.sqrt(draws) / 2);
  });
});
