/**
 * The bound from pieces that cannot share a sheet (`apartBound`): a worked example of plain
 * geometry, the published bin-packing class whose pieces are mostly larger than half the bin, and,
 * as a property, never above the LP over every two-stage pattern (enumerated, solved by HiGHS),
 * which no bound on sheets may pass.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planBlanks } from "../../lib/planner/plan";
import { lpOverAllPatterns, type Piece } from "./brute-force";

describe("pieces that cannot share a sheet", () => {
  it("ten 1300 × 700 panels on 2500 × 1250 sheets need ten sheets (two do not fit side by side either way: 2600 > 2500 along, 1400 > 1250 across; plain geometry), though their area fits in three", async () => {
    for (const canTurn of [false, true]) {
      const plan = await planBlanks(
        [{ length: 2500, width: 1250, count: null }],
        [
          { label: "panel", length: 1300, width: 700, quantity: 10, canTurn },
          { label: "tab", length: 100, width: 100, quantity: 20, canTurn },
        ],
      );
      expect(plan.bounds.area).toBe(3);
      expect(plan.bounds.apart).toBe(10);
      expect(plan.lowerBound).toBe(10);
      expect(plan.sheetsUsed).toBe(10);
      expect(plan.provenFewest).toBe(true);
    }
  });

  it("1300 × 600 panels fit two across a 1250 sheet (2 × 600 ≤ 1250): the bound does not claim a sheet each, and five sheets do", async () => {
    const plan = await planBlanks(
      [{ length: 2500, width: 1250, count: null }],
      [{ label: "panel", length: 1300, width: 600, quantity: 10, canTurn: false }],
    );
    expect(plan.bounds.apart).toBeLessThanOrEqual(5);
    expect(plan.sheetsUsed).toBe(5);
  });

  it("bin-packing class 9 (Martello & Vigo 1998; first instance of 60 items): most pieces exceed half the bin both ways, so the bound is far above the area's", async () => {
    const data = JSON.parse(
      readFileSync(path.resolve(import.meta.dirname, "../fixtures/cutting/CLASS/json/421.json"), "utf8"),
    ) as {
      Name: string;
      Objects: { Length: number; Height: number }[];
      Items: { Length: number; Height: number; Demand: number }[];
    };
    expect(data.Name).toBe("CLASS09_060_01");
    const bin = data.Objects[0];
    const big = data.Items.filter((item) => item.Length > bin.Length / 2 && item.Height > bin.Height / 2).reduce(
      (sum, item) => sum + item.Demand,
      0,
    );
    const plan = await planBlanks(
      [{ length: bin.Length, width: bin.Height, count: null }],
      data.Items.map((item, index) => ({
        label: `i${index}`,
        length: item.Length,
        width: item.Height,
        quantity: item.Demand,
        canTurn: false,
      })),
      { limits: null },
    );
    // pieces larger than half the bin both ways pairwise cannot share one: at least that many bins
    expect(plan.bounds.apart).toBeGreaterThanOrEqual(big);
    expect(plan.bounds.apart).toBeGreaterThan(plan.bounds.area);
    expect(plan.lowerBound).toBeLessThanOrEqual(plan.sheetsUsed);
  });

  it("never above the LP over every two-stage pattern (enumerated, solved by HiGHS) (property)", async () => {
    const instance = fc.record({
      sheet: fc.record({ length: fc.integer({ min: 8, max: 16 }), width: fc.integer({ min: 6, max: 12 }) }),
      blanks: fc.array(
        fc.record({
          share: fc.record({
            length: fc.double({ min: 0.2, max: 1, noNaN: true }),
            width: fc.double({ min: 0.2, max: 1, noNaN: true }),
          }),
          quantity: fc.integer({ min: 1, max: 6 }),
        }),
        { minLength: 1, maxLength: 4 },
      ),
    });
    let above = 0;
    await fc.assert(
      fc.asyncProperty(instance, async ({ sheet, blanks }) => {
        // mostly large blanks, as shares of the sheet: where the bound has something to say
        const sized = blanks.map((blank) => ({
          length: Math.max(1, Math.round(blank.share.length * sheet.length)),
          width: Math.max(1, Math.round(blank.share.width * sheet.width)),
          quantity: blank.quantity,
        }));
        const pieces: Piece[] = sized.map((blank, index) => ({ blank: index, ...blank, value: 1 }));
        const demand = sized.map((blank) => blank.quantity);
        const reference = Math.ceil((await lpOverAllPatterns(pieces, sheet, demand)) - 1e-6);
        const plan = await planBlanks(
          [{ ...sheet, count: null }],
          sized.map((blank, index) => ({ label: `b${index}`, ...blank, canTurn: false })),
        );
        expect(plan.unplaced).toEqual([]);
        expect(plan.bounds.apart).not.toBeNull();
        expect(plan.bounds.apart!).toBeLessThanOrEqual(reference);
        expect(plan.lowerBound).toBe(Math.max(plan.bounds.area, plan.bounds.apart!, plan.bounds.lp ?? 0));
        if (plan.bounds.apart! > plan.bounds.area) above += 1;
      }),
      { numRuns: 60, seed: 29 },
    );
    // the property is not empty: in many of these orders the bound says more than the area does
    expect(above).toBeGreaterThan(5);
  });
});
