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
import { placeStrokes, type FlowLine, type Placement, type Placing } from "./place";

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
  /** Also place every piece, offcut and stroke on the sheet (for drawings), within the placing budget (place.ts). */
  place?: boolean;
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
  /** With `place`: where each of the `count` pieces lies. */
  at?: Placement[];
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
  /** With `place`: true when every piece, offcut and stroke was placed (within MAX_PLACEMENTS). */
  placed: boolean;
  /** With `place`: workpieces no group cut further (offcut that is not a scrap group's piece). */
  leftovers: Rect[];
  /** With `place`: every stroke that cut, in cutting order. */
  lines: FlowLine[];
}

export const rectArea = (rect: Rect): number => rect.widthMm * rect.lengthMm * rect.count;
const sumArea = (rects: readonly Rect[]): number => rects.reduce((total, rect) => total + rectArea(rect), 0);
const sumCount = (rects: readonly Rect[]): number => rects.reduce((total, rect) => total + rect.count, 0);

/** Add `rect` to `list`, merging with an identical size from the same group (placements follow). */
function addRect(list: Rect[], rect: Rect): void {
  if (!(rect.count > 0)) return;
  for (const existing of list) {
    if (
      existing.group === rect.group &&
      Math.abs(existing.widthMm - rect.widthMm) <= SAME_SIZE_MM &&
      Math.abs(existing.lengthMm - rect.lengthMm) <= SAME_SIZE_MM
    ) {
      existing.count += rect.count;
      if (existing.at && rect.at) existing.at.push(...rect.at);
      return;
    }
  }
  list.push({ ...rect, at: rect.at ? [...rect.at] : undefined });
}

/** Number of strokes that cut something on a workpiece `widthMm` wide at backgauge `backgaugeMm`. */
export function strokesThatCut(
  widthMm: number,
  backgaugeMm: number,
  toleranceMm: number = REMNANT_TOLERANCE_MM,
): number {
  if (!(backgaugeMm > 0) || !(widthMm > toleranceMm)) return 0;
  // SAME_SIZE_MM keeps float noise at the tolerance's edge (1000.1 − 0.1 = 1000.0000000000001) from adding a stroke.
  return Math.max(0, Math.ceil((widthMm - toleranceMm - SAME_SIZE_MM) / backgaugeMm) - 1);
}

interface GroupRun {
  group: FlowGroup;
  nextWork: Rect[];
}

/** Run one group's strokes on every workpiece. */
function runGroup(index: number, cut: FlowCut, work: readonly Rect[], toleranceMm: number, placing: Placing): GroupRun {
  const backgaugeMm = cut.backgaugeMm;
  const pieces: Rect[] = [];
  const nextWork: Rect[] = [];
  let workpieces = 0;
  let presented = 0;
  let partial = false;
  let lengthOver = false;
  let beyond: BeyondWorkpiece | null = null;
  for (const workpiece of work) {
    workpieces += workpiece.count;
    presented = Math.max(presented, workpiece.lengthMm);
    if (cut.lengthMm !== null && cut.lengthMm > workpiece.lengthMm + toleranceMm) lengthOver = true;
    if (cut.count > 0 && cut.lengthMm !== null && cut.lengthMm < workpiece.lengthMm - toleranceMm) {
      partial = true; // partial strokes do not sever: the workpiece is unchanged
      const placed = placeStrokes(workpiece, cut, index, 0, true, placing);
      addRect(nextWork, { ...workpiece, at: placed?.remnant });
      continue;
    }
    const cutting = Math.min(cut.count, strokesThatCut(workpiece.widthMm, backgaugeMm, toleranceMm));
    const placed = placeStrokes(workpiece, cut, index, cutting, false, placing);
    if (cutting > 0)
      addRect(pieces, {
        widthMm: backgaugeMm,
        lengthMm: workpiece.lengthMm,
        count: workpiece.count * cutting,
        group: index,
        at: placed?.pieces,
      });
    const remaining = workpiece.widthMm - cutting * backgaugeMm;
    if (cutting < cut.count) {
      const lost = (cut.count - cutting) * workpiece.count;
      if (beyond === null) beyond = { strokes: lost, firstStroke: cutting + 1, remainingMm: remaining };
      else beyond.strokes += lost;
    }
    const rest: Rect = {
      widthMm: remaining,
      lengthMm: workpiece.lengthMm,
      count: workpiece.count,
      group: index,
      at: placed?.remnant,
    };
    if (backgaugeMm > 0 && Math.abs(remaining - backgaugeMm) <= toleranceMm + SAME_SIZE_MM) addRect(pieces, rest);
    else addRect(nextWork, { ...rest, group: cutting > 0 ? index : workpiece.group });
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

/** A piece turned 90°: its width becomes the presented edge; on the sheet, its width now runs the other way. */
const turned = (rect: Rect): Rect => ({
  widthMm: rect.lengthMm,
  lengthMm: rect.widthMm,
  count: rect.count,
  group: rect.group,
  at: rect.at?.map((at) => ({ ...at, widthAlongX: !at.widthAlongX })),
});

/** Simulate one sheet through the program. Pure; never throws on finite input. */
export function simulateFlow(sheet: FlowSheet, cuts: readonly FlowCut[], options: FlowOptions = {}): FlowResult {
  const toleranceMm =
    options.toleranceMm !== undefined && options.toleranceMm > 0 ? options.toleranceMm : REMNANT_TOLERANCE_MM;
  const placing: Placing = { on: options.place === true, stroke: 0, used: 0, lines: [] };
  const stock: Rect = {
    widthMm: sheet.widthMm,
    lengthMm: sheet.lengthMm,
    count: 1,
    group: -1,
    at: placing.on ? [{ x: 0, y: 0, widthAlongX: false, stroke: null }] : undefined,
  };
  const groups: FlowGroup[] = [];
  const blanks: Rect[] = [];
  const offcuts: Rect[] = [];
  const leftovers: Rect[] = [];
  const leaveOver = (rect: Rect): void => {
    addRect(offcuts, rect);
    if (placing.on) addRect(leftovers, rect);
  };
  let work: Rect[] = [stock];
  let turnedPieces = 0;

  for (let index = 0; index < cuts.length; index++) {
    const cut = cuts[index];
    if (cut.turn && index === 0) {
      turnedPieces += 1;
      work = [turned(stock)];
    } else if (cut.turn) {
      for (const workpiece of work) leaveOver(workpiece);
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
    const run = runGroup(index, cut, work, toleranceMm, placing);
    groups.push(run.group);
    work = run.nextWork;
  }
  for (const workpiece of work) leaveOver(workpiece);
  // Pieces no group turned are what the program makes: blanks, or offcut from a scrap group.
  for (const group of groups) {
    if (group.piecesBecome === "turned") continue;
    for (const piece of group.pieces) addRect(group.piecesBecome === "offcut" ? offcuts : blanks, piece);
  }

  return {
    groups,
    blanks,
    offcuts,
    turnedPieces,
    strokes: groups.reduce((total, group) => total + group.strokes, 0),
    stockAreaMm2: sheet.lengthMm * sheet.widthMm,
    blankAreaMm2: sumArea(blanks),
    offcutAreaMm2: sumArea(offcuts),
    placed: placing.on,
    leftovers,
    lines: placing.lines,
  };
}
