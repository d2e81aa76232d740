/**
 * The benchmark's context line: a bare node:http server that INSERTs each request's body into
 * PostgreSQL and answers 201, run as a process of its own so the load generator never shares
 * a process with a server it measures. Usage: tsx scripts/bench-bare-server.ts <port> <database url>
 */
import http from "node:http";
import pg from "pg";

const [port, url] = process.argv.slice(2);
const pool = new pg.Pool({ connectionString: url, max: 10 });
await pool.query(
  "create table if not exists bench_bare (id bigserial primary key, body jsonb not null, created_at timestamptz not null default now())",
);
http
  .createServer((req, res) => {
    if (req.method !== "POST") return void res.writeHead(200).end("ok");
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", async () => {
      await pool.query("insert into bench_bare (body) values ($1)", [body]);
      res.writeHead(201, { "content-type": "application/json" }).end('{"ok":true}');
    });
  })
  .listen(Number(port), "127.0.0.1");
