/** The part of autocannon 8 the load benchmark uses (the package ships no types; see its README's API section). */
declare module 'autocannon' {
  export interface Histogram {
    average: number;
    mean: number;
    p50: number;
    p99: number;
    max: number;
  }

  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
    method?: string;
    body?: string | Buffer;
  }

  export interface Result {
    requests: Histogram & { total: number };
    latency: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    duration: number;
    /** Answers by status code, e.g. { '401': { count: 12 } }. */
    statusCodeStats?: Record<string, { count: number }>;
  }

  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
