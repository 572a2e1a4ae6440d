/** The part of autocannon's programmatic API the bench uses (the package ships no types). */
declare module "autocannon" {
  interface Histogram {
    average: number;
    mean: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
    max: number;
  }
  interface Result {
    requests: Histogram & { total: number };
    latency: Histogram;
    non2xx: number;
    errors: number;
    timeouts: number;
    duration: number;
    "2xx": number;
    "4xx": number;
    "5xx": number;
  }
  interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: Request[];
    timeout?: number;
    pipelining?: number;
  }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
