/**
 * API benchmark (part of `npm run bench`): every route below at the same 32 connections in one
 * run, against the built app (web server and worker, as `npm run up` runs them) and real
 * PostgreSQL and Redis. The yardstick is the framework's own floor, `GET /api/v1/health` (one
 * PostgreSQL and one Redis round trip through the same route wrapper); a bare node:http INSERT
 * is printed for context. The load generator (`scripts/lib/load.ts`, this process) shares a process
 * with no server it measures. Each route runs twice for half its seconds, the second pass in reverse order
 * (A B C C B A), and its two halves are pooled: a linear drift of the machine's speed then weighs on every
 * route alike instead of on whichever ran last. Targets: POST /programs ≥ 0.5 × health with p99 ≤ 4 × its p50,
 * validate ≥ 0.8 × health, batches of 100 ≥ 10 × single create in programs per second.
 * Not a test: it reports, it does not fail. `BENCH_ONLY=create,batch` runs those routes (health
 * always runs, as the yardstick); `BENCH_CPU_PROF=<folder>` writes the web server's CPU profile
 * there when it stops, and the worker's in its `worker` folder.
 */
import pg from "pg";
import { benchDatabase } from "./lib/bench-setup";
import { appEnv } from "./lib/env";
import { cpuSnapshot } from "./lib/cpu";
import { load, percentile } from "./lib/load";
import {
  ensureBuild,
  daemon,
  daemonPid,
  startDaemon,
  startWeb,
  startWorker,
  stopDaemon,
  waitForHttp,
  webEnv,
} from "./lib/web";

const CONNECTIONS = 32;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const BATCH = 100;
const PORT = 3210;
const BARE_PORT = 3211;
const DIST = ".next-test";

const { profile, url, orm, shearId, key: secret } = await benchDatabase("shearwire_bench");
await orm.close(true);

let count = 0;
const program = () => ({
  reference: `BENCH-${process.pid}-${count++}`,
  shear: shearId,
  grade: "A36",
  thickness: { gauge: 10 },
  units: "in",
  sheet: { length: 120, width: 48, count: 2 },
  cuts: [
    { backgauge: 12, count: 3 },
    { turn: true, backgauge: 16, length: 12, count: 7 },
  ],
});

interface Result {
  rps: number;
  /** CPU microseconds per request: the web server's, and the whole machine's (every process, this one too) */
  webCpuUs: number;
  machineCpuUs: number;
  /** the same for the worker, PostgreSQL (all its processes) and Redis */
  workerCpuUs: number;
  postgresCpuUs: number;
  redisCpuUs: number;
  /** the load generator's own (this process: building bodies, reading answers), part of the machine's */
  loadCpuUs: number;
  p50: number;
  p99: number;
  non2xx: number;
  errors: number;
}

/** One stretch of load on one route: what was answered and what each process spent meanwhile. */
interface Window {
  total: number;
  elapsed: number;
  latencies: number[];
  non2xx: number;
  errors: number;
  /** CPU milliseconds spent during the window */
  cpu: { web: number; worker: number; postgres: number; redis: number; machine: number; load: number };
}

async function run(
  path: string,
  method: "GET" | "POST",
  body?: () => object,
  base = `http://127.0.0.1:${PORT}`,
  seconds = SECONDS,
): Promise<Window> {
  const pid = base.endsWith(`:${PORT}`) ? daemonPid(web) : daemonPid(bareServer);
  const workerPid = daemonPid(worker);
  const before = cpuSnapshot();
  const ownBefore = process.cpuUsage();
  const result = await load({
    url: `${base}${path}`,
    connections: CONNECTIONS,
    seconds,
    method,
    headers: { "content-type": "application/json", authorization: `Bearer ${secret}` },
    body,
  });
  const after = cpuSnapshot();
  const own = process.cpuUsage(ownBefore);
  const spent = (ms: (snapshot: typeof before) => number) => ms(after) - ms(before);
  const group = (leader: number | null) => (snapshot: typeof before) => (leader && snapshot.groups.get(leader)) || 0;
  return {
    total: result.total,
    elapsed: result.elapsed,
    latencies: result.latencies,
    non2xx: result.non2xx,
    errors: result.errors,
    cpu: {
      web: spent(group(pid)),
      worker: spent(group(workerPid)),
      postgres: spent((snapshot) => snapshot.postgres),
      redis: spent((snapshot) => snapshot.redis),
      machine: spent((snapshot) => snapshot.machine),
      load: (own.user + own.system) / 1000,
    },
  };
}

/** A route's windows pooled: answers over their summed seconds, percentiles over all their answers, CPU per answer. */
function summarise(windows: Window[]): Result {
  const sum = (of: (w: Window) => number) => windows.reduce((total, w) => total + of(w), 0);
  const answers = sum((w) => w.total);
  const requests = Math.max(1, answers);
  const latencies = windows.flatMap((w) => w.latencies).sort((a, b) => a - b);
  const perRequest = (of: (cpu: Window["cpu"]) => number) => (sum((w) => of(w.cpu)) * 1000) / requests;
  return {
    rps: answers / sum((w) => w.elapsed),
    webCpuUs: perRequest((cpu) => cpu.web),
    machineCpuUs: perRequest((cpu) => cpu.machine),
    workerCpuUs: perRequest((cpu) => cpu.worker),
    postgresCpuUs: perRequest((cpu) => cpu.postgres),
    redisCpuUs: perRequest((cpu) => cpu.redis),
    loadCpuUs: perRequest((cpu) => cpu.load),
    p50: Math.round(percentile(latencies, 0.5)),
    p99: Math.round(percentile(latencies, 0.99)),
    non2xx: sum((w) => w.non2xx),
    errors: sum((w) => w.errors),
  };
}

const env = { ...appEnv(profile, PORT), SHEARWIRE_DIST_DIR: DIST, DATABASE_URL: url };
const only = process.env.BENCH_ONLY ? process.env.BENCH_ONLY.split(",") : undefined;
const wanted = (name: string) => !only || name === "health" || only.includes(name);
const cpuProf = process.env.BENCH_CPU_PROF;
ensureBuild(env, DIST);
const web = daemon(profile.dataRoot, "web-bench");
const worker = daemon(profile.dataRoot, "worker-bench");
const bareServer = daemon(profile.dataRoot, "bare-bench");
for (const d of [web, worker, bareServer]) await stopDaemon(d);
// Profiled processes run as node itself with tsx as a loader: under the tsx command, a wrapper process between them and
// the stop signal, the web server's profile was not written.
const profiled = (dir: string, script: string, ...args: string[]) =>
  ["--cpu-prof", `--cpu-prof-dir=${dir}`, "--import", "tsx", script, ...args] as string[];
if (cpuProf)
  startDaemon(web, process.execPath, profiled(cpuProf, "scripts/web-server.ts", "--port", String(PORT)), webEnv(env));
else await startWeb(web, PORT, env);
if (cpuProf) startDaemon(worker, process.execPath, profiled(`${cpuProf}/worker`, "scripts/worker.ts"), env);
else startWorker(worker, env);
startDaemon(bareServer, "node_modules/.bin/tsx", ["scripts/bench-bare-server.ts", String(BARE_PORT), url], env);
await waitForHttp(`http://127.0.0.1:${PORT}/api/v1/health`, web);
await waitForHttp(`http://127.0.0.1:${BARE_PORT}/`, bareServer);

const results: Partial<Record<string, Result>> & { health?: Result } = {};
try {
  // warm up: fills the pools and the JIT on every route measured
  for (const [route, verb, payload] of [
    ["/api/v1/health", "GET", undefined],
    ["/api/v1/programs/validate", "POST", program],
    ["/api/v1/programs", "POST", program],
  ] as const)
    await run(route, verb, payload, undefined, 3).catch(() => undefined);
  // Each route starts from the same quiet database: the vacuuming and checkpoint the previous route's writes set
  // off would otherwise land in the next one's seconds (the health route's most of all, after the bare INSERTs).
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  const settle = async () => {
    for (let i = 0; i < 40; i++) {
      const { rows } = await db.query(
        "select count(*)::int as n from pg_stat_activity where backend_type = 'autovacuum worker'",
      );
      if (rows[0].n === 0) break;
      await new Promise((r) => setTimeout(r, 500));
    }
    await db.query("checkpoint");
  };
  const windows: Record<string, Window[]> = {};
  const measure = async (
    name: string,
    path: string,
    method: "GET" | "POST",
    body?: () => object,
    base?: string,
    seconds = SECONDS / 2,
  ) => {
    await settle();
    (windows[name] ??= []).push(await run(path, method, body, base, seconds));
  };
  const routes: [name: string, path: string, method: "GET" | "POST", body?: () => object][] = [
    ["health", "/api/v1/health", "GET"],
    ["shears", "/api/v1/shears", "GET"],
    ["validate", "/api/v1/programs/validate", "POST", program],
    ["create", "/api/v1/programs", "POST", program],
    ["batch", "/api/v1/programs/batch", "POST", () => ({ programs: Array.from({ length: BATCH }, program) })],
  ];
  // Each route twice, half the seconds each, the second pass in reverse order (A B C C B A): the machine's speed drifts
  // by a quarter within minutes here, and a ratio of two routes measured one after the other took that drift whole.
  const chosen = routes.filter(([name]) => wanted(name));
  for (const route of [...chosen, ...[...chosen].reverse()]) await measure(...route);
  // last: context only, and its many small writes would disturb the routes measured after it
  if (wanted("bare")) await measure("bare", "/", "POST", program, `http://127.0.0.1:${BARE_PORT}`, SECONDS);
  for (const [name, measured] of Object.entries(windows)) results[name] = summarise(measured);
  await db.end();
} finally {
  // a profiled server writes its profile only on a clean exit: let the requests still in flight end first
  if (cpuProf) await new Promise((r) => setTimeout(r, 10_000));
  for (const d of [web, worker, bareServer]) await stopDaemon(d);
}

const healthRps = results.health!.rps;
const ms = (us: number) => (us / 1000).toFixed(2);
const line = (name: string, result: Result | undefined, extra = "") =>
  result
    ? `  ${name.padEnd(34)} ${result.rps.toFixed(0).padStart(6)} req/s   p50 ${String(result.p50).padStart(5)} ms   p99 ${String(result.p99).padStart(5)} ms   ×health ${(result.rps / healthRps).toFixed(2).padStart(5)}   CPU/req ms: server ${ms(result.webCpuUs)}, worker ${ms(result.workerCpuUs)}, postgres ${ms(result.postgresCpuUs)}, redis ${ms(result.redisCpuUs)}, load generator ${ms(result.loadCpuUs)}, machine ${ms(result.machineCpuUs)}   non-2xx ${result.non2xx}  errors ${result.errors}${extra}`
    : `  ${name.padEnd(34)} (not run)`;
const { create, validate, batch } = results;
const batchPrograms = batch ? batch.rps * BATCH : 0;
const verdict = (ok: boolean) => (ok ? "met" : "NOT met");
const verdicts = [
  create &&
    `create ≥ 0.5 × health: ${(create.rps / healthRps).toFixed(2)} (${verdict(create.rps >= 0.5 * healthRps)}); create p99 ≤ 4 × p50: ${create.p99} vs ${4 * create.p50} ms (${verdict(create.p99 <= 4 * create.p50)})`,
  validate &&
    `validate ≥ 0.8 × health: ${(validate.rps / healthRps).toFixed(2)} (${verdict(validate.rps >= 0.8 * healthRps)})`,
  create &&
    batch &&
    `batch ≥ 10 × single create in programs/s: ${(batchPrograms / create.rps).toFixed(1)} × (${verdict(batchPrograms >= 10 * create.rps)})`,
].filter(Boolean);
console.log(`
API at ${CONNECTIONS} connections, ${SECONDS} s each in two halves, A B C C B A (web server + worker + PostgreSQL + Redis on this machine)
${line("bare node:http INSERT (context)", results.bare)}
${line("GET /api/v1/health (the floor)", results.health)}
${line("GET /api/v1/shears", results.shears)}
${line("POST /api/v1/programs/validate", validate)}
${line("POST /api/v1/programs", create)}
${line(`POST /api/v1/programs/batch (${BATCH})`, batch, `   = ${batchPrograms.toFixed(0)} programs/s`)}
${verdicts.map((v) => `  ${v}`).join("\n")}
`);
process.exit(0);
