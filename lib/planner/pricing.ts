/**
 * Pricing for column generation: the most valuable two-stage pattern on one presented sheet
 * when each blank is worth a given value (the master problem's dual price) and no pattern
 * may hold more of a blank than its cap. Two answers:
 *
 * - `bound`: the optimum of a relaxation, so no pattern the shear can cut is worth more. Strips
 *   by an exact 0/1 knapsack along the strip (each blank's copies split in powers of two, so the
 *   cap holds within a strip; at most one piece longer than the backgauge reaches, the strip's
 *   remnant), for every strip width at once (pieces sorted by width, the table for a width is the
 *   table after the pieces no wider than it); then strips across the sheet by a bounded knapsack
 *   (a strip can be narrowed to its widest piece, so strips of width w are at most the caps of
 *   the blanks that are w wide; at most one strip wider than the backgauge reaches). Caps across
 *   strips and the trimming rules are relaxed, which only raises the bound.
 * - `strips`: a pattern that keeps every cap and rule, built from the relaxed one, strip by
 *   strip, refilling exactly any strip that breaks a cap or rule.
 *
 * Work is counted in table cells. Pure; integer dimensions.
 */
import type { Presentation, Variant } from "./presentation";
import type { StripIn } from "./written";
import { fitsStrip } from "./strips";

export interface Priced {
  /** no pattern on this sheet that keeps the caps is worth more */
  bound: number;
  /** a pattern that keeps the caps and the shear's rules (possibly empty) and its worth */
  strips: StripIn[];
  value: number;
  /** table cells computed */
  work: number;
  /** pieces per blank in the relaxed optimum (it may break caps across strips) */
  relaxedUses: number[];
}

/** Copies of one way a blank lies, taken together; `unbounded` when the cap cannot bind along a strip (any number of copies). */
interface Chunk {
  variant: Variant;
  copies: number;
  length: number;
  value: number;
  long: boolean;
  unbounded: boolean;
}

/** 0/1 knapsack tables along one length, over chunks in order; `keep` records every improving choice for reading back. */
interface Tables {
  best: Float64Array;
  keep: Uint32Array[];
  words: number;
}

/** Split each variant's copies into chunks of 1, 2, 4, … (every count up to the cap is a sum of some). */
function chunksOf(
  variants: Variant[],
  values: ArrayLike<number>,
  caps: ArrayLike<number>,
  stripLength: number,
  backgaugeMax: number,
): Chunk[] {
  const chunks: Chunk[] = [];
  for (const variant of variants) {
    const value = values[variant.blank];
    const cap = caps[variant.blank];
    if (!(value > 0) || cap <= 0 || variant.length > stripLength) continue;
    const long = variant.length > backgaugeMax;
    const fit = Math.floor(stripLength / variant.length);
    if (!long && cap >= fit) {
      chunks.push({ variant, copies: 1, length: variant.length, value, long, unbounded: true });
      continue;
    }
    let copies = long ? 1 : Math.min(cap, fit);
    for (let size = 1; copies > 0; size *= 2) {
      const take = Math.min(size, copies);
      chunks.push({
        variant,
        copies: take,
        length: take * variant.length,
        value: take * value,
        long,
        unbounded: false,
      });
      copies -= take;
    }
  }
  return chunks;
}

/**
 * Knapsack along `length` over `chunks` in order, with two layers when some chunk is long (layer
 * 1 may hold one long chunk, layer 0 none). `after(index)` hears once each chunk is taken in.
 */
function alongTables(length: number, chunks: Chunk[], after?: (index: number, tables: Tables[]) => void): Tables[] {
  const words = (length >> 5) + 1;
  const layers = chunks.some((chunk) => chunk.long) ? 2 : 1;
  const tables: Tables[] = Array.from({ length: layers }, () => ({
    best: new Float64Array(length + 1),
    keep: [],
    words,
  }));
  const bits = new Uint32Array(words * chunks.length * layers); // one allocation for every chunk's choices
  chunks.forEach((chunk, index) => {
    const size = chunk.length;
    const value = chunk.value;
    for (let layer = layers - 1; layer >= 0; layer--) {
      const table = tables[layer];
      const keep = bits.subarray((index * layers + layer) * words, (index * layers + layer + 1) * words);
      table.keep.push(keep);
      if (chunk.long && layer === 0) continue; // layer 0 holds no long piece
      const from = chunk.long ? tables[0].best : table.best; // a long piece moves a strip from layer 0 to 1
      const best = table.best;
      if (chunk.unbounded) {
        // upward: a capacity may build on copies just taken
        for (let capacity = size; capacity <= length; capacity++) {
          const candidate = best[capacity - size] + value;
          if (candidate > best[capacity]) {
            best[capacity] = candidate;
            keep[capacity >> 5] |= 1 << (capacity & 31);
          }
        }
        continue;
      }
      for (let capacity = length; capacity >= size; capacity--) {
        const candidate = from[capacity - size] + value;
        if (candidate > best[capacity]) {
          best[capacity] = candidate;
          keep[capacity >> 5] |= 1 << (capacity & 31);
        }
      }
    }
    after?.(index, tables);
  });
  return tables;
}

/** Read back the chunks chosen from the tables as they stood after `count` chunks, at `capacity`. */
function readBack(tables: Tables[], chunks: Chunk[], count: number, capacity: number): Chunk[] {
  const taken: Chunk[] = [];
  let layer = tables.length - 1;
  for (let index = count - 1; index >= 0 && capacity > 0;) {
    if (tables[layer].keep[index][capacity >> 5] & (1 << (capacity & 31))) {
      taken.push(chunks[index]);
      capacity -= chunks[index].length;
      if (chunks[index].long) layer = 0;
      if (chunks[index].unbounded) continue; // it may have been taken more than once
    }
    index -= 1;
  }
  return taken;
}

const piecesOf = (chunks: Chunk[]): Variant[] =>
  chunks.flatMap((chunk) => Array.from({ length: chunk.copies }, () => chunk.variant));

/** The best strip of this width that keeps the rules and what is left of the caps (exact knapsack). */
function refill(
  way: Presentation,
  stripWidth: number,
  values: ArrayLike<number>,
  left: number[],
  tolerance: number,
): { pieces: Variant[]; work: number } {
  const fitting = way.variants.filter((variant) => fitsStrip(variant, stripWidth, false, tolerance, way.backgaugeMax));
  const chunks = chunksOf(fitting, values, left, way.length, way.backgaugeMax);
  if (!chunks.length) return { pieces: [], work: 0 };
  const tables = alongTables(way.length, chunks);
  return {
    pieces: piecesOf(readBack(tables, chunks, chunks.length, way.length)),
    work: chunks.length * way.length * tables.length,
  };
}

export function priceSheet(
  way: Presentation,
  values: ArrayLike<number>,
  caps: ArrayLike<number>,
  tolerance: number,
): Priced {
  const length = way.length;
  // Strips: pieces by width, narrowest first; the table after the last piece of a width is that width's strip.
  const chunks = chunksOf(way.variants, values, caps, length, way.backgaugeMax).sort(
    (a, b) => a.variant.width - b.variant.width,
  );
  let work = 0;
  const stripValue = new Map<number, number>();
  const stripEnd = new Map<number, number>();
  const tables = alongTables(length, chunks, (index, state) => {
    const width = chunks[index].variant.width;
    if (index + 1 < chunks.length && chunks[index + 1].variant.width === width) return;
    stripValue.set(width, state[state.length - 1].best[length]);
    stripEnd.set(width, index + 1);
  });
  work += chunks.length * length * tables.length;
  // Strips across the sheet: strips of width w are at most the caps of the blanks that are w wide.
  const initiators = new Map<number, number>();
  for (const variant of way.variants) {
    if (values[variant.blank] > 0 && caps[variant.blank] > 0)
      initiators.set(variant.width, (initiators.get(variant.width) ?? 0) + caps[variant.blank]);
  }
  const across = way.usableWidth;
  const narrow: Chunk[] = [];
  const wide: number[] = [];
  for (const [width, value] of stripValue) {
    if (!(value > 0) || width > across) continue;
    if (width > way.backgaugeMax) {
      wide.push(width);
      continue;
    }
    let copies = Math.min(initiators.get(width) ?? 0, Math.floor(across / width));
    const variant: Variant = { blank: -1, length: 0, width, turned: false };
    for (let size = 1; copies > 0; size *= 2) {
      const take = Math.min(size, copies);
      narrow.push({ variant, copies: take, length: take * width, value: take * value, long: false, unbounded: false });
      copies -= take;
    }
  }
  const sheet = alongTables(across, narrow);
  work += narrow.length * across;
  let bound = sheet[0].best[across];
  let wideStrip: number | null = null;
  for (const width of wide) {
    const total = stripValue.get(width)! + sheet[0].best[across - width];
    if (total > bound) {
      bound = total;
      wideStrip = width;
    }
  }
  const chosen = readBack(sheet, narrow, narrow.length, wideStrip === null ? across : across - wideStrip).flatMap(
    (chunk) => Array.from({ length: chunk.copies }, () => chunk.variant.width),
  );
  if (wideStrip !== null) chosen.push(wideStrip);
  const contents = new Map<number, Variant[]>();
  const relaxedUses = new Array<number>(caps.length).fill(0);
  for (const stripWidth of chosen) {
    if (!contents.has(stripWidth))
      contents.set(stripWidth, piecesOf(readBack(tables, chunks, stripEnd.get(stripWidth)!, length)));
    for (const piece of contents.get(stripWidth)!) relaxedUses[piece.blank] += 1;
  }
  // A pattern that keeps the caps: the relaxed strips, densest first, each refilled exactly when it breaks a cap or rule.
  chosen.sort((a, b) => stripValue.get(b)! / b - stripValue.get(a)! / a || b - a);
  const left = Array.from(caps, (cap) => cap);
  const strips: StripIn[] = [];
  let value = 0;
  let free = across;
  /** Add a strip of these pieces, but no piece of a blank beyond what is left of its cap (a turned blank's two ways share it); false when none is left. */
  const take = (stripWidth: number, pieces: Variant[]): boolean => {
    const kept = pieces.filter((piece) => {
      if (left[piece.blank] <= 0) return false;
      left[piece.blank] -= 1;
      value += values[piece.blank];
      return true;
    });
    if (!kept.length) return false;
    strips.push({
      width: stripWidth,
      pieces: kept.map((piece) => ({
        blank: piece.blank,
        length: piece.length,
        width: piece.width,
        turned: piece.turned,
      })),
    });
    free -= stripWidth;
    return true;
  };
  const keeps = (stripWidth: number, pieces: Variant[]) => {
    const count = new Map<number, number>();
    for (const piece of pieces) count.set(piece.blank, (count.get(piece.blank) ?? 0) + 1);
    return (
      pieces.every((piece) => fitsStrip(piece, stripWidth, false, tolerance, way.backgaugeMax)) &&
      [...count].every(([blank, copies]) => copies <= left[blank])
    );
  };
  let wideUsed = false;
  for (const stripWidth of chosen) {
    if (stripWidth > free) continue;
    let pieces = contents.get(stripWidth)!;
    if (!keeps(stripWidth, pieces)) {
      const refilled = refill(way, stripWidth, values, left, tolerance);
      work += refilled.work;
      pieces = refilled.pieces;
    }
    if (take(stripWidth, pieces) && stripWidth > way.backgaugeMax) wideUsed = true;
  }
  // Width left over (strips refilled with less, or dropped): more strips, densest first, a few tries.
  const widths = [...stripValue.keys()]
    .filter((width) => stripValue.get(width)! > 0)
    .sort((a, b) => stripValue.get(b)! / b - stripValue.get(a)! / a || b - a);
  for (let tries = 0; tries < 8; tries++) {
    const stripWidth = widths.find((width) => width <= free && (width <= way.backgaugeMax || !wideUsed));
    if (stripWidth === undefined) break;
    const refilled = refill(way, stripWidth, values, left, tolerance);
    work += refilled.work;
    if (!take(stripWidth, refilled.pieces)) {
      widths.splice(widths.indexOf(stripWidth), 1);
      continue;
    }
    if (stripWidth > way.backgaugeMax) wideUsed = true;
  }
  return { bound, strips, value, work, relaxedUses };
}
