/**
 * The best two-stage guillotine pattern on one sheet, the way a shear cuts: first-stage
 * cuts rip the sheet into full-length strips; each strip is turned and crosscut into
 * pieces no wider than the strip (any leftover beside a piece is trim). Exact dynamic
 * programming: an unbounded knapsack along the strip for every strip width, then an
 * unbounded knapsack of strips across the sheet. Pieces keep their orientation.
 * Pure: no I/O. Integer dimensions (the unit is the caller's).
 */

export interface PieceType {
  length: number;
  width: number;
  /** what one piece is worth; area when unset */
  value?: number;
}

export interface Strip {
  /** the strip's width across the sheet: the first-stage cut's spacing */
  width: number;
  /** how many such strips */
  count: number;
  /** pieces along the strip: piece index and how many */
  pieces: { index: number; count: number }[];
  value: number;
}

export interface TwoStagePattern {
  value: number;
  /** "length": strips run along the sheet's length; "width": along its width */
  stripsAlong: "length" | "width";
  strips: Strip[];
}

/** Unbounded knapsack: best value of items along `capacity`, and the items chosen. */
function knapsack(capacity: number, items: { size: number; value: number; ref: number }[]) {
  const best = new Float64Array(capacity + 1);
  const pick = new Int32Array(capacity + 1).fill(-1);
  for (let room = 1; room <= capacity; room++) {
    best[room] = best[room - 1];
    pick[room] = -1; // -1: leave one unit empty
    for (let index = 0; index < items.length; index++) {
      const item = items[index];
      if (item.size <= room && best[room - item.size] + item.value > best[room]) {
        best[room] = best[room - item.size] + item.value;
        pick[room] = index;
      }
    }
  }
  const chosen = new Map<number, number>();
  for (let room = capacity; room > 0;) {
    const index = pick[room];
    if (index < 0) room -= 1;
    else {
      chosen.set(items[index].ref, (chosen.get(items[index].ref) ?? 0) + 1);
      room -= items[index].size;
    }
  }
  return { value: best[capacity], chosen };
}

export function bestTwoStagePattern(
  sheet: { length: number; width: number },
  pieces: PieceType[],
  stripsAlong: "length" | "width" = "length",
): TwoStagePattern {
  // Strips run `stripLength` along and stack across `acrossSheet`; a piece's extent along and across the strip:
  const stripLength = stripsAlong === "length" ? sheet.length : sheet.width;
  const acrossSheet = stripsAlong === "length" ? sheet.width : sheet.length;
  const alongStrip = (piece: PieceType) => (stripsAlong === "length" ? piece.length : piece.width);
  const acrossStrip = (piece: PieceType) => (stripsAlong === "length" ? piece.width : piece.length);
  const worth = (piece: PieceType) => piece.value ?? piece.length * piece.width;

  const widths = [...new Set(pieces.map(acrossStrip).filter((width) => width <= acrossSheet))].sort((a, b) => a - b);
  const strips = new Map<number, { value: number; chosen: Map<number, number> }>();
  for (const width of widths) {
    const fits = pieces
      .map((piece, ref) => ({ size: alongStrip(piece), value: worth(piece), ref }))
      .filter((item, index) => item.size <= stripLength && acrossStrip(pieces[index]) <= width);
    strips.set(width, knapsack(stripLength, fits));
  }
  const stripItems = widths
    .map((width) => ({ size: width, value: strips.get(width)!.value, ref: width }))
    .filter((item) => item.value > 0);
  const sheetBest = knapsack(acrossSheet, stripItems);
  return {
    value: sheetBest.value,
    stripsAlong,
    strips: [...sheetBest.chosen.entries()].map(([width, count]) => {
      const strip = strips.get(width)!;
      return {
        width,
        count,
        value: strip.value,
        pieces: [...strip.chosen.entries()].map(([index, copies]) => ({ index, count: copies })),
      };
    }),
  };
}
