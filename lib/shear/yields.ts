/**
 * Yield in the caller's units: per sheet, in total, and utilisation of the
 * stock area by blanks, from one simulated sheet.
 */
import type { LengthUnit } from "./types";
import type { GroupYield, PieceReport, YieldReport, YieldTotals } from "./reports";
import type { FlowResult, Rect } from "./flow";
import { areaUnitFor, showArea, showLength, showPct } from "./units";

const sumCount = (rects: readonly Rect[]): number => rects.reduce((total, rect) => total + rect.count, 0);

const pieceReport = (rect: Rect, times: number, units: LengthUnit): PieceReport => ({
  group: rect.group,
  width: showLength(rect.widthMm, units),
  length: showLength(rect.lengthMm, units),
  count: rect.count * times,
});

function totals(flow: FlowResult, times: number, units: LengthUnit): YieldTotals {
  return {
    blanks: sumCount(flow.blanks) * times,
    blankArea: showArea(flow.blankAreaMm2 * times, units),
    offcutPieces: sumCount(flow.offcuts) * times,
    offcutArea: showArea(flow.offcutAreaMm2 * times, units),
    turnedPieces: flow.turnedPieces * times,
    strokes: flow.strokes * times,
    stockArea: showArea(flow.stockAreaMm2 * times, units),
  };
}

/** Yield in the caller's units: per sheet, in total, and utilisation of the stock area by blanks. */
export function yieldReport(
  flow: FlowResult,
  sheets: number,
  units: LengthUnit,
  remnantToleranceMm: number,
): YieldReport {
  return {
    lengthUnit: units,
    areaUnit: areaUnitFor(units),
    sheets,
    perSheet: totals(flow, 1, units),
    total: totals(flow, sheets, units),
    utilisationPct: showPct(flow.stockAreaMm2 > 0 ? (100 * flow.blankAreaMm2) / flow.stockAreaMm2 : 0),
    remnantToleranceMm,
    groups: flow.groups.map((group): GroupYield => ({
      group: group.index,
      workpieces: group.workpieces,
      strokes: group.strokes,
      pieces: group.pieces.map((piece) => pieceReport(piece, 1, units)),
      piecesBecome: group.piecesBecome,
    })),
    blanks: flow.blanks.map((piece) => pieceReport(piece, sheets, units)),
    offcuts: flow.offcuts.map((piece) => pieceReport(piece, sheets, units)),
  };
}
