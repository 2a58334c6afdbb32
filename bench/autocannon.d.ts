// The part of autocannon's programmatic API that bench/http-load.bench.ts uses (the package ships no types).
declare module "autocannon" {
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    method?: string;
    body?: string;
    headers?: Record<string, string>;
    timeout?: number;
    overallRate?: number;
  }
  interface Histogram {
    average: number;
    p50: number;
    p99: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    non2xx: number;
    errors: number;
    timeouts: number;
    statusCodeStats?: Record<string, { count: number }>;
  }
  export default function autocannon(options: Options): Promise<Result>;
}
