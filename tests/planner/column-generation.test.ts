/**
 * Planning all sheets together: the stated lower bound against the LP over every two-stage
 * pattern (enumerated, solved by HiGHS) and against a textbook cutting-stock example; and the
 * plan's promises about its bound, its method, its progress reports and its reproducibility.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planBlanks, type Blank, type Plan, type PlanProgress, type Stock } from "../../lib/planner/plan";
import { allPatterns, lpOverAllPatterns, type Piece } from "./brute-force";

/** Two-stage plan checks every test here needs: the bound is a bound, and "fewest" means it is met. */
function checkBound(plan: Plan) {
  expect(plan.lowerBound).toBeLessThanOrEqual(plan.sheetsUsed);
  expect(plan.lowerBound).toBeGreaterThanOrEqual(plan.bounds.area);
  if (plan.bounds.lp !== null) expect(plan.lowerBound).toBeGreaterThanOrEqual(plan.bounds.lp);
  expect(plan.provenFewest).toBe(plan.sheetsUsed === plan.lowerBound);
}

describe("the lower bound a plan states", () => {
  it("the cutting-stock example of Chvátal's Linear Programming: rolls of 100 cut into 97 × 45, 610 × 36, 395 × 31 and 211 × 14 need 452.25 rolls by LP (from memory; the same by enumeration and HiGHS), so 453", async () => {
    const lengths = [45, 36, 31, 14];
    const demand = [97, 610, 395, 211];
    const enumerated = await lpOverAllPatterns(
      lengths.map((length, blank) => ({ blank, length, width: 10, value: 1 })),
      { length: 100, width: 10 },
      demand,
    );
    expect(enumerated).toBeCloseTo(452.25, 6);
    const plan = await planBlanks(
      [{ length: 100, width: 10, count: null }],
      lengths.map((length, index) => ({
        label: `${length}`,
        length,
        width: 10,
        quantity: demand[index],
        canTurn: false,
      })),
    );
    checkBound(plan);
    expect(plan.bounds.lp).toBe(453);
    expect(plan.sheetsUsed).toBe(453);
    expect(plan.provenFewest).toBe(true);
  });

  it("never above the LP over every two-stage pattern (enumerated, solved by HiGHS), and the plan never below that LP rounded up (property)", async () => {
    const instance = fc.record({
      sheet: fc.record({ length: fc.integer({ min: 8, max: 16 }), width: fc.integer({ min: 6, max: 12 }) }),
      blanks: fc.array(
        fc.record({
          length: fc.integer({ min: 3, max: 10 }),
          width: fc.integer({ min: 2, max: 8 }),
          quantity: fc.integer({ min: 1, max: 9 }),
        }),
        { minLength: 1, maxLength: 4 },
      ),
    });
    await fc.assert(
      fc.asyncProperty(instance, async ({ sheet, blanks }) => {
        const fitting = blanks.filter((blank) => blank.length <= sheet.length && blank.width <= sheet.width);
        if (!fitting.length) return;
        const pieces: Piece[] = fitting.map((blank, index) => ({
          blank: index,
          length: blank.length,
          width: blank.width,
          value: 1,
        }));
        const demand = fitting.map((blank) => blank.quantity);
        const reference = Math.ceil((await lpOverAllPatterns(pieces, sheet, demand)) - 1e-6);
        const plan = await planBlanks(
          [{ ...sheet, count: null }],
          fitting.map((blank, index) => ({ label: `b${index}`, ...blank, canTurn: false })),
        );
        checkBound(plan);
        expect(plan.unplaced).toEqual([]);
        if (plan.bounds.lp !== null) expect(plan.bounds.lp).toBeLessThanOrEqual(reference);
        expect(plan.sheetsUsed).toBeGreaterThanOrEqual(reference);
        expect(allPatterns(pieces, sheet, demand).length).toBeGreaterThan(0);
      }),
      { numRuns: 40, seed: 13 },
    );
  });

  it("holds for any stock and options, and says it is the fewest exactly when it meets the bound (property)", async () => {
    const blank = fc.record({
      label: fc.constant("b"),
      length: fc.integer({ min: 5, max: 90 }),
      width: fc.integer({ min: 5, max: 60 }),
      quantity: fc.integer({ min: 0, max: 15 }),
      canTurn: fc.boolean(),
    });
    const sheet = fc.record({
      length: fc.integer({ min: 40, max: 150 }),
      width: fc.integer({ min: 30, max: 100 }),
      count: fc.option(fc.integer({ min: 0, max: 8 }), { nil: null }),
    });
    const objective = fc.constantFrom("fewest_sheets", "least_waste", "fewest_strokes") as fc.Arbitrary<
      "fewest_sheets" | "least_waste" | "fewest_strokes"
    >;
    await fc.assert(
      fc.asyncProperty(
        fc.array(sheet, { minLength: 1, maxLength: 2 }),
        fc.array(blank, { minLength: 1, maxLength: 6 }),
        objective,
        fc.integer({ min: 0, max: 20 }),
        async (stock, blanks, goal, overProductionPct) => {
          const plan = await planBlanks(stock, blanks, { objective: goal, overProductionPct });
          checkBound(plan);
          if (plan.unplaced.some((entry) => entry.kind === "stock_short")) expect(plan.bounds.lp).toBeNull(); // a partial plan bounds only what it places, by area
        },
      ),
      { numRuns: 80, seed: 17 },
    );
  });
});

describe("planning all sheets together", () => {
  // Twelve large blanks (9 of 1067 × 961, 3 of 1133 × 859, both turnable) and 47 small ones on 2500 × 1250:
  // two large ones never share a strip's width (859 + 859 > 1250) and three never fit along (3 × 859 > 2500),
  // so at least 6 sheets; 6 suffice (two large along a 961 strip, small ones beside and in the 289 strip left)
  // (hand arithmetic). Filling the fullest sheet first takes 7.
  const stock: Stock[] = [{ length: 2500, width: 1250, count: null }];
  const blanks: Blank[] = [
    { label: "small", length: 258, width: 236, quantity: 47, canTurn: true },
    { label: "large", length: 1067, width: 961, quantity: 9, canTurn: true },
    { label: "wide", length: 1133, width: 859, quantity: 3, canTurn: true },
  ];

  it("finds the fewest sheets where pattern-by-pattern filling takes one more, and proves it", async () => {
    const plan = await planBlanks(stock, blanks);
    checkBound(plan);
    expect(plan.sheetsUsed).toBe(6);
    expect(plan.provenFewest).toBe(true);
    expect(plan.method).toBe("column_generation");
    expect(plan.methodNote).toBeNull();
    const greedy = await planBlanks(stock, blanks, { columnGenerationBudget: 0 });
    expect(greedy.sheetsUsed).toBe(7);
  });

  it("without a work budget plans pattern by pattern and says so", async () => {
    const plan = await planBlanks(stock, blanks, { columnGenerationBudget: 0 });
    checkBound(plan);
    expect(plan.method).toBe("greedy");
    expect(plan.methodNote).toMatch(/work budget/);
    expect(plan.bounds.lp).toBeNull();
    expect(plan.provenFewest).toBe(false);
  });

  it("reports progress as sheets are fixed, never going back, ending at the plan returned", async () => {
    const reports: PlanProgress[] = [];
    const plan = await planBlanks(stock, blanks, { onProgress: (progress) => reports.push(progress) });
    expect(reports.length).toBeGreaterThan(0);
    for (let index = 1; index < reports.length; index++)
      expect(reports[index].piecesPlaced).toBeGreaterThanOrEqual(reports[index - 1].piecesPlaced);
    expect(reports.at(-1)).toEqual({ patterns: plan.patterns.length, piecesPlaced: 59, piecesWanted: 59 });
  });

  it("gives the same plan for the same order", async () => {
    const first = await planBlanks(stock, blanks);
    const second = await planBlanks(stock, blanks);
    expect(JSON.stringify(second)).toBe(JSON.stringify(first));
  });
});
