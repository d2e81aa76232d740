/**
 * API benchmark (part of `npm run bench`): throughput and p99 latency of POST /api/v1/programs
 * at 32 connections (autocannon) against the built app and real PostgreSQL, next to a bare
 * node:http server doing one INSERT into the same database in the same run. Target: the API
 * reaches at least 0.6 of the bare baseline. Not a test: it reports, it does not fail.
 */
import http from "node:http";
import autocannon from "autocannon";
import { MikroORM } from "@mikro-orm/postgresql";
import pg from "pg";
import { Grade, Shear, Shop } from "../entities";
import { SCOPES } from "../entities/ApiKey";
import { ormConfig } from "../lib/db/config";
import { migrateUp } from "../lib/db/migrate";
import { createKey } from "../lib/services/keys";
import { GRADE_LIBRARY } from "../lib/shear/grades";
import { appEnv } from "./lib/env";
import { databaseUrl, startAll, testProfile } from "./lib/services";
import { buildApp, daemon, startWeb, stopDaemon, waitForHttp } from "./lib/web";

const CONNECTIONS = 32;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const PORT = 3210;
const BARE_PORT = 3211;
const DIST = ".next-test";

const profile = testProfile();
process.env.SHEARWIRE_QUIET = "1";
await startAll(profile);
const admin = new pg.Client({ connectionString: databaseUrl({ ...profile.pg, database: "postgres" }) });
await admin.connect();
await admin.query('drop database if exists "shearwire_bench" with (force)');
await admin.query('create database "shearwire_bench"');
await admin.end();
const url = databaseUrl({ ...profile.pg, database: "shearwire_bench" });

const orm = await MikroORM.init(ormConfig(url));
await migrateUp(orm);
const em = orm.em.fork();
const shop = em.create(Shop, { name: "Bench shop", slug: "bench" });
const shear = em.create(Shear, {
  shop, name: "Bench shear", ratedThicknessMm: 6.35, ratedTensileMpa: 414, ratedRakeDeg: 1.5, bladeLengthMm: 3100,
  backgaugeMinMm: 5, backgaugeMaxMm: 1000, rakeMinDeg: 0.5, rakeMaxDeg: 2.5, gapMinMm: 0.03, gapMaxMm: 1,
  strokesPerMin: 30, backgaugeSpeedMmPerS: 250, handlingSecondsPerTurn: 6, handlingSecondsPerSheet: 30,
});
for (const g of GRADE_LIBRARY) {
  em.create(Grade, {
    shop, code: g.code, name: g.name ?? g.code, family: g.family, standard: g.standard, yieldMpa: g.yieldMpa,
    tensileMinMpa: g.tensileMinMpa, tensileTypicalMpa: g.tensileTypicalMpa, valuesAreTypical: g.valuesAreTypical,
    shearTensileRatio: g.shearTensileRatio, gaugeFamily: g.gaugeFamily, hardnessHb: g.hardnessHb,
  });
}
await em.flush();
const { secret } = await createKey(em, shop.id, { name: "bench", scopes: [...SCOPES], rateLimitPerMin: 10_000_000 });
await orm.close(true);

let n = 0;
const program = () => JSON.stringify({
  reference: `BENCH-${process.pid}-${n++}`, shear: shear.id, grade: "A36", thickness: { gauge: 10 }, units: "in",
  sheet: { length: 120, width: 48, count: 2 },
  cuts: [{ backgauge: 12, count: 3 }, { turn: true, backgauge: 16, length: 12, count: 7 }],
});

async function run(target: string, headers: Record<string, string>) {
  const result = await autocannon({
    url: target, connections: CONNECTIONS, duration: SECONDS, method: "POST",
    headers: { "content-type": "application/json", ...headers },
    requests: [{ setupRequest: (req) => ({ ...req, body: program() }) }],
  });
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, non2xx: result.non2xx, errors: result.errors };
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
await pool.query("create table if not exists bench_bare (id bigserial primary key, body jsonb not null, created_at timestamptz not null default now())");
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
