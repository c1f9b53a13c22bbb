// autocannon ships no types; this declares the part of its API the bench uses (see its README).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  export type Histogram = { average: number; mean: number; stddev: number; min: number; max: number; p50: number; p90: number; p97_5: number; p99: number; total: number };
  export type RawRequest = { method?: string; path?: string; headers?: Record<string, string>; body?: string };
  export type Options = {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    overallRate?: number;
    timeout?: number;
    headers?: Record<string, string>;
    requests?: { method?: string; path?: string; setupRequest?: (req: RawRequest) => RawRequest }[];
  };
  export type Result = {
    latency: Histogram;
    requests: Histogram & { sent: number };
    throughput: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
  };
  export type Instance = EventEmitter & { stop(): void };
  function autocannon(opts: Options, cb: (err: Error | null, result: Result) => void): Instance;
  export default autocannon;
}
