/**
 * API benchmark (part of `npm run bench`): throughput and p99 latency of POST /api/v1/programs
 * at 32 connections (autocannon) against the built app and real PostgreSQL, next to a bare
 * node:http server doing one INSERT into the same database in the same run. Target: the API
 * reaches at least 0.6 of the bare baseline. Not a test: it reports, it does not fail.
 */
import http from "node:http";
import autocannon from "autocannon";
import pg from "pg";
import { benchDatabase } from "./lib/bench-setup";
import { appEnv } from "./lib/env";
import { buildApp, daemon, startWeb, stopDaemon, waitForHttp } from "./lib/web";

const CONNECTIONS = 32;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const PORT = 3210;
const BARE_PORT = 3211;
const DIST = ".next-test";

const { profile, url, orm, shearId, key: secret } = await benchDatabase("shearwire_bench");
await orm.close(true);
const shear = { id: shearId };

let n = 0;
const program = () =>
  JSON.stringify({
    reference: `BENCH-${process.pid}-${n++}`,
    shear: shear.id,
    grade: "A36",
    thickness: { gauge: 10 },
    units: "in",
    sheet: { length: 120, width: 48, count: 2 },
    cuts: [
      { backgauge: 12, count: 3 },
      { turn: true, backgauge: 16, length: 12, count: 7 },
    ],
  });

async function run(target: string, headers: Record<string, string>) {
  const result = await autocannon({
    url: target,
    connections: CONNECTIONS,
    duration: SECONDS,
    method: "POST",
    headers: { "content-type": "application/json", ...headers },
    requests: [{ setupRequest: (req) => ({ ...req, body: program() }) }],
  });
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors,
  };
}

// The app, built and served as `npm test` does.
const env = { ...appEnv(profile, PORT), SHEARWIRE_DIST_DIR: DIST, DATABASE_URL: url };
if (process.env.BENCH_REBUILD === "1") buildApp(env);
const web = daemon(profile.dataRoot, "web-bench");
await stopDaemon(web);
await startWeb(web, PORT, env);
await waitForHttp(`http://127.0.0.1:${PORT}/api/v1/health`, web);
// warm up the route (first request compiles nothing in production, but fills pools and caches)
await run(`http://127.0.0.1:${PORT}/api/v1/programs`, { authorization: `Bearer ${secret}` }).catch(() => undefined);
const api = await run(`http://127.0.0.1:${PORT}/api/v1/programs`, { authorization: `Bearer ${secret}` });
await stopDaemon(web);

// The baseline: node:http with one INSERT per request into the same database.
const pool = new pg.Pool({ connectionString: url, max: 10 });
await pool.query(
  "create table if not exists bench_bare (id bigserial primary key, body jsonb not null, created_at timestamptz not null default now())",
);
const bare = http.createServer((req, res) => {
  let body = "";
  req.on("data", (c) => (body += c));
  req.on("end", async () => {
    await pool.query("insert into bench_bare (body) values ($1)", [body]);
    res.writeHead(201, { "content-type": "application/json" }).end('{"ok":true}');
  });
});
await new Promise<void>((r) => bare.listen(BARE_PORT, "127.0.0.1", r));
const baseline = await run(`http://127.0.0.1:${BARE_PORT}/`, {});
bare.close();
await pool.end();

const ratio = api.rps / baseline.rps;
console.log(`
POST /api/v1/programs, ${CONNECTIONS} connections, ${SECONDS} s (check + store + outbox event + request log)
  Shearwire API     ${api.rps.toFixed(0).padStart(6)} req/s   p50 ${api.p50} ms   p99 ${api.p99} ms   non-2xx ${api.non2xx}   errors ${api.errors}
  bare node:http    ${baseline.rps.toFixed(0).padStart(6)} req/s   p50 ${baseline.p50} ms   p99 ${baseline.p99} ms   (one INSERT)
  ratio             ${ratio.toFixed(2)}   (target ≥ 0.60: ${ratio >= 0.6 ? "met" : "NOT met"})
`);
process.exit(0);
