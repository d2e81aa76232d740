/**
 * The sheet as it is cut: positioned rectangles (blanks, scrap, offcut) and
 * cut lines, taken from the one piece-flow simulation (`simulateFlow` with
 * `place`), so a drawing shows exactly what the yield counts.
 *
 * Drawing coordinates: x along the sheet's length (the edge first presented
 * to the blade), y along its width toward the backgauge, origin at the corner
 * where the first strip is cut. A rectangle's `length` is its extent along x
 * and its `width` along y, the same pair as the sheet's own.
 */
import type { LengthUnit } from "./types";
import type { LayoutReport, LaidRectangle } from "./reports";
import type { FlowCut, FlowResult, FlowSheet, Rect } from "./flow";
import { simulateFlow } from "./flow";
import { readProgram } from "./read";
import { showLength } from "./units";

/** What a rectangle is: a blank, the piece of a scrap (trim) group, or offcut left over. */
export type LaidKind = LaidRectangle["kind"];

interface LaidMm {
  kind: LaidKind;
  group: number;
  stroke: number | null;
  xMm: number;
  yMm: number;
  lengthMm: number;
  widthMm: number;
}

function laid(rects: readonly Rect[], kind: LaidKind, out: LaidMm[]): boolean {
  for (const rect of rects) {
    if (!rect.at || rect.at.length !== rect.count) return false;
    for (const at of rect.at) {
      const lengthMm = at.widthAlongX ? rect.widthMm : rect.lengthMm;
      const widthMm = at.widthAlongX ? rect.lengthMm : rect.widthMm;
      out.push({ kind, group: rect.group, stroke: at.stroke, xMm: at.x, yMm: at.y, lengthMm, widthMm });
    }
  }
  return true;
}

/**
 * The layout report of a placed flow, in the caller's units; null when the
 * flow was not placed or ran past the placing budget.
 */
export function layoutReport(flow: FlowResult, units: LengthUnit): LayoutReport | null {
  if (!flow.placed) return null;
  const rectangles: LaidMm[] = [];
  const blanksPlaced = laid(flow.blanks, "blank", rectangles);
  const scrapPlaced = flow.groups.every(
    (group) => group.piecesBecome !== "offcut" || laid(group.pieces, "scrap", rectangles),
  );
  const offcutPlaced = laid(flow.leftovers, "offcut", rectangles);
  if (!blanksPlaced || !scrapPlaced || !offcutPlaced) return null;
  const show = (mm: number): number => showLength(mm, units);
  return {
    unit: units,
    rectangles: rectangles.map((rectangle) => ({
      kind: rectangle.kind,
      group: rectangle.group,
      stroke: rectangle.stroke,
      x: show(rectangle.xMm),
      y: show(rectangle.yMm),
      length: show(rectangle.lengthMm),
      width: show(rectangle.widthMm),
    })),
    cuts: flow.lines.map((line) => ({
      group: line.group,
      stroke: line.stroke,
      x1: show(line.x1),
      y1: show(line.y1),
      x2: show(line.x2),
      y2: show(line.y2),
      partial: line.partial,
    })),
  };
}

/** Simulate and place one sheet, and report it in the caller's units. */
export function sheetLayout(
  sheet: FlowSheet,
  cuts: readonly FlowCut[],
  units: LengthUnit,
  toleranceMm?: number,
): LayoutReport | null {
  return layoutReport(simulateFlow(sheet, cuts, { toleranceMm, place: true }), units);
}

/**
 * The layout of a program as given (any value; null when its units, sheet or
 * cuts cannot be read, or when it has too many pieces to place), with the
 * default remnant tolerance or `toleranceMm` (the check's is
 * `remnantToleranceMm(shear)`). The check does not carry it: this is for the
 * callers that draw the sheet.
 */
export function programLayout(input: unknown, toleranceMm?: number): LayoutReport | null {
  const program = readProgram(input, []);
  if (program === null || program.sheet === null || !program.cutsIsArray) return null;
  return sheetLayout(program.sheet, program.cuts, program.units, toleranceMm);
}
