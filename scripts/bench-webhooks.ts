/**
 * Webhook benchmark (part of `npm run bench`): program changes are written at a steady rate
 * through the services (each writes its event in its transaction); the real worker process
 * delivers every event to 10 receivers on loopback. Reports deliveries per second and the
 * time from the state change's commit to receipt (p50, p99). Targets: ≥ 300 deliveries/s,
 * p50 < 150 ms. Not a test: it reports, it does not fail.
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import { createProgram } from "../lib/services/programs";
import { createEndpoint } from "../lib/services/webhooks";
import { benchDatabase } from "./lib/bench-setup";
import { appEnv } from "./lib/env";
import { daemon, startWorker, stopDaemon } from "./lib/web";

const ENDPOINTS = 10;
const EVENTS = Number(process.env.BENCH_EVENTS ?? 300);
const RATE = Number(process.env.BENCH_EVENT_RATE ?? 30); // events per second (× 10 endpoints = deliveries offered per second)

process.env.SHEARWIRE_ALLOW_PRIVATE_WEBHOOKS = "1"; // the receivers are on loopback
const { profile, url, orm, shopId, shearId } = await benchDatabase("shearwire_bench_hooks");

const latencies: number[] = [];
let received = 0;
let lastReceipt = 0;
const servers = await Promise.all(
  Array.from({ length: ENDPOINTS }, () => new Promise<http.Server>((resolve) => {
    const server = http.createServer((req, res) => {
      let body = "";
      req.on("data", (c) => (body += c));
      req.on("end", () => {
        const now = Date.now();
        const event = JSON.parse(body) as { timestamp: string };
        latencies.push(now - Date.parse(event.timestamp));
        received += 1;
        lastReceipt = now;
        res.writeHead(204).end();
      });
    });
    server.listen(0, "127.0.0.1", () => resolve(server));
  })),
);
for (const s of servers) {
  await createEndpoint(orm.em.fork(), shopId, { url: `http://127.0.0.1:${(s.address() as AddressInfo).port}/`, eventTypes: ["program.created"] });
}

const worker = daemon(profile.dataRoot, "worker-bench");
await stopDaemon(worker);
startWorker(worker, { ...appEnv(profile, 3212), DATABASE_URL: url, SHEARWIRE_ALLOW_PRIVATE_WEBHOOKS: "1" });
await new Promise((r) => setTimeout(r, 3000)); // let the worker connect

const started = Date.now();
for (let i = 0; i < EVENTS; i++) {
  const due = started + (i * 1000) / RATE;
  if (due > Date.now()) await new Promise((r) => setTimeout(r, due - Date.now()));
  await createProgram(orm.em.fork(), shopId, {
    reference: `HOOK-${i}`, shear: shearId, grade: "A36", thickness: { gauge: 10 }, units: "in",
    sheet: { length: 120, width: 48, count: 1 }, cuts: [{ backgauge: 12, count: 3 }],
  });
}
const expected = EVENTS * ENDPOINTS;
const deadline = Date.now() + 120_000;
while (received < expected && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
await stopDaemon(worker);
servers.forEach((s) => s.close());
await orm.close(true);

const sorted = [...latencies].sort((a, b) => a - b);
const pct = (p: number) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN;
const seconds = (lastReceipt - started) / 1000;
const rate = received / seconds;
console.log(`
Webhooks: ${EVENTS} events at ${RATE}/s, each to ${ENDPOINTS} loopback endpoints (${expected} deliveries)
  delivered         ${received} of ${expected} in ${seconds.toFixed(1)} s = ${rate.toFixed(0)} deliveries/s   (target ≥ 300: ${rate >= 300 ? "met" : "NOT met"})
  change → receipt  p50 ${pct(50)} ms   p99 ${pct(99)} ms   (target p50 < 150 ms: ${pct(50) < 150 ? "met" : "NOT met"})
`);
process.exit(0);
