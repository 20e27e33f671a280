/**
 * The null shares θ0 of a sequential test, from a hypothesis already checked by
 * sequentialStartSchema (equal, proportions or ratio; every share above 0).
 */
import { sharesFromProportions } from '../hypothesis/given-shares';
import { sharesFromRatio } from '../hypothesis/ratio-shares';
import type { EngineWarning } from '../result/engine-warning';
import type { SequentialStartSpec } from './sequential-spec';

export interface NullShares {
  shares: number[];
  warnings: EngineWarning[];
}

export function nullShares(spec: SequentialStartSpec): NullShares {
  const k = spec.observed.labels.length;
  const hypothesis = spec.hypothesis;
  switch (hypothesis.kind) {
    case 'equal':
      return { shares: spec.observed.labels.map(() => 1 / k), warnings: [] };
    case 'proportions':
      return sharesFromProportions(hypothesis.values);
    case 'ratio':
      return { shares: sharesFromRatio(hypothesis.values), warnings: [] };
    default:
      // sequentialStartSchema refuses the other kinds; reaching here means it was bypassed.
      throw new Error(`nullShares: hypothesis kind "${hypothesis.kind}" has no fixed shares`);
  }
}
