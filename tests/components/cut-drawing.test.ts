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
