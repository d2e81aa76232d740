/**
 * zod's issues as problem+json errors (`zodErrors`): a value that fits none of a union's forms is
 * told what is wrong with it, not only zod's "Invalid input".
 */
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { zodErrors } from "../../lib/api/route-input";
import { PlanInputSchema } from "../../lib/schemas/plan";
import { ThicknessSchema } from "../../lib/schemas/program";

const errorsFor = (thickness: unknown) => {
  const result = z.object({ thickness: ThicknessSchema }).safeParse({ thickness });
  expect(result.success).toBe(false);
  return zodErrors("body", result.error!);
};

describe("errors for a union (a thickness: a value or a gauge)", () => {
  it("names what each form lacks and what it does not know", () => {
    expect(errorsFor({ mm: 3 })).toEqual([
      {
        location: "body",
        pointer: "/thickness",
        message:
          'fits none of its 2 accepted forms: (1) "value" required, unknown "mm"; (2) "gauge" required, unknown "mm"',
      },
    ]);
    expect(errorsFor({ value: 3, gauge: 2 })[0].message).toBe(
      'fits none of its 2 accepted forms: (1) unknown "gauge"; (2) unknown "value"',
    );
  });

  it("points inside the one form whose shape fits", () => {
    expect(errorsFor({ gauge: 1.5 })).toEqual([
      { location: "body", pointer: "/thickness/gauge", message: "Invalid input: expected int, received number" },
    ]);
    expect(errorsFor({ value: -1 })).toEqual([
      { location: "body", pointer: "/thickness/value", message: "Too small: expected number to be >0" },
    ]);
  });

  it("says once what every form says alike", () => {
    expect(errorsFor(3)).toEqual([
      { location: "body", pointer: "/thickness", message: "Invalid input: expected object, received number" },
    ]);
  });

  it("leaves other issues as zod words them", () => {
    const result = z.object({ count: z.number().int() }).safeParse({ count: "x" });
    expect(zodErrors("query", result.error!)).toEqual([
      { location: "query", pointer: "/count", message: "Invalid input: expected number, received string" },
    ]);
  });
});

describe("errors for a plan's stock (the stock on hand, or sizes)", () => {
  const stockErrors = (stock: unknown) => {
    const result = z.object({ stock: PlanInputSchema.shape.stock }).safeParse({ stock });
    expect(result.success).toBe(false);
    return zodErrors("body", result.error!);
  };

  it("points at the size that is wrong when sizes were sent", () => {
    const errors = stockErrors([{ length: 120, width: -48 }]);
    expect(errors.map((e) => e.pointer)).toEqual(["/stock/0/width"]);
  });

  it("names both forms for anything else", () => {
    const [error] = stockErrors("on hand");
    expect(error.pointer).toBe("/stock");
    expect(error.message).toMatch(/^fits none of its 2 accepted forms: \(1\) .*"on_hand".*; \(2\) .*array/);
  });
});
