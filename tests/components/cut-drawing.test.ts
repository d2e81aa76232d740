/**
 * One geometry: the sheet drawing draws the rectangles and cut lines the shear
 * core's piece flow placed, and they agree with the flow's blanks, offcuts and
 * strokes (the yield printed beside the drawing) on every program fixture.
 */
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CutDrawing } from "../../components/console/CutDrawing";
import {
  checkProgram,
  findGrade,
  lengthFromMm,
  programLayout,
  remnantToleranceMm,
  simulateFlow,
  type CutProgram,
  type FlowCut,
  type GradeProfile,
  type Rect,
  type ShearProfile,
} from "@/lib/shear";
import { DEMO_SHEAR, PROGRAM_FIXTURES, WORKED_EXAMPLE } from "../shear/fixtures";

interface Drawn {
  kind: string;
  group: number;
  stroke: number | null;
  x: number;
  y: number;
  length: number;
  width: number;
}

/** The sheet as placed for the drawing, with the shear's remnant tolerance (as the check's flow). */
const placed = (program: CutProgram, shear: ShearProfile = DEMO_SHEAR) =>
  programLayout(program, remnantToleranceMm(shear));

/** The rectangles and lines the component actually rendered, read back from its SVG. */
function drawn(
  program: CutProgram,
  shear: ShearProfile = DEMO_SHEAR,
): { rects: Drawn[]; lines: Array<{ group: number; dashed: boolean }> } {
  const markup = renderToStaticMarkup(
    createElement(CutDrawing, { sheet: program.sheet, layout: placed(program, shear), units: program.units }),
  );
  const attribute = (tag: string, name: string): string | null =>
    new RegExp(`${name}="([^"]*)"`).exec(tag)?.[1] ?? null;
  const rects = [...markup.matchAll(/<rect [^>]*data-kind="[^"]*"[^>]*>/g)].map(([tag]) => ({
    kind: attribute(tag, "data-kind") as string,
    group: Number(attribute(tag, "data-group")),
    stroke: attribute(tag, "data-stroke") === "" ? null : Number(attribute(tag, "data-stroke")),
    x: Number(attribute(tag, "x")),
    y: Number(attribute(tag, "y")),
    length: Number(attribute(tag, "width")), // SVG x runs along the sheet's length
    width: Number(attribute(tag, "height")),
  }));
  const lines = [...markup.matchAll(/<line [^>]*data-group="[^"]*"[^>]*>/g)].map(([tag]) => ({
    group: Number(attribute(tag, "data-group")),
    dashed: attribute(tag, "stroke-dasharray") !== null,
  }));
  return { rects, lines };
}

/** Sizes as sorted "short×long" keys with counts, rounded to the report's decimals. */
function sizeCounts(
  items: ReadonlyArray<{ a: number; b: number; count: number; group: number }>,
  decimals: number,
): Map<string, number> {
  const counts = new Map<string, number>();
  for (const item of items) {
    const [short, long] = [item.a, item.b]
      .sort((first, second) => first - second)
      .map((value) => value.toFixed(decimals));
    const key = `${item.group}:${short}×${long}`;
    counts.set(key, (counts.get(key) ?? 0) + item.count);
  }
  return counts;
}

const grade = (code: string): GradeProfile => findGrade(code) as GradeProfile;
const toFlowCut = (cut: CutProgram["cuts"][number], toMm: (value: number) => number): FlowCut => ({
  backgaugeMm: toMm(cut.backgauge),
  count: cut.count,
  lengthMm: cut.length === undefined ? null : toMm(cut.length),
  turn: cut.turn === true,
  from: cut.from ?? null,
  scrap: cut.scrap === true,
});

describe("the drawing draws the piece flow's rectangles, for every program fixture", () => {
  for (const [name, program] of Object.entries(PROGRAM_FIXTURES)) {
    it(name, () => {
      const check = checkProgram(program, { shear: DEMO_SHEAR, grade: grade(program.grade) });
      expect(placed(program)).not.toBeNull();
      expect(placed(program)?.rectangles.length).toBeGreaterThan(0);
      const { rects, lines } = drawn(program);
      const units = program.units;
      const decimals = units === "in" ? 3 : 2;
      const toMm = (value: number): number => (units === "in" ? value * 25.4 : value);
      const fromMm = (mm: number): number => lengthFromMm(mm, units);

      // The same flow, run on its own (not placed), at the same tolerance as the check.
      const flow = simulateFlow(
        { lengthMm: toMm(program.sheet.length), widthMm: toMm(program.sheet.width) },
        program.cuts.map((cut) => toFlowCut(cut, toMm)),
      );
      const scrapGroups = new Set(program.cuts.flatMap((cut, index) => (cut.scrap ? [index] : [])));
      const flowSizes = (list: readonly Rect[]) =>
        list.map((rect) => ({
          a: fromMm(rect.widthMm),
          b: fromMm(rect.lengthMm),
          count: rect.count,
          group: rect.group,
        }));
      const drawnSizes = (kinds: string[]) =>
        rects
          .filter((rect) => kinds.includes(rect.kind))
          .map((rect) => ({ a: rect.length, b: rect.width, count: 1, group: rect.group }));

      // Blanks: same sizes, groups and counts as the flow, and as the yield printed beside the drawing.
      expect(sizeCounts(drawnSizes(["blank"]), decimals)).toEqual(sizeCounts(flowSizes(flow.blanks), decimals));
      expect(rects.filter((rect) => rect.kind === "blank")).toHaveLength(check.yield?.perSheet.blanks ?? -1);
      // Offcut (left over) and scrap together: the flow's offcuts, and the yield's offcut pieces.
      const flowScrap = flow.offcuts.filter(
        (rect) => scrapGroups.has(rect.group) && flow.groups[rect.group]?.piecesBecome === "offcut",
      );
      expect(rects.filter((rect) => rect.kind !== "blank")).toHaveLength(check.yield?.perSheet.offcutPieces ?? -1);
      expect(rects.filter((rect) => rect.kind === "scrap").length).toBeLessThanOrEqual(
        flowScrap.reduce((total, rect) => total + rect.count, 0),
      );
      expect(
        sizeCounts(
          drawnSizes(["offcut", "scrap"]).map((size) => ({ ...size, group: 0 })),
          decimals,
        ),
      ).toEqual(
        sizeCounts(
          flowSizes(flow.offcuts).map((size) => ({ ...size, group: 0 })),
          decimals,
        ),
      );

      // The rectangles tile the sheet: inside it, no overlaps, areas adding up to it (a shear has no kerf).
      const slack = units === "in" ? 1e-3 : 2e-2;
      let area = 0;
      for (const rect of rects) {
        expect(rect.x).toBeGreaterThanOrEqual(-slack);
        expect(rect.y).toBeGreaterThanOrEqual(-slack);
        expect(rect.x + rect.length).toBeLessThanOrEqual(program.sheet.length + slack);
        expect(rect.y + rect.width).toBeLessThanOrEqual(program.sheet.width + slack);
        area += rect.length * rect.width;
      }
      expect(area).toBeCloseTo(program.sheet.length * program.sheet.width, units === "in" ? 0 : -1);
      for (let first = 0; first < rects.length; first++) {
        for (let second = first + 1; second < rects.length; second++) {
          const a = rects[first];
          const b = rects[second];
          const overlapX = Math.min(a.x + a.length, b.x + b.length) - Math.max(a.x, b.x);
          const overlapY = Math.min(a.y + a.width, b.y + b.width) - Math.max(a.y, b.y);
          expect(overlapX <= slack || overlapY <= slack, `${name}: rectangles ${first} and ${second} overlap`).toBe(
            true,
          );
        }
      }

      // One line per stroke that cut (partial strokes dashed); strokes that cut nothing draw none.
      const partialStrokes = flow.groups
        .filter((group) => group.partial)
        .reduce((total, group) => total + group.strokes, 0);
      expect(lines.filter((line) => line.dashed)).toHaveLength(partialStrokes);
      const beyondStrokes = flow.groups.reduce((total, group) => total + (group.beyond?.strokes ?? 0), 0);
      expect(lines.filter((line) => !line.dashed)).toHaveLength(flow.strokes - partialStrokes - beyondStrokes);
      expect(lines.length + beyondStrokes).toBe(check.yield?.perSheet.strokes ?? -1);
    });
  }
});

describe("the cut-program worked example in our API docs", () => {
  const { rects, lines } = drawn(WORKED_EXAMPLE);

  it("draws 28 blanks 16 × 12 in, an 8 × 12 in offcut per strip, and 31 cut lines", () => {
    const blanks = rects.filter((rect) => rect.kind === "blank");
    expect(blanks).toHaveLength(28); // worked example: 4 strips × 7
    expect(blanks.every((blank) => blank.length === 16 && blank.width === 12)).toBe(true); // crosscut along the strip: 16 in along the sheet's length
    const offcuts = rects.filter((rect) => rect.kind === "offcut");
    expect(offcuts).toHaveLength(4); // worked example: one 8 × 12 in offcut per strip
    expect(offcuts.every((offcut) => offcut.length === 8 && offcut.width === 12 && offcut.x === 112)).toBe(true); // 120 − 7 × 16 at the strip's far end
    expect(lines).toHaveLength(3 + 4 * 7); // 3 rips, then 7 crosscuts in each of 4 strips
  });

  it("numbers strokes in cutting order: rips first, then each strip's crosscuts", () => {
    const strokes = rects
      .filter((rect) => rect.kind === "blank")
      .map((rect) => rect.stroke as number)
      .sort((a, b) => a - b);
    expect(strokes[0]).toBe(4); // strokes 1–3 are the rips
    expect(strokes[strokes.length - 1]).toBe(31); // worked example: 31 strokes per sheet
  });
});

describe("partial strokes and the remnant rule, which the old drawing got wrong", () => {
  it("a partial stroke severs nothing: the sheet stays one offcut and the stroke is a dashed line", () => {
    const program = PROGRAM_FIXTURES["partial strokes"];
    const { rects, lines } = drawn(program);
    expect(rects).toEqual([expect.objectContaining({ kind: "offcut", x: 0, y: 0, length: 1000, width: 500 })]); // our piece-flow rule: partial strokes sever nothing
    expect(lines).toEqual([
      { group: 0, dashed: true },
      { group: 0, dashed: true },
    ]);
  });

  it("a remnant within the machine's repeatability is a blank, outside it offcut", () => {
    const program = PROGRAM_FIXTURES["remnant within the tolerance"];
    const tightShear = { ...DEMO_SHEAR, backgaugeRepeatabilityMm: 0.02 };
    const tight = checkProgram(program, { shear: tightShear, grade: grade("A36") });
    expect(drawn(program).rects.filter((rect) => rect.kind === "blank")).toHaveLength(3); // 100.05 within ±0.1 mm of 100
    expect(drawn(program, tightShear).rects.filter((rect) => rect.kind === "blank")).toHaveLength(2); // not within ±0.02 mm
    expect(drawn(program, tightShear).rects.filter((rect) => rect.kind === "blank")).toHaveLength(
      tight.yield?.perSheet.blanks ?? -1,
    );
  });

  it("the check carries no layout; the program's is placed on demand by the same flow", () => {
    const program = PROGRAM_FIXTURES["two strip kinds, each crosscut (from)"];
    const check = checkProgram(program, { shear: DEMO_SHEAR, grade: grade("A36") });
    expect(check).not.toHaveProperty("layout");
    const blanks = placed(program)?.rectangles.filter((rect) => rect.kind === "blank");
    expect(blanks).toHaveLength(check.yield?.perSheet.blanks ?? -1);
    // the default tolerance is the one a shear that states no repeatability gets
    expect(programLayout(program)).toEqual(placed(program, { ...DEMO_SHEAR, backgaugeRepeatabilityMm: undefined }));
    expect(programLayout({ units: "cm" })).toBeNull();
  });
});
