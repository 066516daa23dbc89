import { createRequire } from 'node:module';

/** The part of autocannon's result the benchmarks read (the package ships no types). */
export interface CannonResult {
  requests: { average: number; total: number };
  latency: { p99: number; p50: number; average: number };
  non2xx: number;
  errors: number;
}

/** autocannon (npm), an HTTP load generator: `url`, `connections`, `duration` in seconds. */
export const autocannon = createRequire(import.meta.url)('autocannon') as (
  opts: Record<string, unknown>,
) => Promise<CannonResult>;
