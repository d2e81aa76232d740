/**
 * The two-stage single-sheet pattern against the published gcut instances (Beasley 1985,
 * OR-Library; unconstrained, no rotation). Targets: the two-stage values with trimming that
 * were computed independently (exact DP) and listed beside the data, NOT a published table;
 * upper bound: the published unconstrained guillotine optimum of each instance.
 */
import { describe, expect, it } from "vitest";
import { bestTwoStagePattern } from "../../lib/planner/two-stage";
import { gcut, TABLE } from "./gcut";

describe("best two-stage pattern on one sheet (gcut instances)", () => {
  it.each(TABLE)(
    "gcut%d: %d along the length, %d along the width, never above the optimum %d",
    (n, alongL, alongW, optimum) => {
      const { sheet, pieces } = gcut(n);
      const l = bestTwoStagePattern(sheet, pieces, "length");
      const w = bestTwoStagePattern(sheet, pieces, "width");
      expect(l.value).toBe(alongL);
      expect(w.value).toBe(alongW);
      expect(Math.max(l.value, w.value)).toBeLessThanOrEqual(optimum);
    },
  );

  it("returns a pattern that really fits and adds up to its value", () => {
    const { sheet, pieces } = gcut(3);
    const p = bestTwoStagePattern(sheet, pieces, "length");
    expect(p.strips.reduce((s, st) => s + st.width * st.count, 0)).toBeLessThanOrEqual(sheet.width);
    let total = 0;
    for (const st of p.strips) {
      expect(st.pieces.reduce((s, x) => s + pieces[x.index].length * x.count, 0)).toBeLessThanOrEqual(sheet.length);
      for (const x of st.pieces) expect(pieces[x.index].width).toBeLessThanOrEqual(st.width);
      total += st.count * st.pieces.reduce((s, x) => s + (pieces[x.index].value ?? 0) * x.count, 0);
    }
    expect(total).toBe(p.value);
  });
});
