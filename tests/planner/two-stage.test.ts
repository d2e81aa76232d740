/**
 * The two-stage single-sheet pattern against the published gcut instances (Beasley 1985,
 * OR-Library; unconstrained, no rotation). Targets: the two-stage values with trimming that
 * were computed independently (exact DP) and listed beside the data, NOT a published table;
 * upper bound: the published unconstrained guillotine optimum of each instance.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { bestTwoStagePattern, type PieceType } from "../../lib/planner/two-stage";

const DATA = path.resolve("..", "shared", "data", "cutting", "GCUT", "original", "Original");

function gcut(n: number) {
  const nums = readFileSync(path.join(DATA, `gcut${n}`), "utf8").trim().split(/\s+/).map(Number);
  const m = nums[0];
  const sheet = { length: nums[1], width: nums[2] };
  const pieces: PieceType[] = [];
  for (let i = 0; i < m; i++) pieces.push({ length: nums[3 + 3 * i], width: nums[4 + 3 * i], value: nums[5 + 3 * i] });
  return { sheet, pieces };
}

// [instance, two-stage with trimming, strips along L; same, strips along W; unconstrained guillotine optimum]
const TABLE: [number, number, number, number][] = [
  [1, 56460, 53808, 56460], [2, 60076, 60071, 60536], [3, 60133, 60078, 61036], [4, 61698, 61252, 61698],
  [5, 246000, 246000, 246000], [6, 235058, 238998, 238998], [7, 242567, 239405, 242567], [8, 245758, 244130, 246633],
  [9, 971100, 971100, 971100], [10, 982025, 955058, 982025], [11, 974638, 980096, 980096], [12, 977768, 978776, 979986],
  [13, 8906216, 8997780, 8997780], // gcut13: the optimum is from later literature, as listed beside the data
];

describe("best two-stage pattern on one sheet (gcut instances)", () => {
  it.each(TABLE)("gcut%d: %d along the length, %d along the width, never above the optimum %d", (n, alongL, alongW, optimum) => {
    const { sheet, pieces } = gcut(n);
    const l = bestTwoStagePattern(sheet, pieces, "length");
    const w = bestTwoStagePattern(sheet, pieces, "width");
    expect(l.value).toBe(alongL);
    expect(w.value).toBe(alongW);
    expect(Math.max(l.value, w.value)).toBeLessThanOrEqual(optimum);
  });

  it("returns a pattern that really fits and adds up to its value", () => {
    const { sheet, pieces } = gcut(3);
    const p = bestTwoStagePattern(sheet, pieces, "length");
    expect(p.strips.reduce((s, st) => s + st.height * st.count, 0)).toBeLessThanOrEqual(sheet.width);
    let total = 0;
    for (const st of p.strips) {
      expect(st.pieces.reduce((s, x) => s + pieces[x.index].length * x.count, 0)).toBeLessThanOrEqual(sheet.length);
      for (const x of st.pieces) expect(pieces[x.index].width).toBeLessThanOrEqual(st.height);
      total += st.count * st.pieces.reduce((s, x) => s + (pieces[x.index].value ?? 0) * x.count, 0);
    }
    expect(total).toBe(p.value);
  });
});
