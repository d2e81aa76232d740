/**
 * `scripts/supervise.ts` (how `npm run up` runs the web server and the worker): a process killed
 * mid-work is started again; a stop signal ends both without a restart.
 */
import { spawn } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";
import { pidAlive } from "../../scripts/lib/services";

describe("supervise", () => {
  it("starts a killed process again, and stops it with itself on SIGTERM", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "supervise-"));
    const pids = path.join(dir, "pids");
    const script = path.join(dir, "busy.mjs");
    // a stand-in for the worker: notes its pid, then works until stopped
    writeFileSync(
      script,
      `import { appendFileSync } from "node:fs";
       appendFileSync(${JSON.stringify(pids)}, process.pid + "\\n");
       process.on("SIGTERM", () => { appendFileSync(${JSON.stringify(pids)}, "stopped\\n"); process.exit(0); });
       setInterval(() => {}, 1000);`,
    );
    // its own process group, so that a failed run can end it and everything it started
    const supervisor = spawn("node_modules/.bin/tsx", ["scripts/supervise.ts", script], {
      stdio: ["ignore", "pipe", "pipe"],
      detached: true,
    });
    let out = "";
    supervisor.stdout.on("data", (d) => (out += d));
    const started = () =>
      readFileSync(pids, "utf8")
        .split("\n")
        .filter((l) => /^\d+$/.test(l))
        .map(Number);
    try {
      await vi.waitFor(() => expect(started()).toHaveLength(1), { timeout: 20_000, interval: 100 });
      const [first] = started();
      process.kill(first, "SIGKILL");
      await vi.waitFor(() => expect(started()).toHaveLength(2), { timeout: 20_000, interval: 100 });
      const [, second] = started();
      expect(second).not.toBe(first);
      expect(pidAlive(second)).toBe(true);
      // tsx, between the supervisor and the script, reports a death by SIGKILL as exit code 137 (128 + 9)
      expect(out).toMatch(/busy ended \((SIGKILL|exit code 137)\); starting it again/);
      // a stop signal reaches the process, which ends cleanly, and nothing is started again
      const exited = new Promise<number | null>((resolve) => supervisor.on("exit", (code) => resolve(code)));
      supervisor.kill("SIGTERM");
      expect(await exited).toBe(0);
      expect(readFileSync(pids, "utf8")).toMatch(/stopped\n$/);
      await new Promise((r) => setTimeout(r, 1_500));
      expect(started()).toHaveLength(2);
      expect(pidAlive(second)).toBe(false);
    } finally {
      try {
        process.kill(-supervisor.pid!, "SIGKILL");
      } catch {
        // ended already
      }
    }
  });
});
