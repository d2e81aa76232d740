/**
 * A whole order planned (`planOrder`, which the plans service and the worker run): the summary
 * states the lower bound, whether the plan meets it, how it was made, and progress is told.
 */
import { describe, expect, it } from "vitest";
import { planOrder, type Order } from "../../lib/planner/order";
import type { PlanProgress } from "../../lib/planner/plan";
import { findGrade } from "../../lib/shear/grades";
import { DEMO_SHEAR } from "../shear/fixtures";

const base = { shear: "shr_demo", grade: "A36", thickness: { gauge: 10 } } as const;

describe("planning an order", () => {
  it("the worked example of our cut-program docs: 56 blanks 16 × 12 in on two 120 × 48 in sheets, provably the fewest", async () => {
    const order: Order = {
      ...base,
      units: "in",
      stock: [{ length: 120, width: 48 }],
      blanks: [{ label: "panel", length: 16, width: 12, quantity: 56, canTurn: false }],
    };
    const reports: PlanProgress[] = [];
    const planned = await planOrder(order, { shear: DEMO_SHEAR, grade: null }, (progress) => reports.push(progress));
    // worked example: 2 sheets of 28; 56 × 192 in² = 10 752 in² is more than one 5 760 in² sheet (hand arithmetic)
    expect(planned.summary).toMatchObject({
      sheets: 2,
      patterns: 1,
      lowerBoundSheets: 2,
      provenFewest: true,
      bounds: { areaSheets: 2, lpSheets: null },
      method: "greedy",
      methodNote: null,
    });
    expect(reports.at(-1)).toEqual({ patterns: 1, piecesPlaced: 56, piecesWanted: 56 });
  });

  it("mixed demand in millimetres: a bound never above the sheets, and 'fewest' exactly when it is met", async () => {
    const order: Order = {
      ...base,
      units: "mm",
      stock: [
        { length: 2500, width: 1250, count: 3 },
        { length: 3000, width: 1500 },
      ],
      blanks: [
        { label: "base", length: 600, width: 400, quantity: 10 },
        { label: "side", length: 450, width: 300, quantity: 12 },
        { label: "tab", length: 250, width: 150, quantity: 30 },
        { label: "lid", length: 950, width: 500, quantity: 4, canTurn: false },
        { label: "strap", length: 980, width: 62.5, quantity: 9 },
      ],
      options: { trim: 5, reusableOffcut: { length: 300, width: 200 } },
    };
    const planned = await planOrder(order, { shear: DEMO_SHEAR, grade: null });
    const { summary } = planned;
    expect(planned.coverage).toBe("complete");
    expect(summary.lowerBoundSheets).toBeLessThanOrEqual(summary.sheets);
    expect(summary.lowerBoundSheets).toBeGreaterThanOrEqual(summary.bounds.areaSheets);
    expect(summary.provenFewest).toBe(summary.sheets === summary.lowerBoundSheets);
    expect(["column_generation", "greedy"]).toContain(summary.method);
    expect(summary.methodNote).toBeNull();
  });

  it("a partial plan bounds only what it places, by area", async () => {
    const order: Order = {
      ...base,
      units: "mm",
      stock: [{ length: 2000, width: 1000, count: 1 }],
      blanks: [
        { label: "too long", length: 2600, width: 300, quantity: 2 },
        { label: "many", length: 1000, width: 500, quantity: 6 },
      ],
    };
    const planned = await planOrder(order, { shear: DEMO_SHEAR, grade: null });
    // one 2000 × 1000 sheet holds 4 of 1000 × 500 and nothing of 2600 mm (hand arithmetic)
    expect(planned.summary).toMatchObject({
      sheets: 1,
      short: 4,
      lowerBoundSheets: 1,
      provenFewest: true,
      bounds: { areaSheets: 1, lpSheets: null },
    });
  });

  it("panels longer than the backgauge reaches: the programs take the spare off in strokes within the travel and pass the shear core's check", async () => {
    // DEMO_SHEAR's backgauge reaches 1000 mm; each 1300 mm panel is what is left of its 2500 mm strip
    const order: Order = {
      ...base,
      thickness: { value: 3 },
      units: "mm",
      stock: [{ length: 2500, width: 1250 }],
      blanks: [
        { label: "panel", length: 1300, width: 700, quantity: 10, canTurn: false },
        { label: "tab", length: 100, width: 100, quantity: 20, canTurn: false },
      ],
    };
    const planned = await planOrder(order, { shear: DEMO_SHEAR, grade: findGrade("A36") });
    expect(planned.summary).toMatchObject({ sheets: 10, provenFewest: true });
    expect(planned.findings.filter((finding) => finding.code === "pattern_not_releasable")).toEqual([]);
    for (const pattern of planned.patterns) {
      expect(pattern.check.findings.filter((finding) => finding.severity === "error")).toEqual([]);
      for (const cut of pattern.cuts) if (cut.count > 0) expect(cut.backgauge).toBeLessThanOrEqual(1000);
    }
  });
});
