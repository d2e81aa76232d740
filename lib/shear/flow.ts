/**
 * Piece flow: what the cut program does to one stock sheet.
 *
 * Rules (our cut program's definition):
 * - Every sheet runs the same program, so one sheet is simulated and totals
 *   are multiplied by the sheet count.
 * - A group without `turn` keeps cutting the current workpiece(s); each stroke
 *   cuts off a piece `backgauge` wide (no kerf on a shear) and the workpiece's
 *   width toward the backgauge shrinks by that much.
 * - A group with `turn` takes, one by one, every piece the previous group made
 *   (or, with `from`, the pieces an earlier group made), turned 90° (the
 *   piece's cut width becomes the presented edge), and runs on each. Workpiece
 *   remnants it does not take are offcut. A group's pieces are turned at most
 *   once; a second turning group finds nothing to take. On the first group,
 *   `turn` turns the stock sheet itself (its width becomes the presented edge).
 *   `from` lets one program rip strips of several widths and then crosscut
 *   each kind: rip A, rip B, turn from A and crosscut, turn from B and crosscut.
 * - After a group's last stroke on a workpiece, the remnant is a piece of that
 *   group when its width equals the backgauge within the remnant tolerance
 *   (the shear's backgauge repeatability, else REMNANT_TOLERANCE_MM);
 *   otherwise it stays the workpiece for a following group without `turn`,
 *   and is offcut when no such group follows.
 * - A stroke whose backgauge is not smaller than the remaining width (less the
 *   tolerance) cuts nothing; it is counted so the program can be corrected.
 * - A stroke whose length of cut is shorter than the presented edge (a partial
 *   stroke) does not sever a piece; it is counted and changes nothing.
 * - Pieces of a `scrap` group are offcut unless a following `turn` group takes them.
 * Identical pieces are kept as one size with a count, so a group's cost does
 * not grow with its stroke count.
 */
import type { LengthUnit } from "./types";
import type { GroupYield, PieceReport, YieldReport, YieldTotals } from "./reports";
import { areaUnitFor, showArea, showLength, showPct } from "./units";

/**
 * Remnant width equal to the backgauge within this, mm (≈ 0.004 in: about a
 * backgauge's positioning accuracy, common practice), when the shear profile
 * states no backgauge repeatability; a stated repeatability takes its place.
 */
export const REMNANT_TOLERANCE_MM = 0.1;

/** The remnant tolerance for a shear: its stated backgauge repeatability, else REMNANT_TOLERANCE_MM. */
export function remnantToleranceMm(shear: { backgaugeRepeatabilityMm?: number | null } | null | undefined): number {
  const stated = shear?.backgaugeRepeatabilityMm;
  return typeof stated === "number" && Number.isFinite(stated) && stated > 0 ? stated : REMNANT_TOLERANCE_MM;
}

export interface FlowOptions {
  /** Remnant tolerance, mm (default REMNANT_TOLERANCE_MM). */
  toleranceMm?: number;
}
/** Sizes closer than this, mm, are the same size (floating-point noise, not a tolerance). */
const SAME_SIZE_MM = 1e-6;

export interface FlowSheet {
  lengthMm: number;
  widthMm: number;
}

export interface FlowCut {
  backgaugeMm: number;
  count: number;
  lengthMm: number | null;
  turn: boolean;
  /** With `turn`: the earlier group whose pieces are taken; null = the group just before. */
  from?: number | null;
  scrap: boolean;
}

/** A size and how many of it. Width is toward the backgauge, length along the blade. */
export interface Rect {
  widthMm: number;
  lengthMm: number;
  count: number;
  /** Group that made it (−1: the stock sheet itself). */
  group: number;
}

export interface BeyondWorkpiece {
  /** Strokes, per sheet, that cut nothing. */
  strokes: number;
  /** 1-based stroke number of the first such stroke on a workpiece. */
  firstStroke: number;
  /** Width of workpiece remaining at that stroke. */
  remainingMm: number;
}

export interface FlowGroup {
  index: number;
  /** Workpieces the group ran on, per sheet. */
  workpieces: number;
  /** Strokes per sheet. */
  strokes: number;
  /** Longest presented edge among its workpieces (0 if none). */
  presentedEdgeMm: number;
  /** Length of cut: the given length, or the longest presented edge. */
  cutLengthMm: number;
  pieces: Rect[];
  piecesBecome: "blanks" | "offcut" | "turned";
  beyond: BeyondWorkpiece | null;
  /** Given length of cut shorter than the presented edge. */
  partial: boolean;
  /** Given length of cut longer than the presented edge. */
  lengthOverWorkpiece: boolean;
}

export interface FlowResult {
  groups: FlowGroup[];
  blanks: Rect[];
  offcuts: Rect[];
  /** Pieces turned by `turn` groups, per sheet (the stock sheet counts when the first group turns it). */
  turnedPieces: number;
  strokes: number;
  stockAreaMm2: number;
  blankAreaMm2: number;
  offcutAreaMm2: number;
}

export const rectArea = (r: Rect): number => r.widthMm * r.lengthMm * r.count;
const sumArea = (rs: readonly Rect[]): number => rs.reduce((a, r) => a + rectArea(r), 0);
const sumCount = (rs: readonly Rect[]): number => rs.reduce((a, r) => a + r.count, 0);

/** Add `r` to `list`, merging with an identical size from the same group. */
function addRect(list: Rect[], r: Rect): void {
  if (!(r.count > 0)) return;
  for (const x of list) {
    if (x.group === r.group && Math.abs(x.widthMm - r.widthMm) <= SAME_SIZE_MM && Math.abs(x.lengthMm - r.lengthMm) <= SAME_SIZE_MM) {
      x.count += r.count;
      return;
    }
  }
  list.push({ ...r });
}

/** Number of strokes that cut something on a workpiece `widthMm` wide at backgauge `backgaugeMm`. */
export function strokesThatCut(widthMm: number, backgaugeMm: number, toleranceMm: number = REMNANT_TOLERANCE_MM): number {
  if (!(backgaugeMm > 0) || !(widthMm > toleranceMm)) return 0;
  // SAME_SIZE_MM keeps float noise at the tolerance's edge (1000.1 − 0.1 = 1000.0000000000001) from adding a stroke.
  return Math.max(0, Math.ceil((widthMm - toleranceMm - SAME_SIZE_MM) / backgaugeMm) - 1);
}

interface GroupRun {
  group: FlowGroup;
  nextWork: Rect[];
}

/** Run one group's strokes on every workpiece. */
function runGroup(index: number, cut: FlowCut, work: readonly Rect[], toleranceMm: number): GroupRun {
  const bg = cut.backgaugeMm;
  const pieces: Rect[] = [];
  const nextWork: Rect[] = [];
  let workpieces = 0;
  let presented = 0;
  let partial = false;
  let lengthOver = false;
  let beyond: BeyondWorkpiece | null = null;
  for (const w of work) {
    workpieces += w.count;
    presented = Math.max(presented, w.lengthMm);
    if (cut.lengthMm !== null && cut.lengthMm > w.lengthMm + toleranceMm) lengthOver = true;
    if (cut.count > 0 && cut.lengthMm !== null && cut.lengthMm < w.lengthMm - toleranceMm) {
      partial = true; // partial strokes do not sever: the workpiece is unchanged
      addRect(nextWork, { ...w });
      continue;
    }
    const n = Math.min(cut.count, strokesThatCut(w.widthMm, bg, toleranceMm));
    if (n > 0) addRect(pieces, { widthMm: bg, lengthMm: w.lengthMm, count: w.count * n, group: index });
    const remaining = w.widthMm - n * bg;
    if (n < cut.count) {
      const lost = (cut.count - n) * w.count;
      if (beyond === null) beyond = { strokes: lost, firstStroke: n + 1, remainingMm: remaining };
      else beyond.strokes += lost;
    }
    if (bg > 0 && Math.abs(remaining - bg) <= toleranceMm + SAME_SIZE_MM) {
      addRect(pieces, { widthMm: remaining, lengthMm: w.lengthMm, count: w.count, group: index });
    } else {
      addRect(nextWork, { widthMm: remaining, lengthMm: w.lengthMm, count: w.count, group: n > 0 ? index : w.group });
    }
  }
  const group: FlowGroup = {
    index,
    workpieces,
    strokes: workpieces * cut.count,
    presentedEdgeMm: presented,
    cutLengthMm: cut.lengthMm ?? presented,
    pieces,
    piecesBecome: cut.scrap ? "offcut" : "blanks",
    beyond,
    partial,
    lengthOverWorkpiece: lengthOver,
  };
  return { group, nextWork };
}

const turned = (r: Rect): Rect => ({ widthMm: r.lengthMm, lengthMm: r.widthMm, count: r.count, group: r.group });

/** Simulate one sheet through the program. Pure; never throws on finite input. */
export function simulateFlow(sheet: FlowSheet, cuts: readonly FlowCut[], options: FlowOptions = {}): FlowResult {
  const toleranceMm = options.toleranceMm !== undefined && options.toleranceMm > 0 ? options.toleranceMm : REMNANT_TOLERANCE_MM;
  const stock: Rect = { widthMm: sheet.widthMm, lengthMm: sheet.lengthMm, count: 1, group: -1 };
  const groups: FlowGroup[] = [];
  const blanks: Rect[] = [];
  const offcuts: Rect[] = [];
  let work: Rect[] = [stock];
  let turnedPieces = 0;

  for (let index = 0; index < cuts.length; index++) {
    const cut = cuts[index];
    if (cut.turn && index === 0) {
      turnedPieces += 1;
      work = [turned(stock)];
    } else if (cut.turn) {
      for (const w of work) addRect(offcuts, w);
      const from = cut.from ?? index - 1;
      const source = from >= 0 && from < index ? groups[from] : undefined;
      if (source && source.piecesBecome !== "turned") {
        source.piecesBecome = "turned";
        turnedPieces += sumCount(source.pieces);
        work = source.pieces.map(turned);
      } else {
        work = [];
      }
    }
    const run = runGroup(index, cut, work, toleranceMm);
    groups.push(run.group);
    work = run.nextWork;
  }
  for (const w of work) addRect(offcuts, w);
  // Pieces no group turned are what the program makes: blanks, or offcut from a scrap group.
  for (const g of groups) {
    if (g.piecesBecome === "turned") continue;
    for (const p of g.pieces) addRect(g.piecesBecome === "offcut" ? offcuts : blanks, p);
  }

  return {
    groups,
    blanks,
    offcuts,
    turnedPieces,
    strokes: groups.reduce((a, g) => a + g.strokes, 0),
    stockAreaMm2: sheet.lengthMm * sheet.widthMm,
    blankAreaMm2: sumArea(blanks),
    offcutAreaMm2: sumArea(offcuts),
  };
}

const pieceReport = (r: Rect, times: number, u: LengthUnit): PieceReport => ({
  group: r.group,
  width: showLength(r.widthMm, u),
  length: showLength(r.lengthMm, u),
  count: r.count * times,
});

function totals(flow: FlowResult, times: number, u: LengthUnit): YieldTotals {
  return {
    blanks: sumCount(flow.blanks) * times,
    blankArea: showArea(flow.blankAreaMm2 * times, u),
    offcutPieces: sumCount(flow.offcuts) * times,
    offcutArea: showArea(flow.offcutAreaMm2 * times, u),
    turnedPieces: flow.turnedPieces * times,
    strokes: flow.strokes * times,
    stockArea: showArea(flow.stockAreaMm2 * times, u),
  };
}

/** Yield in the caller's units: per sheet, in total, and utilisation of the stock area by blanks. */
export function yieldReport(flow: FlowResult, sheets: number, u: LengthUnit): YieldReport {
  return {
    lengthUnit: u,
    areaUnit: areaUnitFor(u),
    sheets,
    perSheet: totals(flow, 1, u),
    total: totals(flow, sheets, u),
    utilisationPct: showPct(flow.stockAreaMm2 > 0 ? (100 * flow.blankAreaMm2) / flow.stockAreaMm2 : 0),
    groups: flow.groups.map(
      (g): GroupYield => ({
        group: g.index,
        workpieces: g.workpieces,
        strokes: g.strokes,
        pieces: g.pieces.map((p) => pieceReport(p, 1, u)),
        piecesBecome: g.piecesBecome,
      }),
    ),
    blanks: flow.blanks.map((p) => pieceReport(p, sheets, u)),
    offcuts: flow.offcuts.map((p) => pieceReport(p, sheets, u)),
  };
}
