/**
 * Reference computations for the column-generation tests, written from the definitions and
 * independent of the planner's code: every two-stage pattern on a small sheet by exhaustive
 * enumeration (strips of any width, pieces no wider than their strip, at most `cap` pieces of a
 * blank on a sheet), and the LP over all of them (strips along either side of the sheet) solved
 * by HiGHS (a general-purpose solver).
 */
import loadHighs from "highs";

export interface Piece {
  blank: number;
  length: number;
  width: number;
  value: number;
}

/** All strips of each width: multisets of pieces no wider than the strip whose lengths fit. */
function strips(pieces: Piece[], sheet: { length: number; width: number }, caps: number[]) {
  const widths = [...new Set(pieces.map((piece) => piece.width))].filter((width) => width <= sheet.width);
  const out: { width: number; counts: number[]; value: number }[] = [];
  for (const width of widths) {
    const fitting = pieces.filter((piece) => piece.width <= width);
    const counts = caps.map(() => 0);
    const walk = (index: number, left: number, value: number) => {
      if (index === fitting.length) {
        if (value > 0) out.push({ width, counts: [...counts], value });
        return;
      }
      const piece = fitting[index];
      for (
        let copies = 0;
        copies * piece.length <= left && counts[piece.blank] + copies <= caps[piece.blank];
        copies++
      ) {
        counts[piece.blank] += copies;
        walk(index + 1, left - copies * piece.length, value + copies * piece.value);
        counts[piece.blank] -= copies;
      }
    };
    walk(0, sheet.length, 0);
  }
  return out;
}

/** Every sheet pattern (strips whose widths fit across the sheet, caps kept over the sheet), as pieces per blank and worth. */
export function allPatterns(
  pieces: Piece[],
  sheet: { length: number; width: number },
  caps: number[],
): { counts: number[]; value: number }[] {
  const kinds = strips(pieces, sheet, caps);
  const seen = new Map<string, { counts: number[]; value: number }>();
  const counts = caps.map(() => 0);
  const walk = (from: number, left: number, value: number) => {
    if (value > 0) seen.set(counts.join(","), { counts: [...counts], value });
    for (let index = from; index < kinds.length; index++) {
      const strip = kinds[index];
      if (strip.width > left || strip.counts.some((count, blank) => counts[blank] + count > caps[blank])) continue;
      strip.counts.forEach((count, blank) => (counts[blank] += count));
      walk(index, left - strip.width, value + strip.value);
      strip.counts.forEach((count, blank) => (counts[blank] -= count));
    }
  };
  walk(0, sheet.width, 0);
  return [...seen.values()];
}

/** The most a pattern is worth (exhaustive). */
export const bestPattern = (pieces: Piece[], sheet: { length: number; width: number }, caps: number[]) =>
  Math.max(0, ...allPatterns(pieces, sheet, caps).map((pattern) => pattern.value));

/**
 * The fewest sheets, fractionally, over every pattern with strips along either side of the sheet
 * (pieces keep their direction to the sheet): the LP solved by HiGHS.
 */
export async function lpOverAllPatterns(
  pieces: Piece[],
  sheet: { length: number; width: number },
  demand: number[],
): Promise<number> {
  const across = pieces.map((piece) => ({ ...piece, length: piece.width, width: piece.length }));
  const patterns = [
    ...allPatterns(pieces, sheet, demand),
    ...allPatterns(across, { length: sheet.width, width: sheet.length }, demand),
  ];
  const solver = await loadHighs();
  const rows = demand
    .map((count, blank) =>
      count > 0
        ? ` d${blank}: ${patterns
            .map((pattern, index) => (pattern.counts[blank] ? `${pattern.counts[blank]} x${index}` : ""))
            .filter(Boolean)
            .join(" + ")} >= ${count}`
        : "",
    )
    .filter(Boolean);
  const lp = `Minimize\n obj: ${patterns.map((_, index) => `x${index}`).join(" + ")}\nSubject To\n${rows.join("\n")}\nEnd\n`;
  const result = solver.solve(lp, { output_flag: false });
  if (result.Status !== "Optimal") throw new Error(`LP: ${result.Status}`);
  return result.ObjectiveValue;
}
