/**
 * Types the compiler must hold: the whole project type-checks, the shear core's result fits
 * the API's schema of a check (what is stored and served is what the core computes), and a
 * route handler returning a body of the wrong shape does not compile.
 */
import { spawnSync } from "node:child_process";
import path from "node:path";
import { describe, expect, expectTypeOf, it } from "vitest";
import { defineOperation, type ReplyOf } from "../../lib/api/operation";
import type { CheckT } from "../../lib/schemas/check";
import { ShearSchema } from "../../lib/schemas/shear";
import type { CheckResult } from "../../lib/shear";

const ROOT = path.resolve(__dirname, "../..");

const readShear = defineOperation({
  operationId: "typeProbe",
  method: "get",
  path: "/probe",
  summary: "A probe for the type test",
  tags: ["probe"],
  scope: null,
  responses: { 200: { description: "a shear", schema: ShearSchema } },
});
type ProbeReply = ReplyOf<typeof readShear.responses>;

describe("types", () => {
  it("the core's check result fits the API's Check schema", () => {
    expectTypeOf<CheckResult>().toExtend<CheckT>();
  });

  it("a handler's reply is typed by its operation's success responses", () => {
    expectTypeOf<{ body: { name: number } }>().not.toExtend<ProbeReply>();
    expectTypeOf<{ status: 201; body: undefined }>().not.toExtend<ProbeReply>();
    expectTypeOf<{ status: 200 }>().toExtend<ProbeReply>();
    expect(Object.keys(readShear.responses)).toEqual(["200"]);
  });

  it("the whole project type-checks (tsc --noEmit)", () => {
    const r = spawnSync(path.join(ROOT, "node_modules/.bin/tsc"), ["--noEmit", "-p", "."], {
      cwd: ROOT,
      encoding: "utf8",
    });
    expect(r.stdout + r.stderr).toBe("");
    expect(r.status).toBe(0);
  }, 180_000);
});
