/**
 * Cochran's (1954, Biometrics 10:417) rule for the chi-square approximation: no expected count
 * below 1 and at most 20% of the expected counts below 5.
 */
export interface ExpectedCountSummary {
  minExpected: number;
  cellsBelow5: number;
  cellsBelow1: number;
  shareBelow5: number;
  cochranOk: boolean;
}

export function summariseExpectedCounts(expected: readonly number[]): ExpectedCountSummary {
  let minExpected = Infinity;
  let cellsBelow5 = 0;
  let cellsBelow1 = 0;
  for (const e of expected) {
    minExpected = Math.min(minExpected, e);
    if (e < 5) cellsBelow5++;
    if (e < 1) cellsBelow1++;
  }
  const shareBelow5 = cellsBelow5 / expected.length;
  return { minExpected, cellsBelow5, cellsBelow1, shareBelow5, cochranOk: cellsBelow1 === 0 && shareBelow5 <= 0.2 };
}
