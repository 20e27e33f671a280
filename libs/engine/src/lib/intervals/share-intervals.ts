/** Intervals for each category's share by the chosen method (see the method modules for sources). */
import type { IntervalMethod } from '../spec/analysis-spec';
import { goodmanIntervals, quesenberryHurstIntervals, wilsonIntervals, type ShareInterval } from './score-intervals';
import { sisonGlazIntervals } from './sison-glaz';

export function shareIntervals(counts: readonly number[], method: IntervalMethod, level: number): ShareInterval[] {
  switch (method) {
    case 'wilson':
      return wilsonIntervals(counts, level);
    case 'quesenberry-hurst':
      return quesenberryHurstIntervals(counts, level);
    case 'goodman':
      return goodmanIntervals(counts, level);
    case 'sison-glaz':
      return sisonGlazIntervals(counts, level);
  }
}
