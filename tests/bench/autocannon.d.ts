// autocannon ships no types; these are the few parts the benchmark uses.
declare module "autocannon" {
  interface Result {
    requests: { average: number };
    latency: { p50: number; p97_5: number; p99: number };
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  export default function autocannon(opts: Record<string, unknown>): Promise<Result>;
}
