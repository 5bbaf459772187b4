// autocannon 9 ships no types: the part of its API the API benchmark uses.
declare module 'autocannon' {
  type Histogram = { average: number; p99: number };
  type Result = { requests: Histogram; latency: Histogram; non2xx: number; errors: number };
  export default function autocannon(opts: {
    url: string;
    connections: number;
    duration: number;
    headers?: Record<string, string>;
  }): Promise<Result>;
}
