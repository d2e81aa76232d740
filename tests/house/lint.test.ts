/**
 * The house rules run as part of the suite: ESLint (Next.js's rules and typescript-eslint's),
 * Prettier's format check, and knip (no unused files, exports or dependencies). Each runs
 * the project's own configuration over the whole tree, as `npm run lint` does.
 */
import { spawnSync } from "node:child_process";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(__dirname, "../..");

function run(bin: string, args: string[]) {
  const r = spawnSync(path.join(ROOT, "node_modules/.bin", bin), args, {
    cwd: ROOT,
    encoding: "utf8",
    maxBuffer: 64 * 1024 * 1024,
  });
  return { status: r.status, output: `${r.stdout}\n${r.stderr}`.trim() };
}

describe("house rules", () => {
  it("ESLint finds no error", () => {
    const r = run("eslint", [".", "--quiet"]);
    expect(r.output).toBe("");
    expect(r.status).toBe(0);
  }, 180_000);

  it("every file is formatted by Prettier", () => {
    const r = run("prettier", ["--check", ".", "--log-level", "warn"]);
    expect(r.output).toBe("");
    expect(r.status).toBe(0);
  }, 120_000);

  it("knip finds no unused file, export or dependency", () => {
    const r = run("knip", ["--no-progress"]);
    expect(r.output).toBe("");
    expect(r.status).toBe(0);
  }, 120_000);
});
