import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { pidAlive, portInUse, ServiceError } from "./services";

const root = path.resolve(import.meta.dirname, "..", "..");
const bin = (name: string) => path.join(root, "node_modules", ".bin", name);

/** A long-running process of ours (web server, worker …) started in the background with a pid file. */
export interface Daemon {
  name: string;
  pidFile: string;
  logFile: string;
}

export function daemon(dataRoot: string, name: string): Daemon {
  return { name, pidFile: path.join(dataRoot, `${name}.pid`), logFile: path.join(dataRoot, "logs", `${name}.log`) };
}

/** The daemon's process id (it leads its own process group), or null when it has none. */
export function daemonPid(service: Daemon): number | null {
  if (!existsSync(service.pidFile)) return null;
  const pid = Number(readFileSync(service.pidFile, "utf8"));
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

export function daemonRunning(service: Daemon): boolean {
  return pidAlive(daemonPid(service));
}

export function startDaemon(service: Daemon, cmd: string, args: string[], env: NodeJS.ProcessEnv): number {
  mkdirSync(path.dirname(service.logFile), { recursive: true });
  const out = openSync(service.logFile, "a");
  const child = spawn(cmd, args, { cwd: root, env, detached: true, stdio: ["ignore", out, out] });
  child.unref();
  writeFileSync(service.pidFile, String(child.pid));
  return child.pid!;
}

/** Stop a daemon and its children (it leads its own process group). */
export async function stopDaemon(service: Daemon): Promise<"stopped" | "not running"> {
  const pid = daemonPid(service);
  if (!pidAlive(pid)) {
    rmSync(service.pidFile, { force: true });
    return "not running";
  }
  const signal = (sig: NodeJS.Signals) => {
    try {
      process.kill(-pid!, sig);
    } catch {
      try {
        process.kill(pid!, sig);
      } catch {
        /* gone */
      }
    }
  };
  signal("SIGTERM");
  for (let i = 0; i < 100 && pidAlive(pid); i++) await new Promise((r) => setTimeout(r, 100));
  if (pidAlive(pid)) signal("SIGKILL");
  rmSync(service.pidFile, { force: true });
  return "stopped";
}

export function buildApp(env: NodeJS.ProcessEnv) {
  const build = spawnSync(bin("next"), ["build"], { cwd: root, env, stdio: "inherit" });
  if (build.status !== 0) throw new ServiceError("next build failed");
}

/**
 * The benchmarks' build: the last one in `distDir` (the tests' build), made when there is none (a fresh clone) or
 * when `BENCH_REBUILD=1` asks for a new one.
 */
export function ensureBuild(env: NodeJS.ProcessEnv, distDir: string) {
  if (process.env.BENCH_REBUILD === "1" || !existsSync(path.join(root, distDir, "BUILD_ID"))) buildApp(env);
}

/**
 * V8 flags for the web server: a larger young generation (32 MB semi-spaces, 16 MB by default on this Node). Each
 * request allocates its body, JSON and answer and drops them; with room for more of them, fewer collections run and
 * fewer short-lived objects are copied into the old generation. Measured with `scripts/bench-api.ts` on 2 cores, two
 * runs each way: the web server's CPU per health request 1.95–2.33 → 1.42–1.77 ms, per create 2.40–2.63 → 2.06–2.11 ms
 * (health 482–570 → 627–785 req/s, create 381–417 → 464–474); a batch of 100 unchanged (~20 ms). Flags set in
 * NODE_OPTIONS come after these, so they can override them.
 */
export const WEB_NODE_OPTIONS = "--max-semi-space-size=32";

export function webEnv(env: NodeJS.ProcessEnv): NodeJS.ProcessEnv {
  return { ...env, NODE_OPTIONS: [WEB_NODE_OPTIONS, env.NODE_OPTIONS].filter(Boolean).join(" ") };
}

/** Run `script` (with `args`) as a daemon; `supervised`, under `scripts/supervise.ts`, which starts it again when it dies. */
function startScript(
  service: Daemon,
  script: string,
  args: string[],
  env: NodeJS.ProcessEnv,
  { supervised = false }: { supervised?: boolean } = {},
) {
  const target = [path.join(root, "scripts", script), ...args];
  return startDaemon(
    service,
    bin("tsx"),
    supervised ? [path.join(root, "scripts", "supervise.ts"), ...target] : target,
    env,
  );
}

export async function startWeb(
  service: Daemon,
  port: number,
  env: NodeJS.ProcessEnv,
  options: { supervised?: boolean } = {},
) {
  if (await portInUse(port)) {
    throw new ServiceError(`port ${port} on 127.0.0.1 is busy with another program; stop it or set PORT`);
  }
  startScript(service, "web-server.ts", ["--port", String(port)], webEnv(env), options);
}

/** The worker process (webhooks, sweepers) in the background. */
export function startWorker(service: Daemon, env: NodeJS.ProcessEnv, options: { supervised?: boolean } = {}) {
  return startScript(service, "worker.ts", [], env, options);
}

/** The fake SMTP server and its inbox page, in the background. */
export async function startMail(
  service: Daemon,
  mail: { smtpPort: number; httpPort: number; dir: string },
  env: NodeJS.ProcessEnv,
) {
  for (const port of [mail.smtpPort, mail.httpPort]) {
    if (await portInUse(port))
      throw new ServiceError(
        `port ${port} on 127.0.0.1 is busy with another program; the fake mail server cannot start there`,
      );
  }
  startDaemon(
    service,
    bin("tsx"),
    [
      path.join(root, "scripts", "mail-server.ts"),
      "--smtp",
      String(mail.smtpPort),
      "--http",
      String(mail.httpPort),
      "--dir",
      mail.dir,
    ],
    env,
  );
  await waitForHttp(`http://127.0.0.1:${mail.httpPort}/messages`, service, 30_000);
}

/** Wait until GET url answers 2xx, or fail with the daemon's log path. */
export async function waitForHttp(url: string, service: Daemon | null, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  let last = "no answer";
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
      last = `HTTP ${res.status}: ${(await res.text()).slice(0, 300)}`;
    } catch (err) {
      last = (err as Error).message;
    }
    if (service && !daemonRunning(service)) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new ServiceError(`${url} did not come up (${last})${service ? `; see ${service.logFile}` : ""}`);
}
