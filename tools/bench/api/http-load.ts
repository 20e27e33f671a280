/** Load on one route with autocannon over loopback, for a fixed time. */
import { createRequire } from 'node:module';

export interface LoadResult {
  requestsPerSecond: number;
  p99Ms: number;
  errors: number;
  non2xx: number;
}

interface AutocannonResult {
  requests: { average: number };
  latency: { p99: number };
  errors: number;
  non2xx: number;
}
type Autocannon = (options: Record<string, unknown>) => Promise<AutocannonResult>;

// autocannon ships no type declarations; only the fields used here are typed above.
const autocannon = createRequire(__filename)('autocannon') as Autocannon;

export async function load(options: {
  url: string;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  body?: string;
  seconds: number;
  connections: number;
}): Promise<LoadResult> {
  const result = await autocannon({
    url: options.url,
    method: options.method ?? 'GET',
    headers: options.headers,
    body: options.body,
    duration: options.seconds,
    connections: options.connections,
  });
  return { requestsPerSecond: result.requests.average, p99Ms: result.latency.p99, errors: result.errors, non2xx: result.non2xx };
}
