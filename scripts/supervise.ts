/**
 * `tsx scripts/supervise.ts <script> [args…]`: keep one of Shearwire's processes running. It runs
 * `tsx <script> [args…]` and, when that process dies (killed, crashed, or ended by itself), starts it again:
 * at once if it had run for a while, else after a delay that doubles up to 30 s, so a process that cannot
 * start does not spin. A stop signal (SIGTERM, SIGINT) is passed on and ends both, without a restart.
 * `npm run up` runs the web server and the worker this way; `npm run down` stops them.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";

const [script, ...args] = process.argv.slice(2);
if (!script) {
  console.error("usage: tsx scripts/supervise.ts <script> [args…]");
  process.exit(2);
}
const tsx = path.join(import.meta.dirname, "..", "node_modules", ".bin", "tsx");
const name = path.basename(script, path.extname(script));
/** a process that ran at least this long before it died is started again at once */
const STEADY_MS = 10_000;
const MAX_DELAY_MS = 30_000;

let child: ChildProcess | undefined;
let stopping = false;
let delayMs = 1_000;

function start() {
  const started = Date.now();
  child = spawn(tsx, [script, ...args], { stdio: "inherit" });
  child.on("exit", (code, signal) => {
    if (stopping) process.exit(code ?? 0);
    const steady = Date.now() - started >= STEADY_MS;
    if (steady) delayMs = 1_000;
    const wait = steady ? 0 : delayMs;
    if (!steady) delayMs = Math.min(delayMs * 2, MAX_DELAY_MS);
    console.log(
      `[supervise] ${new Date().toISOString()} ${name} ended (${signal ?? `exit code ${code}`}); starting it again${
        wait ? ` in ${wait / 1000} s` : ""
      }`,
    );
    setTimeout(start, wait);
  });
}

for (const sig of ["SIGTERM", "SIGINT"] as const) {
  process.on(sig, () => {
    stopping = true;
    if (!child || child.exitCode !== null || child.signalCode !== null) process.exit(0);
    child.kill(sig);
    // the process finishes what it has in flight; if it does not end, leave it to the caller's SIGKILL
    setTimeout(() => process.exit(1), 15_000).unref();
  });
}

start();
