/**
 * Compare a computed value with a reference within a stated tolerance, printing both values, the
 * difference and the tolerance when they disagree.
 */
export interface Tolerance {
  /** relative tolerance |a − b| / |b| */
  relative?: number;
  /** absolute tolerance |a − b| */
  absolute?: number;
}

export function expectClose(actual: number, expected: number, tolerance: Tolerance, label = ''): void {
  const difference = Math.abs(actual - expected);
  const relativeOk = tolerance.relative !== undefined && difference <= tolerance.relative * Math.abs(expected);
  const absoluteOk = tolerance.absolute !== undefined && difference <= tolerance.absolute;
  if (Number.isNaN(actual) || !(relativeOk || absoluteOk || actual === expected)) {
    throw new Error(
      `${label ? `${label}: ` : ''}got ${actual}, expected ${expected}; difference ${difference.toExponential(3)}` +
        ` (relative ${(difference / Math.abs(expected)).toExponential(3)}), tolerance ${JSON.stringify(tolerance)}`,
    );
  }
}
