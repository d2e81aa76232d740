/**
 * The plan page's word on its sheet count. Which bound holds for which cutting: the blanks' area over a sheet's,
 * and pieces that cannot share a sheet, hold for any way of cutting (plain geometry); the LP over two-stage
 * patterns only for two-stage cutting. Hopper's (2000) t-instances are perfect packings of one 200 × 200 sheet, cut by
 * guillotine in more than two stages (that they are guillotine packings: from memory), while the two-stage LP proves 2 for some of them (t1a in
 * `tests/planner/quality.bench.ts`): a claim resting on that bound must say two-stage.
 */
import { describe, expect, it } from "vitest";
import { sheetsHint } from "../../components/console/words";

describe("sheetsHint", () => {
  it("says nothing for plans stored before bounds were reported", () => {
    expect(sheetsHint({ lowerBoundSheets: 0, provenFewest: false, bounds: { areaSheets: 0, apartSheets: null } })).toBe(
      null,
    );
  });

  it("claims the fewest outright when the area or apart bound proves it", () => {
    expect(sheetsHint({ lowerBoundSheets: 7, provenFewest: true, bounds: { areaSheets: 7, apartSheets: 5 } })).toBe(
      "provably the fewest",
    );
    expect(sheetsHint({ lowerBoundSheets: 19, provenFewest: true, bounds: { areaSheets: 12, apartSheets: 19 } })).toBe(
      "provably the fewest",
    );
    expect(sheetsHint({ lowerBoundSheets: 9, provenFewest: false, bounds: { areaSheets: 9, apartSheets: null } })).toBe(
      "at least 9 needed",
    );
  });

  it("limits the claim to two-stage cuts when only the LP bound reaches it", () => {
    expect(sheetsHint({ lowerBoundSheets: 2, provenFewest: true, bounds: { areaSheets: 1, apartSheets: 1 } })).toBe(
      "provably the fewest in two-stage cuts",
    );
    expect(sheetsHint({ lowerBoundSheets: 8, provenFewest: false, bounds: { areaSheets: 6, apartSheets: null } })).toBe(
      "at least 8 needed in two-stage cuts",
    );
  });
});
