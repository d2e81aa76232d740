/**
 * The best two-stage guillotine pattern on one sheet, the way a shear cuts: first-stage
 * cuts rip the sheet into full-length strips; each strip is turned and crosscut into
 * pieces no taller than the strip (any leftover above a piece is trim). Exact dynamic
 * programming: an unbounded knapsack along the strip for every strip height, then an
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
  /** strip height: the first-stage cut's spacing */
  height: number;
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
  for (let c = 1; c <= capacity; c++) {
    best[c] = best[c - 1];
    pick[c] = -1; // -1: leave one unit empty
    for (let i = 0; i < items.length; i++) {
      const it = items[i];
      if (it.size <= c && best[c - it.size] + it.value > best[c]) {
        best[c] = best[c - it.size] + it.value;
        pick[c] = i;
      }
    }
  }
  const chosen = new Map<number, number>();
  for (let c = capacity; c > 0; ) {
    const i = pick[c];
    if (i < 0) c -= 1;
    else {
      chosen.set(items[i].ref, (chosen.get(items[i].ref) ?? 0) + 1);
      c -= items[i].size;
    }
  }
  return { value: best[capacity], chosen };
}

export function bestTwoStagePattern(sheet: { length: number; width: number }, pieces: PieceType[], stripsAlong: "length" | "width" = "length"): TwoStagePattern {
  // Strips run along `run` (their length) and stack across `across`.
  const run = stripsAlong === "length" ? sheet.length : sheet.width;
  const across = stripsAlong === "length" ? sheet.width : sheet.length;
  const along = (p: PieceType) => (stripsAlong === "length" ? p.length : p.width);
  const tall = (p: PieceType) => (stripsAlong === "length" ? p.width : p.length);
  const worth = (p: PieceType) => p.value ?? p.length * p.width;

  const heights = [...new Set(pieces.map(tall).filter((h) => h <= across))].sort((a, b) => a - b);
  const strips = new Map<number, { value: number; chosen: Map<number, number> }>();
  for (const h of heights) {
    const fits = pieces.map((p, ref) => ({ size: along(p), value: worth(p), ref })).filter((it, i) => it.size <= run && tall(pieces[i]) <= h);
    strips.set(h, knapsack(run, fits));
  }
  const stripItems = heights.map((h) => ({ size: h, value: strips.get(h)!.value, ref: h })).filter((s) => s.value > 0);
  const sheetBest = knapsack(across, stripItems);
  return {
    value: sheetBest.value,
    stripsAlong,
    strips: [...sheetBest.chosen.entries()].map(([height, count]) => {
      const s = strips.get(height)!;
      return { height, count, value: s.value, pieces: [...s.chosen.entries()].map(([index, n]) => ({ index, count: n })) };
    }),
  };
}
