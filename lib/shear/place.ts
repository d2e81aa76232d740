/**
 * Placing the piece flow on the sheet, for drawings: where each piece lies,
 * which stroke cut it off, and each stroke's cut line. Used by `simulateFlow`
 * when asked to place; the flow's rules stay in flow.ts.
 */

/** Placing stops past this many placed pieces and cut lines on one sheet (`FlowResult.placed` is then false). */
export const MAX_PLACEMENTS = 20_000;

/**
 * Where one piece lies on the sheet: its corner in sheet coordinates (mm; x
 * along the sheet's length, the edge first presented to the blade; y along
 * its width, toward the backgauge), and which way it is presented.
 */
export interface Placement {
  x: number;
  y: number;
  /** The piece's width (toward the backgauge) runs along the sheet's x (it has been turned an odd number of times). */
  widthAlongX: boolean;
  /** 1-based stroke on the sheet, in cutting order, that cut it off; null for the stock and for a remnant named as a piece. */
  stroke: number | null;
}

/** One stroke's cut line on the sheet (sheet coordinates, mm). */
export interface FlowLine {
  group: number;
  stroke: number;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  /** A partial stroke: it cuts part of the edge and severs nothing. */
  partial: boolean;
}

/** What placing needs of a workpiece and of a cut group. */
interface PlacedWork {
  count: number;
  lengthMm: number;
  at?: Placement[];
}
interface PlacedCut {
  backgaugeMm: number;
  count: number;
  lengthMm: number | null;
}

/** Placing state for one sheet: the stroke counter, the cut lines, and the budget. */
export interface Placing {
  on: boolean;
  stroke: number;
  used: number;
  lines: FlowLine[];
}

/** Count `amount` more placements; stop placing past the budget. */
function spend(placing: Placing, amount: number): boolean {
  if (!placing.on) return false;
  placing.used += amount;
  if (placing.used > MAX_PLACEMENTS) placing.on = false;
  return placing.on;
}

/** A placement moved `offsetMm` toward the backgauge. */
const shifted = (at: Placement, offsetMm: number, stroke: number | null): Placement =>
  at.widthAlongX
    ? { x: at.x + offsetMm, y: at.y, widthAlongX: true, stroke }
    : { x: at.x, y: at.y + offsetMm, widthAlongX: false, stroke };

/** The cut line of a stroke `offsetMm` toward the backgauge from a workpiece's corner, `lengthMm` long. */
function lineAt(
  at: Placement,
  offsetMm: number,
  lengthMm: number,
  group: number,
  stroke: number,
  partial: boolean,
): FlowLine {
  if (at.widthAlongX)
    return { group, stroke, x1: at.x + offsetMm, y1: at.y, x2: at.x + offsetMm, y2: at.y + lengthMm, partial };
  return { group, stroke, x1: at.x, y1: at.y + offsetMm, x2: at.x + lengthMm, y2: at.y + offsetMm, partial };
}

/** Place one workpiece's strokes: its pieces, its remnant, and the cut lines. */
export function placeStrokes(
  work: PlacedWork,
  cut: PlacedCut,
  index: number,
  cutting: number,
  partial: boolean,
  placing: Placing,
): { pieces: Placement[]; remnant: Placement[] } | null {
  if (!work.at || !spend(placing, work.count * (cut.count + 2))) {
    placing.stroke += work.count * cut.count;
    return null;
  }
  const pieces: Placement[] = [];
  const remnant: Placement[] = [];
  for (const at of work.at) {
    for (let stroke = 0; stroke < cut.count; stroke++) {
      const number = ++placing.stroke;
      if (partial) placing.lines.push(lineAt(at, cut.backgaugeMm, cut.lengthMm ?? work.lengthMm, index, number, true));
      else if (stroke < cutting) {
        pieces.push(shifted(at, stroke * cut.backgaugeMm, number));
        placing.lines.push(lineAt(at, (stroke + 1) * cut.backgaugeMm, work.lengthMm, index, number, false));
      }
    }
    remnant.push(partial ? at : shifted(at, cutting * cut.backgaugeMm, null));
  }
  return { pieces, remnant };
}
