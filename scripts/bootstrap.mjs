#!/usr/bin/env node
// Entry point of `npm run up`, `npm run down` and `npm test` on a fresh clone: it needs
// nothing but Node and npm. It installs the dependencies when they are missing or older
// than package-lock.json, then hands over to the TypeScript script of the same name.
import { spawnSync } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const [command, ...rest] = process.argv.slice(2);
const scripts = { up: "up.ts", down: "down.ts", test: "test.ts" };
if (!scripts[command]) {
  console.error(`usage: node scripts/bootstrap.mjs ${Object.keys(scripts).join("|")}`);
  process.exit(2);
}

const mtime = (p) => (existsSync(p) ? statSync(p).mtimeMs : 0);
const installed = path.join(root, "node_modules", ".package-lock.json");
if (!existsSync(installed)) {
  console.log("[setup] installing dependencies (npm ci)");
  const r = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
} else if (mtime(path.join(root, "package-lock.json")) > mtime(installed)) {
  console.log("[setup] package-lock.json changed: updating dependencies (npm install)");
  const r = spawnSync("npm", ["install", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

const tsx = path.join(root, "node_modules", ".bin", "tsx");
const r = spawnSync(tsx, [path.join(root, "scripts", scripts[command]), ...rest], {
  cwd: root,
  stdio: "inherit",
  env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
});
process.exit(r.status ?? 1);
