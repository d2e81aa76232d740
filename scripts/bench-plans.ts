/**
 * Planning benchmark (part of `npm run bench`): plans go through the API to a worker, as in
 * use. Reports the time a plan of 500 pieces in 30 blank types takes from request to answer
 * (target < 2 s of planning), the time the largest plan the limits allow takes (it must end
 * inside the plan time limit), and, while that plan runs, the latency of GET /api/v1/health
 * from a steady stream of requests (target p99 < 200 ms: the web process never plans). Not a
 * test: it reports, it does not fail. The load generator runs here, apart from the servers.
 */
import autocannon from "autocannon";
import { largestOrder, seeded } from "./lib/orders";
import { benchDatabase } from "./lib/bench-setup";
import { appEnv } from "./lib/env";
import { ensureBuild, daemon, startWeb, startWorker, stopDaemon, waitForHttp } from "./lib/web";

const PORT = 3213;
const DIST = ".next-test";
const base = `http://127.0.0.1:${PORT}`;

const { profile, url, orm, shearId, key } = await benchDatabase("shearwire_bench_plans");
await orm.close(true);
const env = { ...appEnv(profile, PORT), SHEARWIRE_DIST_DIR: DIST, DATABASE_URL: url };
ensureBuild(env, DIST);
const web = daemon(profile.dataRoot, "web-bench-plans");
const worker = daemon(profile.dataRoot, "worker-bench-plans");
for (const d of [web, worker]) await stopDaemon(d);
startWorker(worker, env);
await startWeb(web, PORT, env);
await waitForHttp(`${base}/api/v1/health`, web);

const headers = { Authorization: `Bearer ${key}`, "Content-Type": "application/json" };
async function submit(order: object) {
  const res = await fetch(`${base}/api/v1/plans`, { method: "POST", headers, body: JSON.stringify(order) });
  if (res.status !== 202) throw new Error(`plan refused: ${res.status} ${await res.text()}`);
  return (await res.json()).id as string;
}
async function until(id: string, done: (plan: { status: string }) => boolean, seconds = 180) {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    const plan = await (await fetch(`${base}/api/v1/plans/${id}`, { headers })).json();
    if (done(plan) || Date.now() > deadline) return plan;
    await new Promise((r) => setTimeout(r, 50));
  }
}
const ended = (p: { status: string }) => !["queued", "running"].includes(p.status);
const seconds = (plan: { startedAt: string; finishedAt: string }) =>
  (Date.parse(plan.finishedAt) - Date.parse(plan.startedAt)) / 1000;

/** 500 pieces of 30 blank types on three sheet sizes (invented, seeded). */
function fiveHundredPieces() {
  const random = seeded(500);
  const quantities = Array.from({ length: 30 }, () => 1 + Math.floor(random() * 30));
  const total = quantities.reduce((s, q) => s + q, 0);
  const scaled = quantities.map((q) => Math.max(1, Math.round((q * 500) / total)));
  scaled[0] += 500 - scaled.reduce((s, q) => s + q, 0);
  return {
    shear: shearId,
    grade: "A36",
    thickness: { value: 3 },
    units: "mm",
    stock: [
      { length: 2500, width: 1250 },
      { length: 3000, width: 1500 },
      { length: 2000, width: 1000 },
    ],
    blanks: scaled.map((quantity, index) => ({
      label: `part ${index + 1}`,
      length: 80 + Math.floor(random() * 900),
      width: 50 + Math.floor(random() * 500),
      quantity,
      canTurn: random() < 0.8,
    })),
  };
}

// Warm up: one small plan through the whole path.
await until(await submit(fiveHundredPieces()), ended);

const t0 = performance.now();
const medium = await until(await submit(fiveHundredPieces()), ended);
const mediumWall = (performance.now() - t0) / 1000;

// The largest plan, with health requests streaming in while it runs.
const largestId = await submit({ ...largestOrder(shearId), reference: "BENCH-LARGEST" });
await until(largestId, (p) => p.status !== "queued", 60);
const tLargest = performance.now();
const health = await autocannon({ url: `${base}/api/v1/health`, connections: 4, overallRate: 25, duration: 20 });
const largest = await until(largestId, ended, 240);
const largestWall = (performance.now() - tLargest) / 1000;

for (const d of [web, worker]) await stopDaemon(d);
const describe = (plan: {
  status: string;
  failure?: { reason: string } | null;
  result?: { summary: { sheets: number; patterns: number } } | null;
}) =>
  plan.status === "complete"
    ? `${plan.result!.summary.sheets} sheets, ${plan.result!.summary.patterns} patterns`
    : `${plan.status}${plan.failure ? ` (${plan.failure.reason})` : ""}`;
console.log(`
Plans through the API and a worker (${describe(medium)})
  500 pieces, 30 blank types, 3 sheet sizes   ${seconds(medium).toFixed(2)} s planning, ${mediumWall.toFixed(2)} s from request to answer   (target < 2 s)
  largest allowed order (${largestOrder(shearId).blanks.length} types, ${largestOrder(shearId).blanks.reduce((s, b) => s + b.quantity, 0)} pieces, ${largestOrder(shearId).stock.length} sizes)
                                              ${largest.startedAt && largest.finishedAt ? `${seconds(largest).toFixed(1)} s planning` : "—"}, ${describe(largest)}, ${largestWall.toFixed(1)} s observed   (must end inside the plan time limit)
GET /api/v1/health while the largest plan ran (25 req/s for 20 s, 4 connections)
  p50 ${health.latency.p50} ms   p99 ${health.latency.p99} ms   max ${health.latency.max} ms   non-2xx ${health.non2xx}   errors ${health.errors}   (target p99 < 200 ms: ${health.latency.p99 < 200 ? "met" : "NOT met"})
`);
process.exit(0);
