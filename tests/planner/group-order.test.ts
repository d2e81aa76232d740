/**
 * Lead-off strokes: spare beyond the backgauge's reach comes off in strokes each within its travel. Checked by
 * hand arithmetic (the strokes add up to the spare, each between the nearest and farthest settings) and, for the
 * impossible case, by the bound that two strokes of at least the nearest setting are longer than the spare while
 * one stroke cannot reach it.
 */
import { describe, expect, it } from "vitest";
import { leadStrokes } from "../../lib/planner/group-order";

const gauge = { min: 5, max: 1000 };
const total = (strokes: { size: number; count: number }[]) => strokes.reduce((sum, s) => sum + s.size * s.count, 0);

describe("leadStrokes", () => {
  it("one stroke when the backgauge reaches, none for no spare", () => {
    expect(leadStrokes(0, gauge)).toEqual([]);
    expect(leadStrokes(800, gauge)).toEqual([{ size: 800, count: 1 }]);
    expect(leadStrokes(1000, gauge)).toEqual([{ size: 1000, count: 1 }]);
    expect(leadStrokes(5000, { min: 0, max: Infinity })).toEqual([{ size: 5000, count: 1 }]);
  });

  it("beyond the reach: strokes at the farthest setting, then the rest (1200 = 1000 + 200; 3000 = 3 × 1000)", () => {
    expect(leadStrokes(1200, gauge)).toEqual([
      { size: 1000, count: 1 },
      { size: 200, count: 1 },
    ]);
    expect(leadStrokes(3000, gauge)).toEqual([{ size: 1000, count: 3 }]);
    expect(leadStrokes(2500, gauge)).toEqual([
      { size: 1000, count: 2 },
      { size: 500, count: 1 },
    ]);
  });

  it("a rest shorter than the nearest setting takes what it lacks from the stroke before it (2003 = 1000 + 998 + 5)", () => {
    const strokes = leadStrokes(2003, gauge)!;
    expect(strokes).toEqual([
      { size: 1000, count: 1 },
      { size: 998, count: 1 },
      { size: 5, count: 1 },
    ]);
    expect(total(strokes)).toBe(2003);
    expect(total(leadStrokes(1002, gauge)!)).toBe(1002);
    for (const s of leadStrokes(1002, gauge)!) expect(s.size).toBeGreaterThanOrEqual(5);
  });

  it("null when no strokes within the travel add up to the spare", () => {
    // one stroke reaches at most 1000 < 1100; two reach at least 2 × 600 = 1200 > 1100
    expect(leadStrokes(1100, { min: 600, max: 1000 })).toBeNull();
  });

  it("every answer adds up to the spare with every stroke within the travel", () => {
    for (let lead = 1; lead <= 4000; lead += 7) {
      const strokes = leadStrokes(lead, { min: 30, max: 900 });
      if (!strokes) continue;
      expect(total(strokes)).toBe(lead);
      for (const s of strokes) expect(s.size).toBeLessThanOrEqual(900);
      if (lead > 900) for (const s of strokes) expect(s.size).toBeGreaterThanOrEqual(30);
    }
  });
});
