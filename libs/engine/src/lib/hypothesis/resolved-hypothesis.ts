import type { EngineWarning } from '../result/engine-warning';

/** A hypothesis turned into one expected share per category. */
export interface ResolvedHypothesis {
  /** expected share of each category, in input order, summing to 1 */
  shares: number[];
  /** parameters estimated from the data (each removes one degree of freedom) */
  estimatedParameters: number;
  /** plain-English statement of the hypothesis, used in the write-up */
  description: string;
  /** parameter values used for a fitted family (given or estimated) */
  fitted?: Record<string, number>;
  /** names of the parameters that were estimated */
  estimatedNames?: string[];
  /** sentences the methods paragraph should carry (e.g. how tails were pooled) */
  notes: string[];
  warnings: EngineWarning[];
  /**
   * the categories actually tested, when they differ from the spec's (a fitted family sorts
   * categories by value and may pool its upper tail)
   */
  cells?: { labels: string[]; counts: number[] };
}
