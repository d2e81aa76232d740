import { describe, expectTypeOf, it } from "vitest";
import {
  checkProgram,
  GRADE_LIBRARY,
  type CheckResult,
  type CutProgram,
  type Finding,
  type GradeProfile,
  type SetupValue,
  type ShearProfile,
} from "@/lib/shear";
import { DEMO_SHEAR, WORKED_EXAMPLE } from "./fixtures";

describe("public types", () => {
  it("the seed library, demo shear and worked example have the exported shapes", () => {
    expectTypeOf(GRADE_LIBRARY).toEqualTypeOf<readonly GradeProfile[]>();
    expectTypeOf(DEMO_SHEAR).toMatchTypeOf<ShearProfile>();
    expectTypeOf(WORKED_EXAMPLE).toMatchTypeOf<CutProgram>();
  });

  it("checkProgram returns a CheckResult with typed findings and setup values", () => {
    expectTypeOf(checkProgram).returns.toEqualTypeOf<CheckResult>();
    expectTypeOf<CheckResult["findings"][number]>().toEqualTypeOf<Finding>();
    expectTypeOf<Finding["severity"]>().toEqualTypeOf<"error" | "warning">();
    expectTypeOf<SetupValue["source"]>().toEqualTypeOf<"computed" | "given">();
    expectTypeOf<CheckResult["validation"]>().toEqualTypeOf<"pass" | "warn" | "fail">();
  });
});
