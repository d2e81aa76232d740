import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterEach, describe, expect, it, vi } from "vitest";
import { load, percentile } from "../../scripts/lib/load";

let server: http.Server | undefined;
afterEach(() => new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve())));

/** A server answering each POST after `delayMs`, 201 with a large body, or 409 when the reference was seen before. */
async function serve(delayMs: number, answerBytes: number) {
  const seen: string[] = [];
  let open = 0;
  let mostOpen = 0;
  server = http.createServer((req, res) => {
    let body = "";
    req.on("data", (d) => (body += d));
    req.on("end", () => {
      open++;
      mostOpen = Math.max(mostOpen, open);
      setTimeout(() => {
        open--;
        const reference = String(JSON.parse(body).reference);
        const again = seen.includes(reference) || reference === "taken";
        seen.push(reference);
        res.writeHead(again ? 409 : 201, { "content-type": "application/json" });
        res.end(Buffer.alloc(answerBytes, 0x20));
      }, delayMs);
    });
  });
  server.keepAliveTimeout = 5_000;
  await new Promise<void>((resolve) => server!.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return { url: `http://localhost:${port}/`, seen, mostOpen: () => mostOpen, connections: () => connections(server!) };
}

const connections = (s: http.Server) => new Promise<number>((resolve) => s.getConnections((_, n) => resolve(n)));

describe("the benchmarks' load generator", () => {
  it("takes percentiles by nearest rank", () => {
    // nearest-rank method: the value at rank ⌈p·n⌉ of the sorted values (a general statistical definition)
    const values = [15, 20, 35, 40, 50];
    expect(percentile(values, 0.05)).toBe(15);
    expect(percentile(values, 0.3)).toBe(20);
    expect(percentile(values, 0.4)).toBe(20);
    expect(percentile(values, 0.5)).toBe(35);
    expect(percentile(values, 1)).toBe(50);
    expect(percentile([], 0.5)).toBe(0);
  });

  it("keeps its connections busy, builds each body as it sends it, reads large answers to the end", async () => {
    const target = await serve(20, 800_000);
    let n = 0;
    const result = await load({
      url: target.url,
      connections: 4,
      seconds: 1,
      method: "POST",
      headers: { "content-type": "application/json" },
      body: () => ({ reference: n++ === 3 ? "taken" : `R-${n}` }),
    });
    expect(result.errors).toBe(0);
    // every request was answered and counted; the one whose reference was taken is outside 2xx
    expect(result.total).toBe(target.seen.length);
    expect(new Set(target.seen).size).toBe(target.seen.length);
    expect(result.non2xx).toBe(1);
    // four at a time, each waiting ~20 ms: well over one and at most four in flight
    expect(target.mostOpen()).toBe(4);
    expect(result.total).toBeGreaterThan(40);
    expect(result.rps).toBeGreaterThan(0);
    expect(result.p50).toBeGreaterThanOrEqual(20);
    expect(result.p99).toBeGreaterThanOrEqual(result.p50);
    // the connections were closed when the run ended
    await vi.waitFor(async () => expect(await target.connections()).toBe(0), { timeout: 2_000 });
  });

  it("counts a refused connection as an error and goes on until the time is up", async () => {
    const target = await serve(0, 10);
    server!.close();
    await new Promise((resolve) => setTimeout(resolve, 50));
    const result = await load({ url: target.url, connections: 2, seconds: 0.3, method: "GET" });
    expect(result.total).toBe(0);
    expect(result.errors).toBeGreaterThan(2);
    server = undefined;
  });
});
