// Minimal types for the parts of autocannon's programmatic API the bench uses (it ships none).
declare module 'autocannon' {
  interface Histogram {
    average: number;
    mean: number;
    total: number;
    p50: number;
    p90: number;
    p99: number;
    max: number;
  }
  interface RawRequest {
    method?: string;
    path?: string;
    body?: string | Buffer;
    headers?: Record<string, string>;
  }
  interface RequestSpec extends RawRequest {
    setupRequest?: (request: RawRequest, context: Record<string, unknown>) => RawRequest;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: RequestSpec[];
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
  }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
