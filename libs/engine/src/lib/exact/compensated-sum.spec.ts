import { CompensatedSum, LogSum } from './compensated-sum';

describe('CompensatedSum', () => {
  it('keeps the small terms that plain summation loses', () => {
    // 1 + 1e6 terms of 1e-16: plain summation never moves off 1; the exact sum is 1 + 1e-10.
    const sum = new CompensatedSum();
    let naive = 0;
    sum.add(1);
    naive += 1;
    for (let i = 0; i < 1_000_000; i++) {
      sum.add(1e-16);
      naive += 1e-16;
    }
    expect(naive).toBe(1);
    expect(sum.value).toBeCloseTo(1 + 1e-10, 15);
  });

  it('recovers a sum that cancels', () => {
    const sum = new CompensatedSum();
    for (const value of [1e16, 1, -1e16, 1]) sum.add(value);
    expect(sum.value).toBe(2);
  });
});

describe('LogSum', () => {
  it('adds numbers far below the smallest double through their logarithms', () => {
    const sum = new LogSum();
    expect(sum.value).toBe(-Infinity);
    sum.add(-2000);
    sum.add(-2000);
    sum.add(-Infinity);
    sum.add(-2000 + Math.log(2));
    expect(sum.value).toBeCloseTo(-2000 + Math.log(4), 12);
  });
});
