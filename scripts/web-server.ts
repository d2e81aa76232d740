/**
 * The web server: Next.js behind a thin Node HTTP server of our own. It exists for what
 * Next cannot do itself: a request with a method that the Fetch standard forbids (TRACE,
 * TRACK, CONNECT) makes Next fail with a 500 before any of our code runs, and other unknown
 * methods get a bare 400. Every method outside the HTTP methods this product serves is
 * answered here with 405, `Allow` and the same security headers as every other response.
 * Likewise a path whose percent-encoding is not UTF-8 (`/programs/%FF`) makes Next fail with
 * a 500; it is answered here with 400. Under /api/v1 a path no operation has is answered with 404,
 * and a method the path does not take with 405 and its `Allow`, both as problem+json (Next
 * would answer an HTML page and an empty body), from the operations list (lib/api/paths.ts).
 * Usage: tsx scripts/web-server.ts --port 3000 (always on 127.0.0.1).
 */
import http from "node:http";
import path from "node:path";
import { parseArgs } from "node:util";
import next from "next";
import { operations } from "../lib/api/operations";
import { apiPaths } from "../lib/api/paths";
import { PROBLEM_TYPES } from "../lib/api/problem-types";
import { SECURITY_HEADERS } from "../lib/security-headers";
import { beginStopping, hostOwnsShutdown, onStopSignal, runStopHooks } from "../lib/shutdown";

const { values } = parseArgs({
  options: {
    port: { type: "string", default: process.env.PORT ?? "3000" },
    host: { type: "string", default: "127.0.0.1" },
  },
});
const port = Number(values.port);
const hostname = values.host!;
const SERVED = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"];
const ALLOW = SERVED.join(", ");
const apiPath = apiPaths(operations);

const app = next({ dev: false, dir: path.resolve(import.meta.dirname, ".."), hostname, port });
await app.prepare();
const handle = app.getRequestHandler();

/** A problem+json answer of one of the API's problem types (status and title from lib/api/problem-types.ts). */
function problem(
  res: http.ServerResponse,
  slug: keyof typeof PROBLEM_TYPES,
  detail: string,
  instance: string,
  headers: Record<string, string> = {},
) {
  const { status, title } = PROBLEM_TYPES[slug];
  res.writeHead(status, {
    ...SECURITY_HEADERS,
    ...headers,
    "Content-Type": "application/problem+json",
    "Cache-Control": "no-store",
  });
  res.end(JSON.stringify({ type: `/problems/${slug}`, title, status, detail, instance: instance.slice(0, 2000) }));
}

/** True when every percent-escape of the path decodes as UTF-8. */
function decodable(path: string): boolean {
  try {
    decodeURIComponent(path);
    return true;
  } catch {
    return false;
  }
}

/** Set once the process begins to stop (below): answers from then on close their connection. */
let stopping = false;
const server = http.createServer((req, res) => {
  const path = (req.url ?? "/").split("?")[0];
  if (!SERVED.includes(req.method ?? "")) {
    problem(res, "method-not-allowed", `${req.method} is not served here; use one of ${ALLOW}.`, path, {
      Allow: ALLOW,
    });
    return;
  }
  if (!decodable(path)) {
    problem(res, "bad-request", "The path has a percent-escape that is not UTF-8.", "/");
    return;
  }
  const reached = apiPath(req.method!, path);
  if (reached.kind === "unknown") {
    problem(res, "unknown-path", "No operation of API v1 has this path; /api/v1/openapi.json lists them all.", path);
    return;
  }
  if (reached.kind === "method-not-allowed") {
    problem(res, "method-not-allowed", `This path takes ${reached.allow}, not ${req.method}.`, path, {
      Allow: reached.allow,
    });
    return;
  }
  // The client address the sign-in throttle counts by: the socket's, unless a proxy in front is trusted to say.
  if (process.env.SHEARWIRE_TRUST_PROXY !== "1") req.headers["x-forwarded-for"] = req.socket.remoteAddress ?? "unknown";
  if (stopping) res.setHeader("Connection", "close");
  void handle(req, res);
});
server.listen(port, hostname, () => console.log(`▲ Shearwire web server on http://${hostname}:${port}`));

// Stopping (SIGTERM or SIGINT; a second one changes nothing): take no new connections, end long waits (a gateway's
// claim answers 204 at once), let the requests in flight finish, closing each connection once its answer is sent, run
// the stop hooks (the request log's last rows), then exit. After 5 s every connection is closed; after 8 s the process
// exits whatever is still running.
hostOwnsShutdown();
const exit = () => void runStopHooks(2_000).finally(() => process.exit(0));
onStopSignal(() => {
  stopping = true;
  beginStopping();
  server.close(exit);
  const idle = setInterval(() => server.closeIdleConnections(), 50);
  idle.unref();
  setTimeout(() => {
    clearInterval(idle);
    server.closeAllConnections();
  }, 5_000).unref();
  setTimeout(() => process.exit(0), 8_000).unref();
});
