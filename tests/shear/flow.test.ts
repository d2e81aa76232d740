import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  inToMm,
  REMNANT_TOLERANCE_MM,
  remnantToleranceMm,
  simulateFlow,
  strokesThatCut,
  yieldReport,
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
const sumCount = (rs: ReadonlyArray<{ count: number }>): number => rs.reduce((a, r) => a + r.count, 0);

describe("the cut-program worked example in our API docs", () => {
  // 120 × 48 in sheet: 3 strokes at 12 in make 4 strips 12 × 120 (the remnant is the fourth);
  // each strip turned: 7 strokes at 16 in make 7 blanks 12 × 16 and an 8 × 12 offcut.
  const flow = simulateFlow({ lengthMm: inToMm(120), widthMm: inToMm(48) }, [
    cut(inToMm(12), 3),
    cut(inToMm(16), 7, { turn: true, lengthMm: inToMm(12) }),
  ]);
  const report = yieldReport(flow, 2, "in", REMNANT_TOLERANCE_MM);

  it("per sheet: 4 strips, 28 blanks, 4 offcuts, 31 strokes", () => {
    expect(flow.groups[0].pieces).toEqual([expect.objectContaining({ count: 4 })]); // worked example: 4 strips
    expect(report.groups[0].pieces).toEqual([{ group: 0, width: 12, length: 120, count: 4 }]); // worked example: strips 12 × 120
    expect(report.groups[0].piecesBecome).toBe("turned");
    expect(report.perSheet.blanks).toBe(28); // worked example: 4 × 7
    expect(report.perSheet.strokes).toBe(31); // worked example: 3 + 4 × 7
    expect(report.offcuts).toEqual([{ group: 1, width: 8, length: 12, count: 8 }]); // worked example: 8 × 12 offcut per strip
  });

  it("two sheets: exactly 56 blanks, 62 strokes, 93.3 % of the stock area used", () => {
    expect(report.total.blanks).toBe(56); // worked example
    expect(report.total.strokes).toBe(62); // worked example
    expect(report.utilisationPct).toBe(93.3); // worked example: 56 × 16 × 12 / (2 × 120 × 48) = 93.33 %
    expect(report.blanks).toEqual([{ group: 1, width: 16, length: 12, count: 56 }]); // worked example: 56 blanks 12 × 16
    expect(report.total.turnedPieces).toBe(8); // worked example: 4 strips turned per sheet
  });
});

describe("remnant rule", () => {
  it("a remnant within the tolerance of the backgauge is a piece of the group", () => {
    expect(REMNANT_TOLERANCE_MM).toBe(0.1); // about a backgauge's positioning accuracy (common practice)
    const f = simulateFlow({ lengthMm: 1000, widthMm: 300.05 }, [cut(100, 2)]);
    expect(sumCount(f.blanks)).toBe(3); // our piece-flow rule: 100.05 mm remnant is within 0.1 mm of 100 mm
    expect(f.offcuts).toEqual([]);
  });

  it("a remnant outside the tolerance is offcut", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 300.2 }, [cut(100, 2)]);
    expect(sumCount(f.blanks)).toBe(2); // our piece-flow rule: 100.2 mm remnant is not within 0.1 mm
    expect(f.offcuts).toHaveLength(1);
    expect(f.offcuts[0].widthMm).toBeCloseTo(100.2, 9); // 300.2 − 2 × 100 (no kerf)
  });

  it("the next group without turn keeps cutting the remnant", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 500 }, [cut(100, 2), cut(150, 1)]);
    expect(f.groups[1].workpieces).toBe(1); // our piece-flow rule: the 300 mm remnant stays the workpiece
    expect(sumCount(f.blanks)).toBe(4); // 2 × 100, then 150 and a 150 remnant equal to the backgauge
    expect(f.offcuts).toEqual([]);
  });
});

describe("the remnant tolerance follows the machine", () => {
  it("is the shear's stated backgauge repeatability, else the 0.1 mm default", () => {
    expect(remnantToleranceMm({ ...DEMO_SHEAR, backgaugeRepeatabilityMm: 0.02 })).toBe(0.02); // the machine's own figure
    expect(remnantToleranceMm(DEMO_SHEAR)).toBe(REMNANT_TOLERANCE_MM); // not stated: the default (common practice)
    expect(remnantToleranceMm(null)).toBe(REMNANT_TOLERANCE_MM);
    expect(remnantToleranceMm({ backgaugeRepeatabilityMm: -1 })).toBe(REMNANT_TOLERANCE_MM);
  });

  it("a 100.05 mm remnant is a piece at ±0.1 mm but offcut on a machine that holds ±0.02 mm", () => {
    const loose = simulateFlow({ lengthMm: 1000, widthMm: 300.05 }, [cut(100, 2)], { toleranceMm: 0.1 });
    const tight = simulateFlow({ lengthMm: 1000, widthMm: 300.05 }, [cut(100, 2)], { toleranceMm: 0.02 });
    expect(sumCount(loose.blanks)).toBe(3); // hand arithmetic: 300.05 − 2 × 100 = 100.05, within 0.1 of 100
    expect(sumCount(tight.blanks)).toBe(2); // 100.05 is 0.05 from 100: more than ±0.02
    expect(tight.offcuts[0].widthMm).toBeCloseTo(100.05, 9);
    expect(strokesThatCut(100.05, 100, 0.02)).toBe(1); // the 0.05 left over is cut off at the tighter tolerance
  });
});

describe("strokes that cut nothing", () => {
  it("counts the strokes whose backgauge is not smaller than what is left", () => {
    expect(strokesThatCut(48, 12)).toBe(3); // 36, 24, 12 left: the 4th would cut at the edge
    const f = simulateFlow({ lengthMm: 1000, widthMm: 48 }, [cut(12, 5)]);
    expect(f.groups[0].beyond).toEqual({ strokes: 2, firstStroke: 4, remainingMm: 12 }); // strokes 4 and 5 meet 12 mm left
    expect(sumCount(f.blanks)).toBe(4); // 3 cut + the 12 mm remnant equal to the backgauge
  });
});

describe("turning", () => {
  it("turn on the first group turns the stock sheet", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 500 }, [cut(250, 3, { turn: true })]);
    expect(f.groups[0].presentedEdgeMm).toBe(500); // our rule: the sheet width becomes the presented edge
    expect(sumCount(f.blanks)).toBe(4); // 1000 mm toward the gauge: 3 × 250 + a 250 remnant
    expect(f.turnedPieces).toBe(1); // the sheet itself
  });

  it("a turn group takes the previous group's pieces; the leftover workpiece is offcut", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 550 }, [cut(100, 5), cut(300, 3, { turn: true })]);
    expect(f.groups[1].workpieces).toBe(5); // the 5 strips of group 1
    expect(f.offcuts.some((o) => Math.abs(o.widthMm - 50) < 1e-9 && o.lengthMm === 1000)).toBe(true);
    expect(sumCount(f.blanks)).toBe(15); // 5 strips × 3 blanks 300 × 100, remnant 100 is offcut (≠ 300)
  });

  it("a turn group after a group with no pieces has nothing to run on", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 50 }, [cut(100, 1), cut(10, 1, { turn: true })]);
    expect(f.groups[1].workpieces).toBe(0); // group 1 made no piece (100 mm gauge on a 50 mm sheet)
  });
});

describe("partial strokes and scrap", () => {
  it("a partial stroke does not cut a piece off", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 500 }, [cut(100, 2, { lengthMm: 400 })]);
    expect(f.groups[0].partial).toBe(true);
    expect(f.groups[0].strokes).toBe(2); // strokes still run
    expect(sumCount(f.blanks)).toBe(0); // our piece-flow rule: partial strokes sever nothing
    expect(f.offcutAreaMm2).toBe(500_000); // the whole 1000 × 500 sheet
  });

  it("pieces of a scrap group are offcut", () => {
    const f = simulateFlow({ lengthMm: 1000, widthMm: 505 }, [cut(5, 1, { scrap: true }), cut(100, 4)]);
    expect(f.offcuts[0]).toMatchObject({ widthMm: 5, count: 1, group: 0 }); // the trim
    expect(sumCount(f.blanks)).toBe(5); // 4 cut + the 100 mm remnant
  });
});

describe("properties", () => {
  const program = fc.record({
    lengthMm: fc.double({ min: 10, max: 4000, noNaN: true }),
    widthMm: fc.double({ min: 10, max: 2000, noNaN: true }),
    cuts: fc.array(
      fc.record({
        backgaugeMm: fc.double({ min: 0.5, max: 1500, noNaN: true }),
        count: fc.integer({ min: 0, max: 12 }),
        lengthMm: fc.option(fc.double({ min: 1, max: 4000, noNaN: true }), { nil: null }),
        turn: fc.boolean(),
        scrap: fc.boolean(),
      }),
      { maxLength: 12 },
    ),
  });

  it("stock area = blanks + offcut (no kerf)", () => {
    fc.assert(
      fc.property(program, (p) => {
        const f = simulateFlow(p, p.cuts);
        return Math.abs(f.blankAreaMm2 + f.offcutAreaMm2 - f.stockAreaMm2) <= 1e-9 * f.stockAreaMm2;
      }),
      { numRuns: 500 },
    );
  });

  it("the same input gives the same output", () => {
    fc.assert(
      fc.property(program, (p) => JSON.stringify(simulateFlow(p, p.cuts)) === JSON.stringify(simulateFlow(p, p.cuts))),
    );
  });
});

describe("turning the pieces of an earlier group (from)", () => {
  // Hand arithmetic: a 2000 × 1000 mm sheet ripped into two 300 mm and two 200 mm strips
  // (300 + 300 + 200 + 200 = 1000; the last 200 mm is the remnant of the second rip group),
  // then each kind crosscut: 300 mm strips at 500 mm (4 per strip), 200 mm strips at 400 mm (5 per strip).
  const cuts = [cut(300, 2), cut(200, 1), cut(500, 3, { turn: true, from: 0 }), cut(400, 4, { turn: true, from: 1 })];
  const flow = simulateFlow({ lengthMm: 2000, widthMm: 1000 }, cuts);

  it("both strip kinds are crosscut and the sheet is used whole", () => {
    expect(flow.groups.map((g) => g.piecesBecome)).toEqual(["turned", "turned", "blanks", "blanks"]);
    expect(flow.groups[2].workpieces).toBe(2); // two 300 mm strips
    expect(flow.groups[3].workpieces).toBe(2); // two 200 mm strips
    expect(flow.blanks).toEqual([
      { widthMm: 500, lengthMm: 300, count: 8, group: 2 }, // 2 strips × 4
      { widthMm: 400, lengthMm: 200, count: 10, group: 3 }, // 2 strips × 5
    ]);
    expect(flow.offcuts).toEqual([]);
    expect(flow.blankAreaMm2).toBe(2000 * 1000); // 8 × 500 × 300 + 10 × 400 × 200
    expect(flow.strokes).toBe(2 + 1 + 2 * 3 + 2 * 4);
    expect(flow.turnedPieces).toBe(4);
  });

  it("without from, only the last rip group's strips are crosscut and the others stay strips", () => {
    const f = simulateFlow({ lengthMm: 2000, widthMm: 1000 }, [cut(300, 2), cut(200, 1), cut(400, 4, { turn: true })]);
    expect(f.blanks).toEqual([
      { widthMm: 300, lengthMm: 2000, count: 2, group: 0 },
      { widthMm: 400, lengthMm: 200, count: 10, group: 2 },
    ]);
  });

  it("a group's pieces are turned once: a second group taking them finds nothing", () => {
    const f = simulateFlow({ lengthMm: 2000, widthMm: 1000 }, [
      cut(300, 2),
      cut(500, 3, { turn: true, from: 0 }),
      cut(500, 3, { turn: true, from: 0 }),
    ]);
    expect(f.groups[2].workpieces).toBe(0);
  });
});
