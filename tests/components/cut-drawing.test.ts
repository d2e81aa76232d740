import { describe, expect, it } from "vitest";
import { layoutSheet } from "../../components/console/CutDrawing";

describe("the sheet drawing's layout", () => {
  it("lays out the cut-program worked example of our API docs: 4 strips, 7 blanks each, an 8 x 12 offcut per strip", () => {
    const { pieces, offcut } = layoutSheet({ length: 120, width: 48 }, [{ backgauge: 12, count: 3 }, { turn: true, backgauge: 16, count: 7 }]);
    const blanks = pieces.filter((p) => p.group === 1);
    expect(pieces.filter((p) => p.group === 0)).toHaveLength(4); // 3 strokes, the remnant is the fourth strip
    expect(blanks).toHaveLength(28);
    expect(blanks.every((b) => b.w === 16 && b.h === 12)).toBe(true);
    expect(offcut).toHaveLength(4);
    expect(offcut.every((o) => o.w === 8 && o.h === 12)).toBe(true);
    // areas add up: blanks + offcut = the sheet (a shear has no kerf)
    const area = (r: { w: number; h: number }) => r.w * r.h;
    expect(blanks.reduce((a, b) => a + area(b), 0) + offcut.reduce((a, b) => a + area(b), 0)).toBe(120 * 48);
  });
});

describe("a sheet ripped into two strip kinds, each crosscut (from)", () => {
  // Hand arithmetic: 2000 × 1000 sheet, two 300 strips and two 200 strips, 300 strips cut at 500, 200 strips at 400.
  const { finalPieces, offcut } = layoutSheet({ length: 2000, width: 1000 }, [
    { backgauge: 300, count: 2 },
    { backgauge: 200, count: 1 },
    { turn: true, from: 0, backgauge: 500, count: 3 },
    { turn: true, from: 1, backgauge: 400, count: 4 },
  ]);
  it("draws 8 + 10 blanks covering the sheet, none overlapping, no offcut", () => {
    expect(finalPieces.filter((p) => p.group === 2)).toHaveLength(8);
    expect(finalPieces.filter((p) => p.group === 3)).toHaveLength(10);
    expect(finalPieces.reduce((a, p) => a + p.w * p.h, 0)).toBe(2000 * 1000);
    expect(offcut).toEqual([]);
    for (const a of finalPieces) for (const b of finalPieces) {
      if (a === b) continue;
      const overlap = a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
      expect(overlap).toBe(false);
    }
  });
});
