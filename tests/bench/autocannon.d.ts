// The part of autocannon 8's programmatic API the load bench uses (the package ships no types).
declare module "autocannon" {
  export interface Options {
    url: string;
    connections?: number;
    /** Seconds. */
    duration?: number;
    /** Seconds before a request counts as a timeout. */
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
  }

  /** One hdr-histogram summary; latencies are in milliseconds, requests per second sampled each second. */
  export interface Histogram {
    mean: number;
    stddev: number;
    min: number;
    max: number;
    total: number;
    p50: number;
    p90: number;
    p99: number;
  }

  export interface Result {
    latency: Histogram;
    requests: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    statusCodeStats: Record<string, { count: number }>;
    duration: number;
  }

  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
