/**
 * Remnants first: blanks a remnant can carry go onto remnants before any full sheet is cut,
 * what they cannot take goes onto full sheets, and the stated bound stays a true bound.
 * Fits are counted by hand (whole pieces per side: floor division), the bound is the area
 * bound (placed blank area over the largest sheet's area, rounded up).
 */
import { describe, expect, it } from "vitest";
import { planBlanks } from "../../lib/planner/plan";
import { planRemnantsFirst } from "../../lib/planner/remnants-first";

// An invented rack: full 2500 × 1250 mm sheets, two 1000 × 600 mm remnants.
const stock = [
  { length: 2500, width: 1250, count: null },
  { length: 1000, width: 600, count: 2 },
];
const remnant = [false, true];
const limits = { bladeLength: 3100, backgaugeMin: 5, backgaugeMax: 1000 };
const sheetsOf = (plan: { patterns: { stock: number; repeats: number }[] }, index: number) =>
  plan.patterns.filter((p) => p.stock === index).reduce((sum, p) => sum + p.repeats, 0);

describe("planning remnants first", () => {
  it("puts what the remnants can carry on them, where the plain planner takes one full sheet", async () => {
    // 450 × 280 mm: floor(1000/450) × floor(600/280) = 2 × 2 = 4 on a remnant, so 6 need both remnants
    const blanks = [{ label: "bracket", length: 450, width: 280, quantity: 6 }];
    const plain = await planBlanks(stock, blanks, { limits });
    expect(plain.sheetsUsed).toBe(1);
    expect(sheetsOf(plain, 0)).toBe(1);

    const plan = await planRemnantsFirst(stock, blanks, remnant, { limits });
    expect(plan.produced).toEqual([6]);
    expect(sheetsOf(plan, 1)).toBe(2);
    expect(sheetsOf(plan, 0)).toBe(0);
    expect(plan.unplaced).toEqual([]);
    // 6 × 450 × 280 = 756,000 mm² over 3,125,000 mm²: one sheet at the least, and two were used
    expect(plan.lowerBound).toBe(1);
    expect(plan.provenFewest).toBe(false);
    expect(plan.methodNote).toMatch(/Remnants were planned first \(2 used\)/);
    // utilisation is blank area over stock area: 756,000 / (2 × 600,000)
    expect(plan.utilisation).toBeCloseTo(756_000 / 1_200_000, 6);
  });

  it("sends what the remnants cannot take to full sheets, and a blank too big for them too", async () => {
    const blanks = [
      { label: "bracket", length: 450, width: 280, quantity: 10 }, // 8 fit the two remnants
      { label: "panel", length: 1200, width: 700, quantity: 1 }, // larger than a remnant either way round
    ];
    const plan = await planRemnantsFirst(stock, blanks, remnant, { limits });
    expect(plan.produced).toEqual([10, 1]);
    expect(sheetsOf(plan, 1)).toBe(2);
    expect(sheetsOf(plan, 0)).toBe(1);
    const onRemnants = plan.patterns
      .filter((p) => p.stock === 1)
      .flatMap((p) => p.strips.flatMap((s) => s.pieces.map((piece) => ({ blank: piece.blank, repeats: p.repeats }))));
    expect(onRemnants.reduce((sum, p) => sum + (p.blank === 0 ? p.repeats : 0), 0)).toBe(8);
    expect(plan.sheetsUsed).toBe(3);
    expect(plan.lowerBound).toBeLessThanOrEqual(plan.sheetsUsed);
  });

  it("is the plain planner when no row is a remnant", async () => {
    const blanks = [{ label: "bracket", length: 450, width: 280, quantity: 6 }];
    const plain = await planBlanks(stock, blanks, { limits });
    expect(await planRemnantsFirst(stock, blanks, [false, false], { limits })).toEqual(plain);
  });
});
