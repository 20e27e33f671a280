/**
 * Minimise a function of a few variables by the Nelder–Mead simplex method (Nelder & Mead 1965,
 * Computer Journal 7:308) with the standard coefficients (reflection 1, expansion 2,
 * contraction ½, shrink ½). Stops when the simplex's function values agree to `tolerance`
 * (absolute) and its vertices to `tolerance` relative, or after `maxIterations`.
 */
export interface MinimumFound {
  point: number[];
  value: number;
  iterations: number;
}

export function nelderMead(
  objective: (point: number[]) => number,
  start: number[],
  initialStep: number[],
  tolerance = 1e-12,
  maxIterations = 5000,
): MinimumFound {
  const dimension = start.length;
  let simplex: number[][] = [start.slice()];
  for (let i = 0; i < dimension; i++) {
    const vertex = start.slice();
    vertex[i] += initialStep[i];
    simplex.push(vertex);
  }
  let values = simplex.map(objective);
  let iteration = 0;
  const order = () => {
    const indices = values.map((_, i) => i).sort((a, b) => values[a] - values[b]);
    simplex = indices.map((i) => simplex[i]);
    values = indices.map((i) => values[i]);
  };
  const combine = (a: number[], b: number[], t: number) => a.map((value, i) => value + t * (b[i] - value));
  for (; iteration < maxIterations; iteration++) {
    order();
    const spread = Math.abs(values[dimension] - values[0]);
    const size = Math.max(
      ...simplex.slice(1).map((vertex) => Math.max(...vertex.map((value, i) => Math.abs(value - simplex[0][i]) / Math.max(1, Math.abs(simplex[0][i]))))),
    );
    if (spread <= tolerance && size <= tolerance * 1e3) break;
    const centroid = new Array<number>(dimension).fill(0);
    for (let v = 0; v < dimension; v++) for (let i = 0; i < dimension; i++) centroid[i] += simplex[v][i] / dimension;
    const worst = simplex[dimension];
    const reflected = combine(centroid, worst, -1);
    const reflectedValue = objective(reflected);
    if (reflectedValue < values[0]) {
      const expanded = combine(centroid, worst, -2);
      const expandedValue = objective(expanded);
      if (expandedValue < reflectedValue) {
        simplex[dimension] = expanded;
        values[dimension] = expandedValue;
      } else {
        simplex[dimension] = reflected;
        values[dimension] = reflectedValue;
      }
    } else if (reflectedValue < values[dimension - 1]) {
      simplex[dimension] = reflected;
      values[dimension] = reflectedValue;
    } else {
      const outside = reflectedValue < values[dimension];
      const contracted = combine(centroid, outside ? reflected : worst, 0.5);
      const contractedValue = objective(contracted);
      if (contractedValue < Math.min(reflectedValue, values[dimension])) {
        simplex[dimension] = contracted;
        values[dimension] = contractedValue;
      } else {
        for (let v = 1; v <= dimension; v++) {
          simplex[v] = combine(simplex[0], simplex[v], 0.5);
          values[v] = objective(simplex[v]);
        }
      }
    }
  }
  order();
  return { point: simplex[0], value: values[0], iterations: iteration };
}
