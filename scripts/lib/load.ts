/**
 * A closed-loop HTTP load generator for the benchmarks: `connections` keep-alive connections, each
 * sending its next request as soon as the answer to the last one has arrived, for `seconds`.
 *
 * Node's own HTTP client, not autocannon: autocannon appends every answer's body to a string that it
 * never reads (8.0.0), which on a 100-program batch's ~0.8 MB answer cost the load generator ~4 ms of
 * CPU (most of it garbage collection) against ~0.7 ms here. On a machine whose cores the servers
 * measured share with the load generator, that CPU came out of the servers' throughput. Answers are
 * read to the end and dropped; each request's body is built when it is sent (`body()`), so every
 * program created carries a reference of its own.
 */
import http from "node:http";

export interface LoadOptions {
  url: string;
  connections: number;
  seconds: number;
  method: "GET" | "POST";
  headers?: Record<string, string>;
  /** the JSON body of each request, built as it is sent */
  body?: () => object;
}

export interface LoadResult {
  /** answers received per second */
  rps: number;
  /** answers received */
  total: number;
  /** latency percentiles in milliseconds, from sending the request to the answer's last byte */
  p50: number;
  p99: number;
  /** answers outside 2xx, and requests that failed without an answer */
  non2xx: number;
  errors: number;
  /** seconds from the first request to the last answer */
  elapsed: number;
  /** every answer's latency in milliseconds, sorted (to pool several runs' percentiles) */
  latencies: number[];
}

/** The value at `fraction` of the sorted latencies (nearest rank). */
export function percentile(sorted: readonly number[], fraction: number): number {
  if (!sorted.length) return 0;
  const rank = Math.ceil(fraction * sorted.length);
  return sorted[Math.min(sorted.length, Math.max(1, rank)) - 1];
}

/** One request, resolved with its status (0 when it failed without an answer). */
function send(agent: http.Agent, target: URL, options: LoadOptions): Promise<number> {
  const payload = options.body ? Buffer.from(JSON.stringify(options.body()), "utf8") : undefined;
  return new Promise((resolve) => {
    const request = http.request(
      {
        agent,
        host: target.hostname,
        port: target.port,
        path: `${target.pathname}${target.search}`,
        method: options.method,
        headers: { ...options.headers, ...(payload ? { "content-length": String(payload.length) } : {}) },
      },
      (response) => {
        response.on("end", () => resolve(response.statusCode ?? 0));
        response.on("error", () => resolve(0));
        response.resume();
      },
    );
    request.on("error", () => resolve(0));
    request.end(payload);
  });
}

export async function load(options: LoadOptions): Promise<LoadResult> {
  const target = new URL(options.url);
  const agent = new http.Agent({ keepAlive: true, maxSockets: options.connections });
  const latencies: number[] = [];
  let non2xx = 0;
  let errors = 0;
  const started = performance.now();
  const deadline = started + options.seconds * 1000;
  const loop = async () => {
    while (performance.now() < deadline) {
      const sent = performance.now();
      const status = await send(agent, target, options);
      if (status === 0) {
        errors++;
        // a refused connection fails at once: do not spin on it
        await new Promise((resolve) => setTimeout(resolve, 10));
        continue;
      }
      latencies.push(performance.now() - sent);
      if (status < 200 || status > 299) non2xx++;
    }
  };
  await Promise.all(Array.from({ length: options.connections }, loop));
  const elapsed = (performance.now() - started) / 1000;
  agent.destroy();
  latencies.sort((a, b) => a - b);
  return {
    rps: latencies.length / elapsed,
    total: latencies.length,
    p50: percentile(latencies, 0.5),
    p99: percentile(latencies, 0.99),
    non2xx,
    errors,
    elapsed,
    latencies,
  };
}
