// The part of autocannon 8's API that load-client.ts uses (the package ships no types).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  interface RequestParams {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
  }

  interface Request extends RequestParams {
    setupRequest?: (request: RequestParams, context: Record<string, unknown>) => RequestParams;
  }

  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    requests?: Request[];
  }

  interface Stats {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    total: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
  }

  interface Result {
    duration: number;
    requests: Stats;
    latency: Stats;
    throughput: Stats;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
  }

  interface Instance extends EventEmitter {
    on(
      event: 'response',
      listener: (client: unknown, statusCode: number, bytes: number, ms: number) => void,
    ): this;
    on(event: 'done', listener: (result: Result) => void): this;
  }

  function autocannon(options: Options): Instance & Promise<Result>;
  export default autocannon;
}
