// autocannon ships no types; declare only what server/load-check.ts uses.
declare module 'autocannon' {
  interface Percentiles {
    readonly p50: number;
    readonly p90: number;
    readonly p99: number;
    readonly max: number;
    readonly average: number;
  }
  interface Result {
    readonly latency: Percentiles;
    readonly requests: { readonly total: number; readonly average: number };
    readonly non2xx: number;
    readonly errors: number;
    readonly timeouts: number;
  }
  interface RequestSpec {
    readonly method?: string;
    readonly path?: string;
    readonly headers?: Record<string, string>;
    readonly body?: string;
    readonly onResponse?: (status: number, body: string) => void;
  }
  interface Options {
    readonly url: string;
    readonly connections?: number;
    readonly amount?: number;
    readonly duration?: number;
    readonly timeout?: number;
    readonly requests?: readonly RequestSpec[];
  }
  function autocannon(opts: Options): Promise<Result>;
  export default autocannon;
}
