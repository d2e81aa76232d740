import { describe, expect, it } from "vitest";
import {
  estimateCycle,
  estimateReport,
  inToMm,
  simulateFlow,
  STROKE_FIXED_FRACTION,
  strokeSeconds,
  type FlowCut,
} from "@/lib/shear";
import { DEMO_SHEAR } from "./fixtures";

const cut = (backgaugeMm: number, count: number, over: Partial<FlowCut> = {}): FlowCut => ({
  backgaugeMm,
  count,
  lengthMm: null,
  turn: false,
  scrap: false,
  ...over,
});
const FULL_STROKE_S = 60 / DEMO_SHEAR.strokesPerMin; // 30 strokes/min (demo profile) → 2 s

describe("stroke time (our split: fixed share + travel share)", () => {
  const fullTravel =
    DEMO_SHEAR.ratedThicknessMm + DEMO_SHEAR.bladeLengthMm * Math.tan((DEMO_SHEAR.rakeMaxDeg * Math.PI) / 180);

  it("a full-length cut of rated plate at the largest rake is a full stroke", () => {
    expect(
      strokeSeconds(DEMO_SHEAR.bladeLengthMm, DEMO_SHEAR.ratedThicknessMm, DEMO_SHEAR.rakeMaxDeg, DEMO_SHEAR),
    ).toBeCloseTo(FULL_STROKE_S, 12); // our stroke-time rule: share of travel = 1
  });

  it("a shorter cut takes the fixed share plus its travel share", () => {
    const travel = 3 + 1000 * Math.tan((1.5 * Math.PI) / 180);
    const expected = FULL_STROKE_S * (STROKE_FIXED_FRACTION + (1 - STROKE_FIXED_FRACTION) * (travel / fullTravel));
    expect(strokeSeconds(1000, 3, 1.5, DEMO_SHEAR)).toBeCloseTo(expected, 12); // our stroke-time rule, by hand
    expect(strokeSeconds(0, 0, 0, DEMO_SHEAR)).toBeCloseTo(FULL_STROKE_S * STROKE_FIXED_FRACTION, 12); // our rule: no travel leaves the fixed share
  });
});

describe("cycle estimate of the cut-program worked example in our API docs", () => {
  const cuts = [cut(inToMm(12), 3), cut(inToMm(16), 7, { turn: true, lengthMm: inToMm(12) })];
  const flow = simulateFlow({ lengthMm: inToMm(120), widthMm: inToMm(48) }, cuts);
  const e = estimateCycle({ flow, cuts, sheets: 2, shear: DEMO_SHEAR, rakeDeg: 1.5, thicknessMm: inToMm(0.1345) });

  it("counts strokes, moves, turns and sheets", () => {
    expect(e.strokes).toBe(62); // worked example
    expect(e.backgaugeMoves).toBe(3); // 12→16 on each sheet, 16→12 between the sheets
    expect(e.turns).toBe(8); // 4 strips turned per sheet
    expect(e.sheets).toBe(2); // worked example: 2 sheets
  });

  it("adds the profile's constants", () => {
    const perStroke = (l: number): number => strokeSeconds(l, inToMm(0.1345), 1.5, DEMO_SHEAR);
    expect(e.seconds.strokes).toBeCloseTo(2 * (3 * perStroke(inToMm(120)) + 28 * perStroke(inToMm(12))), 9); // worked example: 3 strokes of 120 in and 28 of 12 in per sheet
    expect(e.seconds.backgauge).toBeCloseTo((3 * inToMm(4)) / DEMO_SHEAR.backgaugeSpeedMmPerS, 9); // three 4 in moves
    expect(e.seconds.turns).toBe(8 * DEMO_SHEAR.handlingSecondsPerTurn); // 8 turns × profile constant (demo data)
    expect(e.seconds.sheets).toBe(2 * DEMO_SHEAR.handlingSecondsPerSheet); // 2 sheets × profile constant (demo data)
    expect(e.seconds.total).toBeCloseTo(
      e.seconds.strokes + e.seconds.backgauge + e.seconds.turns + e.seconds.sheets,
      9,
    ); // sum of the parts
  });

  it("reports seconds to 0.1 s", () => {
    const r = estimateReport(e);
    expect(r.seconds.total).toBe(Math.round(e.seconds.total * 10) / 10); // reported to 0.1 s (ours)
  });
});

describe("backgauge moves", () => {
  it("a single setting never moves", () => {
    const cuts = [cut(100, 3)];
    const flow = simulateFlow({ lengthMm: 1000, widthMm: 1000 }, cuts);
    expect(estimateCycle({ flow, cuts, sheets: 5, shear: DEMO_SHEAR, rakeDeg: 1, thicknessMm: 2 }).backgaugeMoves).toBe(
      0,
    ); // one setting: the gauge never moves
  });
});
