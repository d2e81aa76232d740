/**
 * The floors of the code (DEVELOPERS.md, "Layout"), checked by dependency-cruiser with the
 * project's own rules: nothing imports a floor above it, and nothing imports itself round a
 * cycle. A deliberately broken little tree proves the rules catch both.
 */
import { execFileSync } from "node:child_process";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(__dirname, "../..");
const CONFIG = path.join(ROOT, ".dependency-cruiser.cjs");
const BIN = path.join(ROOT, "node_modules/.bin/depcruise");

interface Violation {
  rule: { name: string };
  from: string;
  to: string;
}

function cruise(cwd: string, targets: string[]): Violation[] {
  let out: string;
  try {
    out = execFileSync(BIN, [...targets, "--config", CONFIG, "--output-type", "json"], {
      cwd,
      encoding: "utf8",
      maxBuffer: 64 * 1024 * 1024,
    });
  } catch (err) {
    out = (err as { stdout: string }).stdout; // exit code 1 when violations are found
  }
  return (JSON.parse(out) as { summary: { violations: Violation[] } }).summary.violations;
}

describe("floors", () => {
  it("hold in the code: no upward import and no cycle", () => {
    const violations = cruise(ROOT, [
      "lib",
      "entities",
      "migrations",
      "app",
      "components",
      "scripts",
      "tests",
      "proxy.ts",
    ]);
    expect(violations.map((v) => `${v.rule.name}: ${v.from} → ${v.to}`)).toEqual([]);
  }, 60_000);

  it("catch an upward import and a cycle when someone adds one", () => {
    const violations = cruise(path.join(ROOT, "tests/fixtures/floors"), ["lib"]);
    const seen = violations.map((v) => `${v.rule.name}: ${v.from} → ${v.to}`);
    expect(seen).toContain("floor-lib-shear: lib/shear/upward.ts → lib/services/orders.ts");
    expect(seen).toEqual(
      expect.arrayContaining([expect.stringMatching(/^no-cycles: lib\/planner\/[ab]\.ts → lib\/planner\/[ab]\.ts$/)]),
    );
  }, 60_000);
});
