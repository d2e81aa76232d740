/**
 * `npm test`: start the suite's own PostgreSQL and Redis with throw-away data, build the
 * app into .next-test, run every test, stop everything, and print the totals alone on the
 * last line as `N passed, N failed`.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { appEnv } from "./lib/env";
import { findChromium, startAll, stopAll, testProfile } from "./lib/services";
import { buildApp } from "./lib/web";

const root = path.resolve(import.meta.dirname, "..");
const profile = testProfile();
const report = path.join(root, "tests", "artifacts", "vitest.json");

function countResults(): { passed: number; failed: number } {
  if (!existsSync(report)) return { passed: 0, failed: 1 };
  const json = JSON.parse(readFileSync(report, "utf8"));
  // A file that failed to load has no test results but is a failure all the same.
  const brokenFiles = (json.testResults ?? []).filter(
    (file: { status: string; assertionResults: unknown[] }) =>
      file.status === "failed" && file.assertionResults.length === 0,
  ).length;
  return { passed: json.numPassedTests ?? 0, failed: (json.numFailedTests ?? 0) + brokenFiles };
}

async function main(): Promise<number> {
  // Throw-away: nothing from an earlier run survives.
  await stopAll(profile).catch(() => undefined);
  rmSync(profile.dataRoot, { recursive: true, force: true });
  rmSync(report, { force: true });
  mkdirSync(path.dirname(report), { recursive: true });
  let totals = { passed: 0, failed: 1 };
  let status = 1;
  try {
    findChromium(); // the browser tests drive Debian's Chromium
    await startAll(profile);
    const env = { ...appEnv(profile, 3100), SHEARWIRE_DIST_DIR: ".next-test" };
    console.log("[test] building the app into .next-test");
    rmSync(path.join(root, ".next-test"), { recursive: true, force: true }); // a clean build, nothing stale
    buildApp(env);
    const vitest = spawnSync(
      path.join(root, "node_modules", ".bin", "vitest"),
      ["run", "--reporter=default", "--reporter=json", `--outputFile.json=${report}`, ...process.argv.slice(2)],
      { cwd: root, stdio: "inherit", env: { ...process.env, SHEARWIRE_KEEP_SERVICES: "1" } },
    );
    totals = countResults();
    status = vitest.status === 0 && totals.failed === 0 ? 0 : 1;
  } catch (err) {
    console.error(`[test] ${(err as Error).message}`);
  } finally {
    await stopAll(profile).catch((err) => console.error(`[test] stopping services: ${err.message}`));
    rmSync(profile.dataRoot, { recursive: true, force: true });
  }
  console.log(`${totals.passed} passed, ${totals.failed} failed`);
  return status;
}

process.exit(await main());
