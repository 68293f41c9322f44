// The part of autocannon 9's programmatic API that bench-load.ts uses (the package ships no
// types). Shapes from autocannon's README ("API" section) and lib/run.js.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  export type Request = {
    method?: string;
    path: string;
    headers?: Record<string, string>;
    body?: string;
    onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
  };

  export type Options = {
    url: string;
    connections?: number;
    duration?: number;
    pipelining?: number;
    /** Seconds before a request counts as a timeout. */
    timeout?: number;
    headers?: Record<string, string>;
    /** Each connection sends these in turn, starting again after the last. */
    requests?: Request[];
  };

  export type Histogram = { average: number; mean: number; stddev: number; min: number; max: number; p50: number; p90: number; p97_5: number; p99: number };

  export type Result = {
    requests: Histogram & { total: number; sent: number };
    latency: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    duration: number;
    connections: number;
  };

  /** One connection of the run; `requestIterator.currentRequestIndex` is the request it just answered. */
  export type Client = EventEmitter & { requestIterator: { currentRequestIndex: number } };

  export type Instance = EventEmitter & {
    on(event: 'response', listener: (client: Client, statusCode: number, resBytes: number, responseTime: number) => void): Instance;
    on(event: 'reqError', listener: (err: Error) => void): Instance;
    on(event: 'done', listener: (result: Result) => void): Instance;
    stop(): void;
  };

  function autocannon(opts: Options, cb: (err: Error | null, result: Result) => void): Instance;
  export default autocannon;
}
