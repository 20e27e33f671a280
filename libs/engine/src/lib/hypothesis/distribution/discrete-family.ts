/** A distribution on whole numbers, described by what the fitting code needs from it. */
export interface DiscreteFamily {
  /** plain-English name with its parameters, e.g. "a Poisson distribution with λ = 1.2" */
  description: string;
  supportMin: number;
  /** Infinity for unbounded families */
  supportMax: number;
  /** P(X = v) */
  probability(value: number): number;
  /** P(X <= v) */
  atMost(value: number): number;
  /** P(X >= v) */
  atLeast(value: number): number;
}
