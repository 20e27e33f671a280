/** Power against sample size for the planner's chart, from the engine's `power`. */
import { power } from '@tallyfit/engine';

export interface PowerPoint {
  n: number;
  power: number;
}

/** About `points` evenly spaced whole sample sizes from 2 up to `nMax`, with their power. */
export function powerCurve(w: number, df: number, alpha: number, nMax: number, points = 60): PowerPoint[] {
  const top = Math.max(10, Math.ceil(nMax));
  const step = Math.max(1, Math.ceil(top / points));
  const curve: PowerPoint[] = [];
  for (let n = 2; n <= top; n += step) curve.push({ n, power: power({ w, df, n, alpha }).power });
  if (curve[curve.length - 1].n !== top) curve.push({ n: top, power: power({ w, df, n: top, alpha }).power });
  return curve;
}
